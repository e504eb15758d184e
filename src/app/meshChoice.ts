/**
 * Which k-mesh the view's ranking uses: the same k-point density for every candidate, so that band energies per
 * atom compare on equal terms (a fixed M×M mesh would give a 20-site cell 20 times the density of the one-site
 * lattice). The density is that of the 36×36 mesh of the one-site triangular cell at d = 1.69 Å.
 */
import type { Sheet } from '../lattice/sheet.ts';
import { reciprocal } from '../tb/kspace.ts';

/** Largest reciprocal-vector length (Å⁻¹) per mesh step: |b| = 4π/(√3·1.69 Å) over 36. */
export const RANKING_KSPACING = (4 * Math.PI) / (Math.sqrt(3) * 1.69) / 36;

/** The smallest M with |b_i|/M ≤ RANKING_KSPACING for both reciprocal vectors (at least 6). */
export function rankingMesh(cell: Sheet['cell']): number {
  const [b1, b2] = reciprocal(cell);
  const longest = Math.max(Math.hypot(b1[0], b1[1]), Math.hypot(b2[0], b2[1]));
  return Math.max(6, Math.ceil(longest / RANKING_KSPACING - 1e-9));
}
