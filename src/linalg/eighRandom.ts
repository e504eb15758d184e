/**
 * Seeded random dense complex Hermitian matrices for benchmarks and tests (split storage, row-major:
 * element (r, c) is re[r*n + c] + i·im[r*n + c]), and real symmetric ones (row-major). Entries are uniform in
 * [−1, 1); the diagonal is real.
 */

/** xorshift32 generator (Marsaglia, "Xorshift RNGs", J. Stat. Softw. 8(14), 2003) giving uniforms in [0, 1). */
export function xorshift32(seed: number): () => number {
  let state = seed >>> 0 || 0x9e3779b9;
  return () => {
    state ^= state << 13;
    state >>>= 0;
    state ^= state >>> 17;
    state ^= state << 5;
    state >>>= 0;
    return state / 4294967296;
  };
}

/** Fills re/im (length ≥ n²) with a random Hermitian matrix drawn from `uniform`. */
export function fillRandomHermitian(n: number, uniform: () => number, re: Float64Array, im: Float64Array): void {
  for (let r = 0; r < n; r++) {
    re[r * n + r] = 2 * uniform() - 1;
    im[r * n + r] = 0;
    for (let c = 0; c < r; c++) {
      const a = 2 * uniform() - 1;
      const b = 2 * uniform() - 1;
      re[r * n + c] = a;
      re[c * n + r] = a;
      im[r * n + c] = b;
      im[c * n + r] = -b;
    }
  }
}

/** Fills a (length ≥ n²) with a random real symmetric matrix drawn from `uniform`. */
export function fillRandomSymmetric(n: number, uniform: () => number, a: Float64Array): void {
  for (let r = 0; r < n; r++) {
    for (let c = 0; c <= r; c++) {
      const x = 2 * uniform() - 1;
      a[r * n + c] = x;
      a[c * n + r] = x;
    }
  }
}
