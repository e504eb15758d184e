/**
 * The passes over the lower triangle of one step of the real Householder reduction (symmetricEigenvalues.ts), in
 * TypeScript: the product q = A·v, and the rank-2 update A ← A − u·wᵀ − w·uᵀ alone or fused with the product.
 * Layout: `work` n×n row-major (lower triangle read and written); u, w, v, q of length n. symmetricTriangleSimd.ts
 * has the same passes in WebAssembly SIMD.
 */

/** q = A·v over indices from…n−1, from the lower triangle: row i gives q_i += A_ij·v_j and q_j += A_ij·v_i (j < i). */
export function product(n: number, work: Float64Array, v: Float64Array, q: Float64Array, from: number): void {
  q.fill(0, from, n);
  for (let i = from; i < n; i++) {
    const row = i * n;
    const vi = v[i];
    let sum = 0;
    for (let j = from; j < i; j++) {
      const a = work[row + j];
      sum += a * v[j];
      q[j] += a * vi;
    }
    q[i] += sum + work[row + i] * vi;
  }
}

/**
 * A ← A − u·wᵀ − w·uᵀ over indices from…n−1 (lower triangle), and, when `withProduct`, q = A·v on the updated
 * entries in the same pass.
 */
export function updateAndProduct(
  n: number, work: Float64Array, u: Float64Array, w: Float64Array, v: Float64Array, q: Float64Array,
  from: number, withProduct: boolean,
): void {
  if (!withProduct) {
    for (let i = from; i < n; i++) {
      const row = i * n;
      const ui = u[i];
      const wi = w[i];
      for (let j = from; j <= i; j++) work[row + j] -= ui * w[j] + wi * u[j];
    }
    return;
  }
  q.fill(0, from, n);
  let i = from;
  // Rows in pairs: each load of u_j, w_j, v_j and each update of q_j serves two matrix entries.
  for (; i + 1 < n; i += 2) {
    const row0 = i * n;
    const row1 = row0 + n;
    const u0 = u[i], w0 = w[i], v0 = v[i];
    const u1 = u[i + 1], w1 = w[i + 1], v1 = v[i + 1];
    let sum0 = 0;
    let sum1 = 0;
    for (let j = from; j < i; j++) {
      const uj = u[j], wj = w[j], vj = v[j];
      const a0 = work[row0 + j] - (u0 * wj + w0 * uj);
      const a1 = work[row1 + j] - (u1 * wj + w1 * uj);
      work[row0 + j] = a0;
      work[row1 + j] = a1;
      sum0 += a0 * vj;
      sum1 += a1 * vj;
      q[j] += a0 * v0 + a1 * v1;
    }
    // The 2×2 corner: (i, i), (i+1, i), (i+1, i+1).
    const d0 = work[row0 + i] - 2 * u0 * w0;
    const c = work[row1 + i] - (u1 * w0 + w1 * u0);
    const d1 = work[row1 + i + 1] - 2 * u1 * w1;
    work[row0 + i] = d0;
    work[row1 + i] = c;
    work[row1 + i + 1] = d1;
    q[i] += sum0 + d0 * v0 + c * v1;
    q[i + 1] += sum1 + c * v0 + d1 * v1;
  }
  if (i < n) {
    const row = i * n;
    const ui = u[i], wi = w[i], vi = v[i];
    let sum = 0;
    for (let j = from; j < i; j++) {
      const a = work[row + j] - (ui * w[j] + wi * u[j]);
      work[row + j] = a;
      sum += a * v[j];
      q[j] += a * vi;
    }
    const d = work[row + i] - 2 * ui * wi;
    work[row + i] = d;
    q[i] += sum + d * vi;
  }
}
