/**
 * The automatic k-path through the special points of the Brillouin zone, chosen by the type of the reduced cell.
 *
 * The cell is first Gauss-reduced (src/lattice/reduce.ts) to (u, v), |u| ≤ |v|, 90° ≤ angle ≤ 120°; its dual
 * basis b1 (b1·u = 2π), b2 (b2·v = 2π) is then reduced too, with b1·b2 ≥ 0. The zone is the Wigner–Seitz cell of
 * the reciprocal lattice, bounded by the bisectors of ±b1, ±b2 and ±(b2 − b1); edge midpoints are g/2, corners
 * the circumcentres of 0 and two neighbouring g. Paths (labels as in Setyawan & Curtarolo, Comput. Mater. Sci. 49,
 * 299 (2010), and Hinuma et al., Comput. Mater. Sci. 128, 140 (2017), for the matching 3D lattices; the 2D
 * reduction to these in-plane paths is our choice):
 * - hexagonal (|u| = |v|, 120°):         Γ–M–K–Γ, M = b1/2, K the corner next to M;
 * - square (|u| = |v|, 90°):             Γ–X–M–Γ, X = b1/2, M = (b1 + b2)/2;
 * - rectangular (90°):                   Γ–X–S–Y–Γ, X = b1/2 (along the short real axis), S = (b1 + b2)/2, Y = b2/2;
 * - centred-rectangular (|u| = |v|, or 2|u·v| = |u|²) and oblique: half the zone boundary,
 *                                        Γ–X–H1–Y–H2–C–Γ, X = b1/2, Y = b2/2, C = (b2 − b1)/2, H1 and H2 the corners
 *                                        between them (the other half follows from E(k) = E(−k)).
 */
import { invalid } from '../validate/invalid.ts';
import { gaussReduce } from '../lattice/reduce.ts';
import type { Sheet, Vec2 } from '../lattice/sheet.ts';
import { reciprocal } from './kspace.ts';

/** The five 2D Bravais types, as recognised on the reduced cell. */
export type CellType = 'hexagonal' | 'square' | 'rectangular' | 'centred-rectangular' | 'oblique';

/** A k-path: points, the labelled special points on it and the cumulative distance along it. */
export interface KPath {
  /** Cartesian k (Å⁻¹), kx, ky interleaved. */
  kpoints: Float64Array;
  count: number;
  /** Special points and the index of the path point that sits on each. */
  labels: { label: string; index: number }[];
  /** Cumulative path length |Δk| (Å⁻¹) at every point, 0 at the first. */
  distance: Float64Array;
  cellType: CellType;
}

/** Relative tolerance for equal lengths and right angles of the reduced cell. */
const SHAPE_TOLERANCE = 1e-9;

const dot = (p: Vec2, q: Vec2) => p[0] * q[0] + p[1] * q[1];

/** The 2D Bravais type of a cell, from its Gauss-reduced basis. */
export function cellType(cell: Sheet['cell']): CellType {
  const { u, v } = gaussReduce(cell[0], cell[1]);
  const uu = dot(u, u);
  const vv = dot(v, v);
  const uv = dot(u, v);
  const equal = Math.abs(vv - uu) <= SHAPE_TOLERANCE * uu;
  const right = Math.abs(uv) <= SHAPE_TOLERANCE * uu;
  if (equal && Math.abs(2 * uv + uu) <= SHAPE_TOLERANCE * uu) return 'hexagonal';
  if (right) return equal ? 'square' : 'rectangular';
  if (equal || Math.abs(2 * Math.abs(uv) - uu) <= SHAPE_TOLERANCE * uu) return 'centred-rectangular';
  return 'oblique';
}

/** Circumcentre of 0, p and q: c·p = |p|²/2 and c·q = |q|²/2. */
function corner(p: Vec2, q: Vec2): Vec2 {
  const det = p[0] * q[1] - p[1] * q[0];
  const hp = dot(p, p) / 2;
  const hq = dot(q, q) / 2;
  return [(hp * q[1] - hq * p[1]) / det, (p[0] * hq - q[0] * hp) / det];
}

