import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { HermitianEigensolver } from '../../src/linalg/eigh.ts';
import {
  type ComplexMatrix, embeddingEigenvalues, frobenius, orthonormalityError, randomHermitian, randomUnitary,
  residual, trace, withSpectrum,
} from './eighChecks.ts';

interface Solved {
  values: Float64Array;
  vecRe: Float64Array;
  vecIm: Float64Array;
  valuesOnly: Float64Array;
}

function solve(h: ComplexMatrix, solver = new HermitianEigensolver(h.n)): Solved {
  const { n } = h;
  const values = new Float64Array(n);
  const vecRe = new Float64Array(n * n);
  const vecIm = new Float64Array(n * n);
  solver.eigensystem(h.re, h.im, values, vecRe, vecIm);
  const valuesOnly = solver.eigenvalues(h.re, h.im, new Float64Array(n));
  return { values, vecRe, vecIm, valuesOnly };
}

/** The invariants asked of every answer: ascending, HV = VΛ, V†V = I, Σλ = tr H, both entry points agree. */
function expectInvariants(h: ComplexMatrix, s: Solved): void {
  const { n } = h;
  // Tolerances: backward-stable Householder + QR gives errors of order n·ε·‖H‖ (Golub & Van Loan, Matrix Computations, 4th ed., §8.3; from memory).
  const size = Math.max(frobenius(h), Number.MIN_VALUE);
  for (let m = 1; m < n; m++) {
    expect(s.values[m]).toBeGreaterThanOrEqual(s.values[m - 1]);
    expect(s.valuesOnly[m]).toBeGreaterThanOrEqual(s.valuesOnly[m - 1]);
  }
  expect(residual(h, s.values, s.vecRe, s.vecIm)).toBeLessThanOrEqual(1e-10 * size);
  expect(orthonormalityError(n, s.vecRe, s.vecIm)).toBeLessThanOrEqual(1e-12);
  let sum = 0;
  for (let m = 0; m < n; m++) sum += s.values[m];
  expect(Math.abs(sum - trace(h))).toBeLessThanOrEqual(1e-10 * size);
  for (let m = 0; m < n; m++) expect(Math.abs(s.valuesOnly[m] - s.values[m])).toBeLessThanOrEqual(1e-12 * size);
}

