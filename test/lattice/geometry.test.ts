import fc from 'fast-check';
import { rotateSheet } from '../tb/fixtures.ts';
import { describe, expect, it } from 'vitest';
import {
  bondCutoff, coordinationHistogram, estimateHoleDensity, patternCoordination, sheetCoordination,
} from '../../src/lattice/geometry.ts';
import { holeDensity, patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset, SHEET_PRESETS } from '../../src/lattice/presets.ts';
import type { Sheet } from '../../src/lattice/sheet.ts';
import { patternArb } from './arbitraries.ts';

describe('patternCoordination(pattern)', () => {
  it('equals neighbours within 1.2 d of the explicit sheet, atom by atom', () => {
    fc.assert(fc.property(patternArb(20), (pattern) => {
      const sheet = patternToSheet(pattern);
      expect([...patternCoordination(pattern)]).toEqual([...sheetCoordination(sheet, 1.2 * pattern.bond)]);
    }), { numRuns: 300 });
  });

  it('α: six atoms 5-coordinated and two 6-coordinated (by hand on the 3×3 cell)', () => {
    expect(coordinationHistogram(patternCoordination(findSheetPreset('alpha')!.pattern))).toEqual([0, 0, 0, 0, 0, 6, 2]);
  });

  it('β12 (Feng et al. 2016): two 4-, two 5- and one 6-coordinated atom per cell', () => {
    // Counted by hand on rows (3, 0), (−1, 2) with the hole at 0: (0, 1) and (−1, 1) touch holes 0 and (−1, 2);
    // (±1, 0) touch hole 0 only; (1, 1) touches none.
    expect(coordinationHistogram(patternCoordination(findSheetPreset('beta12')!.pattern))).toEqual([0, 0, 0, 0, 2, 2, 1]);
  });
});

describe('bondCutoff(sheet)', () => {
  it('is 1.2 × the shortest separation', () => {
    expect(bondCutoff(patternToSheet(findSheetPreset('honeycomb')!.pattern))).toBeCloseTo(1.2 * 1.782, 12);
  });
});

describe('estimateHoleDensity(sheet)', () => {
  it('is exact on the presets (their published η)', () => {
    for (const preset of SHEET_PRESETS) {
      const estimate = estimateHoleDensity(patternToSheet(preset.pattern));
      expect(estimate.exact).toBe(true);
      expect(estimate.eta).toBeCloseTo(holeDensity(preset.pattern), 12);
      expect(estimate.bond).toBeCloseTo(preset.pattern.bond, 10);
      // Rotated by 0.7 rad: the same structure, the same η (η = vacancies / sites, DESIGN.md conventions).
      expect(estimateHoleDensity(rotateSheet(patternToSheet(preset.pattern), 0.7)).eta).toBeCloseTo(holeDensity(preset.pattern), 10);
    }
  });

  it('estimates η of a distorted α sheet near 1/9 (Tang & Ismail-Beigi 2007) from its areal density', () => {
    const alpha = patternToSheet(findSheetPreset('alpha')!.pattern);
    // Atoms displaced by up to 0.02 Å, far beyond the recognition tolerance: not recognised.
    const shaken: Sheet = { ...alpha, atoms: alpha.atoms.map(([f1, f2, z], k) => [f1 + 0.004 * Math.sin(k), f2 + 0.004 * Math.cos(3 * k), z]) };
    const estimate = estimateHoleDensity(shaken);
    expect(estimate.exact).toBe(false);
    expect(estimate.eta).toBeCloseTo(1 / 9, 1);
  });
});
