/**
 * The lattice of a periodic picture from its spectrum peaks (src/stm/peaks.ts).
 * 1. Reciprocal basis: among the peaks with ≥ 1 % of the strongest power, the shortest g1 and the shortest one at
 *    least 15° from its line, g2 (taken from the peaks with ≥ 0.2 % when the strong ones all lie on one line: stripes); while a peak with ≥ 0.2 % of the strongest power is not an integer combination of them, its remainder p − round(c)·(g1, g2) is a shorter
 *    lattice vector and the basis is rebuilt from the three (Gauss-reduced) — unless the remainder is shorter than the
 *    longest period allowed (minRadians), when the peak is left out.
 * 2. Least squares: every peak indexed within 0.2 of integers (n1, n2) gives p ≈ n1·g1 + n2·g2; x and y components
 *    are fitted separately, with covariance σ²·(NᵀN)⁻¹ (σ the residual rms, at least 0.05 bin, the interpolation
 *    accuracy: common practice estimate).
 * 3. Real cell A = 2π·(Gᵀ)⁻¹, Gauss-reduced (a ≤ b, γ in [90°, 120°]); uncertainties by linear propagation.
 */
import { reducedPeriodicity } from '../lattice/periodicity.ts';
import { gaussReduce } from '../lattice/reduce.ts';
import type { Vec2 } from '../lattice/sheet.ts';
import type { SpectrumPeak } from './peaks.ts';

/** A measured lattice: the reduced cell in Å (picture frame, y up) with standard uncertainties. */
export interface MeasuredLattice {
  /** Reduced real cell vectors (Å). */
  vectors: [Vec2, Vec2];
  /** Reciprocal vectors of `vectors` in rad/pixel (g_i·A_j = 2π·δ_ij with A in pixels): the folding basis. */
  reciprocalPixels: [Vec2, Vec2];
  a: number;
  b: number;
  gammaDeg: number;
  aError: number;
  bError: number;
  gammaDegError: number;
  /** Peaks indexed and fitted. */
  peaks: number;
}

const cross = (p: Vec2, q: Vec2) => p[0] * q[1] - p[1] * q[0];
const length = (p: Vec2) => Math.hypot(p[0], p[1]);
const SIN_15 = Math.sin(Math.PI / 12);
/** Peaks that may start the basis, and peaks that may refine it, as shares of the strongest peak's power. */
const BASIS_SHARE = 0.01;
const STRAY_SHARE = 0.002;

function independentPair(vectors: Vec2[]): [Vec2, Vec2] | undefined {
  const sorted = [...vectors].filter((v) => length(v) > 1e-9).sort((p, q) => length(p) - length(q));
  if (sorted.length === 0) return undefined;
  const first = sorted[0];
  const second = sorted.find((v) => Math.abs(cross(first, v)) > SIN_15 * length(first) * length(v));
  return second ? [first, second] : undefined;
}

function coordinates(g1: Vec2, g2: Vec2, p: Vec2): Vec2 {
  const det = cross(g1, g2);
  return [cross(p, g2) / det, cross(g1, p) / det];
}

/** Real cell of a reciprocal basis: A_i·g_j = 2π·δ_ij (the same relation gives the reciprocal of a real cell). */
export function realCell(g1: Vec2, g2: Vec2): [Vec2, Vec2] {
  const s = (2 * Math.PI) / cross(g1, g2);
  return [[s * g2[1], -s * g2[0]], [-s * g1[1], s * g1[0]]];
}

/** Least-squares fit of p_j ≈ N_j·(g1, g2) for one component: returns the two values and (NᵀN)⁻¹. */
function fitComponent(n: Vec2[], values: number[]): { x: Vec2; inverse: [number, number, number] } {
  let s11 = 0, s12 = 0, s22 = 0, r1 = 0, r2 = 0;
  n.forEach(([a, b], j) => {
    s11 += a * a; s12 += a * b; s22 += b * b; r1 += a * values[j]; r2 += b * values[j];
  });
  const det = s11 * s22 - s12 * s12;
  return { x: [(s22 * r1 - s12 * r2) / det, (s11 * r2 - s12 * r1) / det], inverse: [s22 / det, -s12 / det, s11 / det] };
}

