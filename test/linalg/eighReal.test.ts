import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { RealSymmetricEigensolver } from '../../src/linalg/eighReal.ts';
import { HermitianEigensolver } from '../../src/linalg/eigh.ts';
import { frobenius, orthonormalityError, randomHermitian, residual } from './eighChecks.ts';

describe('RealSymmetricEigensolver', () => {
  it('matches ml-matrix EigenvalueDecomposition on random symmetric matrices', () => {
    // Reference library: ml-matrix's real symmetric decomposition.
    for (const n of [1, 2, 9, 31, 64]) {
      const h = randomHermitian(n, 300 + n);
      h.im.fill(0);
      const values = new RealSymmetricEigensolver(n).eigenvalues(h.re, new Float64Array(n));
      const reference = new EigenvalueDecomposition(new Matrix(Array.from({ length: n }, (_, r) =>
        Array.from(h.re.subarray(r * n, r * n + n)))), { assumeSymmetric: true }).realEigenvalues.sort((a, b) => a - b);
      for (let m = 0; m < n; m++) expect(Math.abs(values[m] - reference[m])).toBeLessThanOrEqual(1e-12 * n);
    }
  });

  it('eigensystem gives real orthonormal eigenvectors with HV = VΛ, equal to the complex solver on im = 0', () => {
    const n = 40;
    const h = randomHermitian(n, 77);
    h.im.fill(0);
    const values = new Float64Array(n);
    const vec = new Float64Array(n * n);
    new RealSymmetricEigensolver(n).eigensystem(h.re, values, vec);
    const zero = new Float64Array(n * n);
    expect(residual(h, values, vec, zero)).toBeLessThanOrEqual(1e-10 * frobenius(h));
    expect(orthonormalityError(n, vec, zero)).toBeLessThanOrEqual(1e-12);
    const complexRe = new Float64Array(n * n);
    const complexIm = new Float64Array(n * n);
    const complexValues = new Float64Array(n);
    new HermitianEigensolver(n).eigensystem(h.re, h.im, complexValues, complexRe, complexIm);
    expect(values).toEqual(complexValues);
    expect(vec).toEqual(complexRe);
    expect(complexIm.every((x) => x === 0)).toBe(true);
  });
});
