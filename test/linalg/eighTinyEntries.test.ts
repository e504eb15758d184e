import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { HermitianEigensolver } from '../../src/linalg/eigh.ts';
import {
  type ComplexMatrix, frobenius, orthonormalityError, randomHermitian, residual, shiftedEmbeddingEigenvalues, trace,
} from './eighChecks.ts';

// Matrices that mix ordinary entries (~1–10) with entries of 1e-300…1e-150 or subnormal size, as H(k) has at
// k ≈ 1e-160 Å⁻¹ or at tiny rotation angles. Backward-stable Householder + QR promises errors of order n·ε·‖H‖
// (Golub & Van Loan, Matrix Computations, 4th ed., §8.3; from memory), whatever the size of single entries.
const RUNS = 300;

/** Where a tiny value goes in entry (r, c), r ≥ c, and its mirror (c, r). */
type Placement = 'real' | 'imaginary' | 'both' | 'zero';

interface TinyEntry {
  slot: number;
  placement: Placement;
  value: number;
}

/** 10^e·m for e in [−300, −150], or a subnormal k·2^−1074 (0 < k < 2^52), with a random sign. */
const tinyValue = fc.oneof(
  fc.tuple(fc.integer({ min: -300, max: -150 }), fc.double({ min: 1, max: 9.99, noNaN: true }), fc.boolean())
    .map(([exponent, mantissa, negative]) => (negative ? -1 : 1) * mantissa * 10 ** exponent),
  fc.tuple(fc.integer({ min: 1, max: 2 ** 52 - 1 }), fc.boolean())
    .map(([k, negative]) => (negative ? -1 : 1) * k * Number.MIN_VALUE),
  fc.constantFrom(1e-160, -1e-160, 1e-200, 1e-300, Number.MIN_VALUE),
);

const tinyEntry = fc.record({
  slot: fc.nat(),
  placement: fc.constantFrom<Placement>('real', 'imaginary', 'both', 'zero'),
  value: tinyValue,
});

/**
 * Rows and columns from `first` on multiplied by `factor` — a nearly decoupled block of tiny entries, as when one
 * set of orbitals couples to the rest only through sin(k·r) at tiny k; `first` ≥ n leaves H as it is.
 */
interface TinyBlock {
  first: number;
  factor: number;
}

/**
 * Random Hermitian matrix with entries up to `scale`, the tiny block applied, then the tiny entries written over
 * it (Hermitian kept exact).
 */
function mixedMatrix(n: number, seed: number, scale: number, block: TinyBlock, tiny: TinyEntry[]): ComplexMatrix {
  const h = randomHermitian(n, seed, scale);
  for (let r = block.first; r < n; r++) {
    for (let c = 0; c < n; c++) {
      for (const i of [r * n + c, c * n + r]) {
        // Entries inside the block are scaled once per index in the block, so their size drops below the coupling.
        h.re[i] *= block.factor;
        h.im[i] *= block.factor;
      }
    }
  }
  const slots = (n * (n + 1)) / 2;
  for (const { slot, placement, value } of tiny) {
    // Slot s of the lower triangle, row by row: (r, c) with r(r+1)/2 + c = s.
    const s = slot % slots;
    const r = Math.floor((Math.sqrt(8 * s + 1) - 1) / 2);
    const c = s - (r * (r + 1)) / 2;
    const lower = r * n + c;
    const upper = c * n + r;
    if (placement === 'zero') {
      h.re[lower] = h.re[upper] = 0;
      h.im[lower] = h.im[upper] = 0;
      continue;
    }
    if (placement !== 'imaginary' || r === c) h.re[lower] = h.re[upper] = value;
    if ((placement === 'imaginary' || placement === 'both') && r !== c) {
      h.im[lower] = value;
      h.im[upper] = -value;
    }
  }
  return h;
}

/** H with every entry below 1e-100 in size set to 0, and ‖H − H₀‖_F (scaled, so tiny entries do not underflow). */
function withoutTiny(h: ComplexMatrix): { cleaned: ComplexMatrix; removed: number } {
  const re = h.re.slice();
  const im = h.im.slice();
  const removed = { n: h.n, re: new Float64Array(re.length), im: new Float64Array(im.length) };
  for (let i = 0; i < re.length; i++) {
    if (Math.abs(re[i]) < 1e-100) [removed.re[i], re[i]] = [re[i], 0];
    if (Math.abs(im[i]) < 1e-100) [removed.im[i], im[i]] = [im[i], 0];
  }
  return { cleaned: { n: h.n, re, im }, removed: frobenius(removed) };
}

