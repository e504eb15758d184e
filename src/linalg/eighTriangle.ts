/**
 * The passes over the lower triangle of one Householder step (see eighHouseholder.ts): the rank-2 update
 * A₂₂ ← A₂₂ − u·wᴴ − w·uᴴ, the Hermitian product q = A₂₂·v, or both fused in one pass.
 *
 * Layout (shared with eighHouseholder.ts): `work` is n×n row-major, complex interleaved, lower triangle —
 * (r, c) at work[2(r·n + c)] (re), +1 (im). `lanes` holds 8 doubles per index j: u at +0, w at +2, v at +4,
 * q at +6 (re, then im). Offsets are literals in the loops: V8 re-reads module-level constants with a hole check.
 * Row i of the product gives q_i += A_ij·v_j and q_j += conj(A_ij)·v_i (j < i), plus the real diagonal term.
 */

/** q = A₂₂·v over rows/columns start…n−1 (Hermitian product from the lower triangle): row i gives q_i += A_ij v_j and q_j += conj(A_ij) v_i. */
export function productOnly(n: number, work: Float64Array, lanes: Float64Array, start: number): void {
  for (let j = 8 * start, end = 8 * n; j < end; j += 8) {
    lanes[j + 6] = 0;
    lanes[j + 7] = 0;
  }
  for (let i = start; i < n; i++) {
    const li = 8 * i;
    const viRe = lanes[li + 4];
    const viIm = lanes[li + 5];
    let sRe = 0;
    let sIm = 0;
    for (let a = 2 * (i * n + start), l = 8 * start; l < li; a = (a + 2) | 0, l = (l + 8) | 0) {
      const x = work[a];
      const y = work[(a + 1) | 0];
      const vjRe = lanes[(l + 4) | 0];
      const vjIm = lanes[(l + 5) | 0];
      sRe += x * vjRe - y * vjIm;
      sIm += x * vjIm + y * vjRe;
      lanes[(l + 6) | 0] += x * viRe + y * viIm;
      lanes[(l + 7) | 0] += x * viIm - y * viRe;
    }
    const d = work[2 * (i * n + i)];
    lanes[li + 6] += sRe + d * viRe;
    lanes[li + 7] += sIm + d * viIm;
  }
}

/** Rank-2 update over rows/columns start…n−1 (no product: the next step needs no reflection). */
export function updateOnly(n: number, work: Float64Array, lanes: Float64Array, start: number): void {
  for (let i = start; i < n; i++) {
    const li = 8 * i;
    const uiRe = lanes[li];
    const uiIm = lanes[li + 1];
    const wiRe = lanes[li + 2];
    const wiIm = lanes[li + 3];
    for (let a = 2 * (i * n + start), l = 8 * start; l <= li; a = (a + 2) | 0, l = (l + 8) | 0) {
      const ujRe = lanes[l];
      const ujIm = lanes[(l + 1) | 0];
      const wjRe = lanes[(l + 2) | 0];
      const wjIm = lanes[(l + 3) | 0];
      work[a] -= uiRe * wjRe + uiIm * wjIm + wiRe * ujRe + wiIm * ujIm;
      work[(a + 1) | 0] -= uiIm * wjRe - uiRe * wjIm + wiIm * ujRe - wiRe * ujIm;
    }
  }
}

/**
 * Rank-2 update over rows/columns start…n−1 fused with q = A₂₂·v (v the next reflector) on the updated
 * entries: one pass over the triangle instead of two. Rows go in pairs so that each load of u_j, w_j, v_j
 * and each update of q_j serves two matrix entries (typed-array accesses, not flops, bound this loop in V8).
 */
export function updateAndProduct(n: number, work: Float64Array, lanes: Float64Array, start: number): void {
  for (let j = 8 * start, end = 8 * n; j < end; j += 8) {
    lanes[j + 6] = 0;
    lanes[j + 7] = 0;
  }
  let i = start;
  for (; i + 1 < n; i += 2) updatePairAndProduct(n, work, lanes, start, i);
  if (i < n) updateRowAndProduct(n, work, lanes, start, i);
}

