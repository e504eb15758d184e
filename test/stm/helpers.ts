/**
 * Test helpers for pictures: a seeded generator (mulberry32, a public-domain PRNG) and a synthetic measured picture
 * of a sheet's model image placed with any rotation, scale error, tilt and noise. Synthetic data, made in the tests.
 */
import type { Sheet } from '../../src/lattice/sheet.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { findParameterPreset, type ParameterSet } from '../../src/tb/params.ts';
import { stmModel } from '../../src/stm/simulate.ts';
import { syntheticPicture as makeSynthetic, type Distortion } from '../../src/stm/synthetic.ts';
import type { Picture } from '../../src/stm/stmImage.ts';

export const PARAMS = findParameterPreset('harrison1980') as ParameterSet;

export { mulberry32 } from '../../src/stm/synthetic.ts';
export type { Distortion } from '../../src/stm/synthetic.ts';

/** The sheet's constant-current model picture on a rotated pixel grid, with tilt and noise added (row 0 at the top). */
export function syntheticPicture(sheet: Sheet, d: Distortion): Picture {
  return makeSynthetic(stmModel(new TightBindingModel(sheet, PARAMS), { mesh: 24 }), d);
}
