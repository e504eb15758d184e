/** Shared pieces of the calibrate tests: reference bands made by the model, invented parameter sets, noise. */
import { matchBands, type BandMatch } from '../../../src/learn/calibrate/bandMatch.ts';
import type { CalibrationSheet } from '../../../src/learn/calibrate/calibrate.ts';
import type { BandBlock } from '../../../src/learn/calibrate/parametricBands.ts';
import { computeBands } from '../../../src/tb/bands.ts';
import { TightBindingModel } from '../../../src/tb/model.ts';
import type { ReferenceBands } from '../../../src/learn/calibrate/referenceBands.ts';
import type { Sheet } from '../../../src/lattice/sheet.ts';
import { xorshift32 } from '../../../src/linalg/eighRandom.ts';
import { autoPath } from '../../../src/tb/kspacePath.ts';
import type { ParameterSet } from '../../../src/tb/params.ts';

/** Invented "true" parameters, unlike every named set (for fit-back tests only). */
export const TRUTH: ParameterSet = {
  name: 'invented-truth',
  source: 'invented for the tests',
  onsite: { s: -10.2, p: -5.1 },
  hopping: { ss_sigma: -4.4, sp_sigma: 5.6, pp_sigma: 6.9, pp_pi: -2.5 },
  d0: 1.69,
  exponent: 2,
  cutoff: 2.1,
};

/** A set with every integral times `factor` and both on-site energies moved by `move` eV: a start far from TRUTH. */
export function farFrom(set: ParameterSet, factor: number, move: number, name: string): ParameterSet {
  const { ss_sigma, sp_sigma, pp_sigma, pp_pi } = set.hopping;
  return {
    ...set,
    name,
    onsite: { s: set.onsite.s + move, p: set.onsite.p - move / 2 },
    hopping: { ss_sigma: factor * ss_sigma, sp_sigma: factor * sp_sigma, pp_sigma: factor * pp_sigma, pp_pi: factor * pp_pi },
  };
}

/** The β12 sheet with one atom raised 0.25 Å (as the DEMO sheet file): bonds of several lengths. */
export const BUCKLED: Sheet = {
  cell: [[5.07, 0], [0, 2.927187]],
  atoms: [[0.1666667, 0.5, 0], [0.3333333, 0, 0.25], [0.5, 0.5, 0], [0.6666667, 0, 0], [0.8333333, 0.5, 0]],
};

/**
 * Bands of `set` on the sheet's automatic path, `offset` added (a reference's own zero), optional noise. Made by
 * src/tb (TightBindingModel, computeBands), not by the fit's own ParametricBands, so a fit-back checks the two
 * against each other as well.
 */
export function modelReference(sheet: Sheet, set: ParameterSet, options: { points?: number; offset?: number; noise?: number; seed?: number } = {}): ReferenceBands {
  const path = autoPath(sheet.cell, options.points ?? 50);
  const bands = computeBands(new TightBindingModel(sheet, set), path.kpoints);
  const energies = bands.energies;
  const uniform = xorshift32(options.seed ?? 1);
  const normal = () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
  for (let i = 0; i < energies.length; i++) energies[i] += (options.offset ?? 0) + (options.noise ? options.noise * normal() : 0);
  for (let k = 0; k < bands.count; k++) energies.subarray(k * bands.bands, (k + 1) * bands.bands).sort();
  return { count: bands.count, bands: bands.bands, kpoints: path.kpoints, energies };
}

/** A calibration sheet with the default (lowest) match, or the one given. */
export function calibrationSheet(sheet: Sheet, reference: ReferenceBands, label: string, block: BandBlock = 'full', match?: BandMatch): CalibrationSheet {
  const modelBands = (block === 'full' ? 4 : block === 'sigma' ? 3 : 1) * sheet.atoms.length;
  return {
    sheet, label, reference, referenceLabel: `${label}.json`, block,
    match: match ?? matchBands(modelBands, reference.bands, {}, { model: 'model', reference: 'reference', file: 'file' }),
  };
}
