/**
 * The real symmetric eigenvalue kernel (src/linalg/symmetricEigenvalues.ts) against analytic spectra and against
 * ml-matrix's EigenvalueDecomposition (a general-purpose reference library), on both routes of its reduction
 * (WebAssembly SIMD and TypeScript).
 */
import fc from 'fast-check';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { xorshift32 } from '../../src/linalg/eighRandom.ts';
import { SYMMETRIC_SIMD_FROM, SymmetricEigenvalues } from '../../src/linalg/symmetricEigenvalues.ts';

function solveOn(matrix: number[][], simd: boolean): Float64Array {
  const n = matrix.length;
  const solver = new SymmetricEigenvalues(n, { simd });
  expect(solver.simd).toBe(simd && n >= 3);
  return solver.eigenvalues(Float64Array.from(matrix.flat()), new Float64Array(n));
}

/** A random orthogonal matrix: a product of n Householder reflections I − 2vvᵀ/vᵀv (orthogonal by construction). */
function randomOrthogonal(n: number, seed: number): number[][] {
  const uniform = xorshift32(seed);
  const q = Array.from({ length: n }, (_, r) => Array.from({ length: n }, (_, c): number => (r === c ? 1 : 0)));
  for (let k = 0; k < n; k++) {
    const v = Array.from({ length: n }, () => 2 * uniform() - 1);
    const vv = v.reduce((sum, x) => sum + x * x, 0);
    for (const row of q) {
      const dot = row.reduce((sum, x, i) => sum + x * v[i], 0);
      for (let i = 0; i < n; i++) row[i] -= (2 * dot * v[i]) / vv;
    }
  }
  return q;
}

function reference(matrix: number[][]): number[] {
  return new EigenvalueDecomposition(new Matrix(matrix)).realEigenvalues.sort((a, b) => a - b);
}

const maxError = (a: ArrayLike<number>, b: ArrayLike<number>) => Math.max(0, ...Array.from(a, (x, i) => Math.abs(x - b[i])));

