import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { TridiagonalDivideConquer } from '../../src/linalg/eighDivide.ts';

interface Result {
  values: Float64Array;
  vectors: Float64Array;
}

/** Divide and conquer on T = tridiag(off, diag, off); eigenvector m in column m of `vectors`. */
function divide(diag: number[], off: number[], options: { simd?: boolean; leafSize?: number }): Result {
  const n = diag.length;
  const values = Float64Array.from(diag);
  const e = Float64Array.from([...off, 0]);
  const vectors = new Float64Array(n * n);
  expect(new TridiagonalDivideConquer(n, options).solve(values, e, n, vectors)).toBe(true);
  return { values, vectors };
}

/** max over m of ‖T·z_m − λ_m·z_m‖ and max |ZᵀZ − I|, and whether the values ascend. */
function invariants(diag: number[], off: number[], { values, vectors }: Result): { residual: number; orthonormality: number; ascending: boolean } {
  const n = diag.length;
  let residual = 0;
  let orthonormality = 0;
  for (let m = 0; m < n; m++) {
    let sum = 0;
    for (let r = 0; r < n; r++) {
      let t = (diag[r] - values[m]) * vectors[r * n + m];
      if (r > 0) t += off[r - 1] * vectors[(r - 1) * n + m];
      if (r + 1 < n) t += off[r] * vectors[(r + 1) * n + m];
      sum += t * t;
    }
    residual = Math.max(residual, Math.sqrt(sum));
    for (let q = 0; q < n; q++) {
      let dot = 0;
      for (let r = 0; r < n; r++) dot += vectors[r * n + m] * vectors[r * n + q];
      orthonormality = Math.max(orthonormality, Math.abs(dot - (m === q ? 1 : 0)));
    }
  }
  let ascending = true;
  for (let m = 1; m < n; m++) ascending &&= values[m] >= values[m - 1];
  return { residual, orthonormality, ascending };
}

/** ‖T‖ bound: largest |T_ii| + 2·largest |T_ij|. */
function size(diag: number[], off: number[]): number {
  return Math.max(...diag.map(Math.abs)) + 2 * Math.max(0, ...off.map(Math.abs));
}

// Every route: the SIMD and the TypeScript product, leaves of 1, 2 and 16 (merges from n = 2 on).
const ROUTES = [
  { simd: true, leafSize: 1 }, { simd: false, leafSize: 2 }, { simd: true, leafSize: 3 }, { simd: true }, { simd: false },
];

