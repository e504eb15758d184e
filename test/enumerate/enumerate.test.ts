import { describe, expect, it } from 'vitest';
import { canonicalForm } from '../../src/enumerate/canonical.ts';
import { enumerateStructures } from '../../src/enumerate/enumerate.ts';
import { inequivalentSupercells } from '../../src/enumerate/supercells.ts';
import type { Structure } from '../../src/enumerate/types.ts';
import { compareHnf } from '../../src/enumerate/supercells.ts';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { elongation } from '../../src/lattice/reduce.ts';
import { latticePoint, NEAREST_STEPS } from '../../src/lattice/triangular.ts';
import { siteIndex } from '../../src/lattice/hnf.ts';
import { bruteForceStructures, torusKeyOf } from './torusBruteForce.ts';

const list = (options: Parameters<typeof enumerateStructures>[0]) => [...enumerateStructures(options)];

describe('enumerateStructures(options) against an independent brute force', () => {
  it('finds exactly the brute-force structures for N ≤ 10, all k, with and without isolated holes (torus brute force, test/enumerate/torusBruteForce.ts)', () => {
    const all = list({ sites: [1, 10], holes: [0, 10] });
    const isolated = list({ sites: [1, 10], holes: [0, 10], isolated: true });
    for (let n = 1; n <= 10; n++) {
      const brute = bruteForceStructures(n);
      const keysOf = (structures: Structure[]) => structures
        .filter((s) => s.sites === n)
        .map((s) => `${s.holes}/${torusKeyOf(n, s.pattern.supercell, s.pattern.vacancies)}`)
        .sort();
      const expectedAll = [...brute].map(([key, s]) => `${s.holes}/${key}`).sort();
      const expectedIsolated = [...brute].filter(([, s]) => s.isolated).map(([key, s]) => `${s.holes}/${key}`).sort();
      expect(keysOf(all)).toEqual(expectedAll);
      expect(keysOf(isolated)).toEqual(expectedIsolated);
    }
  });
});

