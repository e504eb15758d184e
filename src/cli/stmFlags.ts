/**
 * Flags shared by `stm` and `match` (the simulated image of a sheet), declared once, and the caveat of model images.
 */
import type { FlagSpec } from './args.ts';

export const BIAS_FLAG: FlagSpec = {
  kind: 'number', min: -10, max: 10, placeholder: 'V',
  help: 'sample bias in volts, |V| from 0.01 to 10; V > 0 images empty states (E_F … E_F + eV), V < 0 filled states (default 1)',
};
export const HEIGHT_FLAG: FlagSpec = { kind: 'number', min: 1.5, max: 15, placeholder: 'h', help: 'tip height above the highest atom in Å, 1.5 to 15 (default 4)' };
export const MODE_FLAG: FlagSpec = {
  kind: 'choice', values: ['constant-current', 'constant-height'], placeholder: 'constant-current|constant-height',
  help: 'constant current: the tip height at the mean current of height h (default); constant height: the current at h',
};
export const WORK_FUNCTION_FLAG: FlagSpec = {
  kind: 'number', min: 1, max: 10, placeholder: 'φ', help: 'vacuum barrier in eV, κ = 0.5123·√φ Å⁻¹ (default 4.5, an estimate)',
};
export const STM_MESH_FLAG: FlagSpec = { kind: 'integer', min: 2, max: 200, placeholder: 'M', help: 'Γ-centred M×M k-mesh of E_F and of the LDOS (default 24)' };

/** Smallest |bias| (V) accepted (src/stm/biasWindow.ts). */
export { MIN_BIAS } from '../stm/biasWindow.ts';

/** The caveat printed under every human-readable STM result. */
export const STM_CAVEAT =
  'Model images (Tersoff–Hamann on tight binding: s and pz vacuum tails, an s-wave tip, no substrate), not predictions: compare with experiment and higher-level calculations.';
