/**
 * Flags and arguments shared by the commands that solve the tight-binding model, declared once.
 */
import { DEFAULT_KSPACING, FIXED_MESH_MAX_ATOMS } from '../tb/meshDensity.ts';
import type { FlagSpec } from './args.ts';

/** Largest k-mesh side the CLI accepts: 400² k-points of an 8-atom cell take about a minute. */
export const MAX_MESH = 400;

export const SHEET_ARGUMENT = { name: 'SHEET', help: 'a preset name, a sheet file, or sheet JSON text' } as const;

export const PARAMS_FLAG: FlagSpec = {
  kind: 'text',
  placeholder: 'FILE|NAME',
  help: 'parameter set: a preset name or a parameter file (default harrison1980)',
};

export const MESH_FLAG: FlagSpec = {
  kind: 'integer', min: 1, max: MAX_MESH, placeholder: 'M',
  help: `Γ-centred M×M k-mesh (default 36 for cells up to ${FIXED_MESH_MAX_ATOMS} atoms, else by --kspacing ${DEFAULT_KSPACING})`,
};

/** The k-point density alternative to --mesh (src/tb/meshDensity.ts); the two are exclusive. */
export const KSPACING_FLAG: FlagSpec = {
  kind: 'number', min: 0.001, max: 10, placeholder: 'Å⁻¹',
  help: 'k-point spacing instead of --mesh: M is the smallest with |b_i|/M ≤ spacing for both reciprocal vectors',
};

export const PROGRESS_FLAG: FlagSpec = {
  kind: 'switch', help: 'machine-readable progress on stderr: the estimate, then progress, one JSON object per line',
};

export const SMEARING_FLAG: FlagSpec = {
  kind: 'number', min: 0, max: 10, exclusiveMin: true, placeholder: 'W', help: 'width of the Gaussian occupation in eV (default 0.1)',
};

export const DOPING_FLAG: FlagSpec = {
  kind: 'number', min: -3, max: 5, exclusiveMin: true, exclusiveMax: true, placeholder: 'δ',
  help: 'extra electrons per atom, positive when given by the substrate (default 0; strictly between −3 and 5)',
};

export const OVERWRITE_FLAG: FlagSpec = { kind: 'switch', help: 'replace the output file if it exists' };

export const JSON_FLAG: FlagSpec = { kind: 'switch', help: 'one JSON document on stdout' };

/** The caveat printed under every human-readable model result. */
export const MODEL_CAVEAT =
  'A tight-binding estimate with the parameter set named above, not a prediction: check against experiment and higher-level calculations.';
