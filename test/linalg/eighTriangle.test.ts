/**
 * The passes of one Householder step (src/linalg/eighTriangle.ts in TypeScript, eighTriangleSimd.ts in WebAssembly
 * SIMD) against their definition, worked in the test on the full matrix: A′ = A − u·wᴴ − w·uᴴ and q = A′·v on
 * rows and columns start…n−1 (Golub & Van Loan, Matrix Computations, 4th ed., §8.3, in complex form).
 */
import { describe, expect, it } from 'vitest';
import { productOnly, updateAndProduct, updateOnly } from '../../src/linalg/eighTriangle.ts';
import { xorshift32 } from '../../src/linalg/eighRandom.ts';
import { simdInstance, simdModule } from '../../src/linalg/simdModule.ts';

type PassName = 'productOnly' | 'updateOnly' | 'updateAndProduct';
type Run = (n: number, work: Float64Array, lanes: Float64Array, start: number) => void;

const TYPESCRIPT: Record<PassName, Run> = { productOnly, updateOnly, updateAndProduct };

/** The SIMD pass on copies of work and lanes in its memory (layout of eighHouseholder.ts), results copied back. */
function simdPass(name: string): Run {
  return (n, work, lanes, start) => {
    const module = simdModule();
    if (module === null) throw new Error('WebAssembly SIMD missing');
    const lanesAt = 16 * n * n;
    const { memory, exports } = simdInstance(module, lanesAt + 96 * n);
    const f = new Float64Array(memory.buffer);
    f.set(work, 0);
    f.set(lanes, lanesAt / 8);
    (exports[name] as (...args: number[]) => void)(0, lanesAt, lanesAt + 64 * n, n, start);
    work.set(f.subarray(0, 2 * n * n));
    lanes.set(f.subarray(lanesAt / 8, lanesAt / 8 + 8 * n));
  };
}

const SIMD: Record<PassName, Run> = {
  productOnly: simdPass('hermitianProduct'),
  updateOnly: simdPass('hermitianUpdate'),
  updateAndProduct: simdPass('hermitianUpdateProduct'),
};

/** Random lower triangle (real diagonal) and lanes u, w, v (q filled with junk the pass must overwrite). */
function randomStep(n: number, seed: number): { work: Float64Array; lanes: Float64Array } {
  const uniform = xorshift32(seed);
  const work = new Float64Array(2 * n * n).map(() => 2 * uniform() - 1);
  for (let i = 0; i < n; i++) work[2 * (i * n + i) + 1] = 0;
  const lanes = new Float64Array(8 * n).map(() => 2 * uniform() - 1);
  return { work, lanes };
}

/** The definition on the full Hermitian matrix: A′ (lower triangle, interleaved) and q = A′·v. */
function expected(n: number, work: Float64Array, lanes: Float64Array, start: number, update: boolean) {
  const at = (r: number, c: number): [number, number] =>
    r >= c ? [work[2 * (r * n + c)], work[2 * (r * n + c) + 1]] : [work[2 * (c * n + r)], -work[2 * (c * n + r) + 1]];
  const lane = (j: number, slot: number): [number, number] => [lanes[8 * j + 2 * slot], lanes[8 * j + 2 * slot + 1]];
  // a·conj(b)
  const timesConj = ([ar, ai]: [number, number], [br, bi]: [number, number]): [number, number] =>
    [ar * br + ai * bi, ai * br - ar * bi];
  const updated = new Float64Array(work);
  const full = (r: number, c: number): [number, number] => {
    let [x, y] = at(r, c);
    if (update && r >= start && c >= start) {
      const [a, b] = timesConj(lane(r, 0), lane(c, 1));
      const [d, e] = timesConj(lane(r, 1), lane(c, 0));
      x -= a + d;
      y -= b + e;
    }
    return r === c ? [x, 0] : [x, y];
  };
  for (let r = start; r < n; r++) {
    for (let c = start; c <= r; c++) {
      const [x, y] = full(r, c);
      updated[2 * (r * n + c)] = x;
      if (r !== c) updated[2 * (r * n + c) + 1] = y;
    }
  }
  const q = new Float64Array(2 * n);
  for (let r = start; r < n; r++) {
    for (let c = start; c < n; c++) {
      const [x, y] = full(r, c);
      const [vr, vi] = lane(c, 2);
      q[2 * r] += x * vr - y * vi;
      q[2 * r + 1] += x * vi + y * vr;
    }
  }
  return { updated, q };
}

describe('the passes of a Householder step on both routes', () => {
  it('WebAssembly SIMD is available in this Node (else the SIMD route would silently be TypeScript)', () => {
    // Node ≥ 16.4 ships WebAssembly SIMD (common practice); a null here means our module failed to validate.
    expect(simdModule()).not.toBeNull();
  });

  for (const [route, passes] of [['TypeScript', TYPESCRIPT], ['SIMD', SIMD]] as const) {
    for (const name of ['productOnly', 'updateOnly', 'updateAndProduct'] as const) {
      it(`${route} ${name}: the definition on the full matrix, n = 1…9 and 16, every start`, () => {
        for (const n of [1, 2, 3, 4, 5, 6, 7, 8, 9, 16]) {
          for (let start = 0; start <= n; start++) {
            const { work, lanes } = randomStep(n, 100 * n + start);
            const reference = expected(n, work, lanes, start, name !== 'productOnly');
            passes[name](n, work, lanes, start);
            // Sums of at most 4n products of entries in [−1, 1): rounding below 1e-14 (common practice).
            for (let r = 0; r < n; r++) {
              for (let c = 0; c <= r; c++) {
                for (const part of [0, 1]) {
                  const i = 2 * (r * n + c) + part;
                  expect(Math.abs(work[i] - reference.updated[i])).toBeLessThanOrEqual(1e-14);
                }
              }
            }
            if (name === 'updateOnly') continue;
            for (let j = start; j < n; j++) {
              expect(Math.abs(lanes[8 * j + 6] - reference.q[2 * j])).toBeLessThanOrEqual(1e-13);
              expect(Math.abs(lanes[8 * j + 7] - reference.q[2 * j + 1])).toBeLessThanOrEqual(1e-13);
            }
          }
        }
      });
    }
  }
});
