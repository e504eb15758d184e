/**
 * Eigenvalues (and optionally rotations of a basis) of a real symmetric tridiagonal matrix by the implicit
 * symmetric QR step with a Wilkinson shift (Golub & Van Loan, Matrix Computations, 4th ed., §8.3).
 *
 * Layout: `diag[i]` (i = 0…n−1) is T[i][i]; `off[i]` (i = 0…n−2) is T[i][i+1] = T[i+1][i].
 * Basis rows (eigenvector variant): `rows` is n×n real row-major; row i holds the current basis vector that
 * belongs to index i of T, so a rotation in the (i, i+1) plane touches two contiguous rows.
 * The arrays are overwritten: `diag` ends with the (unsorted) eigenvalues, `off` with zeros.
 * Callers pre-scale T so that its largest entry lies in [2^−100, 2^100] (squares neither overflow nor underflow).
 */

const EPS = 2 ** -52;
/** Sweeps allowed per eigenvalue before giving up (LAPACK allows 30 per eigenvalue; common practice). */
const SWEEPS_PER_VALUE = 30;

/**
 * Off-diagonals below this are negligible outright: callers scale T so that its largest entry lies in
 * [2^−100, 2^100], so this is far below ε·‖T‖, and squares of larger values stay normal numbers.
 */
export const ABSOLUTE_FLOOR = 2 ** -500;
/** Below this a rotation's x² + z² may have lost precision to underflow; rescale before the square root. */
const ROTATION_UNSAFE = 2 ** -450;
const FLOOR_SQUARED = ABSOLUTE_FLOOR * ABSOLUTE_FLOOR;
/**
 * Flush level of the root-free step, relative to the block's largest entry squared. A pivot square
 * p = γ²/c ≥ γ² (the entry the next rotation eliminates against, squared) below (2^−10·ε·scale)² is replaced
 * by 0 together with γ: the exact step for a T changed by less than 2^−10·ε·scale, so backward stable.
 * Without it a tiny γ (a shift equal to a diagonal entry up to 1e-160, say) leaves p subnormal with a few
 * digits, and ν²/(r·p) comes out wrong by ~1e-5 or as 0/0. With p = 0 or p ≥ this level, r·p ≥ p² is a
 * normal number and underflow in ν² adds far less than (ε·scale)² to the next p.
 */
const FLUSH_SQUARED = (EPS * 2 ** -10) ** 2;
/** Smallest block scale the flush level is taken relative to: callers scale T's largest entry to ≥ 2^−100. */
const SMALLEST_SCALE_SQUARED = 2 ** -200;

/**
 * True when off[i] is negligible beside its diagonal neighbours (relative test, Golub & Van Loan §8.3)
 * or below the absolute floor.
 */
function negligible(diag: Float64Array, off: Float64Array, i: number): boolean {
  const b = Math.abs(off[i]);
  return b <= ABSOLUTE_FLOOR || b <= EPS * (Math.abs(diag[i]) + Math.abs(diag[i + 1]));
}

/**
 * One implicit QR step on the unreduced block l…m (Golub & Van Loan §8.3, implicit symmetric QR step), chasing the bulge from the top.
 * When `rows` is given the rotations are recorded in `rotations` (c_k at 2k, s_k at 2k + 1) and then applied
 * to the basis rows.
 */
function qrStep(
  diag: Float64Array, off: Float64Array, l: number, m: number, n: number,
  rows: Float64Array | null, rotations: Float64Array | null,
): void {
  // Wilkinson shift: eigenvalue of the trailing 2×2 block closer to its last diagonal entry.
  const bLast = off[m - 1];
  const delta = 0.5 * (diag[m - 1] - diag[m]);
  const root = Math.sqrt(delta * delta + bLast * bLast);
  const shift = diag[m] - (bLast * bLast) / (delta + (delta >= 0 ? root : -root));

  let x = diag[l] - shift;
  let z = off[l];
  for (let k = l; k < m; k++) {
    let r = Math.sqrt(x * x + z * z);
    if (r < ROTATION_UNSAFE && r !== 0) {
      const big = Math.max(Math.abs(x), Math.abs(z));
      r = big * Math.sqrt((x / big) * (x / big) + (z / big) * (z / big));
    }
    // r = 0 only if the bulge vanished; the identity rotation keeps the block as it is.
    const c = r === 0 ? 1 : x / r;
    const s = r === 0 ? 0 : z / r;
    if (k > l) off[k - 1] = r;
    // Rotation R = [[c, s], [−s, c]] in the (k, k+1) plane: T ← R T Rᵀ.
    const ak = diag[k];
    const ak1 = diag[k + 1];
    const bk = off[k];
    const cs = c * s;
    diag[k] = c * c * ak + 2 * cs * bk + s * s * ak1;
    diag[k + 1] = s * s * ak - 2 * cs * bk + c * c * ak1;
    off[k] = cs * (ak1 - ak) + (c * c - s * s) * bk;
    x = off[k];
    if (k + 1 < m) {
      const bNext = off[k + 1];
      z = s * bNext;
      off[k + 1] = c * bNext;
    }
    if (rotations !== null) {
      rotations[2 * k] = c;
      rotations[2 * k + 1] = s;
    }
  }
  if (rows !== null && rotations !== null) applyRotations(rows, n, l, m, rotations);
}

