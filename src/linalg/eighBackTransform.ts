/**
 * Back-transformation of tridiagonal eigenvectors to the original basis: V = Q·D·Z (see eigh.ts).
 *
 * Layout. `q` is Q, n×n row-major, complex interleaved: (r, c) at q[2(r·n + c)] (re) and q[2(r·n + c) + 1] (im).
 * Reflector k is u_k in row k of `reflRe`/`reflIm` (entries k+1…n−1) with τ_k in `tau` (P_k = I − τ_k·u_k·u_kᴴ).
 * `sums` is scratch of length 4n: per column c, [s_c re, s_c im, s'_c re, s'_c im].
 */

/**
 * Q = P₀·P₁·…·P_{n−2}, applied right to left (Q ← P_k·Q, k = n−2…0) so each P_k touches only the trailing
 * block k+1…n−1 (Golub & Van Loan, Matrix Computations, 4th ed., §5.1, backward accumulation).
 * Each step needs s = u_kᴴ·Q; the update of step k and the sums s' of the next reflector share one pass.
 */
export function formUnitary(
  n: number, tau: Float64Array, reflRe: Float64Array, reflIm: Float64Array, q: Float64Array, sums: Float64Array,
): void {
  q.fill(0, 0, 2 * n * n);
  for (let i = 0; i < n; i++) q[2 * (i * n + i)] = 1;
  let k = nextReflector(tau, n - 2);
  if (k < 0) return;
  // s = u_kᴴ·Q for the first reflector applied: Q is still the identity there.
  for (let c = k + 1; c < n; c++) {
    sums[4 * c] = reflRe[k * n + c];
    sums[4 * c + 1] = -reflIm[k * n + c];
  }
  while (k >= 0) {
    const next = nextReflector(tau, k - 1);
    const t = tau[k];
    const uRow = k * n;
    const first = k + 1;
    if (next >= 0) {
      // Rows next+1…k of Q are still identity rows, so s'_c = conj(u'_c) there; the pass adds rows k+1…n−1.
      const vRow = next * n;
      for (let c = next + 1; c <= k; c++) {
        sums[4 * c + 2] = reflRe[vRow + c];
        sums[4 * c + 3] = -reflIm[vRow + c];
      }
      for (let c = first; c < n; c++) {
        sums[4 * c + 2] = 0;
        sums[4 * c + 3] = 0;
      }
      let r = first;
      for (; r + 1 < n; r += 2) updatePairAndSum(n, q, sums, first, r, t, reflRe, reflIm, uRow, vRow);
      if (r < n) {
        const tuRe = t * reflRe[uRow + r];
        const tuIm = t * reflIm[uRow + r];
        const vRe = reflRe[vRow + r];
        const vIm = reflIm[vRow + r];
        // `| 0` keeps the index arithmetic in int32 without overflow checks (indices < 4n², far from 2^31).
        for (let a = 2 * (r * n + first), l = 4 * first, end = 2 * (r * n + n); a < end; a = (a + 2) | 0, l = (l + 4) | 0) {
          const sRe = sums[l];
          const sIm = sums[(l + 1) | 0];
          const x = q[a] - (tuRe * sRe - tuIm * sIm);
          const y = q[(a + 1) | 0] - (tuRe * sIm + tuIm * sRe);
          q[a] = x;
          q[(a + 1) | 0] = y;
          sums[(l + 2) | 0] += vRe * x + vIm * y;
          sums[(l + 3) | 0] += vRe * y - vIm * x;
        }
      }
      for (let c = next + 1; c < n; c++) {
        sums[4 * c] = sums[4 * c + 2];
        sums[4 * c + 1] = sums[4 * c + 3];
      }
    } else {
      for (let r = first; r < n; r++) {
        const tuRe = t * reflRe[uRow + r];
        const tuIm = t * reflIm[uRow + r];
        for (let a = 2 * (r * n + first), l = 4 * first, end = 2 * (r * n + n); a < end; a = (a + 2) | 0, l = (l + 4) | 0) {
          const sRe = sums[l];
          const sIm = sums[(l + 1) | 0];
          q[a] -= tuRe * sRe - tuIm * sIm;
          q[(a + 1) | 0] -= tuRe * sIm + tuIm * sRe;
        }
      }
    }
    k = next;
  }
}

/**
 * Rows r and r+1 of the fused pass: Q_rc −= τ·u_r·s_c, then s'_c += conj(v_r)·Q_rc, for columns first…n−1.
 * Pairing rows halves the loads and stores of the sums per entry.
 */