describe('TridiagonalDivideConquer.solve(diag, off, n, vectors)', () => {
  it('tridiag(−1, 2, −1): eigenvalues 2 − 2cos(kπ/(n+1)) and sine eigenvectors', () => {
    // Analytic: the second-difference matrix has eigenvalues 2 − 2cos(kπ/(n+1)) with eigenvectors
    // (sin(jkπ/(n+1)))_j (Smith, Numerical Solution of PDEs by Finite Difference Methods, 3rd ed., 1985; from memory).
    for (const route of ROUTES) {
      for (const n of [1, 2, 5, 33, 100]) {
        const { values, vectors } = divide(new Array(n).fill(2), new Array(n - 1).fill(-1), route);
        for (let k = 1; k <= n; k++) {
          const m = k - 1;
          expect(Math.abs(values[m] - (2 - 2 * Math.cos((k * Math.PI) / (n + 1))))).toBeLessThanOrEqual(1e-14 * n);
          let norm = 0;
          let dot = 0;
          for (let j = 1; j <= n; j++) {
            const s = Math.sin((j * k * Math.PI) / (n + 1));
            norm += s * s;
            dot += s * vectors[(j - 1) * n + m];
          }
          expect(Math.abs(Math.abs(dot) / Math.sqrt(norm) - 1)).toBeLessThanOrEqual(1e-12);
        }
      }
    }
  });

  it('Wilkinson W21+ (diag |10 − i|, off 1): the top pair near 10.7461941829 agrees to ~1e-13 and stays orthonormal', () => {
    // Wilkinson, The Algebraic Eigenvalue Problem (1965), ch. 5: W21+'s largest eigenvalues form pairs that
    // agree to many figures; 10.746194182903 for the top pair is from memory.
    const diag = Array.from({ length: 21 }, (_, i) => Math.abs(10 - i));
    const off = new Array(20).fill(1);
    for (const route of ROUTES) {
      const result = divide(diag, off, route);
      expect(Math.abs(result.values[20] - 10.746194182903)).toBeLessThanOrEqual(1e-11);
      expect(result.values[20] - result.values[19]).toBeLessThanOrEqual(1e-12);
      const check = invariants(diag, off, result);
      expect(check.ascending).toBe(true);
      expect(check.residual).toBeLessThanOrEqual(1e-14 * 21 * size(diag, off));
      expect(check.orthonormality).toBeLessThanOrEqual(1e-14 * 21);
    }
  });

  it('the Clement matrix has eigenvalues −(n−1), −(n−3), …, n−1', () => {
    // Analytic (Clement, SIAM Review 1(1), 50 (1959)).
    for (const route of ROUTES) {
      for (const n of [6, 41, 64]) {
        const off = Array.from({ length: n - 1 }, (_, k) => Math.sqrt((k + 1) * (n - k - 1)));
        const result = divide(new Array(n).fill(0), off, route);
        for (let k = 0; k < n; k++) expect(Math.abs(result.values[k] - (-(n - 1) + 2 * k))).toBeLessThanOrEqual(1e-12 * n);
        expect(invariants(new Array(n).fill(0), off, result).orthonormality).toBeLessThanOrEqual(1e-13);
      }
    }
  });

  it('deflation-heavy inputs keep every invariant: zero couplings, equal diagonals, glued blocks, graded entries (property)', () => {
    // Invariants (common practice): T·Z = Z·Λ to n·ε·‖T‖ and ZᵀZ = I, whatever deflates.
    const shapes = ['random', 'zero-off', 'constant', 'glued', 'graded', 'tiny-off'] as const;
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 70 }), fc.constantFrom(...shapes), fc.integer({ min: 0, max: ROUTES.length - 1 }),
        fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 140, maxLength: 140 }),
        (n, shape, route, noise) => {
          const diag = Array.from({ length: n }, (_, i) =>
            shape === 'constant' ? 0.5 : shape === 'graded' ? 10 ** (-i / 6) * (1 + noise[i] / 4) : shape === 'glued' ? (i % 7) * 0.1 : noise[i]);
          const off = Array.from({ length: n - 1 }, (_, i) =>
            shape === 'zero-off' ? 0 : shape === 'glued' ? (i % 7 === 6 ? 1e-12 : 1) : shape === 'graded' ? 10 ** (-i / 6 - 0.1)
              : shape === 'tiny-off' ? 1e-9 * noise[70 + i] : shape === 'constant' ? 0 : noise[70 + i]);
          const result = divide(diag, off, ROUTES[route]);
          const check = invariants(diag, off, result);
          expect(check.ascending).toBe(true);
          // Plus the kernel's absolute floor 2^−500 (couplings below it are negligible: callers scale T near 1).
          expect(check.residual).toBeLessThanOrEqual(1e-14 * Math.max(n, 4) * size(diag, off) + Math.max(n, 4) * 2 ** -500);
          expect(check.orthonormality).toBeLessThanOrEqual(1e-14 * Math.max(n, 4));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('a block with every pole at 0 and a subnormal coupling keeps orthonormal vectors (invariants, common practice; a fast-check counterexample, seed 748776548)', () => {
    for (const route of ROUTES) {
      for (const coupling of [5e-324, 1e-310, 2 ** -600]) {
        const check = invariants([0, 0], [coupling], divide([0, 0], [coupling], route));
        expect(check.orthonormality).toBeLessThanOrEqual(1e-15);
        expect(check.residual).toBeLessThanOrEqual(2 ** -500);
      }
    }
  });
});
