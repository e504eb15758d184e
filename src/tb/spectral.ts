/**
 * The spectral function of unfolded bands, A(k, E) = Σ_n W_n(k)·δ_w(E − E_n), on an energy grid along a path and
 * at one energy over a grid of k (a constant-energy cut: what a photoemission map at fixed binding energy shows).
 *
 * Broadening: the Gaussian δ_w(x) = exp(−(x/w)²)/(w·√π) of the DOS and the occupation (src/tb/dos.ts), w the
 * "Gaussian width". Units: states per eV per lattice site, one spin; ∫A(k, E) dE = Σ_n W_n(k) = 4(1 − η).
 * The σ part weights each state by its s + px + py weight (UnfoldResult.sigmaWeights); the π part is total − σ.
 * Layout: k-major, value[k·points + e] on the path; value[k] for a cut.
 *
 * Pictures. A grid samples A(k, E) at points; a band steeper than width/step in k, or narrower than the energy step,
 * then shows as beads or vanishes between samples. `spectralImage` and the `spread` of a cut give instead the mean
 * of A over each pixel: over an energy bin exactly (the Gaussian's integral, by erfc), and over the k step to second
 * order, by widening each state's Gaussian to w_eff² = w² + s²/6 where s is the change of its energy across one
 * step (a linear variation over a step is uniform in energy, variance s²/12, and δ_w has variance w²/2). The
 * spread is taken from the neighbours of the same band index (ascending order), so it is too large where bands
 * cross: the picture is a little wider there. The sums are unchanged: every state still carries its weight.
 */
import { erfc } from './erfc.ts';
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

/**
 * A(k, E0) and its σ part at every k of `result`: a constant-energy cut at E0 = `energy` eV; with `spread` (eV per
 * state, layout of `result`), the mean over each pixel (see above).
 */
export function constantEnergyCut(result: UnfoldResult, energy: number, width: number, spread?: Float64Array): { total: Float64Array; sigma: Float64Array } {
  const total = new Float64Array(result.count);
  const sigma = new Float64Array(result.count);
  for (let k = 0; k < result.count; k++) {
    let t = 0;
    let s = 0;
    for (let n = 0, row = k * result.bands; n < result.bands; n++, row++) {
      const w = spread ? Math.sqrt(width * width + (spread[row] * spread[row]) / 6) : width;
      const x = energy - result.energies[row];
      if (x > GAUSSIAN_RANGE * w || x < -GAUSSIAN_RANGE * w) continue;
      const g = Math.exp(-(x / w) * (x / w)) / (w * Math.sqrt(Math.PI));
      t += result.weights[row] * g;
      s += result.sigmaWeights[row] * g;
    }
    total[k] = t;
    sigma[k] = s;
  }
  return { total, sigma };
}

/**
 * The mean of A(k, E) over `rows` equal energy bins from `low` to `high` (eV) at every k of `result`, k-major
 * (bin 0 lowest): Σ_n W_n·(Φ(upper) − Φ(lower))/bin, Φ the Gaussian's integral ½·erfc(−x/w). With `spread`, each
 * state's width is widened for its change across a k step (see above).
 */
export function spectralImage(
  result: UnfoldResult, low: number, high: number, rows: number, width: number, spread?: Float64Array,
): { total: Float64Array; sigma: Float64Array } {
  const total = new Float64Array(result.count * rows);
  const sigma = new Float64Array(result.count * rows);
  const bin = (high - low) / rows;
  for (let k = 0; k < result.count; k++) {
    const base = k * rows;
    for (let n = 0, row = k * result.bands; n < result.bands; n++, row++) {
      const weight = result.weights[row];
      if (weight === 0) continue;
      const w = spread ? Math.sqrt(width * width + (spread[row] * spread[row]) / 6) : width;
      const e = result.energies[row];
      const first = Math.max(0, Math.floor((e - GAUSSIAN_RANGE * w - low) / bin));
      const last = Math.min(rows - 1, Math.floor((e + GAUSSIAN_RANGE * w - low) / bin));
      let below = 0.5 * erfc(-(low + first * bin - e) / w);
      for (let r = first; r <= last; r++) {
        const above = 0.5 * erfc(-(low + (r + 1) * bin - e) / w);
        const share = (above - below) / bin;
        below = above;
        total[base + r] += weight * share;
        sigma[base + r] += result.sigmaWeights[row] * share;
      }
    }
  }
  return { total, sigma };
}

/** Per state on a path, half the change of its energy from the previous to the next point (one step's change). */
export function pathSpread(result: UnfoldResult): Float64Array {
  const spread = new Float64Array(result.count * result.bands);
  const bands = result.bands;
  for (let k = 0; k < result.count; k++) {
    const before = Math.max(0, k - 1);
    const after = Math.min(result.count - 1, k + 1);
    if (after === before) continue;
    for (let n = 0; n < bands; n++) {
      spread[k * bands + n] = Math.abs(result.energies[after * bands + n] - result.energies[before * bands + n]) / (after - before);
    }
  }
  return spread;
}

/**
 * Per state on a square k grid (side × side pixels, `pixel[p]` the k-point of pixel p or −1, as src/tb/unfoldZone.ts),
 * the change of its energy across one pixel: the length of the gradient from neighbouring pixels (central where
 * both lie in the zone, else one-sided) times the pixel size.
 */
export function gridSpread(result: UnfoldResult, pixel: Int32Array, side: number): Float64Array {
  const bands = result.bands;
  const spread = new Float64Array(result.count * bands);
  const done = new Uint8Array(result.count);
  const at = (i: number, j: number) => (i >= 0 && i < side && j >= 0 && j < side ? pixel[j * side + i] : -1);
  for (let p = 0; p < side * side; p++) {
    const k = pixel[p];
    if (k < 0 || done[k]) continue;
    done[k] = 1;
    const i = p % side;
    const j = (p - i) / side;
    const left = at(i - 1, j), right = at(i + 1, j), up = at(i, j - 1), down = at(i, j + 1);
    for (let n = 0; n < bands; n++) {
      const e = result.energies[k * bands + n];
      const gx = oneStep(result.energies, bands, n, e, left, right);
      const gy = oneStep(result.energies, bands, n, e, up, down);
      spread[k * bands + n] = Math.sqrt(gx * gx + gy * gy);
    }
  }
  return spread;
}

/** The change of band n across one step between neighbours `before` and `after` (−1: outside), e at the centre. */
function oneStep(energies: Float64Array, bands: number, n: number, e: number, before: number, after: number): number {
  if (before >= 0 && after >= 0) return (energies[after * bands + n] - energies[before * bands + n]) / 2;
  if (after >= 0) return energies[after * bands + n] - e;
  if (before >= 0) return e - energies[before * bands + n];
  return 0;
}