function updatePairAndSum(
  n: number, q: Float64Array, sums: Float64Array, first: number, r: number, t: number,
  reflRe: Float64Array, reflIm: Float64Array, uRow: number, vRow: number,
): void {
  const tuRe = t * reflRe[uRow + r];
  const tuIm = t * reflIm[uRow + r];
  const vRe = reflRe[vRow + r];
  const vIm = reflIm[vRow + r];
  const tu2Re = t * reflRe[uRow + r + 1];
  const tu2Im = t * reflIm[uRow + r + 1];
  const v2Re = reflRe[vRow + r + 1];
  const v2Im = reflIm[vRow + r + 1];
  // `| 0` keeps the index arithmetic in int32 without overflow checks (indices < 4n², far from 2^31).
  let b = 2 * ((r + 1) * n + first);
  for (let a = 2 * (r * n + first), l = 4 * first, end = 2 * (r * n + n); a < end; a = (a + 2) | 0, b = (b + 2) | 0, l = (l + 4) | 0) {
    const sRe = sums[l];
    const sIm = sums[(l + 1) | 0];
    const x = q[a] - (tuRe * sRe - tuIm * sIm);
    const y = q[(a + 1) | 0] - (tuRe * sIm + tuIm * sRe);
    q[a] = x;
    q[(a + 1) | 0] = y;
    const x2 = q[b] - (tu2Re * sRe - tu2Im * sIm);
    const y2 = q[(b + 1) | 0] - (tu2Re * sIm + tu2Im * sRe);
    q[b] = x2;
    q[(b + 1) | 0] = y2;
    sums[(l + 2) | 0] += vRe * x + vIm * y + v2Re * x2 + v2Im * y2;
    sums[(l + 3) | 0] += vRe * y - vIm * x + v2Re * y2 - v2Im * x2;
  }
}

/** Largest k' ≤ k with τ_k' ≠ 0, or −1. */
function nextReflector(tau: Float64Array, k: number): number {
  while (k >= 0 && tau[k] === 0) k--;
  return k;
}

/**
 * V = Q·D·Z with Z real, written to vecRe/vecIm[r·n + m]: eigenvector m is row order[m] of `rows` (Zᵀ, n×n
 * real row-major). Scales Q's columns by the phases d_i in place first. Each entry is a dot product of two
 * contiguous rows; four eigenvectors share each pass so every load of Q serves eight multiply-adds.
 */
export function multiplyBasis(
  n: number, q: Float64Array, phaseRe: Float64Array, phaseIm: Float64Array, rows: Float64Array,
  order: Int32Array, vecRe: Float64Array, vecIm: Float64Array,
): void {
  for (let r = 0; r < n; r++) {
    for (let i = 0, a = 2 * r * n; i < n; i++, a += 2) {
      const x = q[a];
      const y = q[a + 1];
      q[a] = x * phaseRe[i] - y * phaseIm[i];
      q[a + 1] = x * phaseIm[i] + y * phaseRe[i];
    }
  }
  for (let r = 0; r < n; r++) {
    const qRow = 2 * r * n;
    const out = r * n;
    let m = 0;
    for (; m + 3 < n; m += 4) dotFour(n, q, qRow, rows, order, m, vecRe, vecIm, out);
    for (; m < n; m++) {
      const first = order[m] * n;
      let aRe = 0;
      let aIm = 0;
      // `| 0` keeps the index arithmetic in int32 without overflow checks (indices < 2n², far from 2^31).
      for (let i = 0, a = qRow; i < n; i = (i + 1) | 0, a = (a + 2) | 0) {
        const u = rows[(first + i) | 0];
        aRe += q[a] * u;
        aIm += q[(a + 1) | 0] * u;
      }
      vecRe[out + m] = aRe;
      vecIm[out + m] = aIm;
    }
  }
}

/** Entries m…m+3 of row r of V (see multiplyBasis), with eight independent accumulators. */
function dotFour(
  n: number, q: Float64Array, qRow: number, rows: Float64Array, order: Int32Array, m: number,
  vecRe: Float64Array, vecIm: Float64Array, out: number,
): void {
  const z0 = order[m] * n;
  const z1 = order[m + 1] * n;
  const z2 = order[m + 2] * n;
  const z3 = order[m + 3] * n;
  let re0 = 0;
  let im0 = 0;
  let re1 = 0;
  let im1 = 0;
  let re2 = 0;
  let im2 = 0;
  let re3 = 0;
  let im3 = 0;
  // `| 0` keeps the index arithmetic in int32 without overflow checks (indices < 2n², far from 2^31).
  for (let i = 0, a = qRow; i < n; i = (i + 1) | 0, a = (a + 2) | 0) {
    const x = q[a];
    const y = q[(a + 1) | 0];
    const u0 = rows[(z0 + i) | 0];
    const u1 = rows[(z1 + i) | 0];
    const u2 = rows[(z2 + i) | 0];
    const u3 = rows[(z3 + i) | 0];
    re0 += x * u0;
    im0 += y * u0;
    re1 += x * u1;
    im1 += y * u1;
    re2 += x * u2;
    im2 += y * u2;
    re3 += x * u3;
    im3 += y * u3;
  }
  vecRe[out + m] = re0;
  vecIm[out + m] = im0;
  vecRe[out + m + 1] = re1;
  vecIm[out + m + 1] = im1;
  vecRe[out + m + 2] = re2;
  vecIm[out + m + 2] = im2;
  vecRe[out + m + 3] = re3;
  vecIm[out + m + 3] = im3;
}
