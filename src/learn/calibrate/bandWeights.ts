/**
 * Weights that favour bands near the Fermi level: w(E) = 1/(1 + ((E − E_F)/W)²) for a reference energy E, a
 * Lorentzian of half-width W (default 4 eV) — a choice of ours: states at E_F count fully, states W below count
 * half, the bottom of a boron valence band some 12 eV down about a tenth. The states near E_F decide the electron
 * counting, the doping and the STM pictures, so the fit should serve them first. A fitted residual is
 * √w·(E_model + shift − E_reference).
 *
 * E_F of the reference: the file's `fermi` when it gives one; else estimated from the reference bands themselves
 * by the electron count (3 valence electrons per boron atom, 2 per state: 1.5 bands per atom filled on average
 * over the file's k-points — a path average, not a zone average, hence an estimate); else none, and equal weights.
 */
import type { BandMatch } from './bandMatch.ts';
import type { BandBlock } from './parametricBands.ts';
import type { ReferenceBands } from './referenceBands.ts';

export const DEFAULT_WEIGHT_WIDTH = 4;

/** Filled bands per atom of a neutral boron sheet: 3 electrons, 2 per band. */
const FILLED_PER_ATOM = 1.5;

export function bandWeight(energy: number, fermi: number, width: number): number {
  const x = (energy - fermi) / width;
  return 1 / (1 + x * x);
}

/**
 * E_F of the reference by the electron count, or undefined when the count cannot be made: a single block (σ or π
 * electrons alone are not known), or a file whose bands do not reach the filled ones. Reference band j stands for
 * model band j − referenceFirst + modelFirst.
 */
export function estimateFermi(reference: ReferenceBands, match: BandMatch, atoms: number, block: BandBlock): number | undefined {
  if (block !== 'full') return undefined;
  const filled = FILLED_PER_ATOM * atoms - (match.modelFirst - match.referenceFirst);
  if (!(filled > 0 && filled < reference.bands)) return undefined;
  const sorted = Float64Array.from(reference.energies).sort();
  const below = Math.min(sorted.length - 1, Math.max(1, Math.round(filled * reference.count)));
  return 0.5 * (sorted[below - 1] + sorted[below]);
}