describe('HermitianEigensolver on ordinary entries mixed with tiny ones (1e-300…1e-150, subnormal)', () => {
  for (const simd of [true, false]) {
    it(`eigenvalues() and eigensystem() match ml-matrix on the embedding and keep every invariant (property; ${simd ? 'SIMD' : 'TypeScript'} kernels)`, () => {
      fc.assert(
        fc.property(
          fc.integer({ min: 2, max: 24 }), fc.integer({ min: 1, max: 2 ** 31 }),
          fc.double({ min: 1, max: 10, noNaN: true }),
          fc.record({ first: fc.integer({ min: 1, max: 40 }), factor: fc.double({ min: 1e-80, max: 1e-60, noNaN: true }) }),
          fc.array(tinyEntry, { maxLength: 80 }),
          (n, seed, scale, block, tiny) => {
            const h = mixedMatrix(n, seed, scale, block, tiny);
            const size = frobenius(h);
            const solver = new HermitianEigensolver(n, { simd });
            const only = solver.eigenvalues(h.re, h.im, new Float64Array(n));
            const values = new Float64Array(n);
            const vecRe = new Float64Array(n * n);
            const vecIm = new Float64Array(n * n);
            solver.eigensystem(h.re, h.im, values, vecRe, vecIm);

            // Reference library: ml-matrix's real symmetric decomposition of [[A, −B], [B, A]], each value twice.
            const reference = shiftedEmbeddingEigenvalues(h);
            // Weyl's inequality |λ_k(H) − λ_k(H₀)| ≤ ‖H − H₀‖₂ ≤ ‖H − H₀‖_F (Golub & Van Loan, 4th ed., §8.1; from
            // memory): dropping the tiny entries may move the spectrum by no more than their size.
            const { cleaned, removed } = withoutTiny(h);
            const cleanedReference = shiftedEmbeddingEigenvalues(cleaned);
            const tolerance = 1e-12 * size;
            for (let m = 0; m < n; m++) {
              expect(Math.abs(only[m] - reference[2 * m])).toBeLessThanOrEqual(tolerance);
              expect(Math.abs(only[m] - reference[2 * m + 1])).toBeLessThanOrEqual(tolerance);
              expect(Math.abs(values[m] - reference[2 * m])).toBeLessThanOrEqual(tolerance);
              expect(Math.abs(only[m] - cleanedReference[2 * m])).toBeLessThanOrEqual(tolerance + removed);
              if (m > 0) {
                expect(only[m]).toBeGreaterThanOrEqual(only[m - 1]);
                expect(values[m]).toBeGreaterThanOrEqual(values[m - 1]);
              }
            }
            // Invariants: ‖HV − VΛ‖ ≤ 1e-10·‖H‖, V†V = I, Σλ = tr H (common practice).
            expect(residual(h, values, vecRe, vecIm)).toBeLessThanOrEqual(1e-10 * size);
            expect(orthonormalityError(n, vecRe, vecIm)).toBeLessThanOrEqual(1e-12);
            let sum = 0;
            for (let m = 0; m < n; m++) sum += values[m];
            expect(Math.abs(sum - trace(h))).toBeLessThanOrEqual(1e-10 * size);
          },
        ),
        { numRuns: RUNS },
      );
    });
  }

  it('a complex 3×3 whose Wilkinson shift equals its tiny first diagonal entry gives 1/2 and (9 ± 3√17)/4', () => {
    // H = [[δ, 1.5·e^{iφ}, 0], [1.5·e^{−iφ}, 4, 2], [0, 2, 1]] is D·H_real·D† with D = diag(e^{iφ}, 1, 1), so it has
    // the spectrum of the real matrix; at δ = 0 that is the roots of λ³ − 5λ² − 2.25λ + 2.25 (analytic, common
    // practice), and δ moves them by at most |δ| (Weyl; Golub & Van Loan, 4th ed., §8.1; from memory).
    // The trailing block [[4, 2], [2, 1]] is singular, so the shift is 0 and the first pivot is δ itself.
    const expected = [(9 - 3 * Math.sqrt(17)) / 4, 0.5, (9 + 3 * Math.sqrt(17)) / 4];
    for (const phi of [0, 0.7, Math.PI / 2]) {
      for (const delta of [1e-160, 2e-162, 1e-200, 1e-310, Number.MIN_VALUE]) {
        const [c, s] = [1.5 * Math.cos(phi), 1.5 * Math.sin(phi)];
        const h = {
          n: 3,
          re: new Float64Array([delta, c, 0, c, 4, 2, 0, 2, 1]),
          im: new Float64Array([0, s, 0, -s, 0, 0, 0, 0, 0]),
        };
        for (const simd of [true, false]) {
          const solver = new HermitianEigensolver(3, { simd });
          const only = solver.eigenvalues(h.re, h.im, new Float64Array(3));
          const values = new Float64Array(3);
          const vecRe = new Float64Array(9);
          const vecIm = new Float64Array(9);
          solver.eigensystem(h.re, h.im, values, vecRe, vecIm);
          for (let m = 0; m < 3; m++) {
            expect(Math.abs(only[m] - expected[m])).toBeLessThanOrEqual(1e-14);
            expect(Math.abs(values[m] - expected[m])).toBeLessThanOrEqual(1e-14);
          }
          expect(residual(h, values, vecRe, vecIm)).toBeLessThanOrEqual(1e-14);
          expect(orthonormalityError(3, vecRe, vecIm)).toBeLessThanOrEqual(1e-15);
        }
      }
    }
  });
});