/**
 * Applies the recorded rotations k = l…m−1 (rows k, k+1 ← c·row_k + s·row_{k+1}, c·row_{k+1} − s·row_k) in order,
 * four at a time: consecutive rotations share rows, so each pass loads and stores five rows instead of eight
 * (typed-array accesses, not flops, bound this loop in V8).
 */
function applyRotations(rows: Float64Array, n: number, l: number, m: number, rotations: Float64Array): void {
  let k = l;
  for (; k + 3 < m; k += 4) {
    const c1 = rotations[2 * k];
    const s1 = rotations[2 * k + 1];
    const c2 = rotations[2 * k + 2];
    const s2 = rotations[2 * k + 3];
    const c3 = rotations[2 * k + 4];
    const s3 = rotations[2 * k + 5];
    const c4 = rotations[2 * k + 6];
    const s4 = rotations[2 * k + 7];
    // `| 0` keeps the index arithmetic in int32 without overflow checks (indices < n², far from 2^31).
    for (let p = k * n, end = p + n; p < end; p = (p + 1) | 0) {
      const p1 = (p + n) | 0;
      const p2 = (p1 + n) | 0;
      const p3 = (p2 + n) | 0;
      const p4 = (p3 + n) | 0;
      const a = rows[p];
      const b = rows[p1];
      const b1 = c1 * b - s1 * a;
      rows[p] = c1 * a + s1 * b;
      const d = rows[p2];
      const d2 = c2 * d - s2 * b1;
      rows[p1] = c2 * b1 + s2 * d;
      const e = rows[p3];
      const e3 = c3 * e - s3 * d2;
      rows[p2] = c3 * d2 + s3 * e;
      const f = rows[p4];
      rows[p3] = c4 * e3 + s4 * f;
      rows[p4] = c4 * f - s4 * e3;
    }
  }
  for (; k < m; k++) {
    const c = rotations[2 * k];
    const s = rotations[2 * k + 1];
    for (let p = k * n, end = p + n; p < end; p = (p + 1) | 0) {
      const q = (p + n) | 0;
      const u = rows[p];
      const v = rows[q];
      rows[p] = c * u + s * v;
      rows[q] = c * v - s * u;
    }
  }
}

/**
 * Eigenvalues only, by the root-free QR step of Pal, Walker and Kahan (Parlett, The Symmetric Eigenvalue Problem,
 * 1998, ch. 8, root-free QR): it carries the squared off-diagonal, so a rotation costs divisions but no square root.
 * `offSquared[i]` is T[i][i+1]²; both arrays are overwritten. Returns false when it did not converge.
 * Pivots below 2^−10·ε times their block's largest entry are flushed to 0 (FLUSH_SQUARED).
 */
