import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { HermitianEigensolver } from '../../src/linalg/eigh.ts';
import { frobenius, orthonormalityError, randomHermitian, residual } from './eighChecks.ts';

// Edge scales: entries from subnormal to 1e300 and matrices mixing entries 2^−600 below the rest, where squares
// underflow. Backward stability promises errors of order n·ε·‖H‖ (Golub & Van Loan, 4th ed., §8.3; from memory); unitarity of the
// computed V must hold to a few ε regardless of scale (common practice).
const RUNS_2X2 = 3000;
const RUNS_MIXED = 400;

describe('HermitianEigensolver at extreme scales', () => {
  it('2×2 with any entries up to 1e300: unitary V, agreeing entry points, ascending values', () => {
    const entry = fc.double({ noNaN: true, min: -1e300, max: 1e300 });
    fc.assert(
      fc.property(entry, entry, entry, entry, (a, b, c, d) => {
        const h = { n: 2, re: new Float64Array([a, b, b, d]), im: new Float64Array([0, -c, c, 0]) };
        const solver = new HermitianEigensolver(2);
        const values = new Float64Array(2);
        const vecRe = new Float64Array(4);
        const vecIm = new Float64Array(4);
        solver.eigensystem(h.re, h.im, values, vecRe, vecIm);
        const only = solver.eigenvalues(h.re, h.im, new Float64Array(2));
        const largest = Math.max(Math.abs(a), Math.abs(b), Math.abs(c), Math.abs(d));
        expect(orthonormalityError(2, vecRe, vecIm)).toBeLessThanOrEqual(1e-14);
        expect(values[0]).toBeLessThanOrEqual(values[1]);
        for (let m = 0; m < 2; m++) expect(Math.abs(only[m] - values[m])).toBeLessThanOrEqual(1e-14 * largest);
      }),
      { numRuns: RUNS_2X2 },
    );
  });

  for (const simd of [true, false]) {
    it(`random matrices scaled by 2^±1000 with entries shrunk by 2^−600 or zeroed: unitary V, small residual (${simd ? 'SIMD' : 'TypeScript'} kernels)`, () => {
      fc.assert(
        fc.property(
          fc.integer({ min: 1, max: 20 }), fc.integer({ min: 1, max: 2 ** 31 }),
          fc.integer({ min: -1000, max: 1000 }), fc.integer({ min: 0, max: 3 }),
          (n, seed, exponent, sparsity) => {
            const h = randomHermitian(n, seed, 2 ** exponent * 1.3);
            for (let r = 0; r < n; r++) {
              for (let c = 0; c < r; c++) {
                if ((r * 7 + c * 3 + seed) % 4 >= sparsity) continue;
                const f = (r + c) % 2 === 1 ? 0 : 2 ** -600;
                for (const i of [r * n + c, c * n + r]) {
                  h.re[i] *= f;
                  h.im[i] *= f;
                }
              }
            }
            const solver = new HermitianEigensolver(n, { simd });
            const values = new Float64Array(n);
            const vecRe = new Float64Array(n * n);
            const vecIm = new Float64Array(n * n);
            solver.eigensystem(h.re, h.im, values, vecRe, vecIm);
            const only = solver.eigenvalues(h.re, h.im, new Float64Array(n));
            const size = frobenius(h);
            expect(orthonormalityError(n, vecRe, vecIm)).toBeLessThanOrEqual(1e-13);
            for (let m = 0; m < n; m++) expect(Math.abs(only[m] - values[m])).toBeLessThanOrEqual(1e-12 * size);
            // The residual helper squares entries itself, so it is only meaningful away from the extremes.
            if (Math.abs(exponent) < 400) expect(residual(h, values, vecRe, vecIm)).toBeLessThanOrEqual(1e-12 * size);
          },
        ),
        { numRuns: RUNS_MIXED },
      );
    });
  }
});
