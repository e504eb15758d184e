/**
 * Test helpers for pictures: a seeded generator (mulberry32, a public-domain PRNG) and a synthetic measured picture
 * of a sheet's model image placed with any rotation, scale error, tilt and noise. Synthetic data, made in the tests.
 */
import type { Sheet } from '../../src/lattice/sheet.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { findParameterPreset, type ParameterSet } from '../../src/tb/params.ts';
import { evaluateStm, stmModel } from '../../src/stm/simulate.ts';
import type { Picture } from '../../src/stm/stmImage.ts';

export const PARAMS = findParameterPreset('harrison1980') as ParameterSet;

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

export interface Distortion {
  pixels: number;
  /** True Å per pixel. */
  pixelSize: number;
  angleDeg: number;
  /** Plane tilt across the picture, in units of the picture's own corrugation. */
  tilt: number;
  /** Gaussian noise σ in units of the corrugation. */
  noise: number;
  seed: number;
}

/** The sheet's constant-current model picture on a rotated pixel grid, with tilt and noise added (row 0 at the top). */
export function syntheticPicture(sheet: Sheet, d: Distortion): Picture {
  const stm = stmModel(new TightBindingModel(sheet, PARAMS), { mesh: 24 });
  const n = d.pixels;
  const x = new Float64Array(n * n), y = new Float64Array(n * n);
  const c = Math.cos((d.angleDeg * Math.PI) / 180), s = Math.sin((d.angleDeg * Math.PI) / 180);
  for (let row = 0; row < n; row++) for (let col = 0; col < n; col++) {
    const u = (col + 0.5) * d.pixelSize + 0.37, v = (n - row - 0.5) * d.pixelSize - 1.1;
    x[row * n + col] = c * u - s * v;
    y[row * n + col] = s * u + c * v;
  }
  const values = evaluateStm(stm, x, y, new Float64Array(n * n));
  let lo = Infinity, hi = -Infinity;
  for (const v of values) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  const range = hi - lo;
  const random = mulberry32(d.seed);
  for (let row = 0; row < n; row++) for (let col = 0; col < n; col++) {
    // Box–Muller for the Gaussian noise.
    const g = Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
    values[row * n + col] += range * (d.tilt * (0.8 * col + 0.6 * row) / n + d.noise * g);
  }
  return { width: n, height: n, pixelSize: d.pixelSize, values };
}
