import fc from 'fast-check';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { type EigensolverOptions, HermitianEigensolver } from '../../src/linalg/eigh.ts';
import {
  type ComplexMatrix, frobenius, orthonormalityError, randomHermitian, randomUnitary, residual, trace, withSpectrum,
} from './eighChecks.ts';

// Every route eigensystem can take: QR or divide and conquer on the tridiagonal (with leaves of 1, 3 and the
// default, so merges run from n = 2 on), each with the WebAssembly SIMD kernels (Householder passes and column
// steps, back-transformation, merge product) and with TypeScript only.
const ROUTES: EigensolverOptions[] = [
  { tridiagonal: 'qr', simd: true }, { tridiagonal: 'qr', simd: false },
  { tridiagonal: 'divide', simd: true, leafSize: 1 }, { tridiagonal: 'divide', simd: false, leafSize: 3 },
  { tridiagonal: 'divide', simd: true }, { tridiagonal: 'divide', simd: false }, {},
];
const name = (route: EigensolverOptions) => JSON.stringify(route);

interface Solved {
  values: Float64Array;
  vecRe: Float64Array;
  vecIm: Float64Array;
}

function solve(h: ComplexMatrix, route: EigensolverOptions): Solved {
  const { n } = h;
  const solver = new HermitianEigensolver(n, route);
  const values = new Float64Array(n);
  const vecRe = new Float64Array(n * n);
  const vecIm = new Float64Array(n * n);
  solver.eigensystem(h.re, h.im, values, vecRe, vecIm);
  return { values, vecRe, vecIm };
}

/** Ascending, H·V = V·Λ to 1e-10·‖H‖_F, VᴴV = I to 1e-12, Σλ = tr H (backward stability, Golub & Van Loan 4th ed. §8.3; from memory). */
function expectInvariants(h: ComplexMatrix, s: Solved): void {
  const size = Math.max(frobenius(h), Number.MIN_VALUE);
  for (let m = 1; m < h.n; m++) expect(s.values[m]).toBeGreaterThanOrEqual(s.values[m - 1]);
  expect(residual(h, s.values, s.vecRe, s.vecIm)).toBeLessThanOrEqual(1e-10 * size);
  expect(orthonormalityError(h.n, s.vecRe, s.vecIm)).toBeLessThanOrEqual(1e-12);
  let sum = 0;
  for (const v of s.values) sum += v;
  expect(Math.abs(sum - trace(h))).toBeLessThanOrEqual(1e-10 * size);
}

