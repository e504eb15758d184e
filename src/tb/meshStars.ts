/**
 * The Γ-centred M×M mesh (kspace.ts) split into stars: the points that the sheet's symmetry operations and time
 * reversal map onto one another. Bands are equal on a star — E(O·k) = E(k) for every symmetry {O|t} of the sheet
 * (the operation only relabels atoms and rotates orbitals, a unitary change of basis of H(k)), and E(−k) = E(k)
 * because the Slater–Koster blocks are real (H(−k) = H(k)*) — and so are the σ shares (the operations keep
 * heights, so they never mix pz with s, px, py). One diagonalisation per star serves every point of it.
 *
 * Why the whole mesh maps onto itself: O maps the sheet's lattice onto itself, so in the reciprocal basis it is an
 * integer matrix N = B⁻¹·O·B, and N takes (i/M, j/M) to a point of the same mesh.
 */
import type { Sheet } from '../lattice/sheet.ts';
import { sheetOperations, type SheetOperation } from '../lattice/sheetSymmetry.ts';
import { reciprocal } from './kspace.ts';

export interface MeshStars {
  /** Mesh index of each star's first point (in mesh order). */
  representatives: Int32Array;
  /** starOf[p]: the star of mesh point p (an index into representatives). */
  starOf: Int32Array;
  /** Operations used, counting −1 (time reversal) once: the largest star has this many points. */
  order: number;
}

/** An operation as an integer matrix on reciprocal-basis coordinates, [n00, n01, n10, n11]. */
function reciprocalAction(cell: Sheet['cell'], o: SheetOperation['matrix']): [number, number, number, number] {
  const [b1, b2] = reciprocal(cell);
  // Columns b1, b2; N = B⁻¹·O·B.
  const det = b1[0] * b2[1] - b2[0] * b1[1];
  const ob1 = [o[0] * b1[0] + o[1] * b1[1], o[2] * b1[0] + o[3] * b1[1]];
  const ob2 = [o[0] * b2[0] + o[1] * b2[1], o[2] * b2[0] + o[3] * b2[1]];
  const solve = (v: number[]): [number, number] => [(v[0] * b2[1] - b2[0] * v[1]) / det, (b1[0] * v[1] - v[0] * b1[1]) / det];
  const [n00, n10] = solve(ob1);
  const [n01, n11] = solve(ob2);
  const n: [number, number, number, number] = [n00, n01, n10, n11];
  // The operations come from sheetOperations, which checked that they keep the lattice: N is integer to rounding.
  return n.map(Math.round) as [number, number, number, number];
}

/**
 * Stars of the M×M mesh of `sheet` under its symmetry operations (sheetOperations) and k → −k.
 * `operations` may be given when already known; pass only the identity to get the time-reversal pairs alone.
 */
export function meshStars(sheet: Sheet, mesh: number, operations: readonly SheetOperation[] = sheetOperations(sheet)): MeshStars {
  const actions = operations.map((o) => reciprocalAction(sheet.cell, o.matrix));
  const withInverse = operations.some((o) => o.kind === 'rotation' && o.degrees === 180);
  const count = mesh * mesh;
  const starOf = new Int32Array(count).fill(-1);
  const representatives: number[] = [];
  const wrap = (x: number) => ((x % mesh) + mesh) % mesh;
  for (let p = 0; p < count; p++) {
    if (starOf[p] >= 0) continue;
    const star = representatives.length;
    representatives.push(p);
    const i = Math.floor(p / mesh);
    const j = p - i * mesh;
    for (const [n00, n01, n10, n11] of actions) {
      const i2 = n00 * i + n01 * j;
      const j2 = n10 * i + n11 * j;
      starOf[wrap(i2) * mesh + wrap(j2)] = star;
      starOf[wrap(-i2) * mesh + wrap(-j2)] = star;
    }
  }
  return { representatives: Int32Array.from(representatives), starOf, order: actions.length * (withInverse ? 1 : 2) };
}