export function tridiagonalEigenvaluesRootFree(diag: Float64Array, offSquared: Float64Array, n: number): boolean {
  const eps2 = EPS * EPS;
  let sweeps = 0;
  const maxSweeps = SWEEPS_PER_VALUE * n;
  let m = n - 1;
  // Start of the unreduced block that ends at m, or −1 when it must be searched for again.
  let l = -1;
  // Pivot squares below this are flushed to 0 (FLUSH_SQUARED); set per block, an upper bound after deflations.
  let flushBelow = 0;
  while (m > 0) {
    // Deflation test b² ≤ ε²·(|a_i| + |a_{i+1}|)² or b² ≤ floor², the square of the test in `negligible`.
    let size = Math.abs(diag[m - 1]) + Math.abs(diag[m]);
    if (offSquared[m - 1] <= eps2 * size * size || offSquared[m - 1] <= FLOOR_SQUARED) {
      offSquared[m - 1] = 0;
      m--;
      if (m <= l) l = -1;
      continue;
    }
    if (l < 0) {
      l = m - 1;
      while (l > 0) {
        size = Math.abs(diag[l - 1]) + Math.abs(diag[l]);
        if (offSquared[l - 1] <= eps2 * size * size || offSquared[l - 1] <= FLOOR_SQUARED) break;
        l--;
      }
      if (l > 0) offSquared[l - 1] = 0;
      flushBelow = flushLevel(diag, offSquared, l, m);
    }
    if (++sweeps > maxSweeps) return false;
    // Wilkinson shift from the trailing 2×2 block, as in qrStep.
    const bb = offSquared[m - 1];
    const delta = 0.5 * (diag[m - 1] - diag[m]);
    const root = Math.sqrt(delta * delta + bb);
    const shift = diag[m] - bb / (delta + (delta >= 0 ? root : -root));
    // γ-form of the shifted QR step (Parlett, ch. 8): γ is the running diagonal entry of the rotated T − σ,
    // p = γ²/c² the square of the entry the next rotation eliminates against. Written with
    // ν = r·γ_next = p·(α − σ) − b²·γ so that the divisions 1/r and 1/(r·p) do not wait on each other.
    // Splits inside the block are detected during the sweep, off the division chain's critical path.
    let c = 1;
    let s = 0;
    let gamma = diag[l] - shift;
    let p = gamma * gamma;
    let split = -1;
    for (let i = l; i < m; i++) {
      const b2 = offSquared[i];
      const alpha = diag[i + 1];
      let r: number;
      let nextGamma: number;
      let nextP: number;
      let nextC: number;
      let nextS: number;
      if (p >= flushBelow) {
        r = p + b2;
        const inverse = 1 / r;
        const nu = p * (alpha - shift) - b2 * gamma;
        nextGamma = nu * inverse;
        // p_next = γ_next²/c_next = ν²/(r·p).
        nextP = (nu * nu) / (r * p);
        nextC = p * inverse;
        nextS = b2 * inverse;
      } else {
        // Flushed pivot (FLUSH_SQUARED): the exact step for γ = p = 0, whose limit p_next = c_previous·b²
        // (Parlett, ch. 8).
        gamma = 0;
        r = b2;
        nextGamma = 0;
        nextP = c * b2;
        nextC = 0;
        nextS = 1;
      }
      diag[i] = gamma + (alpha - nextGamma);
      if (i > l) {
        const settled = s * r;
        offSquared[i - 1] = settled;
        const around = Math.abs(diag[i - 1]) + Math.abs(diag[i]);
        if (settled <= eps2 * around * around || settled <= FLOOR_SQUARED) split = i - 1;
      }
      c = nextC;
      s = nextS;
      gamma = nextGamma;
      p = nextP;
    }
    if (p < flushBelow) {
      // The last pivot, flushed as in the loop (it becomes the last off-diagonal's square).
      p = 0;
      gamma = 0;
    }
    offSquared[m - 1] = s * p;
    diag[m] = shift + gamma;
    if (split >= 0) {
      offSquared[split] = 0;
      l = split + 1;
      flushBelow = flushLevel(diag, offSquared, l, m);
    }
  }
  return true;
}

/** Flush level of the root-free step on block l…m: FLUSH_SQUARED·max(largest entry², 2^−200). */
function flushLevel(diag: Float64Array, offSquared: Float64Array, l: number, m: number): number {
  let largest = SMALLEST_SCALE_SQUARED;
  for (let i = l; i <= m; i++) largest = Math.max(largest, diag[i] * diag[i]);
  for (let i = l; i < m; i++) largest = Math.max(largest, offSquared[i]);
  return FLUSH_SQUARED * largest;
}

/**
 * Diagonalises the tridiagonal T in place. With `rows` (basis rows, see the layout above) the same rotations
 * are applied to them; `rotations` is then required scratch of length ≥ 2n. Returns false when the iteration
 * did not converge within 30 sweeps per eigenvalue (the caller then reports its NaN sentinel).
 */
export function diagonaliseTridiagonal(
  diag: Float64Array, off: Float64Array, n: number,
  rows: Float64Array | null = null, rotations: Float64Array | null = null,
): boolean {
  let sweeps = 0;
  const maxSweeps = SWEEPS_PER_VALUE * n;
  let m = n - 1;
  while (m > 0) {
    if (negligible(diag, off, m - 1)) {
      off[m - 1] = 0;
      m--;
      continue;
    }
    let l = m - 1;
    while (l > 0 && !negligible(diag, off, l - 1)) l--;
    if (l > 0) off[l - 1] = 0;
    if (++sweeps > maxSweeps) return false;
    qrStep(diag, off, l, m, n, rows, rotations);
  }
  return true;
}
