import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { sheetToCif } from '../../src/io/cif.ts';
import { sheetToXyz } from '../../src/io/xyz.ts';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { alignFirstVector, reducedSheet } from '../../src/lattice/reducedCell.ts';
import { cartesian } from '../../src/lattice/sheet.ts';
import { motionArb, moveSheet, patternArb } from '../lattice/arbitraries.ts';
import { readCif, readExtendedXyz } from './structureReaders.ts';

describe('sheetToXyz(sheet)', () => {
  it('writes the count, Lattice with the vacuum vector, Properties=species:S:1:pos:R:3, pbc="T T F"', () => {
    const text = sheetToXyz(patternToSheet(findSheetPreset('alpha')!.pattern));
    const read = readExtendedXyz(text);
    expect(text.split('\n')[0]).toBe('8');
    expect(read.comment.get('Properties')).toBe('species:S:1:pos:R:3');
    expect(read.comment.get('pbc')).toBe('T T F');
    expect(read.lattice[2]).toEqual([0, 0, 15]);
    expect(read.species).toEqual(Array(8).fill('B'));
    // α has a 3×3 cell of the triangular net (Tang & Ismail-Beigi, PRL 99, 115501 (2007)), so a = b = 3d; with the
    // presets' d = 1.69 Å (a bond length from memory, presets/sheets/alpha.json) that is 5.07 Å, at 120° reduced.
    expect(Math.hypot(...read.lattice[0])).toBeCloseTo(5.07, 7);
    expect(Math.hypot(...read.lattice[1])).toBeCloseTo(5.07, 7);
  });

  it('reads back to the export frame and agrees with the CIF reader, atom by atom', () => {
    fc.assert(fc.property(patternArb(12), motionArb, (pattern, motion) => {
      const sheet = moveSheet(patternToSheet(pattern), motion);
      const read = readExtendedXyz(sheetToXyz(sheet));
      const frame = alignFirstVector(reducedSheet(sheet));
      expect(read.lattice[0][0]).toBeCloseTo(frame.cell[0][0], 7);
      expect(read.lattice[0][1]).toBe(0);
      expect(read.lattice[1][0]).toBeCloseTo(frame.cell[1][0], 7);
      expect(read.lattice[1][1]).toBeCloseTo(frame.cell[1][1], 7);
      const cif = readCif(sheetToCif(sheet));
      read.positions.forEach((p, k) => {
        const [x, y, z] = cartesian(frame, k);
        expect(Math.hypot(p[0] - x, p[1] - y, p[2] - z)).toBeLessThan(1e-7);
        const q = cif.positions[k];
        expect(Math.hypot(p[0] - q[0], p[1] - q[1], p[2] - q[2])).toBeLessThan(1e-5);
      });
    }), { numRuns: 200 });
  });

  it('reduce: false writes the sheet\'s own cell, turned so that A1 lies along +x', () => {
    const sheet = patternToSheet(findSheetPreset('honeycomb')!.pattern);
    const read = readExtendedXyz(sheetToXyz(sheet, { reduce: false }));
    // Honeycomb preset HNF [[3, 0], [1, 1]]: A1 = 3d along x (d = 1.782 Å).
    expect(read.lattice[0]).toEqual([5.346, 0, 0]);
  });
});
