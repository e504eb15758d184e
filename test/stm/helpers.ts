/**
 * Test helpers for pictures: a seeded generator (mulberry32, a public-domain PRNG) and a synthetic measured picture
 * of a sheet's model image placed with any rotation, scale error, tilt and noise. Synthetic data, made in the tests.
 */
import type { Sheet, Vec2 } from '../../src/lattice/sheet.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { findParameterPreset, type ParameterSet } from '../../src/tb/params.ts';
import { evaluateStm, stmModel } from '../../src/stm/simulate.ts';
import { distort, scanPoints, syntheticPicture as makeSynthetic, type Distortion } from '../../src/stm/synthetic.ts';
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
  const count = d.pixels * d.pixels;
  const { x: px, y: py } = scanPoints(d);
  const det = M[0][0] * M[1][1] - M[0][1] * M[1][0];
  const x = new Float64Array(count), y = new Float64Array(count), f1 = new Float64Array(count), f2 = new Float64Array(count);
  for (let k = 0; k < count; k++) {
    // r = f1·M1 + f2·M2 → (f1, f2) by Cramer's rule; the sheet point is f1·S1 + f2·S2.
    const a = (px[k] * M[1][1] - py[k] * M[1][0]) / det, b = (M[0][0] * py[k] - M[0][1] * px[k]) / det;
    f1[k] = a; f2[k] = b;
    x[k] = a * S[0][0] + b * S[1][0];
    y[k] = a * S[0][1] + b * S[1][1];
  }
  const moire = (k: number) => d.moire * (Math.cos(2 * Math.PI * f1[k]) + Math.cos(2 * Math.PI * f2[k]) + Math.cos(2 * Math.PI * (f1[k] - f2[k]))) / 3;
  return distort(evaluateStm(stm, x, y, new Float64Array(count)), d, moire);
}
