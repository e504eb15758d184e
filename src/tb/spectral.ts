/**
 * The spectral function of unfolded bands, A(k, E) = Σ_n W_n(k)·δ_w(E − E_n), on an energy grid along a path and
 * at one energy over a grid of k (a constant-energy cut: what a photoemission map at fixed binding energy shows).
 *
 * Broadening: the Gaussian δ_w(x) = exp(−(x/w)²)/(w·√π) of the DOS and the occupation (src/tb/dos.ts), w the
 * "Gaussian width". Units: states per eV per lattice site, one spin; ∫A(k, E) dE = Σ_n W_n(k) = 4(1 − η).
 * The σ part weights each state by its s + px + py weight (UnfoldResult.sigmaWeights); the π part is total − σ.
 * Layout: k-major, value[k·points + e] on the path; value[k] for a cut.
 */
import type { UnfoldResult } from './unfold.ts';

/** The Gaussian is cut at this many widths (exp(−64) ≈ 1.6e-28). */
const GAUSSIAN_RANGE = 8;

/** A(k, E) and its σ part on an energy grid. */
export interface SpectralFunction {
  /** Grid energies (eV), ascending and evenly spaced. */
  energies: Float64Array;
  /** k-points (count) × energies, k-major. */
  total: Float64Array;
  sigma: Float64Array;
  /** Gaussian width (eV). */
  width: number;
}

/** `points` evenly spaced energies from `low` to `high` (eV). */
export function spectralEnergies(low: number, high: number, points: number): Float64Array {
  const grid = new Float64Array(points);
  for (let i = 0; i < points; i++) grid[i] = points > 1 ? low + ((high - low) * i) / (points - 1) : low;
  return grid;
}

/** The lowest and highest state of an unfolding, widened by `margin` eV. */
export function unfoldedRange(result: UnfoldResult, margin = 1): [number, number] {
  let low = Infinity;
  let high = -Infinity;
  for (const e of result.energies) {
    if (e < low) low = e;
    if (e > high) high = e;
  }
  return [low - margin, high + margin];
}

/** A(k, E) on `energies` (even, ascending grid) at every k of `result`, Gaussian width `width` eV. */
export function spectralFunction(result: UnfoldResult, energies: Float64Array, width: number): SpectralFunction {
  const points = energies.length;
  const total = new Float64Array(result.count * points);
  const sigma = new Float64Array(result.count * points);
  const step = points > 1 ? energies[1] - energies[0] : 1;
  const start = energies[0];
  const norm = 1 / (width * Math.sqrt(Math.PI));
  for (let k = 0; k < result.count; k++) {
    const base = k * points;
    for (let n = 0, row = k * result.bands; n < result.bands; n++, row++) {
      const w = result.weights[row];
      if (w === 0) continue;
      const e = result.energies[row];
      const ws = result.sigmaWeights[row];
      const first = Math.max(0, Math.ceil((e - GAUSSIAN_RANGE * width - start) / step));
      const last = Math.min(points - 1, Math.floor((e + GAUSSIAN_RANGE * width - start) / step));
      for (let i = first; i <= last; i++) {
        const x = (energies[i] - e) / width;
        const g = norm * Math.exp(-x * x);
        total[base + i] += w * g;
        sigma[base + i] += ws * g;
      }
    }
  }
  return { energies, total, sigma, width };
}

/** A(k, E0) and its σ part at every k of `result`: a constant-energy cut at E0 = `energy` eV. */
export function constantEnergyCut(result: UnfoldResult, energy: number, width: number): { total: Float64Array; sigma: Float64Array } {
  const total = new Float64Array(result.count);
  const sigma = new Float64Array(result.count);
  const norm = 1 / (width * Math.sqrt(Math.PI));
  const reach = GAUSSIAN_RANGE * width;
  for (let k = 0; k < result.count; k++) {
    let t = 0;
    let s = 0;
    for (let n = 0, row = k * result.bands; n < result.bands; n++, row++) {
      const x = energy - result.energies[row];
      if (x > reach || x < -reach) continue;
      const g = norm * Math.exp(-(x / width) * (x / width));
      t += result.weights[row] * g;
      s += result.sigmaWeights[row] * g;
    }
    total[k] = t;
    sigma[k] = s;
  }
  return { total, sigma };
}
