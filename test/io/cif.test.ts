import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { sheetToCif } from '../../src/io/cif.ts';
import { DEFAULT_VACUUM } from '../../src/io/exportFrame.ts';
import { ValidationError } from '../../src/validate/invalid.ts';
import { makePattern, patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { alignFirstVector, cellMetrics, reducedSheet } from '../../src/lattice/reducedCell.ts';
import { nearestDistances } from '../../src/lattice/separation.ts';
import { cartesian, type Sheet } from '../../src/lattice/sheet.ts';
import { motionArb, moveSheet, patternArb } from '../lattice/arbitraries.ts';
import { readCif } from './structureReaders.ts';

/** The sheet a reader sees: its cell's first two rows and its atoms, as an explicit Sheet. */
function sheetFromRead(read: ReturnType<typeof readCif>): Sheet {
  const [[ax, ay], [bx, by]] = read.lattice;
  const det = ax * by - ay * bx;
  return {
    cell: [[ax, ay], [bx, by]],
    atoms: read.positions.map(([x, y, z]) => [(x * by - y * bx) / det, (ax * y - ay * x) / det, z]),
  };
}

describe('sheetToCif(sheet) on the MgB2 honeycomb', () => {
  // MgB2, AlB2 type, P6/mmm: a = 3.086 Å, γ = 120°, B at 2d (1/3, 2/3, 1/2), (2/3, 1/3, 1/2)
  // (Nagamatsu et al., Nature 410, 63 (2001); Wyckoff 2d of P6/mmm, International Tables Vol. A; from memory).
  // Our hole (the Mg column) is at the origin and the sheet at z = 0, so the B sites read (1/3, 2/3, 0), (2/3, 1/3, 0).
  const a = 3.086;
  const honeycomb = makePattern({ name: 'MgB2 layer', bond: a / Math.sqrt(3), supercell: [[1, 1], [-1, 2]], vacancies: [[0, 0]] });
  const read = readCif(sheetToCif(patternToSheet(honeycomb)));

  it('writes a = b = 3.086 Å, γ = 120°, α = β = 90°, c = the default vacuum of 15 Å', () => {
    expect(read.values.get('_cell_length_a')).toBe('3.086000');
    expect(read.values.get('_cell_length_b')).toBe('3.086000');
    expect(read.values.get('_cell_angle_gamma')).toBe('120.000000');
    expect(read.values.get('_cell_angle_alpha')).toBe('90');
    expect(read.values.get('_cell_angle_beta')).toBe('90');
    expect(Number(read.values.get('_cell_length_c'))).toBe(DEFAULT_VACUUM);
    // V = (√3/2)·a²·c (analytic).
    expect(Number(read.values.get('_cell_volume'))).toBeCloseTo((Math.sqrt(3) / 2) * a * a * 15, 5);
  });

  it('puts the two B atoms at (1/3, 2/3, 0) and (2/3, 1/3, 0), type B, space group P 1', () => {
    const text = sheetToCif(patternToSheet(honeycomb));
    expect(text).toMatch(/^data_MgB2_layer$/m);
    expect(text).toMatch(/^_symmetry_space_group_name_H-M 'P 1'$/m);
    expect(text).toMatch(/^_space_group_symop_operation_xyz\n'x, y, z'$/m);
    expect(text).toMatch(/^B1 B 0\.33333333 0\.66666667 0\.00000000$/m);
    expect(text).toMatch(/^B2 B 0\.66666667 0\.33333333 0\.00000000$/m);
    expect(read.species).toEqual(['B', 'B']);
  });
});

describe('sheetToCif(sheet) read back', () => {
  it('reduced (default): the reader gets the reduced cell and the atoms turned rigidly onto it', () => {
    fc.assert(fc.property(patternArb(12), motionArb, (pattern, motion) => {
      const sheet = moveSheet(patternToSheet(pattern), motion);
      const read = readCif(sheetToCif(sheet));
      const expected = alignFirstVector(reducedSheet(sheet));
      const m0 = cellMetrics(expected.cell), m1 = cellMetrics(sheetFromRead(read).cell);
      expect(m1.a).toBeCloseTo(m0.a, 5);
      expect(m1.b).toBeCloseTo(m0.b, 5);
      expect(m1.gammaDeg).toBeCloseTo(m0.gammaDeg, 5);
      read.positions.forEach((position, k) => {
        const [x, y, z] = cartesian(expected, k);
        expect(Math.hypot(position[0] - x, position[1] - y, position[2] - z)).toBeLessThan(1e-5);
      });
      // A rigid motion keeps every nearest-neighbour distance (buckling included).
      const d0 = nearestDistances(sheet), d1 = nearestDistances(sheetFromRead(read));
      d0.forEach((d, k) => expect(d1[k]).toBeCloseTo(d, 5));
    }), { numRuns: 200 });
  });

  it('reduce: false keeps the sheet\'s own cell; a left-handed one is read as the sheet turned about a (heights negated)', () => {
    const beta12 = patternToSheet(findSheetPreset('beta12')!.pattern);
    const leftHanded: Sheet = { cell: [beta12.cell[1], beta12.cell[0]], atoms: beta12.atoms.map(([f1, f2], k) => [f2, f1, k === 0 ? 0.4 : 0]) };
    for (const sheet of [beta12, leftHanded]) {
      const read = readCif(sheetToCif(sheet, { reduce: false }));
      const m0 = cellMetrics(sheet.cell);
      expect(Number(read.values.get('_cell_length_a'))).toBeCloseTo(m0.a, 6);
      expect(Number(read.values.get('_cell_length_b'))).toBeCloseTo(m0.b, 6);
      expect(Number(read.values.get('_cell_angle_gamma'))).toBeCloseTo(m0.gammaDeg, 6);
      const d0 = nearestDistances(sheet), d1 = nearestDistances(sheetFromRead(read));
      d0.forEach((d, k) => expect(d1[k]).toBeCloseTo(d, 5));
    }
    const read = readCif(sheetToCif(leftHanded, { reduce: false }));
    expect(read.positions[0][2]).toBeCloseTo(-0.4, 6);
  });

  it('vacuum: any length above the thickness + 0.5 Å; refused below', () => {
    const sheet: Sheet = { cell: [[3, 0], [0, 3]], atoms: [[0, 0, 0.5], [0.5, 0.5, -0.5]] };
    expect(readCif(sheetToCif(sheet, { vacuum: 20 })).values.get('_cell_length_c')).toBe('20.000000');
    expect(() => sheetToCif(sheet, { vacuum: 1.2 })).toThrow(ValidationError);
    expect(() => sheetToCif(sheet, { vacuum: NaN })).toThrow(/^invalid vacuum: NaN/);
  });

  it('data block name: unsafe characters replaced, "sheet" when unnamed', () => {
    expect(sheetToCif({ name: 'my sheet\n#1', cell: [[2, 0], [0, 2]], atoms: [[0, 0, 0]] })).toMatch(/^data_my_sheet__1\n/);
    expect(sheetToCif({ cell: [[2, 0], [0, 2]], atoms: [[0, 0, 0]] })).toMatch(/^data_sheet\n/);
  });
});
