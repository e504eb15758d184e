import { describe, expect, it } from 'vitest';
import { diagonaliseTridiagonal, tridiagonalEigenvaluesRootFree } from '../../src/linalg/eighTridiagonal.ts';

const ascending = (values: Float64Array): number[] => Array.from(values).sort((x, y) => x - y);

/** Both kernels on T = tridiag(off, diag, off); returns [with rotations, root-free], each sorted. */
function bothKernels(diag: number[], off: number[]): [number[], number[]] {
  const n = diag.length;
  const d1 = Float64Array.from(diag);
  const e1 = Float64Array.from([...off, 0]);
  const rows = new Float64Array(n * n);
  for (let i = 0; i < n; i++) rows[i * n + i] = 1;
  expect(diagonaliseTridiagonal(d1, e1, n, rows, new Float64Array(2 * n))).toBe(true);
  const d2 = Float64Array.from(diag);
  const e2 = Float64Array.from([...off.map((b) => b * b), 0]);
  expect(tridiagonalEigenvaluesRootFree(d2, e2, n)).toBe(true);
  return [ascending(d1), ascending(d2)];
}

describe('tridiagonal kernels', () => {
  it('Toeplitz tridiag(b, a, b) has eigenvalues a + 2b·cos(kπ/(n+1))', () => {
    // Analytic (Smith, Numerical Solution of PDEs by Finite Difference Methods, 3rd ed., Oxford 1985; from memory).
    for (const [n, a, b] of [[1, 2, 1], [2, 0, 1], [10, 2, -1], [50, -0.3, 0.7], [128, 1, 1e-3]]) {
      const expected = Array.from({ length: n }, (_, k) => a + 2 * b * Math.cos(((k + 1) * Math.PI) / (n + 1)));
      expected.sort((x, y) => x - y);
      for (const values of bothKernels(new Array(n).fill(a), new Array(n - 1).fill(b))) {
        for (let k = 0; k < n; k++) expect(Math.abs(values[k] - expected[k])).toBeLessThanOrEqual(1e-13 * n);
      }
    }
  });

  it('the Clement matrix (zero diagonal, off-diagonal √(k(n−k))) has eigenvalues −(n−1), −(n−3), …, n−1', () => {
    // Analytic (Clement, "A class of triple-diagonal matrices for test purposes", SIAM Review 1(1), 1959, 50–52).
    for (const n of [2, 7, 20, 41]) {
      const off = Array.from({ length: n - 1 }, (_, k) => Math.sqrt((k + 1) * (n - k - 1)));
      const expected = Array.from({ length: n }, (_, k) => -(n - 1) + 2 * k);
      for (const values of bothKernels(new Array(n).fill(0), off)) {
        for (let k = 0; k < n; k++) expect(Math.abs(values[k] - expected[k])).toBeLessThanOrEqual(1e-12 * n);
      }
    }
  });

  it('block-diagonal T (zero couplings between 2×2 blocks) gives the union of the blocks\' eigenvalues', () => {
    // Analytic: a 2×2 block [[a, b], [b, d]] has (a+d)/2 ± √(((a−d)/2)² + b²) (common practice).
    const blocks = [[1, 0.5, -2], [0, 3, 0], [4, 1e-9, 4], [-1, 2, 5], [2, 0, 2]];
    const diag: number[] = [];
    const off: number[] = [];
    const expected: number[] = [];
    for (const [a, b, d] of blocks) {
      if (diag.length > 0) off.push(0);
      diag.push(a, d);
      off.push(b);
      const mean = (a + d) / 2;
      const radius = Math.hypot((a - d) / 2, b);
      expected.push(mean - radius, mean + radius);
    }
    expected.sort((x, y) => x - y);
    for (const values of bothKernels(diag, off)) {
      for (let k = 0; k < expected.length; k++) expect(Math.abs(values[k] - expected[k])).toBeLessThanOrEqual(1e-14);
    }
  });

  it('rotations keep the basis rows orthonormal and diagonalise T (TZ = ZΛ)', () => {
    // Invariant check (common practice): rows of the rotated identity are the eigenvectors of T.
    const n = 30;
    const diag = Array.from({ length: n }, (_, i) => Math.sin(i * 1.7));
    const off = Array.from({ length: n - 1 }, (_, i) => Math.cos(i * 0.9) + 0.1);
    const d = Float64Array.from(diag);
    const e = Float64Array.from([...off, 0]);
    const rows = new Float64Array(n * n);
    for (let i = 0; i < n; i++) rows[i * n + i] = 1;
    expect(diagonaliseTridiagonal(d, e, n, rows, new Float64Array(2 * n))).toBe(true);
    for (let m = 0; m < n; m++) {
      for (let r = 0; r < n; r++) {
        let t = diag[r] * rows[m * n + r];
        if (r > 0) t += off[r - 1] * rows[m * n + r - 1];
        if (r + 1 < n) t += off[r] * rows[m * n + r + 1];
        expect(Math.abs(t - d[m] * rows[m * n + r])).toBeLessThanOrEqual(1e-13);
      }
      for (let q = 0; q < n; q++) {
        let dot = 0;
        for (let r = 0; r < n; r++) dot += rows[m * n + r] * rows[q * n + r];
        expect(Math.abs(dot - (m === q ? 1 : 0))).toBeLessThanOrEqual(1e-14);
      }
    }
  });

  it('a Wilkinson shift equal to a tiny diagonal entry (1e-160 … subnormal) leaves the eigenvalues of δ = 0', () => {
    // T = [[δ, 1.5, 0], [1.5, 4, 2], [0, 2, 1]]: the trailing block [[4, 2], [2, 1]] is singular, so the shift is
    // exactly 0 and the first pivot is δ. At δ = 0 the characteristic polynomial is λ³ − 5λ² − 2.25λ + 2.25
    // = (λ − 1/2)(λ² − 9λ/2 − 9/2): λ = 1/2, (9 ± 3√17)/4 (analytic, common practice); by Weyl's inequality
    // the eigenvalues move by at most |δ| (Golub & Van Loan, Matrix Computations, 4th ed., §8.1; from memory).
    const expected = [(9 - 3 * Math.sqrt(17)) / 4, 0.5, (9 + 3 * Math.sqrt(17)) / 4];
    for (const delta of [1e-158, 1e-160, 3e-161, 2e-162, -1e-170, 1e-200, 1e-300, 1e-310, Number.MIN_VALUE]) {
      for (const values of bothKernels([delta, 4, 1], [1.5, 2])) {
        for (let k = 0; k < 3; k++) expect(Math.abs(values[k] - expected[k])).toBeLessThanOrEqual(1e-14);
      }
    }
  });

  it('a decoupled block of entries near 1e-120 beside an entry 1 converges (no 0/0 in the root-free step)', () => {
    // Analytic 2×2 eigenvalues (a+d)/2 ± √(((a−d)/2)² + b²) (common practice); the tolerance is ε-relative to
    // ‖T‖ = 1, the accuracy backward-stable QR promises (Golub & Van Loan, 4th ed., §8.3; from memory).
    for (const [a, b, d] of [[-8e-121, 4e-131, 2e-136], [3e-110, 1e-112, -1e-125], [1e-140, 1e-141, 0]]) {
      const mean = (a + d) / 2;
      const radius = Math.hypot((a - d) / 2, b);
      const expected = [mean - radius, mean + radius, 1];
      for (const values of bothKernels([1, a, d], [0, b])) {
        for (let k = 0; k < 3; k++) expect(Math.abs(values[k] - expected[k])).toBeLessThanOrEqual(1e-15);
      }
    }
  });

  it('a NaN off-diagonal never deflates: both kernels report failure (false)', () => {
    const d = new Float64Array([1, 2, 3]);
    expect(diagonaliseTridiagonal(d.slice(), new Float64Array([1, NaN, 0]), 3)).toBe(false);
    expect(tridiagonalEigenvaluesRootFree(d.slice(), new Float64Array([1, NaN, 0]), 3)).toBe(false);
  });
});
