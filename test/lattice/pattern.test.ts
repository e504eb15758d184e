import { describe, expect, it } from 'vitest';
import { hnfRows, holeDensity, makePattern, patternCell, patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { cartesian } from '../../src/lattice/sheet.ts';
import { SQRT3 } from '../../src/lattice/triangular.ts';

// Published η and atoms per cell of the preset sheets.
const PUBLISHED: [string, number, number, string][] = [
  ['delta6', 0, 1, 'the filled triangular layer (common practice)'],
  ['alpha', 1 / 9, 8, 'Tang & Ismail-Beigi, PRL 99, 115501 (2007)'],
  ['beta12', 1 / 6, 5, 'Feng et al., Nat. Chem. 8, 563 (2016)'],
  ['chi3', 1 / 5, 4, 'Feng et al., Nat. Chem. 8, 563 (2016)'],
  ['honeycomb', 1 / 3, 2, 'boron layer of MgB2, AlB2 type (common practice)'],
];

describe('holeDensity(pattern) and patternToSheet(pattern) on the presets', () => {
  for (const [name, eta, atoms, source] of PUBLISHED) {
    it(`${name}: η = ${eta.toFixed(4)}, ${atoms} atoms per cell (${source})`, () => {
      const pattern = findSheetPreset(name)!.pattern;
      expect(holeDensity(pattern)).toBeCloseTo(eta, 14);
      expect(patternToSheet(pattern).atoms).toHaveLength(atoms);
    });
  }
});

describe('patternToSheet(pattern)', () => {
  it('puts every atom on a lattice site that is not vacant, each site once, z = 0', () => {
    const pattern = makePattern({ bond: 1.5, supercell: [[4, 0], [3, 3]], vacancies: [[0, 0], [2, 1], [5, 7]] });
    const sheet = patternToSheet(pattern);
    const sites = new Set<string>();
    sheet.atoms.forEach((atom, k) => {
      expect(atom[0] >= 0 && atom[0] < 1 && atom[1] >= 0 && atom[1] < 1 && atom[2] === 0).toBe(true);
      const [x, y] = cartesian(sheet, k);
      // Lattice coordinates from a1 = d(1, 0), a2 = d(1/2, √3/2).
      const j = y / (1.5 * SQRT3 / 2), i = x / 1.5 - j / 2;
      expect(Math.abs(i - Math.round(i)) + Math.abs(j - Math.round(j))).toBeLessThan(1e-9);
      sites.add(`${Math.round(i)},${Math.round(j)}`);
    });
    expect(sites.size).toBe(12 - 3);
    expect(sites.has('0,0') || sites.has('2,1')).toBe(false);
  });

  it('has the cell A1 = a·a1, A2 = b·a1 + c·a2', () => {
    const pattern = makePattern({ bond: 2, supercell: [[3, 0], [1, 2]], vacancies: [] });
    const [[ax, ay], [bx, by]] = patternCell(pattern);
    expect([ax, ay]).toEqual([6, 0]);
    expect(bx).toBeCloseTo(2 + 2, 12);
    expect(by).toBeCloseTo(2 * SQRT3, 12);
  });
});

describe('makePattern(parts)', () => {
  it('brings the rows to HNF and merges vacancies equal modulo the supercell (3a1 and a1 + a2 are supercell vectors)', () => {
    const pattern = makePattern({ bond: 1, supercell: [[1, 1], [-1, 2]], vacancies: [[0, 0], [3, 0], [2, 0], [1, 1]] });
    expect(hnfRows(pattern.supercell)).toEqual([[3, 0], [1, 1]]);
    expect(pattern.vacancies).toEqual([[0, 0], [2, 0]]);
  });

  it('throws on singular rows (untrusted input goes through src/io)', () => {
    expect(() => makePattern({ bond: 1, supercell: [[1, 2], [2, 4]], vacancies: [] })).toThrow();
  });
});
