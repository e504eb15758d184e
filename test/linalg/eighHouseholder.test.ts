import { describe, expect, it } from 'vitest';
import { formUnitary } from '../../src/linalg/eighBackTransform.ts';
import { HermitianTridiagonaliser } from '../../src/linalg/eighHouseholder.ts';
import { frobenius, randomHermitian } from './eighChecks.ts';

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

describe('HermitianTridiagonaliser.reduce(re, im) with formUnitary', () => {
  it('gives QᴴHQ = T: tridiagonal, with the reported real diagonal and complex sub-diagonal', () => {
    // Definition of the Householder tridiagonalisation (Golub & Van Loan, Matrix Computations, 4th ed., §8.3).
    for (const n of [1, 2, 3, 6, 17, 40]) {
      const h = randomHermitian(n, 500 + n);
      const reduction = new HermitianTridiagonaliser(n);
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
    }
  });

  it('returns NaN for non-finite entries and a power of two outside [2^-100, 2^100]', () => {
    const h = randomHermitian(4, 1, 2 ** 300);
    const reduction = new HermitianTridiagonaliser(4);
    const scale = reduction.reduce(h.re, h.im);
    expect(Math.log2(scale)).toBe(Math.round(Math.log2(scale)));
    expect(scale).toBeGreaterThan(2 ** 290);
    h.im[4] = Infinity; // entry (1, 0): only the lower triangle is read
    expect(reduction.reduce(h.re, h.im)).toBeNaN();
  });
});
