/**
 * fitExpansion(set, structures), leastSquares(…), predictStructures(fit, options): the fit against a known pair
 * model, the leave-one-out shortcut against refitting, the least squares against a general-purpose library, and
 * the cross-validation score against its analytic expectation as the training set grows.
 */
import { inverse, Matrix, pseudoInverse, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { clusterSet } from '../../../src/learn/expansion/clusters.ts';
import { CorrelationEngine } from '../../../src/learn/expansion/correlations.ts';
import { designMatrix, fitExpansion, isFitProblem, type ExpansionFit, type TrainingStructure } from '../../../src/learn/expansion/fit.ts';
import { leastSquares, quadraticForm } from '../../../src/learn/expansion/leastSquares.ts';
import { predictStructures } from '../../../src/learn/expansion/predict.ts';
import type { Pattern } from '../../../src/lattice/sheet.ts';
import { gaussian, KNOWN_ECI, pairModelEnergy, patternPool, shuffled } from './pairModel.ts';

const PAIRS_3 = clusterSet({ pairShells: 3, tripletShells: 0 });
const sitesOf = (p: Pattern) => p.supercell.a * p.supercell.c;
/** Training structures of the known pair model: energy per cell = sites × energy per site (brute force). */
const exact = (patterns: readonly Pattern[]): TrainingStructure[] => patterns.map((pattern) => ({ pattern, energy: sitesOf(pattern) * pairModelEnergy(pattern) }));
const fitted = (set: typeof PAIRS_3, training: TrainingStructure[]): ExpansionFit => {
  const fit = fitExpansion(set, training);
  if (isFitProblem(fit)) throw new Error(`unexpected ${fit.kind}`);
  return fit;
};

const POOL = shuffled(patternPool([1, 8], [0, 8]), 8);
/** Per-site energies of the known model, computed once per pattern of the pool. */
const TRUE_ENERGY = new Map(POOL.map((p) => [p, pairModelEnergy(p)]));

describe('fitExpansion on a known pair model', () => {
  const training = exact(POOL.slice(0, 12));
  const fit = fitted(PAIRS_3, training);

  it('recovers the ECIs of the model exactly from 12 structures (noise-free data, complete cluster set)', () => {
    Array.from(fit.eci).forEach((j, k) => expect(j, PAIRS_3.orbits[k].name).toBeCloseTo(KNOWN_ECI[k], 10));
    expect(fit.fitRms).toBeLessThan(1e-12);
    expect(fit.cvRms).toBeLessThan(1e-12);
  });

  it('reproduces the model on patterns outside the training set (9–11 sites; brute-force Cartesian pair sums)', () => {
    let checked = 0;
    let index = 0;
    for (const prediction of predictStructures(fit, { sites: [9, 11], holes: [0, 11] })) {
      if (index++ % 4 !== 0) continue; // a spread sample: the brute force is slow
      expect(prediction.energyPerSite).toBeCloseTo(pairModelEnergy(prediction.structure.pattern), 10);
      expect(prediction.energy).toBeCloseTo(prediction.structure.sites * prediction.energyPerSite, 10);
      checked++;
    }
    expect(checked).toBeGreaterThan(150);
  });

  it('refuses, rather than guesses, with fewer structures than clusters + 1 (p + 1 = 6 for the default set)', () => {
    expect(fitExpansion(PAIRS_3, training.slice(0, 5))).toEqual({ kind: 'too-few', structures: 5, needed: 6 });
  });

  it('names the first cluster the structures cannot determine: pair 1 when no two vacancies touch (Φ1 = 1 − 4η is linear in η; analytic)', () => {
    const isolated = exact(shuffled(patternPool([1, 12], [0, 4], true), 5).slice(0, 20));
    expect(isolated.length).toBe(20);
    expect(fitExpansion(PAIRS_3, isolated)).toEqual({ kind: 'dependent', orbit: 2 });
  });
});

describe('leastSquares against ml-matrix (a general-purpose library: its solve and pseudo-inverse)', () => {
  it('gives the same coefficients, hat-matrix diagonal and prediction variances', () => {
    const random = gaussian(3);
    const patterns = POOL.slice(0, 30);
    const x = designMatrix(new CorrelationEngine(PAIRS_3), patterns);
    const n = patterns.length;
    const p = PAIRS_3.orbits.length;
    const y = Float64Array.from(patterns, (q) => TRUE_ENERGY.get(q)! + 0.01 * random());
    const ours = leastSquares(x, y, n, p);
    const X = new Matrix(n, p);
    for (let i = 0; i < n; i++) for (let k = 0; k < p; k++) X.set(i, k, x[i + n * k]);
    const beta = solve(X, Matrix.columnVector(Array.from(y)));
    for (let k = 0; k < p; k++) expect(ours.coefficients[k]).toBeCloseTo(beta.get(k, 0), 9);
    const hat = X.mmul(pseudoInverse(X));
    for (let i = 0; i < n; i++) expect(ours.leverage[i]).toBeCloseTo(hat.get(i, i), 9);
    const gramInverse = inverse(X.transpose().mmul(X));
    const work = new Float64Array(p);
    for (const q of POOL.slice(30, 40)) {
      const row = Array.from(new CorrelationEngine(PAIRS_3).correlate(q.supercell, q.vacancies), (phi, k) => PAIRS_3.orbits[k].perSite * phi);
      const reference = Matrix.rowVector(row).mmul(gramInverse).mmul(Matrix.columnVector(row)).get(0, 0);
      expect(quadraticForm(ours.r, p, row, work)).toBeCloseTo(reference, 9);
    }
  });
});

describe('leave-one-out cross-validation', () => {
  it('the hat-matrix shortcut equals refitting without each structure in turn (independent route)', () => {
    const random = gaussian(11);
    const training = POOL.slice(0, 18).map((pattern) => ({ pattern, energy: sitesOf(pattern) * (TRUE_ENERGY.get(pattern)! + 0.004 * random()) }));
    const fit = fitted(PAIRS_3, training);
    let squares = 0;
    const engine = new CorrelationEngine(PAIRS_3);
    training.forEach((left, i) => {
      const refit = fitted(PAIRS_3, training.filter((_, k) => k !== i));
      const phi = engine.correlate(left.pattern.supercell, left.pattern.vacancies);
      const predicted = PAIRS_3.orbits.reduce((sum, o, k) => sum + o.perSite * refit.eci[k] * phi[k], 0);
      squares += (left.energy / sitesOf(left.pattern) - predicted) ** 2;
    });
    expect(fit.cvRms).toBeCloseTo(Math.sqrt(squares / training.length), 12);
  });

  it('falls as the training set grows, as its expectation σ²·mean(1/(1 − H_ii)) does (analytic: Var r_i = σ²(1 − H_ii) for least squares)', () => {
    const sigma = 0.003;
    const sizes = [8, 12, 20, 35, 60, 100];
    const means: number[] = [];
    for (const n of sizes) {
      const patterns = POOL.slice(0, n);
      const noise = gaussian(1000 + n);
      let sum = 0;
      const runs = 150;
      let expected = NaN;
      for (let run = 0; run < runs; run++) {
        const fit = fitted(PAIRS_3, patterns.map((pattern) => ({ pattern, energy: sitesOf(pattern) * (TRUE_ENERGY.get(pattern)! + sigma * noise()) })));
        sum += fit.cvRms ** 2;
        expected = (sigma ** 2 * Array.from(fit.solution.leverage).reduce((s, h) => s + 1 / (1 - h), 0)) / n;
      }
      const mean = sum / runs;
      expect(mean / expected, `n = ${n}`).toBeGreaterThan(0.8);
      expect(mean / expected, `n = ${n}`).toBeLessThan(1.2);
      means.push(Math.sqrt(mean));
    }
    for (let k = 1; k < means.length; k++) expect(means[k], `CV at n = ${sizes[k]} below n = ${sizes[k - 1]}`).toBeLessThan(means[k - 1]);
    expect(means[means.length - 1] / sigma).toBeLessThan(1.05); // tends to the noise itself
  });
});
