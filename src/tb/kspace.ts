/**
 * Reciprocal lattice and the Γ-centred k-mesh (DESIGN.md, `fill` contract).
 * k in Å⁻¹ with Bloch phase exp(i k·r): reciprocal vectors satisfy b_i·a_j = 2π·δ_ij (no hidden 2π).
 * Layout of k-point lists: Float64Array, kx, ky interleaved — point p at [2p, 2p + 1].
 */
import { signedArea, type Sheet, type Vec2 } from '../lattice/sheet.ts';

/** Reciprocal vectors b1, b2 of the cell rows a1, a2: b_i·a_j = 2π·δ_ij. */
export function reciprocal(cell: Sheet['cell']): [Vec2, Vec2] {
  const [[ax, ay], [bx, by]] = cell;
  const scale = (2 * Math.PI) / signedArea(cell);
  return [
    [scale * by, -scale * bx],
    [-scale * ay, scale * ax],
  ];
}

/**
 * The Γ-centred M×M mesh k = (i/M)·b1 + (j/M)·b2, i, j = 0…M−1, of the cell exactly as given (not its reduced
 * form), i-major: point p = i·M + j. All points carry the weight 1/M².
 */
export function kMesh(cell: Sheet['cell'], m: number): Float64Array {
  const [b1, b2] = reciprocal(cell);
  const out = new Float64Array(2 * m * m);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      const p = 2 * (i * m + j);
      out[p] = (i / m) * b1[0] + (j / m) * b2[0];
      out[p + 1] = (i / m) * b1[1] + (j / m) * b2[1];
    }
  }
  return out;
}