describe('enumerateStructures(options)', () => {
  it('yields structures ordered by N, then k, then supercell, then labeling', () => {
    const structures = list({ sites: [1, 9], holes: [0, 9] });
    const supercellRank = (s: Structure) =>
      inequivalentSupercells(s.sites).findIndex((h) => compareHnf(h, s.pattern.supercell) === 0);
    for (let t = 1; t < structures.length; t++) {
      const [x, y] = [structures[t - 1], structures[t]];
      const xs = x.pattern.vacancies.map(([i, j]) => j * x.pattern.supercell.a + i);
      const ys = y.pattern.vacancies.map(([i, j]) => j * y.pattern.supercell.a + i);
      const labeling = xs.findIndex((v, u) => v !== ys[u]);
      const order = x.sites - y.sites || x.holes - y.holes || supercellRank(x) - supercellRank(y) || xs[labeling] - ys[labeling];
      expect(order).toBeLessThan(0);
    }
  });

  it('describes each structure consistently: η = k/N, N − k atoms, canonical form of its own pattern, distinct forms', () => {
    const structures = list({ sites: [1, 11], holes: [0, 11] });
    for (const s of structures) {
      expect(s.eta).toBe(s.holes / s.sites);
      expect(s.pattern.supercell.a * s.pattern.supercell.c).toBe(s.sites);
      expect(s.pattern.vacancies).toHaveLength(s.holes);
      expect(patternToSheet(s.pattern).atoms).toHaveLength(s.sites - s.holes);
      expect(canonicalForm(s.pattern)).toBe(s.canonical);
      expect(s.pattern.bond).toBe(1.69);
    }
    expect(new Set(structures.map((s) => s.canonical)).size).toBe(structures.length);
  });

  it('with isolated: no vacancy has a vacancy (or its own image) as nearest neighbour (constraint definition)', () => {
    for (const s of list({ sites: [1, 16], holes: [1, 5], isolated: true })) {
      const h = s.pattern.supercell;
      const vacant = new Set(s.pattern.vacancies.map(([i, j]) => siteIndex(h, i, j)));
      for (const [i, j] of s.pattern.vacancies) {
        for (const [di, dj] of NEAREST_STEPS) expect(vacant.has(siteIndex(h, i + di, j + dj))).toBe(false);
      }
    }
  });

  it('with holeDensity: exactly the structures with η in range', () => {
    const every = list({ sites: [1, 10], holes: [0, 10] });
    const some = list({ sites: [1, 10], holes: [0, 10], holeDensity: [0.2, 1 / 3] });
    expect(some.map((s) => s.canonical)).toEqual(every.filter((s) => s.eta >= 0.2 && s.eta <= 1 / 3).map((s) => s.canonical));
    expect(some.length).toBeGreaterThan(0);
  });

  it('with maxElongation: exactly the structures whose reduced cell is at most that elongated', () => {
    const elongationOf = (s: Structure) => {
      const { a, b, c } = s.pattern.supercell;
      return elongation(latticePoint(a, 0, 1), latticePoint(b, c, 1));
    };
    const every = list({ sites: [1, 10], holes: [0, 4] });
    const some = list({ sites: [1, 10], holes: [0, 4], maxElongation: 1.6 });
    expect(some.map((s) => s.canonical)).toEqual(every.filter((s) => elongationOf(s) <= 1.6 + 1e-9).map((s) => s.canonical));
    expect(some.length).toBeLessThan(every.length);
    expect(list({ sites: [9, 9], holes: [1, 1], maxElongation: 1 }).map((s) => s.phase)).toEqual(['alpha']);
  });

  it('writes the given bond into each pattern', () => {
    const [honeycomb] = list({ sites: [3, 3], holes: [1, 1], isolated: true, bond: 1.782 });
    expect(honeycomb.pattern.bond).toBe(1.782);
    expect(patternToSheet(honeycomb.pattern).cell[0][0]).toBeCloseTo(3 * 1.782, 12);
  });

  it('reports progress: examined and fraction never decrease, fraction ends at 1', () => {
    const reports: { examined: number; found: number; fraction: number }[] = [];
    const found = list({ sites: [1, 20], holes: [0, 6], onProgress: (p) => reports.push({ ...p }) }).length;
    expect(reports.length).toBeGreaterThan(10);
    for (let t = 1; t < reports.length; t++) {
      expect(reports[t].examined).toBeGreaterThanOrEqual(reports[t - 1].examined);
      expect(reports[t].fraction).toBeGreaterThanOrEqual(reports[t - 1].fraction);
      expect(reports[t].fraction).toBeLessThanOrEqual(1);
    }
    expect(reports.at(-1)).toMatchObject({ fraction: 1, found });
  });
});

// Published η and atoms per cell of the named sheets (as in presets/sheets/*.json).
const PRESETS: [string, number, number, number, string][] = [
  ['delta6', 1, 0, 1, 'the filled triangular layer (common practice)'],
  ['alpha', 9, 1, 8, 'Tang & Ismail-Beigi, PRL 99, 115501 (2007)'],
  ['beta12', 6, 1, 5, 'Feng et al., Nat. Chem. 8, 563 (2016)'],
  ['chi3', 5, 1, 4, 'Feng et al., Nat. Chem. 8, 563 (2016)'],
  ['honeycomb', 3, 1, 2, 'boron layer of MgB2, AlB2 type (common practice)'],
];

describe('enumerateStructures(options) finds the named sheets', () => {
  for (const [name, sites, holes, atoms, source] of PRESETS) {
    it(`${name}: N = ${sites}, ${holes} isolated hole(s), η = ${holes}/${sites}, ${atoms} atoms per cell (${source})`, () => {
      const found = list({ sites: [sites, sites], holes: [holes, holes], isolated: true }).filter((s) => s.phase === name);
      expect(found).toHaveLength(1);
      expect(found[0].eta).toBeCloseTo(holes / sites, 14);
      expect(patternToSheet(found[0].pattern).atoms).toHaveLength(atoms);
    });
  }

  it('names no other structure with N ≤ 12', () => {
    const named = list({ sites: [1, 12], holes: [0, 12] }).filter((s) => s.phase !== undefined);
    expect(named.map((s) => s.phase).sort()).toEqual(['alpha', 'beta12', 'chi3', 'delta6', 'honeycomb']);
  });
});
