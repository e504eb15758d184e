import { describe, expect, it } from 'vitest';
import { formUnitary } from '../../src/linalg/eighBackTransform.ts';
import { HermitianTridiagonaliser } from '../../src/linalg/eighHouseholder.ts';
import { type ComplexMatrix, frobenius, randomHermitian } from './eighChecks.ts';

/** (QᴴHQ)_{rc} for Q complex interleaved and H split. */
function similarity(n: number, q: Float64Array, re: Float64Array, im: Float64Array): { re: Float64Array; im: Float64Array } {
  const hqRe = new Float64Array(n * n);
  const hqIm = new Float64Array(n * n);
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      let sRe = 0;
      let sIm = 0;
      for (let i = 0; i < n; i++) {
        const a = re[r * n + i];
        const b = im[r * n + i];
        const x = q[2 * (i * n + c)];
        const y = q[2 * (i * n + c) + 1];
        sRe += a * x - b * y;
        sIm += a * y + b * x;
      }
      hqRe[r * n + c] = sRe;
      hqIm[r * n + c] = sIm;
    }
  }
  const outRe = new Float64Array(n * n);
  const outIm = new Float64Array(n * n);
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      let sRe = 0;
      let sIm = 0;
      for (let i = 0; i < n; i++) {
        const x = q[2 * (i * n + r)];
        const y = -q[2 * (i * n + r) + 1];
        sRe += x * hqRe[i * n + c] - y * hqIm[i * n + c];
        sIm += x * hqIm[i * n + c] + y * hqRe[i * n + c];
      }
      outRe[r * n + c] = sRe;
      outIm[r * n + c] = sIm;
    }
  }
  return { re: outRe, im: outIm };
}

/** QᴴHQ = T (the reported diagonal and sub-diagonal, zero elsewhere) to 1e-13·‖H‖_F, and QᴴQ = I. */
function expectReduction(h: ComplexMatrix, simd: boolean): HermitianTridiagonaliser {
  // Definition of the Householder tridiagonalisation (Golub & Van Loan, Matrix Computations, 4th ed., §8.3).
  const { n } = h;
  const reduction = new HermitianTridiagonaliser(n, { simd });
  expect(reduction.simd).toBe(simd && n >= 3);
  expect(reduction.reduce(h.re, h.im)).toBe(1);
  const q = new Float64Array(2 * n * n);
  formUnitary(n, reduction.tau, reduction.reflRe, reduction.reflIm, q, new Float64Array(4 * n));
  const t = similarity(n, q, h.re, h.im);
  const tolerance = 1e-13 * frobenius(h);
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      let expectedRe = 0;
      let expectedIm = 0;
      if (r === c) expectedRe = reduction.diag[r];
      else if (r === c + 1) [expectedRe, expectedIm] = [reduction.subRe[c], reduction.subIm[c]];
      else if (c === r + 1) [expectedRe, expectedIm] = [reduction.subRe[r], -reduction.subIm[r]];
      expect(Math.abs(t.re[r * n + c] - expectedRe)).toBeLessThanOrEqual(tolerance);
      expect(Math.abs(t.im[r * n + c] - expectedIm)).toBeLessThanOrEqual(tolerance);
    }
  }
  // Q unitary: QᴴIQ = I through the same helper.
  const eye = new Float64Array(n * n);
  for (let i = 0; i < n; i++) eye[i * n + i] = 1;
  const qq = similarity(n, q, eye, new Float64Array(n * n));
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      expect(Math.abs(qq.re[r * n + c] - (r === c ? 1 : 0))).toBeLessThanOrEqual(1e-14 * n);
      expect(Math.abs(qq.im[r * n + c])).toBeLessThanOrEqual(1e-14 * n);
    }
  }
  return reduction;
}

/** diag(A, B) with A of order m and B of order n − m, random Hermitian; coupled by `coupling`·(random) between them. */
function twoBlocks(n: number, m: number, seed: number, coupling: number): ComplexMatrix {
  const h = randomHermitian(n, seed);
  for (let r = m; r < n; r++) {
    for (let c = 0; c < m; c++) {
      for (const i of [r * n + c, c * n + r]) {
        h.re[i] *= coupling;
        h.im[i] *= coupling;
      }
    }
  }
  return h;
}

describe('HermitianTridiagonaliser.reduce(re, im) with formUnitary', () => {
  for (const simd of [false, true]) {
    const route = simd ? 'SIMD' : 'TypeScript';
    it(`${route}: gives QᴴHQ = T, tridiagonal, with the reported real diagonal and complex sub-diagonal`, () => {
      for (const n of [1, 2, 3, 4, 5, 6, 17, 40]) expectReduction(randomHermitian(n, 500 + n), simd);
    });

    it(`${route}: a column needing no reflector mid-way (τ = 0: the update and the product passes alone)`, () => {
      // Block diagonal: column m−1 has nothing below row m, so step m−2's update runs without a product and
      // step m's product without an update; T[m][m−1] = 0 exactly (analytic: the blocks never mix).
      for (const [n, m] of [[11, 5], [12, 6], [9, 8], [9, 1]]) {
        const reduction = expectReduction(twoBlocks(n, m, 40 + n + m, 0), simd);
        expect(reduction.tau[m - 1]).toBe(0);
        expect(Math.hypot(reduction.subRe[m - 1], reduction.subIm[m - 1])).toBe(0);
      }
      // Already tridiagonal (complex off-diagonal): no reflector at all, T = H (analytic).
      const n = 7;
      const h = randomHermitian(n, 3);
      for (let r = 0; r < n; r++) {
        for (let c = 0; c < n; c++) {
          if (Math.abs(r - c) > 1) h.re[r * n + c] = h.im[r * n + c] = 0;
        }
      }
      const reduction = expectReduction(h, simd);
      for (let k = 0; k + 1 < n; k++) {
        expect(reduction.tau[k]).toBe(0);
        expect([reduction.subRe[k], reduction.subIm[k]]).toEqual([h.re[(k + 1) * n + k], h.im[(k + 1) * n + k]]);
      }
    });

    it(`${route}: blocks coupled by 1e-300 (columns whose squares underflow, rescaled before the reflector)`, () => {
      for (const [n, m] of [[10, 4], [9, 6]]) {
        const reduction = expectReduction(twoBlocks(n, m, 70 + n, 1e-300), simd);
        // The coupling survives as a tiny but nonzero T[m][m−1] (not flushed to 0 by underflowing squares);
        // its size is that of the coupling block (Weyl: the blocks move by no more; common practice).
        const size = Math.hypot(reduction.subRe[m - 1], reduction.subIm[m - 1]);
        expect(size).toBeGreaterThan(1e-302);
        expect(size).toBeLessThan(1e-298);
      }
    });
  }

  it('returns NaN for non-finite entries and a power of two outside [2^-100, 2^100], on both routes', () => {
    for (const simd of [false, true]) {
      const h = randomHermitian(4, 1, 2 ** 300);
      const reduction = new HermitianTridiagonaliser(4, { simd });
      const scale = reduction.reduce(h.re, h.im);
      expect(Math.log2(scale)).toBe(Math.round(Math.log2(scale)));
      expect(scale).toBeGreaterThan(2 ** 290);
      h.im[4] = Infinity; // entry (1, 0): only the lower triangle is read
      expect(reduction.reduce(h.re, h.im)).toBeNaN();
    }
  });
});