const half = (p: Vec2): Vec2 => [p[0] / 2, p[1] / 2];
const add = (p: Vec2, q: Vec2): Vec2 => [p[0] + q[0], p[1] + q[1]];
const sub = (p: Vec2, q: Vec2): Vec2 => [p[0] - q[0], p[1] - q[1]];

/** The special points of the path for a cell, in path order (first and last Γ). */
export function specialPoints(cell: Sheet['cell']): { type: CellType; points: { label: string; k: Vec2 }[] } {
  const type = cellType(cell);
  const { u, v } = gaussReduce(cell[0], cell[1]);
  const [b1, b2] = reciprocal([u, v]);
  const gamma: Vec2 = [0, 0];
  const at = (label: string, k: Vec2) => ({ label, k });
  switch (type) {
    case 'hexagonal':
      return { type, points: [at('Γ', gamma), at('M', half(b1)), at('K', corner(b1, b2)), at('Γ', gamma)] };
    case 'square':
      return { type, points: [at('Γ', gamma), at('X', half(b1)), at('M', half(add(b1, b2))), at('Γ', gamma)] };
    case 'rectangular':
      return {
        type,
        points: [at('Γ', gamma), at('X', half(b1)), at('S', half(add(b1, b2))), at('Y', half(b2)), at('Γ', gamma)],
      };
    default: {
      const third = sub(b2, b1);
      return {
        type,
        points: [
          at('Γ', gamma), at('X', half(b1)), at('H1', corner(b1, b2)), at('Y', half(b2)),
          at('H2', corner(b2, third)), at('C', half(third)), at('Γ', gamma),
        ],
      };
    }
  }
}

/**
 * The automatic path with `points` points in all (ends and special points included), spread over the segments
 * in proportion to their lengths (largest remainders; at least one step per segment).
 */
export function autoPath(cell: Sheet['cell'], points: number): KPath {
  const { type, points: corners } = specialPoints(cell);
  const segments = corners.length - 1;
  if (!Number.isInteger(points) || points < segments + 1) {
    invalid('points', points, `need an integer of at least ${segments + 1} for the ${type} path`);
  }
  const lengths = corners.slice(1).map((c, s) => Math.hypot(c.k[0] - corners[s].k[0], c.k[1] - corners[s].k[1]));
  const total = lengths.reduce((a, b) => a + b, 0);
  const steps = points - 1;
  const spare = steps - segments;
  const exact = lengths.map((l) => (l / total) * spare);
  const counts = exact.map((x) => 1 + Math.floor(x));
  let left = steps - counts.reduce((a, b) => a + b, 0);
  const byRemainder = exact.map((x, s) => [x - Math.floor(x), s]).sort((p, q) => q[0] - p[0] || p[1] - q[1]);
  for (let r = 0; left > 0; r++, left--) counts[byRemainder[r % segments][1]]++;

  const kpoints = new Float64Array(2 * points);
  const distance = new Float64Array(points);
  const labels = [{ label: corners[0].label, index: 0 }];
  let index = 0;
  let travelled = 0;
  for (let s = 0; s < segments; s++) {
    const [x0, y0] = corners[s].k;
    const [x1, y1] = corners[s + 1].k;
    for (let t = s === 0 ? 0 : 1; t <= counts[s]; t++) {
      const f = t / counts[s];
      kpoints[2 * index] = x0 + f * (x1 - x0);
      kpoints[2 * index + 1] = y0 + f * (y1 - y0);
      distance[index] = travelled + f * lengths[s];
      index++;
    }
    travelled += lengths[s];
    labels.push({ label: corners[s + 1].label, index: index - 1 });
  }
  return { kpoints, count: points, labels, distance, cellType: type };
}
