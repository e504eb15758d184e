/**
 * A synthetic "measured" picture for demonstrations (DEMO, never a measurement): a model picture sampled on a pixel
 * grid rotated against the sheet, with a background plane and Gaussian noise added, as a real picture would come
 * with. Row 0 is the top row. The noise comes from a seeded generator (mulberry32, a public-domain PRNG), so a
 * demo is the same every time.
 */
import { evaluateStm, type StmModel } from './simulate.ts';
import type { Picture } from './stmImage.ts';

export interface Distortion {
  pixels: number;
  /** Å per pixel. */
  pixelSize: number;
  /** Rotation of the scan frame against the sheet (degrees). */
  angleDeg: number;
  /** Plane tilt across the picture, in units of the picture's own corrugation. */
  tilt: number;
  /** Gaussian noise σ in units of the corrugation. */
  noise: number;
  seed: number;
}

export const DEMO_LABEL = 'DEMO: synthetic picture, not a measurement';

export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The in-plane point (Å, the sheet's frame) under each pixel of a scan turned by d.angleDeg; row 0 at the top. */
export function scanPoints(d: Pick<Distortion, 'pixels' | 'pixelSize' | 'angleDeg'>): { x: Float64Array; y: Float64Array } {
  const n = d.pixels;
  const x = new Float64Array(n * n), y = new Float64Array(n * n);
  const c = Math.cos((d.angleDeg * Math.PI) / 180), s = Math.sin((d.angleDeg * Math.PI) / 180);
  for (let row = 0; row < n; row++) for (let col = 0; col < n; col++) {
    // An offset, so that no lattice site sits on the picture's corner.
    const u = (col + 0.5) * d.pixelSize + 0.37, v = (n - row - 0.5) * d.pixelSize - 1.1;
    x[row * n + col] = c * u - s * v;
    y[row * n + col] = s * u + c * v;
  }
  return { x, y };
}

/**
 * Adds to a clean picture, in units of its own corrugation (max − min): the tilt plane, Gaussian noise, and an
 * optional extra signal per pixel (e.g. a moiré modulation). In place; returns the picture.
 */
export function distort(values: Float64Array, d: Distortion, extra?: (pixel: number) => number): Picture {
  const n = d.pixels;
  let lo = Infinity, hi = -Infinity;
  for (const v of values) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  const range = hi - lo;
  const random = mulberry32(d.seed);
  for (let row = 0; row < n; row++) for (let col = 0; col < n; col++) {
    const k = row * n + col;
    // Box–Muller for the Gaussian noise.
    const g = Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
    values[k] += range * ((extra ? extra(k) : 0) + d.tilt * (0.8 * col + 0.6 * row) / n + d.noise * g);
  }
  return { width: n, height: n, pixelSize: d.pixelSize, values };
}

export function syntheticPicture(stm: StmModel, d: Distortion): Picture {
  const { x, y } = scanPoints(d);
  return distort(evaluateStm(stm, x, y, new Float64Array(d.pixels * d.pixels)), d);
}
