import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { canonicalForm } from '../../src/enumerate/canonical.ts';
import { patternCoordination } from '../../src/lattice/geometry.ts';
import { makePattern, patternToSheet } from '../../src/lattice/pattern.ts';
import { SHEET_PRESETS } from '../../src/lattice/presets.ts';
import { sheetToPattern } from '../../src/lattice/recognise.ts';
import type { Sheet } from '../../src/lattice/sheet.ts';
import { motionArb, moveSheet, patternArb } from './arbitraries.ts';
import { patternsEquivalent, ROTATIONS } from './equivalent.ts';

const hasNearestPair = (pattern: Parameters<typeof patternCoordination>[0]) => patternCoordination(pattern).some((k) => k > 0);

describe('sheetToPattern(sheet)', () => {
  for (const preset of SHEET_PRESETS) {
    it(`recovers the ${preset.name} preset from its explicit sheet, up to a rotation and translation`, () => {
      const found = sheetToPattern(patternToSheet(preset.pattern))!;
      expect(found.name).toBe(preset.name);
      expect(patternsEquivalent(found, preset.pattern, ROTATIONS)).toBe(true);
    });
  }

  it('round trip pattern → explicit (turned, shifted, lifted, in another basis) → pattern gives an equivalent pattern', () => {
    fc.assert(fc.property(patternArb(16).filter(hasNearestPair), motionArb, (pattern, motion) => {
      const found = sheetToPattern(moveSheet(patternToSheet(pattern), motion));
      expect(found).toBeDefined();
      expect(patternsEquivalent(found!, pattern, ROTATIONS)).toBe(true);
      // Cross-check with the enumerator's independent canonical form (src/enumerate/canonical.ts).
      expect(canonicalForm(found!)).toBe(canonicalForm(pattern));
    }), { numRuns: 500 });
  });

  it('a mirrored sheet is recognised as the mirror pattern (equivalent under the 12 operations of 6mm)', () => {
    fc.assert(fc.property(patternArb(12).filter(hasNearestPair), motionArb, (pattern, motion) => {
      const found = sheetToPattern(moveSheet(patternToSheet(pattern), { ...motion, mirror: true }))!;
      expect(patternsEquivalent(found, pattern)).toBe(true);
    }), { numRuns: 200 });
  });

  it('no nearest-neighbour pair: a coarser lattice describing the same structure', () => {
    // 2×2 cell with three vacancies: the atoms form a triangular lattice of spacing 2d (analytic).
    const pattern = makePattern({ bond: 1.5, supercell: [[2, 0], [0, 2]], vacancies: [[1, 0], [0, 1], [1, 1]] });
    const found = sheetToPattern(patternToSheet(pattern))!;
    expect(found.bond).toBeCloseTo(3, 12);
    expect(found.supercell).toEqual({ a: 1, b: 0, c: 1 });
  });

  it('refuses sheets off a triangular lattice: square lattice, buckled, displaced atom, rectangular cell', () => {
    expect(sheetToPattern({ cell: [[2, 0], [0, 2]], atoms: [[0, 0, 0]] })).toBeUndefined();
    const alpha = patternToSheet(SHEET_PRESETS.find((p) => p.name === 'alpha')!.pattern);
    const buckled: Sheet = { ...alpha, atoms: alpha.atoms.map(([f1, f2], k) => [f1, f2, k === 0 ? 0.3 : 0]) };
    expect(sheetToPattern(buckled)).toBeUndefined();
    const displaced: Sheet = { ...alpha, atoms: alpha.atoms.map(([f1, f2, z], k) => [k === 3 ? f1 + 0.01 : f1, f2, z]) };
    expect(sheetToPattern(displaced)).toBeUndefined();
    // Within the tolerance (1e-4 of a 5 Å cell = 5e-4 Å < 1e-3 Å) it is still α.
    const nudged: Sheet = { ...alpha, atoms: alpha.atoms.map(([f1, f2, z], k) => [k === 3 ? f1 + 1e-4 : f1, f2, z]) };
    expect(sheetToPattern(nudged)).toBeDefined();
    // A centred rectangular cell that is not triangular (2.5 ≠ √3·1.69).
    expect(sheetToPattern({ cell: [[1.69, 0], [0, 2.5]], atoms: [[0, 0, 0], [0.5, 0.5, 0]] })).toBeUndefined();
    // …but with the height √3·1.69 it is the filled triangular lattice in a rectangular 2-site cell (analytic).
    const rectangular = sheetToPattern({ cell: [[1.69, 0], [0, 1.69 * Math.sqrt(3)]], atoms: [[0, 0, 0], [0.5, 0.5, 0]] })!;
    expect(rectangular.supercell.a * rectangular.supercell.c).toBe(2);
    expect(rectangular.vacancies).toEqual([]);
  });
});

describe('sheetToPattern(sheet, tolerance, maxSites)', () => {
  it('gives up on supercells past maxSites (two atoms in a 590 × 590 cell would be 348,100 sites)', () => {
    const d = 1.69, n = 590;
    const sparse: Sheet = { cell: [[n * d, 0], [(n * d) / 2, (n * d * Math.sqrt(3)) / 2]], atoms: [[0, 0, 0], [1 / n, 0, 0]] };
    expect(sheetToPattern(sparse)).toBeUndefined();
    expect(sheetToPattern(sparse, 1e-3, n * n)!.vacancies).toHaveLength(n * n - 2);
  });
});
