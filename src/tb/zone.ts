/**
 * The first Brillouin zone of a sheet: the Wigner–Seitz cell of its reciprocal lattice (Å⁻¹, no hidden 2π).
 *
 * The reciprocal basis of the Gauss-reduced cell (as the k-path uses, src/tb/kspacePath.ts) is Gauss-reduced
 * again to (u, v) with u·v ≤ 0; in 2D the zone is then bounded by the perpendicular bisectors of ±u, ±v and
 * ±(u + v) only (the Voronoi-relevant vectors of a reduced 2D basis; Conway & Sloane, Proc. R. Soc. Lond. A 436,
 * 55 (1992)). Its corners are the circumcentres of 0 and two angularly neighbouring g; for a rectangular lattice
 * (u·v = 0) two such corners coincide and the zone has 4 corners instead of 6.
 */
import { gaussReduce } from '../lattice/reduce.ts';
import type { Sheet, Vec2 } from '../lattice/sheet.ts';
import { reciprocal } from './kspace.ts';

/** The Brillouin zone: counter-clockwise corners starting nearest the +kx axis, and the reciprocal vectors. */
export interface BrillouinZone {
  /** Corners (Å⁻¹), counter-clockwise; 6 (hexagonal, oblique, centred) or 4 (square, rectangular). */
  corners: Vec2[];
  /** b1, b2 of the reduced cell (the ones the k-path's labels are built on), b_i·a_j = 2π·δ_ij. */
  reciprocal: [Vec2, Vec2];
}

/** Corners closer than this (relative to |u|) are one corner: the two halves of a rectangle's corner. */
const MERGE_TOLERANCE = 1e-9;

const dot = (p: Vec2, q: Vec2) => p[0] * q[0] + p[1] * q[1];

/** Circumcentre of 0, p and q: c·p = |p|²/2 and c·q = |q|²/2. */
function circumcentre(p: Vec2, q: Vec2): Vec2 {
  const det = p[0] * q[1] - p[1] * q[0];
  const hp = dot(p, p) / 2;
  const hq = dot(q, q) / 2;
  return [(hp * q[1] - hq * p[1]) / det, (p[0] * hq - q[0] * hp) / det];
}

export function brillouinZone(cell: Sheet['cell']): BrillouinZone {
  const real = gaussReduce(cell[0], cell[1]);
  const [b1, b2] = reciprocal([real.u, real.v]);
  const { u, v } = gaussReduce(b1, b2);
  const w: Vec2 = [u[0] + v[0], u[1] + v[1]];
  const around = [u, w, v, [-u[0], -u[1]], [-w[0], -w[1]], [-v[0], -v[1]]] as Vec2[];
  around.sort((p, q) => Math.atan2(p[1], p[0]) - Math.atan2(q[1], q[0]));
  const scale = Math.sqrt(dot(u, u));
  const corners: Vec2[] = [];
  for (let i = 0; i < around.length; i++) {
    const c = circumcentre(around[i], around[(i + 1) % around.length]);
    const last = corners[corners.length - 1];
    if (last && Math.hypot(c[0] - last[0], c[1] - last[1]) <= MERGE_TOLERANCE * scale) continue;
    corners.push(c);
  }
  if (corners.length > 1) {
    const [first, last] = [corners[0], corners[corners.length - 1]];
    if (Math.hypot(first[0] - last[0], first[1] - last[1]) <= MERGE_TOLERANCE * scale) corners.pop();
  }
  // Start at the corner of smallest non-negative angle, so the order is the same for every cell orientation.
  const angle = (p: Vec2) => {
    const a = Math.atan2(p[1], p[0]);
    return a < -1e-12 ? a + 2 * Math.PI : Math.max(0, a);
  };
  let start = 0;
  for (let i = 1; i < corners.length; i++) if (angle(corners[i]) < angle(corners[start])) start = i;
  return { corners: [...corners.slice(start), ...corners.slice(0, start)], reciprocal: [b1, b2] };
}
