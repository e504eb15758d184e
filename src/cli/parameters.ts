/**
 * The --params option: a parameter-set preset name or a path to a parameter file (DESIGN.md contract).
 */
import { invalid } from '../io/invalid.ts';
import { parseParameterFile } from '../io/paramsFile.ts';
import { DEFAULT_PARAMETERS, PARAMETER_PRESETS, findParameterPreset, type ParameterSet } from '../tb/params.ts';
import type { CliIo } from './io.ts';

export function resolveParameters(value: string | undefined, io: CliIo): ParameterSet {
  const name = value ?? DEFAULT_PARAMETERS;
  const preset = findParameterPreset(name);
  if (preset) return preset;
  let content: string;
  try {
    content = io.readText(name);
  } catch (error) {
    const names = PARAMETER_PRESETS.map((p) => p.name).join(', ');
    const reason = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such parameter set or file' : 'cannot read the file';
    invalid('--params', name, `${reason}; presets: ${names}`);
  }
  return parseParameterFile(content);
}
