/**
 * CorrelationEngine.correlate(h, vacancies): correlation functions checked analytically on simple orderings, for
 * invariance under the choice of cell, translations and the operations of 6mm, and against the brute-force pair
 * sums of pairModel.ts.
 */
import { describe, expect, it } from 'vitest';
import { clusterSet } from '../../../src/learn/expansion/clusters.ts';
import { CorrelationEngine } from '../../../src/learn/expansion/correlations.ts';
import { makePattern } from '../../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../../src/lattice/presets.ts';
import type { Pattern } from '../../../src/lattice/sheet.ts';
import { apply, POINT_GROUP_6MM } from '../../../src/lattice/triangular.ts';
import { pairModelEnergy, patternPool } from './pairModel.ts';

const engine = new CorrelationEngine(clusterSet({ pairShells: 3, tripletShells: 2 }));
const correlate = (p: Pattern) => Array.from(engine.correlate(p.supercell, p.vacancies));
const preset = (name: string) => findSheetPreset(name)!.pattern;

describe('CorrelationEngine.correlate', () => {
  it('pure lattice: every correlation is 1 (all spins +1; analytic)', () => {
    for (const value of correlate(preset('delta6'))) expect(value).toBe(1);
  });

  it('honeycomb (η = 1/3, one vacancy in the √3×√3 cell): point 1/3, pairs −1/3, 1, −1/3, nearest-neighbour triangles −1 (worked by hand)', () => {
    // By hand: the three √3×√3 sublattices; vacancies fill one. Each nearest-neighbour and distance-2 step changes
    // sublattice, each √3 step keeps it. Nearest-neighbour bonds per site 3: B–V bonds 6·N/3 = 2N, V–V none,
    // B–B N, so Φ1 = (N − 2N)/3N = −1/3; likewise at distance 2; every √3 pair is alike, Φ2 = 1. Every
    // nearest-neighbour triangle holds one site of each sublattice, so one vacancy: product −1.
    const [empty, point, pair1, pair2, pair3, triangle] = correlate(preset('honeycomb'));
    expect([empty, point, pair1, pair2, pair3, triangle].map((x) => Number(x.toFixed(12)))).toEqual([1, 1 / 3, -1 / 3, 1, -1 / 3, -1].map((x) => Number(x.toFixed(12))));
  });

  it('α (η = 1/9, isolated vacancies): point 7/9, nearest-neighbour pair 5/9 (worked by hand)', () => {
    // By hand: B–V bonds 6·N/9, V–V none, B–B 3N − 2N/3; Φ1 = (7N/3 − 2N/3)/3N = 5/9.
    const [, point, pair1] = correlate(preset('alpha'));
    expect(point).toBeCloseTo(7 / 9, 14);
    expect(pair1).toBeCloseTo(5 / 9, 14);
  });

  it('any pattern of isolated vacancies: Φ1 = 1 − 4η (B–V bonds 6k, V–V none; analytic)', () => {
    for (const name of ['alpha', 'beta12', 'chi3', 'honeycomb']) {
      const p = preset(name);
      const eta = p.vacancies.length / (p.supercell.a * p.supercell.c);
      expect(correlate(p)[2], name).toBeCloseTo(1 - 4 * eta, 14);
    }
  });

  it('does not depend on the supercell: the same pattern in a 2×3 larger cell, in non-HNF rows (invariance)', () => {
    for (const name of ['alpha', 'beta12', 'chi3']) {
      const p = preset(name);
      const { a, b, c } = p.supercell;
      const big: [number, number][] = [];
      for (const [i, j] of p.vacancies) for (let m = 0; m < 2; m++) for (let l = 0; l < 3; l++) big.push([i + m * a + l * b, j + l * c]);
      const larger = makePattern({ bond: 1.69, supercell: [[2 * a, 0], [3 * b, 3 * c]], vacancies: big });
      const rows = makePattern({ bond: 1.69, supercell: [[a + b, c], [b, c]], vacancies: p.vacancies });
      expect(larger.supercell.a * larger.supercell.c).toBe(6 * a * c);
      for (const other of [larger, rows]) correlate(other).forEach((x, k) => expect(x, `${name} ${k}`).toBeCloseTo(correlate(p)[k], 13));
    }
  });

  it('does not depend on a translation or on any of the 12 operations of 6mm applied to the pattern (invariance)', () => {
    for (const p of patternPool([5, 9], [2, 3]).slice(0, 40)) {
      const reference = correlate(p);
      const rows: [[number, number], [number, number]] = [[p.supercell.a, 0], [p.supercell.b, p.supercell.c]];
      const moved = makePattern({ bond: 1.69, supercell: rows, vacancies: p.vacancies.map(([i, j]) => [i + 2, j - 5]) });
      correlate(moved).forEach((x, k) => expect(x).toBeCloseTo(reference[k], 13));
      for (const op of POINT_GROUP_6MM) {
        const image = makePattern({
          bond: 1.69,
          supercell: [apply(op, rows[0][0], rows[0][1]), apply(op, rows[1][0], rows[1][1])],
          vacancies: p.vacancies.map(([i, j]) => apply(op, i, j)),
        });
        correlate(image).forEach((x, k) => expect(x).toBeCloseTo(reference[k], 13));
      }
    }
  });

  it('Σ m·J·Φ equals the brute-force Cartesian pair sum of a pair model on every pattern up to 8 sites (independent route)', () => {
    const pairs = new CorrelationEngine(clusterSet({ pairShells: 3, tripletShells: 0 }));
    const eci = [0.3, -0.7, 0.11, -0.05, 0.023];
    for (const p of patternPool([1, 8], [0, 8])) {
      const phi = pairs.correlate(p.supercell, p.vacancies);
      const energy = pairs.set.orbits.reduce((sum, o, k) => sum + o.perSite * eci[k] * phi[k], 0);
      expect(energy).toBeCloseTo(pairModelEnergy(p, eci), 12);
    }
  });
});
