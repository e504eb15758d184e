/**
 * Which choices of a candidate's reduced cell vectors line up with a measured reduced cell. Both cells are
 * Gauss-reduced, so the equivalent choices are the integer matrices U with entries −1, 0, 1 and det ±1 (det −1: the
 * mirror image, the same structure for the enumerator). C' = U·C (rows) matches M when, after one common scale
 * s = √(area_M / area_C), the lengths agree within `shape` (relative) and the angles within `angleDeg`.
 */
import { gaussReduce } from '../lattice/reduce.ts';
import type { Vec2 } from '../lattice/sheet.ts';

export interface CellTolerance {
  /** Largest |s − 1| of the common scale (pixel size and bond errors). */
  scale: number;
  /** Largest relative length difference after scaling (drift, distortion). */
  shape: number;
  /** Largest angle difference (degrees). */
  angleDeg: number;
}

export const CELL_TOLERANCE: CellTolerance = { scale: 0.08, shape: 0.04, angleDeg: 4 };

export interface Correspondence {
  /** The candidate's cell vectors (Å, its own frame) that play the measured A1, A2. */
  vectors: [Vec2, Vec2];
  scale: number;
  /** U, row-major [a, b, c, d]: vectors = U·(candidate rows), so the same choice can be applied to a related cell. */
  transform: [number, number, number, number];
}

const len = (v: Vec2) => Math.hypot(v[0], v[1]);
const angle = (p: Vec2, q: Vec2) => (Math.atan2(Math.abs(p[0] * q[1] - p[1] * q[0]), p[0] * q[0] + p[1] * q[1]) * 180) / Math.PI;

export function correspondences(candidate: [Vec2, Vec2], measured: [Vec2, Vec2], tolerance: CellTolerance): Correspondence[] {
  const [c1, c2] = candidate, [m1, m2] = measured;
  const areaC = Math.abs(c1[0] * c2[1] - c1[1] * c2[0]);
  const areaM = Math.abs(m1[0] * m2[1] - m1[1] * m2[0]);
  const scale = Math.sqrt(areaM / areaC);
  if (!(Math.abs(scale - 1) <= tolerance.scale)) return [];
  const out: Correspondence[] = [];
  const steps = [-1, 0, 1];
  for (const a of steps) for (const b of steps) for (const c of steps) for (const d of steps) {
    if (Math.abs(a * d - b * c) !== 1) continue;
    const u: Vec2 = [a * c1[0] + b * c2[0], a * c1[1] + b * c2[1]];
    const v: Vec2 = [c * c1[0] + d * c2[0], c * c1[1] + d * c2[1]];
    if (Math.abs((len(u) * scale) / len(m1) - 1) > tolerance.shape) continue;
    if (Math.abs((len(v) * scale) / len(m2) - 1) > tolerance.shape) continue;
    if (Math.abs(angle(u, v) - angle(m1, m2)) > tolerance.angleDeg) continue;
    out.push({ vectors: [u, v], scale, transform: [a, b, c, d] });
  }
  return out;
}

/** A cell of the measured lattice's sublattice: its reduced, right-handed vectors (Å) and index (area ratio). */
export interface Sublattice {
  vectors: [Vec2, Vec2];
  index: number;
}

/**
 * The sublattices of index 1…maxIndex of a lattice (Hermite normal forms [[a, 0], [b, c]], a·c = index, 0 ≤ b < a, rows
 * in the lattice's basis), each Gauss-reduced and right-handed. A weak fundamental Fourier peak lost in the noise
 * makes the measured lattice finer than the true one; the true cell is then one of these.
 */
export function sublattices(cell: [Vec2, Vec2], maxIndex: number): Sublattice[] {
  const out: Sublattice[] = [];
  const [m1, m2] = cell;
  for (let index = 1; index <= maxIndex; index++) {
    for (let a = 1; a <= index; a++) {
      if (index % a !== 0) continue;
      const c = index / a;
      for (let b = 0; b < a; b++) {
        const u: Vec2 = [a * m1[0], a * m1[1]];
        const v: Vec2 = [b * m1[0] + c * m2[0], b * m1[1] + c * m2[1]];
        const r = gaussReduce(u, v);
        let [p, q] = [r.u, r.v];
        if (p[0] * q[1] - p[1] * q[0] < 0) [p, q] = [q, p];
        out.push({ vectors: [p, q], index });
      }
    }
  }
  return out;
}
