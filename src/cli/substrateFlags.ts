/**
 * Flags shared by the substrate commands (transfer, fit, metals), declared once, and the caveat under their output.
 */
import { invalid } from '../validate/invalid.ts';
import { ALIGNMENT_FLAG_LIMITS as L } from '../substrate/alignmentLimits.ts';
import { ALIGNMENT_DEFAULTS } from '../substrate/defaults.ts';
import { requireSubstrate, SUBSTRATES, type Substrate } from '../substrate/substrates.ts';
import { alignmentParameters, type AlignmentParameters } from '../substrate/transfer.ts';
import type { FlagSpec, FlagValue } from './args.ts';

export const SUBSTRATE_FLAG: FlagSpec = {
  kind: 'text', placeholder: 'NAME', help: `metal surface: ${SUBSTRATES.map((s) => s.name).join(', ')}; required`,
};

/** --sheet-work-function, --dipole, --distance, --d0: the alignment model's inputs. */
export const ALIGNMENT_FLAGS: Readonly<Record<string, FlagSpec>> = {
  'sheet-work-function': { kind: 'number', min: L.sheetWorkFunction[0], max: L.sheetWorkFunction[1], placeholder: 'W_S', help: `work function of the free sheet in eV (default ${ALIGNMENT_DEFAULTS.sheetWorkFunction.value}, an estimate)` },
  dipole: { kind: 'number', min: L.dipole[0], max: L.dipole[1], placeholder: 'Δc', help: `interface dipole from the chemical interaction in eV (default ${ALIGNMENT_DEFAULTS.dipole.value}, graphene's)` },
  distance: { kind: 'number', min: L.distance[0], max: L.distance[1], placeholder: 'd', help: `sheet–metal distance in Å (default ${ALIGNMENT_DEFAULTS.distance.value}, graphene's)` },
  d0: { kind: 'number', min: L.d0[0], max: L.d0[1], placeholder: 'd0', help: `offset of the interface charge layer in Å, d ≥ d0 (default ${ALIGNMENT_DEFAULTS.d0.value}, graphene's)` },
};

/** The required --substrate flag, resolved. */
export function substrateOf(flags: Record<string, FlagValue>): Substrate {
  if (flags.substrate === undefined) invalid('--substrate', undefined, `required; substrates: ${SUBSTRATES.map((s) => s.name).join(', ')}`);
  return requireSubstrate(flags.substrate as string, '--substrate');
}

/** The alignment flags with defaults filled in; d < d0 is refused naming the flag given. */
export function alignmentOf(flags: Record<string, FlagValue>): Required<AlignmentParameters> {
  return alignmentParameters({
    sheetWorkFunction: flags['sheet-work-function'] as number | undefined,
    dipole: flags.dipole as number | undefined,
    distance: flags.distance as number | undefined,
    d0: flags.d0 as number | undefined,
  }, { distance: '--distance', d0: '--d0' });
}

/** The model parameters as JSON, with the origin of each default. */
export function alignmentJson(parameters: Required<AlignmentParameters>): Record<string, unknown> {
  return {
    sheet_work_function: parameters.sheetWorkFunction,
    dipole: parameters.dipole,
    distance: parameters.distance,
    d0: parameters.d0,
    defaults: {
      sheet_work_function: ALIGNMENT_DEFAULTS.sheetWorkFunction,
      dipole: ALIGNMENT_DEFAULTS.dipole,
      distance: ALIGNMENT_DEFAULTS.distance,
      d0: ALIGNMENT_DEFAULTS.d0,
    },
  };
}

/** What the substrate commands' numbers are, printed under their readable output and in their JSON. */
export const SUBSTRATE_CAVEAT =
  'Model estimates (tight binding, the electron-counting rule, a capacitor model of the interface; a lattice fit that ignores energetics), not predictions of which pattern grows or is stable: relax candidate structures on the metal with a higher-level method (density-functional theory and beyond) and check against experiment (STM, ARPES, photoemission).';

/** Why the alignment can fall short where a sheet bonds to the metal. */
export const ALIGNMENT_SCOPE =
  'The alignment model describes weak (physisorption-like) coupling; where the sheet bonds to the metal (as B on Al(111) is reported to) it misses the chemistry and underestimates the transfer.';