/** Rows i and i+1 of updateAndProduct (columns start…i+1 of the lower triangle). */
function updatePairAndProduct(n: number, work: Float64Array, lanes: Float64Array, start: number, i: number): void {
  const li = 8 * i;
  const uiRe = lanes[li];
  const uiIm = lanes[li + 1];
  const wiRe = lanes[li + 2];
  const wiIm = lanes[li + 3];
  const viRe = lanes[li + 4];
  const viIm = lanes[li + 5];
  const lk = li + 8;
  const ukRe = lanes[lk];
  const ukIm = lanes[lk + 1];
  const wkRe = lanes[lk + 2];
  const wkIm = lanes[lk + 3];
  const vkRe = lanes[lk + 4];
  const vkIm = lanes[lk + 5];
  let sRe = 0;
  let sIm = 0;
  let tRe = 0;
  let tIm = 0;
  let a = 2 * (i * n + start);
  let b = a + 2 * n;
  // `| 0` keeps the index arithmetic in int32 without overflow checks (indices are < 8n², far from 2^31).
  for (let l = 8 * start; l < li; a = (a + 2) | 0, b = (b + 2) | 0, l = (l + 8) | 0) {
    const ujRe = lanes[l];
    const ujIm = lanes[(l + 1) | 0];
    const wjRe = lanes[(l + 2) | 0];
    const wjIm = lanes[(l + 3) | 0];
    const vjRe = lanes[(l + 4) | 0];
    const vjIm = lanes[(l + 5) | 0];
    const x = work[a] - (uiRe * wjRe + uiIm * wjIm + wiRe * ujRe + wiIm * ujIm);
    const y = work[(a + 1) | 0] - (uiIm * wjRe - uiRe * wjIm + wiIm * ujRe - wiRe * ujIm);
    work[a] = x;
    work[(a + 1) | 0] = y;
    const x2 = work[b] - (ukRe * wjRe + ukIm * wjIm + wkRe * ujRe + wkIm * ujIm);
    const y2 = work[(b + 1) | 0] - (ukIm * wjRe - ukRe * wjIm + wkIm * ujRe - wkRe * ujIm);
    work[b] = x2;
    work[(b + 1) | 0] = y2;
    sRe += x * vjRe - y * vjIm;
    sIm += x * vjIm + y * vjRe;
    tRe += x2 * vjRe - y2 * vjIm;
    tIm += x2 * vjIm + y2 * vjRe;
    lanes[(l + 6) | 0] += x * viRe + y * viIm + x2 * vkRe + y2 * vkIm;
    lanes[(l + 7) | 0] += x * viIm - y * viRe + x2 * vkIm - y2 * vkRe;
  }
  // Entry (i+1, i), then the two diagonal entries (real).
  const x2 = work[b] - (ukRe * wiRe + ukIm * wiIm + wkRe * uiRe + wkIm * uiIm);
  const y2 = work[b + 1] - (ukIm * wiRe - ukRe * wiIm + wkIm * uiRe - wkRe * uiIm);
  work[b] = x2;
  work[b + 1] = y2;
  tRe += x2 * viRe - y2 * viIm;
  tIm += x2 * viIm + y2 * viRe;
  const d = work[a] - 2 * (uiRe * wiRe + uiIm * wiIm);
  work[a] = d;
  lanes[li + 6] += sRe + d * viRe + x2 * vkRe + y2 * vkIm;
  lanes[li + 7] += sIm + d * viIm + x2 * vkIm - y2 * vkRe;
  const dk = work[b + 2] - 2 * (ukRe * wkRe + ukIm * wkIm);
  work[b + 2] = dk;
  lanes[lk + 6] += tRe + dk * vkRe;
  lanes[lk + 7] += tIm + dk * vkIm;
}

/** Row i of updateAndProduct on its own (the last row when the count is odd). */
function updateRowAndProduct(n: number, work: Float64Array, lanes: Float64Array, start: number, i: number): void {
  const li = 8 * i;
  const uiRe = lanes[li];
  const uiIm = lanes[li + 1];
  const wiRe = lanes[li + 2];
  const wiIm = lanes[li + 3];
  const viRe = lanes[li + 4];
  const viIm = lanes[li + 5];
  let sRe = 0;
  let sIm = 0;
  let a = 2 * (i * n + start);
  for (let l = 8 * start; l < li; a = (a + 2) | 0, l = (l + 8) | 0) {
    const ujRe = lanes[l];
    const ujIm = lanes[(l + 1) | 0];
    const wjRe = lanes[(l + 2) | 0];
    const wjIm = lanes[(l + 3) | 0];
    const x = work[a] - (uiRe * wjRe + uiIm * wjIm + wiRe * ujRe + wiIm * ujIm);
    const y = work[(a + 1) | 0] - (uiIm * wjRe - uiRe * wjIm + wiIm * ujRe - wiRe * ujIm);
    work[a] = x;
    work[(a + 1) | 0] = y;
    const vjRe = lanes[(l + 4) | 0];
    const vjIm = lanes[(l + 5) | 0];
    sRe += x * vjRe - y * vjIm;
    sIm += x * vjIm + y * vjRe;
    lanes[(l + 6) | 0] += x * viRe + y * viIm;
    lanes[(l + 7) | 0] += x * viIm - y * viRe;
  }
  const d = work[a] - 2 * (uiRe * wiRe + uiIm * wiIm);
  work[a] = d;
  lanes[li + 6] += sRe + d * viRe;
  lanes[li + 7] += sIm + d * viIm;
}