for (const simd of [true, false]) {
  const solve = (matrix: number[][]) => solveOn(matrix, simd);
  describe(`SymmetricEigenvalues (${simd ? 'SIMD' : 'TypeScript'} reduction)`, () => {
    it('the tridiagonal Toeplitz matrix (2 on the diagonal, −1 beside it) has 2 − 2cos(jπ/(n+1)) (analytic)', () => {
      for (const n of [1, 2, 3, 10, 57]) {
        const m = Array.from({ length: n }, (_, r) => Array.from({ length: n }, (_, c) => (r === c ? 2 : Math.abs(r - c) === 1 ? -1 : 0)));
        const exact = Array.from({ length: n }, (_, j) => 2 - 2 * Math.cos(((j + 1) * Math.PI) / (n + 1)));
        expect(maxError(solve(m), exact)).toBeLessThan(1e-13);
      }
    });

    it('a dense matrix J − I (all ones less the identity) has n − 1 once and −1 n − 1 times (analytic, degenerate)', () => {
      const n = 12;
      const m = Array.from({ length: n }, (_, r) => Array.from({ length: n }, (_, c) => (r === c ? 0 : 1)));
      const exact = [...Array(n - 1).fill(-1), n - 1];
      expect(maxError(solve(m), exact)).toBeLessThan(1e-13);
    });

    it('random symmetric matrices: the eigenvalues of ml-matrix, at any scale (property)', () => {
      fc.assert(fc.property(
        fc.integer({ min: 1, max: 40 }),
        fc.integer({ min: 1, max: 2 ** 30 }),
        fc.constantFrom(1, 1e-200, 1e200),
        (n, seed, scale) => {
          let s = seed;
          const next = () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648) * 2 - 1;
          const m = Array.from({ length: n }, () => new Array<number>(n).fill(0));
          for (let r = 0; r < n; r++) for (let c = 0; c <= r; c++) m[r][c] = m[c][r] = next();
          const ours = solve(m.map((row) => row.map((x) => x * scale)));
          const exact = reference(m);
          const norm = Math.max(1, ...exact.map(Math.abs));
          return maxError(Array.from(ours, (x) => x / scale), exact) < 1e-12 * norm * n;
        },
      ), { numRuns: 60 });
    });

    it('only the lower triangle is read, and the input is untouched', () => {
      const m = Float64Array.of(2, 99, 99, 1, 3, 99, 0, 1, 4);
      const copy = Float64Array.from(m);
      const ours = new SymmetricEigenvalues(3, { simd }).eigenvalues(m, new Float64Array(3));
      expect(maxError(ours, reference([[2, 1, 0], [1, 3, 1], [0, 1, 4]]))).toBeLessThan(1e-13);
      expect(Array.from(m)).toEqual(Array.from(copy));
    });

    it('a NaN or infinite entry gives NaN everywhere (the sentinel of the complex kernel); n = 0 does nothing', () => {
      expect(Array.from(solve([[1, 0], [NaN, 1]])).every(Number.isNaN)).toBe(true);
      expect(Array.from(solve([[Infinity, 0], [0, 1]])).every(Number.isNaN)).toBe(true);
      expect(new SymmetricEigenvalues(0, { simd }).eigenvalues(new Float64Array(0), new Float64Array(0))).toHaveLength(0);
    });

    it('a spectrum with clusters, Q·diag(λ)·Qᵀ with Q orthogonal: λ back (analytic), n = 3…41', () => {
      for (const n of [3, 4, 5, 8, 23, 41]) {
        const spectrum = Array.from({ length: n }, (_, i) => Math.floor(i / 3) - 2);
        const q = randomOrthogonal(n, 7 + n);
        const m = q.map((row) => q.map((other) => row.reduce((sum, x, i) => sum + x * spectrum[i] * other[i], 0)));
        expect(maxError(solve(m), spectrum)).toBeLessThan(1e-13 * n);
      }
    });

    it('block diagonal (a column needing no reflector mid-way), graded, and blocks coupled by 1e-300: ml-matrix', () => {
      const uniform = xorshift32(99);
      const randomMatrix = (n: number) => {
        const m = Array.from({ length: n }, () => new Array<number>(n).fill(0));
        for (let r = 0; r < n; r++) for (let c = 0; c <= r; c++) m[r][c] = m[c][r] = 2 * uniform() - 1;
        return m;
      };
      for (const [n, blockEnd] of [[11, 5], [12, 6], [9, 8], [9, 1], [10, 4]]) {
        for (const coupling of [0, 1e-300]) {
          const m = randomMatrix(n).map((row, r) => row.map((x, c) => ((r < blockEnd) !== (c < blockEnd) ? x * coupling : x)));
          // Weyl: a coupling of 1e-300 moves no eigenvalue by more than its size (Golub & Van Loan, 4th ed., §8.1; from
          // memory), so ml-matrix on the uncoupled blocks is the reference.
          const uncoupled = m.map((row, r) => row.map((x, c) => ((r < blockEnd) !== (c < blockEnd) ? 0 : x)));
          expect(maxError(solve(m), reference(uncoupled))).toBeLessThan(1e-13 * n);
        }
      }
      // Graded: entry (r, c) scaled by 10^(−(r+c)/8), eight decades across the matrix.
      const graded = randomMatrix(50).map((row, r) => row.map((x, c) => x * 10 ** (-(r + c) / 8)));
      expect(maxError(solve(graded), reference(graded))).toBeLessThan(1e-13);
    });
  });
}

describe('SymmetricEigenvalues route by default', () => {
  it('TypeScript below SYMMETRIC_SIMD_FROM, WebAssembly SIMD from there (Node ≥ 16.4 has it; common practice)', () => {
    expect(new SymmetricEigenvalues(SYMMETRIC_SIMD_FROM - 1).simd).toBe(false);
    expect(new SymmetricEigenvalues(SYMMETRIC_SIMD_FROM).simd).toBe(true);
    expect(new SymmetricEigenvalues(128, { simd: false }).simd).toBe(false);
    expect(new SymmetricEigenvalues(3, { simd: true }).simd).toBe(true);
  });
});