describe('HermitianEigensolver on every route', () => {
  it('picks QR below DIVIDE_FROM and divide and conquer from there (route getter)', () => {
    expect(new HermitianEigensolver(24).route.tridiagonal).toBe('qr');
    expect(new HermitianEigensolver(128).route.tridiagonal).toBe('divide');
    expect(new HermitianEigensolver(64, { simd: false }).route.simd).toBe(false);
  });

  it('runs the SIMD reduction exactly where asked and needed (n ≥ 3), and the TypeScript one with simd: false', () => {
    // Node ≥ 16.4 has WebAssembly SIMD (common practice): a false here would mean our module failed to validate
    // and every "SIMD" route below silently ran TypeScript.
    for (const n of [0, 1, 2, 3, 24, 64]) {
      expect(new HermitianEigensolver(n).route.reductionSimd).toBe(n >= 3);
      expect(new HermitianEigensolver(n, { simd: false }).route.reductionSimd).toBe(false);
    }
    expect(new HermitianEigensolver(24).route.simd).toBe(true);
  });

  for (const route of ROUTES) {
    it(`${name(route)}: random Hermitian matrices, n = 1…70, keep every invariant (property)`, () => {
      fc.assert(
        fc.property(fc.integer({ min: 1, max: 70 }), fc.integer({ min: 1, max: 2 ** 31 }), (n, seed) => {
          const h = randomHermitian(n, seed);
          expectInvariants(h, solve(h, route));
        }),
        { numRuns: 20 },
      );
    });

    it(`${name(route)}: degenerate clusters, graded, diagonal, tridiagonal, tiny and huge inputs, n = 1, 2`, () => {
      // Degenerate spectra U·diag(λ)·U†, U unitary by construction (Golub & Van Loan, 4th ed., §5.1).
      for (const n of [8, 45]) {
        const spectrum = Array.from({ length: n }, (_, i) => Math.floor(i / 4) - 3);
        const h = withSpectrum(randomUnitary(n, 3 + n), spectrum);
        const s = solve(h, route);
        for (let m = 0; m < n; m++) expect(Math.abs(s.values[m] - spectrum[m])).toBeLessThanOrEqual(1e-12 * n);
        expectInvariants(h, s);
      }
      // Graded: entry (r, c) scaled by 10^(−(r+c)/8), eight decades across the matrix.
      const graded = randomHermitian(50, 17);
      for (let r = 0; r < 50; r++) {
        for (let c = 0; c < 50; c++) {
          graded.re[r * 50 + c] *= 10 ** (-(r + c) / 8);
          graded.im[r * 50 + c] *= 10 ** (-(r + c) / 8);
        }
      }
      expectInvariants(graded, solve(graded, route));
      // Diagonal input: the sorted diagonal (analytic).
      const diagonal = { n: 41, re: new Float64Array(41 * 41), im: new Float64Array(41 * 41) };
      for (let i = 0; i < 41; i++) diagonal.re[i * 41 + i] = Math.cos(i * 2.3);
      const d = solve(diagonal, route);
      expect(Array.from(d.values)).toEqual(Array.from({ length: 41 }, (_, i) => Math.cos(i * 2.3)).sort((a, b) => a - b));
      expectInvariants(diagonal, d);
      // Tiny and huge: λ(c·H) = c·λ(H) (common practice), V unitary at any scale.
      const base = solve(randomHermitian(44, 5), route);
      for (const scale of [1e-300, 1e300]) {
        const s = solve(randomHermitian(44, 5, scale), route);
        for (let m = 0; m < 44; m++) expect(Math.abs(s.values[m] / scale - base.values[m])).toBeLessThanOrEqual(1e-12 * 44);
        expect(orthonormalityError(44, s.vecRe, s.vecIm)).toBeLessThanOrEqual(1e-12);
      }
      // n = 1, 2, 3 (3: the smallest order with a Householder pass); n = 0 does nothing and writes nothing.
      for (const n of [1, 2, 3]) expectInvariants(randomHermitian(n, 9), solve(randomHermitian(n, 9), route));
      const empty = new HermitianEigensolver(0, route);
      const values = new Float64Array(1).fill(7);
      empty.eigensystem(new Float64Array(0), new Float64Array(0), values, new Float64Array(1), new Float64Array(1));
      expect(empty.eigenvalues(new Float64Array(0), new Float64Array(0), values)).toBe(values);
      expect(values[0]).toBe(7);
    });

    it(`${name(route)}: complex tridiagonal Toeplitz with hopping t·e^{iθ}: a + 2|t|cos(kπ/(n+1)), gauged sine eigenvectors`, () => {
      // Analytic: the gauge D = diag(e^{ijθ}) makes it the real tridiag(|t|, a, |t|), whose eigenvectors are
      // (sin(jkπ/(n+1)))_j (Smith, Numerical Solution of PDEs by Finite Difference Methods, 3rd ed., 1985; from memory).
      for (const n of [2, 30, 90]) {
        const [a, t, theta] = [0.3, 1.2, 0.7];
        const re = new Float64Array(n * n);
        const im = new Float64Array(n * n);
        for (let j = 0; j < n; j++) {
          re[j * n + j] = a;
          if (j + 1 < n) {
            // H[j+1][j] = t·e^{iθ}, H[j][j+1] its conjugate.
            re[(j + 1) * n + j] = t * Math.cos(theta);
            im[(j + 1) * n + j] = t * Math.sin(theta);
            re[j * n + j + 1] = t * Math.cos(theta);
            im[j * n + j + 1] = -t * Math.sin(theta);
          }
        }
        const s = solve({ n, re, im }, route);
        for (let k = 1; k <= n; k++) {
          // Ascending order: k-th value from the top is a + 2t·cos(kπ/(n+1)).
          const m = n - k;
          expect(Math.abs(s.values[m] - (a + 2 * t * Math.cos((k * Math.PI) / (n + 1))))).toBeLessThanOrEqual(1e-13 * n);
          // |⟨w, v_m⟩| = ‖w‖ for w_j = e^{ijθ}·sin((j+1)kπ/(n+1)).
          let dotRe = 0;
          let dotIm = 0;
          let norm = 0;
          for (let j = 0; j < n; j++) {
            const w = Math.sin(((j + 1) * k * Math.PI) / (n + 1));
            const wRe = w * Math.cos(j * theta);
            const wIm = w * Math.sin(j * theta);
            norm += w * w;
            dotRe += wRe * s.vecRe[j * n + m] + wIm * s.vecIm[j * n + m];
            dotIm += wRe * s.vecIm[j * n + m] - wIm * s.vecRe[j * n + m];
          }
          expect(Math.abs(Math.hypot(dotRe, dotIm) / Math.sqrt(norm) - 1)).toBeLessThanOrEqual(1e-11);
        }
      }
    });
  }

  it('eigenvectors lie in ml-matrix\'s eigenspaces of the real embedding [[A, −B], [B, A]]', () => {
    // Standard linear algebra: v = x + iy is an eigenvector of H = A + iB iff (x; y) and (−y; x) are eigenvectors of
    // the embedding for the same λ; ml-matrix's EigenvalueDecomposition (a general-purpose library) gives that pair.
    for (const route of ROUTES) {
      for (const n of [3, 20, 48]) {
        const h = randomHermitian(n, 300 + n);
        const s = solve(h, route);
        const big = Matrix.zeros(2 * n, 2 * n);
        for (let r = 0; r < n; r++) {
          for (let c = 0; c < n; c++) {
            big.set(r, c, h.re[r * n + c]);
            big.set(r + n, c + n, h.re[r * n + c]);
            big.set(r, c + n, -h.im[r * n + c]);
            big.set(r + n, c, h.im[r * n + c]);
          }
        }
        const reference = new EigenvalueDecomposition(big, { assumeSymmetric: true });
        const order = reference.realEigenvalues.map((v, i) => [v, i]).sort((x, y) => x[0] - y[0]).map((p) => p[1]);
        const w = reference.eigenvectorMatrix;
        for (let m = 0; m < n; m++) {
          // Projection of (x; y) on the span of the reference pair 2m, 2m+1 (orthonormal columns).
          let projected = 0;
          for (const column of [order[2 * m], order[2 * m + 1]]) {
            let dot = 0;
            for (let r = 0; r < n; r++) dot += w.get(r, column) * s.vecRe[r * n + m] + w.get(r + n, column) * s.vecIm[r * n + m];
            projected += dot * dot;
          }
          expect(Math.abs(Math.sqrt(projected) - 1)).toBeLessThanOrEqual(1e-9);
        }
      }
    }
  });
});
