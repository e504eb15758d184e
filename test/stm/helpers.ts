/**
 * Test helpers for pictures: a seeded generator (mulberry32, a public-domain PRNG) and a synthetic measured picture
 * of a sheet's model image placed with any rotation, scale error, tilt and noise. Synthetic data, made in the tests.
 */
import type { Sheet, Vec2 } from '../../src/lattice/sheet.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { findParameterPreset, type ParameterSet } from '../../src/tb/params.ts';
import { evaluateStm, stmModel } from '../../src/stm/simulate.ts';
import { mulberry32, syntheticPicture as makeSynthetic, type Distortion } from '../../src/stm/synthetic.ts';
import type { Picture } from '../../src/stm/stmImage.ts';

export const PARAMS = findParameterPreset('harrison1980') as ParameterSet;

export { mulberry32 } from '../../src/stm/synthetic.ts';
export type { Distortion } from '../../src/stm/synthetic.ts';

/** The sheet's constant-current model picture on a rotated pixel grid, with tilt and noise added (row 0 at the top). */
export function syntheticPicture(sheet: Sheet, d: Distortion): Picture {
  return makeSynthetic(stmModel(new TightBindingModel(sheet, PARAMS), { mesh: 24 }), d);
}

/**
 * A synthetic picture of a sheet lying on a metal in a coincidence cell (DEMO geometry, made in the test): the sheet's
 * model picture strained so that its supercell S (rows, Å, the sheet's frame) fills the metal supercell M (rows, Å),
 * plus a moiré modulation of `moire` × the sheet's corrugation with M's periodicity, on a pixel grid turned by
 * `angleDeg`, with tilt and noise as syntheticPicture.
 */
export function moirePicture(sheet: Sheet, S: [Vec2, Vec2], M: [Vec2, Vec2], d: Distortion & { moire: number }): Picture {
  const stm = stmModel(new TightBindingModel(sheet, PARAMS), { mesh: 24 });
  const n = d.pixels;
  const det = M[0][0] * M[1][1] - M[0][1] * M[1][0];
  const c = Math.cos((d.angleDeg * Math.PI) / 180), s = Math.sin((d.angleDeg * Math.PI) / 180);
  const x = new Float64Array(n * n), y = new Float64Array(n * n), f1 = new Float64Array(n * n), f2 = new Float64Array(n * n);
  for (let row = 0; row < n; row++) for (let col = 0; col < n; col++) {
    const u = (col + 0.5) * d.pixelSize + 0.37, v = (n - row - 0.5) * d.pixelSize - 1.1;
    const px = c * u - s * v, py = s * u + c * v;
    // r = f1·M1 + f2·M2 → (f1, f2) by Cramer's rule; the sheet point is f1·S1 + f2·S2.
    const a = (px * M[1][1] - py * M[1][0]) / det, b = (M[0][0] * py - M[0][1] * px) / det;
    const k = row * n + col;
    f1[k] = a; f2[k] = b;
    x[k] = a * S[0][0] + b * S[1][0];
    y[k] = a * S[0][1] + b * S[1][1];
  }
  const values = evaluateStm(stm, x, y, new Float64Array(n * n));
  let lo = Infinity, hi = -Infinity;
  for (const v of values) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  const range = hi - lo;
  const random = mulberry32(d.seed);
  for (let row = 0; row < n; row++) for (let col = 0; col < n; col++) {
    const k = row * n + col;
    const g = Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
    const moire = (Math.cos(2 * Math.PI * f1[k]) + Math.cos(2 * Math.PI * f2[k]) + Math.cos(2 * Math.PI * (f1[k] - f2[k]))) / 3;
    values[k] += range * (d.moire * moire + d.tilt * (0.8 * col + 0.6 * row) / n + d.noise * g);
  }
  return { width: n, height: n, pixelSize: d.pixelSize, values };
}
