/**
 * The passes of one step of the real Householder reduction (src/linalg/symmetricTriangle.ts in TypeScript,
 * symmetricTriangleSimd.ts in WebAssembly SIMD) against their definition, worked in the test on the full matrix:
 * A′ = A − u·wᵀ − w·uᵀ and q = A′·v on indices from…n−1 (Golub & Van Loan, Matrix Computations, 4th ed., §8.3).
 */
import { describe, expect, it } from 'vitest';
import { xorshift32 } from '../../src/linalg/eighRandom.ts';
import { simdInstance, simdModule } from '../../src/linalg/simdModule.ts';
import { product, updateAndProduct } from '../../src/linalg/symmetricTriangle.ts';

type Kind = 'product' | 'update' | 'updateAndProduct';
interface Step {
  work: Float64Array;
  u: Float64Array;
  w: Float64Array;
  v: Float64Array;
  q: Float64Array;
}
type Run = (n: number, step: Step, from: number) => void;

const TYPESCRIPT: Record<Kind, Run> = {
  product: (n, s, from) => product(n, s.work, s.v, s.q, from),
  update: (n, s, from) => updateAndProduct(n, s.work, s.u, s.w, s.v, s.q, from, false),
  updateAndProduct: (n, s, from) => updateAndProduct(n, s.work, s.u, s.w, s.v, s.q, from, true),
};

/** The SIMD pass on copies in its memory (work, then u, w, v, q), results copied back. */
function simdPass(name: string): Run {
  return (n, s, from) => {
    const module = simdModule();
    if (module === null) throw new Error('WebAssembly SIMD missing');
    const { memory, exports } = simdInstance(module, 8 * n * n + 32 * n);
    const f = new Float64Array(memory.buffer);
    const at = [0, n * n, n * n + n, n * n + 2 * n, n * n + 3 * n];
    [s.work, s.u, s.w, s.v, s.q].forEach((array, i) => f.set(array, at[i]));
    (exports[name] as (...args: number[]) => void)(...at.map((x) => 8 * x), n, from);
    s.work.set(f.subarray(0, n * n));
    s.q.set(f.subarray(at[4], at[4] + n));
  };
}

const SIMD: Record<Kind, Run> = {
  product: simdPass('symmetricProduct'),
  update: simdPass('symmetricUpdate'),
  updateAndProduct: simdPass('symmetricUpdateProduct'),
};

function randomStep(n: number, seed: number): Step {
  const uniform = xorshift32(seed);
  const random = (length: number) => new Float64Array(length).map(() => 2 * uniform() - 1);
  return { work: random(n * n), u: random(n), w: random(n), v: random(n), q: random(n) };
}

describe('the passes of a real Householder step on both routes', () => {
  for (const [route, passes] of [['TypeScript', TYPESCRIPT], ['SIMD', SIMD]] as const) {
    for (const kind of ['product', 'update', 'updateAndProduct'] as const) {
      it(`${route} ${kind}: the definition on the full matrix, n = 1…10 and 17, every start`, () => {
        for (const n of [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 17]) {
          for (let from = 0; from <= n; from++) {
            const step = randomStep(n, 100 * n + from);
            const { work, u, w, v } = step;
            // A′ from the lower triangle, mirrored (the upper triangle is never read).
            const full = (r: number, c: number): number => {
              const [i, j] = r >= c ? [r, c] : [c, r];
              const a = work[i * n + j];
              return kind !== 'product' && i >= from && j >= from ? a - (u[i] * w[j] + w[i] * u[j]) : a;
            };
            const updated = Float64Array.from({ length: n * n }, (_, i) => {
              const [r, c] = [Math.floor(i / n), i % n];
              return c <= r ? full(r, c) : work[i];
            });
            const q = Float64Array.from({ length: n }, (_, r) => {
              let sum = 0;
              for (let c = from; c < n; c++) sum += full(r, c) * v[c];
              return sum;
            });
            passes[kind](n, step, from);
            // Sums of at most 2n products of entries in [−1, 1): rounding below 1e-14 (common practice).
            for (let i = 0; i < n * n; i++) expect(Math.abs(step.work[i] - updated[i])).toBeLessThanOrEqual(1e-14);
            if (kind === 'update') continue;
            for (let j = from; j < n; j++) expect(Math.abs(step.q[j] - q[j])).toBeLessThanOrEqual(1e-14);
          }
        }
      });
    }
  }
});
