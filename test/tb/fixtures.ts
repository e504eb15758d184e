/** Shared test fixtures: preset sheets, parameter sets with changes, small linear-algebra helpers. */
import { makePattern, patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import type { Sheet } from '../../src/lattice/sheet.ts';
import { HermitianEigensolver } from '../../src/linalg/eigh.ts';
import type { HamiltonianBlock, TightBindingModel } from '../../src/tb/model.ts';
import { findParameterPreset, type ParameterSet } from '../../src/tb/params.ts';

export function presetSheet(name: string): Sheet {
  const preset = findSheetPreset(name);
  if (!preset) throw new Error(`no preset ${name}`);
  return patternToSheet(preset.pattern);
}

export function patternSheet(bond: number, supercell: [[number, number], [number, number]], vacancies: [number, number][]): Sheet {
  return patternToSheet(makePattern({ bond, supercell, vacancies }));
}

export const HARRISON_1980 = findParameterPreset('harrison1980') as ParameterSet;

/** A copy of a parameter set with some values replaced (invented values, for analytic checks only). */
export function withParameters(
  base: ParameterSet,
  changes: { onsite?: Partial<ParameterSet['onsite']>; hopping?: Partial<ParameterSet['hopping']>; name?: string },
): ParameterSet {
  return {
    ...base,
    name: changes.name ?? `${base.name}-modified`,
    onsite: { ...base.onsite, ...changes.onsite },
    hopping: { ...base.hopping, ...changes.hopping },
  };
}

/** Ascending eigenvalues of one block of H(k). */
export function blockEigenvalues(model: TightBindingModel, kx: number, ky: number, block: HamiltonianBlock): Float64Array {
  const n = model.size(block);
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  model.hamiltonian(kx, ky, block, re, im);
  return new HermitianEigensolver(n).eigenvalues(re, im, new Float64Array(n));
}

export function maxDifference(a: ArrayLike<number>, b: ArrayLike<number>): number {
  if (a.length !== b.length) return Infinity;
  let worst = 0;
  for (let i = 0; i < a.length; i++) worst = Math.max(worst, Math.abs(a[i] - b[i]));
  return worst;
}

/** The sheet with cell and atoms rotated by `angle` (radians) about z; fractional coordinates unchanged. */
export function rotateSheet(sheet: Sheet, angle: number): Sheet {
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  const turn = ([x, y]: [number, number]): [number, number] => [c * x - s * y, s * x + c * y];
  return { cell: [turn(sheet.cell[0]), turn(sheet.cell[1])], atoms: sheet.atoms.map((a) => [a[0], a[1], a[2]]) };
}
