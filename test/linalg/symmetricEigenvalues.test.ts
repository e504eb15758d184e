/**
 * The real symmetric eigenvalue kernel (src/linalg/symmetricEigenvalues.ts) against analytic spectra and against
 * ml-matrix's EigenvalueDecomposition (a general-purpose reference library).
 */
import fc from 'fast-check';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { SymmetricEigenvalues } from '../../src/linalg/symmetricEigenvalues.ts';

function solve(matrix: number[][]): Float64Array {
  const n = matrix.length;
  return new SymmetricEigenvalues(n).eigenvalues(Float64Array.from(matrix.flat()), new Float64Array(n));
}

function reference(matrix: number[][]): number[] {
  return new EigenvalueDecomposition(new Matrix(matrix)).realEigenvalues.sort((a, b) => a - b);
}

const maxError = (a: ArrayLike<number>, b: ArrayLike<number>) => Math.max(0, ...Array.from(a, (x, i) => Math.abs(x - b[i])));

describe('SymmetricEigenvalues', () => {
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
    const ours = new SymmetricEigenvalues(3).eigenvalues(m, new Float64Array(3));
    expect(maxError(ours, reference([[2, 1, 0], [1, 3, 1], [0, 1, 4]]))).toBeLessThan(1e-13);
    expect(Array.from(m)).toEqual(Array.from(copy));
  });

  it('a NaN or infinite entry gives NaN everywhere (the sentinel of the complex kernel); n = 0 does nothing', () => {
    expect(Array.from(solve([[1, 0], [NaN, 1]])).every(Number.isNaN)).toBe(true);
    expect(Array.from(solve([[Infinity, 0], [0, 1]])).every(Number.isNaN)).toBe(true);
    expect(new SymmetricEigenvalues(0).eigenvalues(new Float64Array(0), new Float64Array(0))).toHaveLength(0);
  });
});