/** The lattice of the peaks (k in rad/pixel), or undefined when the peaks do not make two independent directions. */
export function fitLattice(peaks: readonly SpectrumPeak[], pixelSize: number, binRadians: number, minRadians = 0): MeasuredLattice | undefined {
  if (peaks.length < 2) return undefined;
  const strongest = Math.max(...peaks.map((p) => p.power));
  const strong: Vec2[] = peaks.filter((p) => p.power >= BASIS_SHARE * strongest).map((p) => [p.kx, p.ky]);
  const weaker: Vec2[] = peaks.filter((p) => p.power >= STRAY_SHARE * strongest).map((p) => [p.kx, p.ky]);
  let basis = independentPair(strong) ?? independentPair([independentPair(strong.concat(weaker))?.[0] ?? [0, 0], ...weaker]);
  if (!basis) return undefined;
  for (let round = 0; round < 6; round++) {
    const [g1, g2] = basis;
    let rest: Vec2 | undefined;
    for (const p of peaks) {
      if (p.power < STRAY_SHARE * strongest) continue;
      const c = coordinates(g1, g2, [p.kx, p.ky]);
      if (Math.max(Math.abs(c[0] - Math.round(c[0])), Math.abs(c[1] - Math.round(c[1]))) <= 0.25) continue;
      const r: Vec2 = [p.kx - Math.round(c[0]) * g1[0] - Math.round(c[1]) * g2[0], p.ky - Math.round(c[0]) * g1[1] - Math.round(c[1]) * g2[1]];
      // A remainder shorter than the longest period allowed is not a lattice vector: the peak is left unindexed.
      if (length(r) >= minRadians) {
        rest = r;
        break;
      }
    }
    if (!rest) break;
    const pair = independentPair([g1, g2, rest]);
    if (!pair) return undefined;
    const reduced = gaussReduce(pair[0], pair[1]);
    basis = [reduced.u, reduced.v];
  }
  const [g1, g2] = basis;
  const indices: Vec2[] = [], xs: number[] = [], ys: number[] = [];
  for (const p of peaks) {
    const c = coordinates(g1, g2, [p.kx, p.ky]);
    const n: Vec2 = [Math.round(c[0]), Math.round(c[1])];
    if (Math.max(Math.abs(c[0] - n[0]), Math.abs(c[1] - n[1])) > 0.2 || (n[0] === 0 && n[1] === 0)) continue;
    indices.push(n); xs.push(p.kx); ys.push(p.ky);
  }
  const [n1, n2] = [indices.some((n) => n[0] !== 0), indices.some((n) => n[1] !== 0)];
  if (indices.length < 2 || !n1 || !n2) return undefined;
  const fx = fitComponent(indices, xs), fy = fitComponent(indices, ys);
  if (!Number.isFinite(fx.x[0] + fx.x[1] + fy.x[0] + fy.x[1])) return undefined;
  let residual = 0;
  indices.forEach(([a, b], j) => {
    residual += (a * fx.x[0] + b * fx.x[1] - xs[j]) ** 2 + (a * fy.x[0] + b * fy.x[1] - ys[j]) ** 2;
  });
  const m = indices.length;
  const sigma2 = Math.max(m > 2 ? residual / (2 * (m - 2)) : 0, (0.05 * binRadians) ** 2);
  const metrics = (p: [number, number, number, number]) => {
    // p = (g1x, g2x, g1y, g2y) in rad/pixel → reduced real cell in Å.
    const cell = realCell([p[0], p[2]], [p[1], p[3]]);
    const r = reducedPeriodicity([[cell[0][0] * pixelSize, cell[0][1] * pixelSize], [cell[1][0] * pixelSize, cell[1][1] * pixelSize]]);
    return [r.a, r.b, r.gammaDeg];
  };
  const params: [number, number, number, number] = [fx.x[0], fx.x[1], fy.x[0], fy.x[1]];
  const centre = metrics(params);
  const jac: number[][] = [];
  for (let i = 0; i < 4; i++) {
    const h = 1e-6 * Math.max(Math.abs(params[i]), binRadians);
    const up = [...params] as typeof params, down = [...params] as typeof params;
    up[i] += h; down[i] -= h;
    const fu = metrics(up), fd = metrics(down);
    jac.push(fu.map((v, k) => (v - fd[k]) / (2 * h)));
  }
  const errors = centre.map((_, k) => {
    const [ix, iy] = [[0, 1], [2, 3]];
    const v = (pair: number[], inv: [number, number, number]) => {
      const a = jac[pair[0]][k], b = jac[pair[1]][k];
      return sigma2 * (a * a * inv[0] + 2 * a * b * inv[1] + b * b * inv[2]);
    };
    return Math.sqrt(v(ix, fx.inverse) + v(iy, fy.inverse));
  });
  const cellPixels = realCell([fx.x[0], fy.x[0]], [fx.x[1], fy.x[1]]);
  const reduced = gaussReduce(cellPixels[0], cellPixels[1]);
  // Right-handed, as the sheets' reduced cells (src/lattice/reducedCell.ts).
  let [u, v] = [reduced.u, reduced.v];
  if (cross(u, v) < 0) [u, v] = [v, u];
  const recip = realCell(u, v); // the same relation inverts: reciprocal of a real cell (rad/pixel)
  return {
    vectors: [[u[0] * pixelSize, u[1] * pixelSize], [v[0] * pixelSize, v[1] * pixelSize]],
    reciprocalPixels: recip,
    a: centre[0], b: centre[1], gammaDeg: centre[2],
    aError: errors[0], bError: errors[1], gammaDegError: errors[2],
    peaks: m,
  };
}
