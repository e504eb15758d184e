import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { reduceSite } from '../../src/lattice/hnf.ts';
import { hexagonalHoles, vacancyClusters } from '../../src/lattice/holes.ts';
import { makePattern } from '../../src/lattice/pattern.ts';
import { SHEET_PRESETS } from '../../src/lattice/presets.ts';
import { NEAREST_STEPS } from '../../src/lattice/triangular.ts';
import { patternArb } from './arbitraries.ts';

describe('hexagonalHoles(pattern)', () => {
  it('every preset hole is hexagonal: α (Tang & Ismail-Beigi 2007), β12 and χ3 (Feng et al. 2016), honeycomb', () => {
    for (const preset of SHEET_PRESETS) {
      expect(hexagonalHoles(preset.pattern)).toEqual(preset.pattern.vacancies);
    }
  });

  it('is exactly the vacancies whose six neighbour sites are filled (checked directly)', () => {
    fc.assert(fc.property(patternArb(20), (pattern) => {
      const h = pattern.supercell;
      const vacant = new Set(pattern.vacancies.map(([i, j]) => `${i},${j}`));
      const direct = pattern.vacancies.filter(([i, j]) =>
        NEAREST_STEPS.every(([di, dj]) => !vacant.has(reduceSite(h, i + di, j + dj).join(','))));
      expect(hexagonalHoles(pattern)).toEqual(direct);
    }), { numRuns: 500 });
  });
});

describe('vacancyClusters(pattern)', () => {
  it('a divacancy and a triangle of three in a 6×6 cell: sizes 2 and 3, bounded', () => {
    const pattern = makePattern({ bond: 1.7, supercell: [[6, 0], [0, 6]], vacancies: [[0, 0], [1, 0], [2, 2], [3, 2], [2, 3]] });
    const clusters = vacancyClusters(pattern);
    expect(clusters.map((c) => [c.size, c.periodic])).toEqual([[2, false], [3, false]]);
    expect(clusters[1].sites).toEqual([[2, 2], [3, 2], [2, 3]]);
    expect(hexagonalHoles(pattern)).toEqual([]);
  });

  it('an endless row: one vacancy in a 1×2 cell joins its image along a1', () => {
    const clusters = vacancyClusters(makePattern({ bond: 1.7, supercell: [[1, 0], [0, 2]], vacancies: [[0, 0]] }));
    expect(clusters).toEqual([{ sites: [[0, 0]], size: 1, periodic: true }]);
  });

  it('a row of two in a 2×3 cell (a full line along a1) is periodic; a pair in a 3×3 cell is not', () => {
    expect(vacancyClusters(makePattern({ bond: 1, supercell: [[2, 0], [0, 3]], vacancies: [[0, 0], [1, 0]] }))[0].periodic).toBe(true);
    expect(vacancyClusters(makePattern({ bond: 1, supercell: [[3, 0], [0, 3]], vacancies: [[0, 0], [1, 0]] }))[0].periodic).toBe(false);
  });

  it('partitions the vacancies: sizes add up, no site twice', () => {
    fc.assert(fc.property(patternArb(20), (pattern) => {
      const clusters = vacancyClusters(pattern);
      const all = clusters.flatMap((c) => c.sites.map((s) => s.join(',')));
      expect(new Set(all).size).toBe(pattern.vacancies.length);
      expect(clusters.reduce((sum, c) => sum + c.size, 0)).toBe(pattern.vacancies.length);
    }), { numRuns: 300 });
  });
});
