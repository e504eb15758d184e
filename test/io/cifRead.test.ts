import { describe, expect, it } from 'vitest';
import { parseCifText } from '../../src/io/cifRead.ts';
import { sheetToCif } from '../../src/io/cif.ts';
import { canonicalForm } from '../../src/enumerate/index.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { ValidationError } from '../../src/validate/invalid.ts';

describe('parseCifText(text)', () => {
  it('reads back every preset written by sheetToCif as the same vacancy pattern (round trip)', () => {
    for (const name of ['delta6', 'alpha', 'beta12', 'chi3', 'honeycomb']) {
      const pattern = findSheetPreset(name)!.pattern;
      const read = parseCifText(sheetToCif({ ...patternToSheet(pattern), name }));
      expect(read.pattern, name).toBeDefined();
      expect(canonicalForm(read.pattern!)).toBe(canonicalForm(pattern));
      expect(read.sheet.name).toBe(name);
    }
  });

  it('builds a along x and b at γ in the plane (orthogonalisation with a ∥ x, International Tables Vol. B; common practice)', () => {
    const cif = ['data_t', '_cell_length_a 3', '_cell_length_b 3', '_cell_length_c 15', '_cell_angle_alpha 90',
      '_cell_angle_beta 90', '_cell_angle_gamma 120', 'loop_', '_atom_site_label', '_atom_site_fract_x',
      '_atom_site_fract_y', '_atom_site_fract_z', 'B1 0 0 0', 'B2 0.3333333333 0.6666666667 0.98'].join('\n');
    const { sheet } = parseCifText(cif);
    expect(sheet.cell[0]).toEqual([3, 0]);
    expect(sheet.cell[1][0]).toBeCloseTo(-1.5, 12);
    expect(sheet.cell[1][1]).toBeCloseTo(1.5 * Math.sqrt(3), 12);
    // fract_z 0.98 of c = 15 Å is 0.3 Å below the plane.
    expect(sheet.atoms[1][2]).toBeCloseTo(-0.3, 12);
  });

  it('keeps only boron, drops standard uncertainties, reads loop rows split over lines', () => {
    const cif = ['data_x', '_cell_length_a 5.0(1)', '_cell_length_b 5', '_cell_length_c 20', '_cell_angle_gamma 90',
      'loop_', '_atom_site_type_symbol', '_atom_site_fract_x', '_atom_site_fract_y', '_atom_site_fract_z',
      'B 0 0 0', 'Ag 0.5 0.5', '0', 'B 0.5 0 0'].join('\n');
    const { sheet } = parseCifText(cif);
    expect(sheet.atoms).toHaveLength(2);
    expect(sheet.cell[0][0]).toBe(5);
  });

  it('names the item and the line of a bad field', () => {
    const bad = (text: string, pattern: RegExp) => {
      expect.assertions(2);
      try {
        parseCifText(text);
      } catch (error) {
        expect(error).toBeInstanceOf(ValidationError);
        expect((error as Error).message).toMatch(pattern);
      }
    };
    bad('data_x\n_cell_length_a abc\n', /invalid CIF _cell_length_a \(line 2\): "abc" \(not a number\)/);
  });

  it('refuses a non-slab cell, a file with no atoms loop, and text that is no CIF', () => {
    const head = 'data_x\n_cell_length_a 3\n_cell_length_b 3\n_cell_length_c 15\n';
    expect(() => parseCifText(`${head}_cell_angle_alpha 80\n`)).toThrow(/_cell_angle_alpha \(line 5\)/);
    expect(() => parseCifText(head)).toThrow(/invalid CIF _atom_site_fract_x/);
    expect(() => parseCifText('{"bond": 1.69}')).toThrow(/no data_ block/);
  });
});