describe('HermitianEigensolver', () => {
  it('eigenvalues(re, im, out) match ml-matrix on the real embedding [[A, −B], [B, A]], each value twice', () => {
    // Standard linear algebra: H = A + iB and the 2n×2n real embedding share the spectrum, doubled.
    for (const n of [1, 2, 3, 7, 16, 40]) {
      const h = randomHermitian(n, 100 + n);
      const values = new HermitianEigensolver(n).eigenvalues(h.re, h.im, new Float64Array(n));
      const doubled = embeddingEigenvalues(h);
      for (let m = 0; m < n; m++) {
        expect(Math.abs(values[m] - doubled[2 * m])).toBeLessThanOrEqual(1e-12 * frobenius(h));
        expect(Math.abs(values[m] - doubled[2 * m + 1])).toBeLessThanOrEqual(1e-12 * frobenius(h));
      }
    }
  });

  it('eigensystem on random Hermitian matrices, n = 1…32, keeps every invariant (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 32 }), fc.integer({ min: 1, max: 2 ** 31 }), (n, seed) => {
        const h = randomHermitian(n, seed);
        expectInvariants(h, solve(h));
      }),
      { numRuns: 60 },
    );
  });

  it('eigensystem on random Hermitian matrices, n = 33…128, keeps every invariant (property, few runs)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 33, max: 128 }), fc.integer({ min: 1, max: 2 ** 31 }), (n, seed) => {
        const h = randomHermitian(n, seed);
        expectInvariants(h, solve(h));
      }),
      { numRuns: 6 },
    );
  });

  it('2×2 [[a, b − ic], [b + ic, d]] gives (a+d)/2 ± √(((a−d)/2)² + b² + c²)', () => {
    // Analytic: characteristic polynomial of a 2×2 Hermitian matrix (common practice).
    fc.assert(
      fc.property(
        fc.double({ min: -10, max: 10, noNaN: true }), fc.double({ min: -10, max: 10, noNaN: true }),
        fc.double({ min: -10, max: 10, noNaN: true }), fc.double({ min: -10, max: 10, noNaN: true }),
        (a, b, c, d) => {
          const h = { n: 2, re: new Float64Array([a, b, b, d]), im: new Float64Array([0, -c, c, 0]) };
          const s = solve(h);
          const mean = (a + d) / 2;
          const radius = Math.hypot((a - d) / 2, b, c);
          const tolerance = 1e-14 * (Math.abs(mean) + radius + 1);
          expect(Math.abs(s.values[0] - (mean - radius))).toBeLessThanOrEqual(tolerance);
          expect(Math.abs(s.values[1] - (mean + radius))).toBeLessThanOrEqual(tolerance);
          expectInvariants(h, s);
        },
      ),
      { numRuns: 100 },
    );
  });

  it('Hermitian circulant ring with hopping t·e^{iθ} has eigenvalues 2t·cos(θ + 2πm/n)', () => {
    // Analytic: eigenvalues of a circulant are Σ_j c_j ω^{jm}, ω = e^{2πi/n} (Gray, "Toeplitz and Circulant
    // Matrices: A Review", Found. Trends Commun. Inf. Theory 2(3), 2006, ch. 3).
    for (const [n, t, theta] of [[6, 1, 0.3], [24, -1.7, 1.1], [64, 0.5, 0], [128, 2, 0.05]] as const) {
      const re = new Float64Array(n * n);
      const im = new Float64Array(n * n);
      for (let r = 0; r < n; r++) {
        const c = (r + 1) % n;
        re[r * n + c] += t * Math.cos(theta);
        im[r * n + c] += t * Math.sin(theta);
        re[c * n + r] += t * Math.cos(theta);
        im[c * n + r] -= t * Math.sin(theta);
      }
      const h = { n, re, im };
      const expected = Array.from({ length: n }, (_, m) => 2 * t * Math.cos(theta + (2 * Math.PI * m) / n));
      expected.sort((x, y) => x - y);
      const s = solve(h);
      for (let m = 0; m < n; m++) expect(Math.abs(s.values[m] - expected[m])).toBeLessThanOrEqual(1e-12 * n);
      expectInvariants(h, s);
    }
  });

  it('diagonal matrices give the sorted diagonal and unit eigenvectors', () => {
    // Analytic (common practice): a diagonal matrix is its own eigendecomposition.
    const diagonal = [3, -1, 0.5, -1, 7, 0, 2.25];
    const n = diagonal.length;
    const re = new Float64Array(n * n);
    diagonal.forEach((v, i) => (re[i * n + i] = v));
    const h = { n, re, im: new Float64Array(n * n) };
    const s = solve(h);
    expect(Array.from(s.values)).toEqual([...diagonal].sort((x, y) => x - y));
    for (let m = 0; m < n; m++) {
      let largest = 0;
      for (let r = 0; r < n; r++) largest = Math.max(largest, Math.hypot(s.vecRe[r * n + m], s.vecIm[r * n + m]));
      expect(largest).toBeCloseTo(1, 14);
    }
    expectInvariants(h, s);
  });

  it('degenerate spectra U·diag(λ)·U† recover the repeated values with an orthonormal basis', () => {
    // U is a product of Householder reflectors, unitary by construction (Golub & Van Loan, Matrix Computations, 4th ed., §5.1).
    for (const [n, pattern] of [[8, [1, 1, 1, -2, -2, 5, 5, 5]], [30, null], [64, null]] as const) {
      const spectrum = pattern ? [...pattern] : Array.from({ length: n }, (_, i) => Math.floor(i / 4) - 3);
      const h = withSpectrum(randomUnitary(n, 7 + n), spectrum);
      const s = solve(h);
      const expected = [...spectrum].sort((x, y) => x - y);
      for (let m = 0; m < n; m++) expect(Math.abs(s.values[m] - expected[m])).toBeLessThanOrEqual(1e-12 * n);
      expectInvariants(h, s);
    }
  });

  it('the zero matrix gives zero eigenvalues and a unitary V', () => {
    for (const n of [1, 5, 33]) {
      const h = { n, re: new Float64Array(n * n), im: new Float64Array(n * n) };
      const s = solve(h);
      expect(Array.from(s.values)).toEqual(new Array(n).fill(0));
      expect(orthonormalityError(n, s.vecRe, s.vecIm)).toBe(0);
    }
  });

  it('1×1 returns its entry and the eigenvector 1', () => {
    const s = solve({ n: 1, re: new Float64Array([-4.5]), im: new Float64Array([0]) });
    expect(s.values[0]).toBe(-4.5);
    expect(s.valuesOnly[0]).toBe(-4.5);
    expect(Math.hypot(s.vecRe[0], s.vecIm[0])).toBe(1);
  });

  it('real symmetric input matches ml-matrix EigenvalueDecomposition directly', () => {
    for (const n of [4, 20, 50]) {
      const h = randomHermitian(n, 900 + n);
      h.im.fill(0);
      const s = solve(h);
      // The real embedding of a real matrix is block diagonal [[A, 0], [0, A]]: each value twice.
      const reference = embeddingEigenvalues(h);
      for (let m = 0; m < n; m++) expect(Math.abs(s.values[m] - reference[2 * m])).toBeLessThanOrEqual(1e-12 * n);
      expectInvariants(h, s);
    }
  });

  it('scaled inputs (1e-8, 1e8, and 1e-300, 1e300 past the square-safe range) scale the eigenvalues', () => {
    // Analytic: eigenvalues of c·H are c·λ(H) (common practice).
    const n = 20;
    const base = solve(randomHermitian(n, 55));
    for (const scale of [1e-8, 1e8, 1e-300, 1e300]) {
      const h = randomHermitian(n, 55, scale);
      const s = solve(h);
      for (let m = 0; m < n; m++) {
        expect(Math.abs(s.values[m] / scale - base.values[m])).toBeLessThanOrEqual(1e-12 * n);
        expect(Math.abs(s.valuesOnly[m] / scale - base.values[m])).toBeLessThanOrEqual(1e-12 * n);
      }
      expect(orthonormalityError(n, s.vecRe, s.vecIm)).toBeLessThanOrEqual(1e-12);
      if (scale >= 1e-8 && scale <= 1e8) expectInvariants(h, s);
    }
  });

  it('leaves its inputs untouched', () => {
    const h = randomHermitian(17, 3);
    const re = h.re.slice();
    const im = h.im.slice();
    solve(h);
    expect(h.re).toEqual(re);
    expect(h.im).toEqual(im);
  });

  it('one solver reused across many matrices gives the same answers as fresh solvers', () => {
    const n = 24;
    const solver = new HermitianEigensolver(n);
    const first = randomHermitian(n, 1);
    const before = solve(first, solver);
    for (let seed = 2; seed < 40; seed++) solve(randomHermitian(n, seed), solver);
    const after = solve(first, solver);
    const fresh = solve(first);
    for (const s of [after, fresh]) {
      expect(s.values).toEqual(before.values);
      expect(s.valuesOnly).toEqual(before.valuesOnly);
      expect(s.vecRe).toEqual(before.vecRe);
      expect(s.vecIm).toEqual(before.vecIm);
    }
  });

  it('NaN or infinite entries give the NaN sentinel in every output instead of throwing', () => {
    const n = 6;
    const cases: [number, number, number][] = [[2, 1, NaN], [3, 3, NaN], [4, 0, Infinity], [5, 5, -Infinity]];
    for (const [r, c, bad] of cases) {
      const h = randomHermitian(n, 4);
      h.re[r * n + c] = bad;
      h.re[c * n + r] = bad;
      const s = solve(h);
      expect(Array.from(s.values).every(Number.isNaN)).toBe(true);
      expect(Array.from(s.valuesOnly).every(Number.isNaN)).toBe(true);
      expect(Array.from(s.vecRe).every(Number.isNaN)).toBe(true);
      expect(Array.from(s.vecIm).every(Number.isNaN)).toBe(true);
    }
  });

  it('n = 0 is a no-op', () => {
    const out = new Float64Array(0);
    expect(new HermitianEigensolver(0).eigenvalues(new Float64Array(0), new Float64Array(0), out)).toBe(out);
  });
});
