/**
 * Slater–Koster parameter sets: the named presets (data in presets/params/*.json, each with its
 * source) and the default. Every preset goes through the same validation as a user's parameter file.
 */
import harrison1980 from '../../presets/params/harrison1980.json' with { type: 'json' };
import harrison1999 from '../../presets/params/harrison1999.json' with { type: 'json' };
import type { ParameterSet } from './parameterSet.ts';
import { validateParameterObject } from './paramsCheck.ts';

export type { ParameterSet } from './parameterSet.ts';

/** The named parameter sets, in order of publication. */
export const PARAMETER_PRESETS: readonly ParameterSet[] = [harrison1980, harrison1999].map((data, index) =>
  validateParameterObject(data, `presets/params[${index}]`),
);

/** Name of the parameter set used when none is given. */
export const DEFAULT_PARAMETERS = 'harrison1980';

export function findParameterPreset(name: string): ParameterSet | undefined {
  return PARAMETER_PRESETS.find((p) => p.name === name);
}
