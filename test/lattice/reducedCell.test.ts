import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { alignFirstVector, cellMetrics, reducedSheet, wrapFraction } from '../../src/lattice/reducedCell.ts';
import { nearestDistances } from '../../src/lattice/separation.ts';
import { cartesian, signedArea, type Sheet } from '../../src/lattice/sheet.ts';
import { motionArb, moveSheet, patternArb } from './arbitraries.ts';

/** Is the Cartesian vector w a lattice vector of the cell? */
function isLatticeVector(cell: Sheet['cell'], wx: number, wy: number): boolean {
  const [[ax, ay], [bx, by]] = cell;
  const det = ax * by - ay * bx;
  const m = (wx * by - wy * bx) / det, n = (ax * wy - ay * wx) / det;
  return Math.abs(m - Math.round(m)) < 1e-8 && Math.abs(n - Math.round(n)) < 1e-8;
}

describe('cellMetrics(cell)', () => {
  it('hexagonal cell: a = b, γ = 120°, area (√3/2)·a² (analytic)', () => {
    const m = cellMetrics([[3, 0], [-1.5, 1.5 * Math.sqrt(3)]]);
    expect(m.a).toBeCloseTo(3, 12);
    expect(m.b).toBeCloseTo(3, 12);
    expect(m.gammaDeg).toBeCloseTo(120, 10);
    expect(m.area).toBeCloseTo((Math.sqrt(3) / 2) * 9, 12);
  });
});

describe('reducedSheet(sheet)', () => {
  it('the honeycomb preset ([[3, 0], [1, 1]], γ = 30°) becomes the hexagonal cell a = b = √3·d, γ = 120°', () => {
    const reduced = reducedSheet(patternToSheet(findSheetPreset('honeycomb')!.pattern));
    const m = cellMetrics(reduced.cell);
    // MgB2 boron layer: a = √3·d = 3.0865 Å for d = 1.782 Å (Nagamatsu et al. 2001, a = 3.086 Å, from memory).
    expect(m.a).toBeCloseTo(Math.sqrt(3) * 1.782, 12);
    expect(m.b).toBeCloseTo(Math.sqrt(3) * 1.782, 12);
    expect(m.gammaDeg).toBeCloseTo(120, 9);
    expect(signedArea(reduced.cell)).toBeGreaterThan(0);
  });

  it('same lattice and atoms (modulo the lattice), right-handed, γ in [90°, 120°], fractions in [0, 1)', () => {
    fc.assert(fc.property(patternArb(12), motionArb, (pattern, motion) => {
      const sheet = moveSheet(patternToSheet(pattern), motion);
      const reduced = reducedSheet(sheet);
      const before = cellMetrics(sheet.cell), after = cellMetrics(reduced.cell);
      expect(after.area).toBeCloseTo(before.area, 9);
      expect(signedArea(reduced.cell)).toBeGreaterThan(0);
      expect(after.gammaDeg).toBeGreaterThanOrEqual(90 - 1e-9);
      expect(after.gammaDeg).toBeLessThanOrEqual(120 + 1e-9);
      for (const v of reduced.cell) expect(isLatticeVector(sheet.cell, v[0], v[1])).toBe(true);
      reduced.atoms.forEach(([g1, g2, z], k) => {
        expect(g1 >= 0 && g1 < 1 && g2 >= 0 && g2 < 1).toBe(true);
        const [x, y] = cartesian(reduced, k);
        const [x0, y0, z0] = cartesian(sheet, k);
        expect(z).toBe(z0);
        expect(isLatticeVector(sheet.cell, x - x0, y - y0)).toBe(true);
      });
      // The nearest-neighbour distances do not depend on the cell chosen.
      const d0 = nearestDistances(sheet), d1 = nearestDistances(reduced);
      d0.forEach((d, k) => expect(d1[k]).toBeCloseTo(d, 9));
    }), { numRuns: 300 });
  });
});

describe('alignFirstVector(sheet)', () => {
  it('turns the first vector onto +x, keeps lengths, angle and fractional coordinates', () => {
    const sheet: Sheet = { cell: [[1, 2], [-3, 1]], atoms: [[0.2, 0.7, 0.1]] };
    const aligned = alignFirstVector(sheet);
    expect(aligned.cell[0][1]).toBe(0);
    expect(aligned.cell[0][0]).toBeCloseTo(Math.sqrt(5), 12);
    const m0 = cellMetrics(sheet.cell), m1 = cellMetrics(aligned.cell);
    expect(m1.b).toBeCloseTo(m0.b, 12);
    expect(m1.gammaDeg).toBeCloseTo(m0.gammaDeg, 10);
    expect(aligned.atoms).toEqual(sheet.atoms);
    expect(signedArea(aligned.cell)).toBeCloseTo(signedArea(sheet.cell), 12);
  });
});

describe('wrapFraction(f)', () => {
  it('maps to [0, 1), with −0, −1e−17 and 1 to 0', () => {
    expect(Object.is(wrapFraction(-0), 0)).toBe(true);
    expect(wrapFraction(-1e-17)).toBe(0);
    expect(wrapFraction(1)).toBe(0);
    expect(wrapFraction(2.25)).toBe(0.25);
    expect(wrapFraction(-0.25)).toBe(0.75);
  });
});
