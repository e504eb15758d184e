/**
 * Eigenvalues and eigenvectors of a real symmetric tridiagonal matrix by divide and conquer (Cuppen, Numer.
 * Math. 36, 177 (1981)) with the eigenvector update of Gu & Eisenstat (SIAM J. Matrix Anal. Appl. 16, 172 (1995)).
 *
 * Layout: `diag[i]` = T[i][i], `off[i]` = T[i][i+1] (i < n−1). Result: `diag` ascending eigenvalues (overwritten),
 * `vectors` n×n real row-major with eigenvector m in column m (component r at vectors[r·n + m]).
 *
 * Split. T = diag(T₁′, T₂′) + ρ·v·vᵀ with β = T[h−1][h] at the middle h, ρ = |β|, v = e_{h−1} + sign(β)·e_h, and
 * T₁′, T₂′ the halves with |β| taken from their touching diagonal entries. Each half is solved (recursively; QR
 * below LEAF_SIZE), which turns the problem into D + ρ·z·zᵀ with z = (last row of Q₁, sign(β)·first row of Q₂).
 * Merge. Deflation (Dongarra & Sorensen, SIAM J. Sci. Stat. Comput. 8, s139 (1987)): a component with ρ|z_j| below
 * tol = max(8ε·max(|d|, ρ), 2^−500) keeps (d_j, its column); two poles closer than tol after a rotation that zeroes one z
 * component keep the rotated pair. The rest solve the secular equation (eighSecular.ts); z is then recomputed
 * from the computed roots (Löwner's formula, Gu & Eisenstat §3), ẑ_j² = Π_i (λ_i − d_j) / Π_{i≠j} (d_i − d_j),
 * which makes the eigenvectors u_i ∝ (ẑ_j/(d_j − λ_i))_j orthogonal to working precision, and the merged
 * eigenvectors are [Q₁ 0; 0 Q₂]·U, multiplied only where the blocks are non-zero (columns from Q₁ only, from
 * both after a deflating rotation, from Q₂ only — the column types of LAPACK's dlaed2, described in Gu &
 * Eisenstat §5).
 */
import { simdModule } from './simdModule.ts';
import { secularRoot } from './eighSecular.ts';
import { ABSOLUTE_FLOOR, diagonaliseTridiagonal } from './eighTridiagonal.ts';

const EPS = 2 ** -52;
/** Blocks up to this order are solved by implicit QR with rotations (faster there than a merge). */
export const LEAF_SIZE = 16;

const TOP = 1;
const BOTTOM = 2;

/** Divide-and-conquer solver with workspaces for orders up to maxN (allocated once; solve allocates nothing). */
export class TridiagonalDivideConquer {
  readonly maxN: number;
  private readonly poles: Float64Array;
  private readonly weights: Float64Array;
  private readonly origin: Int32Array;
  private readonly offset: Float64Array;
  private readonly updated: Float64Array;
  private readonly z: Float64Array;
  private readonly sorted: Int32Array;
  private readonly kept: Int32Array;
  private readonly deflated: Int32Array;
  private readonly kind: Int32Array;
  private readonly grouped: Int32Array;
  private readonly values: Float64Array;
  private readonly finalOrder: Int32Array;
  private readonly columns: Float64Array;
  private readonly update: Float64Array;
  private readonly product: Float64Array;
  private readonly gatheredU: Float64Array;
  private readonly leafDiag: Float64Array;
  private readonly leafOff: Float64Array;
  private readonly leafRows: Float64Array;
  private readonly leafRotations: Float64Array;
  /** The SIMD product (eighDivideSimd.ts) and where its operands sit in its memory, or null (TypeScript). */
  private readonly simd: { run: (...args: number[]) => void; a: number; bt: number; out: number } | null;
  /** Row stride of `product` in the last merge. */
  private productStride = 0;

  /** Blocks up to this order are leaves (QR). */
  readonly leafSize: number;

  /**
   * Options: `simd` (default true) runs the merge's product in WebAssembly SIMD where the runtime has it;
   * `leafSize` (default LEAF_SIZE, at least 1) is the largest block solved by QR — tests set it low to merge
   * at small orders.
   */
  constructor(maxN: number, options: { simd?: boolean; leafSize?: number } = {}) {
    this.maxN = maxN;
    this.leafSize = Math.max(1, options.leafSize ?? LEAF_SIZE);
    const module = options.simd === false ? null : simdModule();
    // Padded operands (see eighDivideSimd.ts): a spare row, columns to even counts, bt rows to multiples of 4.
    const side = maxN + 4;
    if (module !== null) {
      const memory = new WebAssembly.Memory({ initial: Math.ceil((3 * 8 * side * side) / 65536) });
      const instance = new WebAssembly.Instance(module, { env: { memory } });
      const run = instance.exports.multiplyRows as (...args: number[]) => void;
      this.columns = new Float64Array(memory.buffer, 0, side * side);
      this.gatheredU = new Float64Array(memory.buffer, 8 * side * side, side * side);
      this.product = new Float64Array(memory.buffer, 16 * side * side, side * side);
      this.simd = { run, a: 0, bt: 8 * side * side, out: 16 * side * side };
    } else {
      this.columns = new Float64Array(maxN * maxN);
      this.gatheredU = new Float64Array(maxN * maxN);
      this.product = new Float64Array(maxN * maxN);
      this.simd = null;
    }
    this.poles = new Float64Array(maxN);
    this.weights = new Float64Array(maxN);
    this.origin = new Int32Array(maxN);
    this.offset = new Float64Array(maxN);
    this.updated = new Float64Array(maxN);
    this.z = new Float64Array(maxN);
    this.sorted = new Int32Array(maxN);
    this.kept = new Int32Array(maxN);
    this.deflated = new Int32Array(maxN);
    this.kind = new Int32Array(maxN);
    this.grouped = new Int32Array(maxN);
    this.values = new Float64Array(maxN);
    this.finalOrder = new Int32Array(maxN);
    this.update = new Float64Array(maxN * maxN);
    const leaf = Math.max(1, Math.min(maxN, this.leafSize));
    this.leafDiag = new Float64Array(leaf);
    this.leafOff = new Float64Array(leaf);
    this.leafRows = new Float64Array(leaf * leaf);
    this.leafRotations = new Float64Array(2 * leaf);
  }

  /**
   * Diagonalises T (order n ≤ maxN) in place: ascending eigenvalues in `diag`, eigenvectors in the columns of
   * `vectors`. `off` is overwritten. Returns false when a QR leaf did not converge (outputs then undefined).
   * Callers pre-scale T so that its largest entry lies in [2^−100, 2^100], as for eighTridiagonal.ts.
   */
  solve(diag: Float64Array, off: Float64Array, n: number, vectors: Float64Array): boolean {
    vectors.fill(0, 0, n * n);
    return this.block(diag, off, n, vectors, 0, n);
  }

  private block(diag: Float64Array, off: Float64Array, n: number, vectors: Float64Array, lo: number, hi: number): boolean {
    const m = hi - lo;
    if (m <= this.leafSize) return this.leaf(diag, off, n, vectors, lo, hi);
    const mid = lo + (m >> 1);
    const beta = off[mid - 1];
    const rho = Math.abs(beta);
    diag[mid - 1] -= rho;
    diag[mid] -= rho;
    if (!this.block(diag, off, n, vectors, lo, mid)) return false;
    if (!this.block(diag, off, n, vectors, mid, hi)) return false;
    this.merge(diag, n, vectors, lo, mid, hi, rho, beta < 0 ? -1 : 1);
    return true;
  }

  /** QR with rotations on the block, eigenvalues sorted ascending with their vectors. */
  private leaf(diag: Float64Array, off: Float64Array, n: number, vectors: Float64Array, lo: number, hi: number): boolean {
    const m = hi - lo;
    const d = this.leafDiag;
    const e = this.leafOff;
    const rows = this.leafRows;
    for (let i = 0; i < m; i++) {
      d[i] = diag[lo + i];
      e[i] = i + 1 < m ? off[lo + i] : 0;
    }
    rows.fill(0, 0, m * m);
    for (let i = 0; i < m; i++) rows[i * m + i] = 1;
    if (!diagonaliseTridiagonal(d, e, m, rows, this.leafRotations)) return false;
    const order = this.finalOrder;
    for (let i = 0; i < m; i++) {
      const v = d[i];
      let j = i - 1;
      while (j >= 0 && d[order[j]] > v) {
        order[j + 1] = order[j];
        j--;
      }
      order[j + 1] = i;
    }
    for (let c = 0; c < m; c++) {
      const source = order[c] * m;
      diag[lo + c] = d[order[c]];
      for (let r = 0; r < m; r++) vectors[(lo + r) * n + lo + c] = rows[source + r];
    }
    return true;
  }

  /**
   * Merges the solved halves lo…mid−1 and mid…hi−1 (block columns ascending within each half) under the
   * rank-one term ρ·v·vᵀ; leaves the block's eigenvalues ascending in diag[lo…hi−1] and vectors in its columns.
   */
  private merge(
    diag: Float64Array, n: number, vectors: Float64Array, lo: number, mid: number, hi: number, rho: number, sign: number,
  ): void {
    const m = hi - lo;
    const n1 = mid - lo;
    const z = this.z;
    const kind = this.kind;
    // z with ‖z‖ = 1 (each half's row of an orthogonal matrix has norm 1), so ρ doubles.
    const half = Math.SQRT1_2;
    for (let c = 0; c < n1; c++) {
      z[c] = vectors[(mid - 1) * n + lo + c] * half;
      kind[c] = TOP;
    }
    for (let c = n1; c < m; c++) {
      z[c] = sign * vectors[mid * n + lo + c] * half;
      kind[c] = BOTTOM;
    }
    rho *= 2;
    // Block columns in ascending order of their eigenvalue (a merge of the two sorted halves).
    const sorted = this.sorted;
    let largest = rho;
    for (let a = 0, b = n1, s = 0; s < m; s++) {
      if (b >= m || (a < n1 && diag[lo + a] <= diag[lo + b])) sorted[s] = a++;
      else sorted[s] = b++;
      largest = Math.max(largest, Math.abs(diag[lo + sorted[s]]));
    }
    // The floor is the QR route's negligible coupling (eighTridiagonal.ts; callers scale T to entries near 1): with
    // every pole 0 and a subnormal ρ, 8ε·largest underflows to 0 and the secular equation loses its eigenvectors.
    const tol = Math.max(8 * EPS * largest, ABSOLUTE_FLOOR);
    const kept = this.kept;
    const deflated = this.deflated;
    let k = 0;
    let deflatedCount = 0;
    let previous = -1;
    for (let s = 0; s < m; s++) {
      const c = sorted[s];
      if (rho * Math.abs(z[c]) <= tol) {
        deflated[deflatedCount++] = c;
        continue;
      }
      if (previous < 0) {
        previous = c;
        continue;
      }
      // Close poles: the rotation G = [[γ, σ], [−σ, γ]] on (previous, c) zeroes z_previous; it leaves the
      // off-diagonal γσ(d_c − d_previous), dropped when below tol.
      const zp = z[previous];
      const zc = z[c];
      const length = Math.hypot(zp, zc);
      const gamma = zc / length;
      const sigma = -zp / length;
      const dp = diag[lo + previous];
      const dc = diag[lo + c];
      if (Math.abs((dc - dp) * gamma * sigma) <= tol) {
        z[c] = length;
        z[previous] = 0;
        for (let r = 0; r < m; r++) {
          const at = (lo + r) * n + lo;
          const x = vectors[at + previous];
          const y = vectors[at + c];
          vectors[at + previous] = gamma * x + sigma * y;
          vectors[at + c] = gamma * y - sigma * x;
        }
        diag[lo + previous] = gamma * gamma * dp + sigma * sigma * dc;
        diag[lo + c] = sigma * sigma * dp + gamma * gamma * dc;
        kind[c] |= kind[previous];
        kind[previous] |= kind[c];
        deflated[deflatedCount++] = previous;
      } else {
        kept[k++] = previous;
      }
      previous = c;
    }
    if (previous >= 0) kept[k++] = previous;

    const values = this.values;
    const product = this.product;
    if (k > 0) {
      this.secular(diag, lo, k, rho);
      this.multiply(n, vectors, lo, m, n1, k);
      for (let i = 0; i < k; i++) values[i] = this.poles[this.origin[i]] + this.offset[i];
    }
    // Deflated values ascending (insertion sort: nearly sorted already), then merged with the k roots.
    for (let a = 1; a < deflatedCount; a++) {
      const c = deflated[a];
      const v = diag[lo + c];
      let b = a - 1;
      while (b >= 0 && diag[lo + deflated[b]] > v) {
        deflated[b + 1] = deflated[b];
        b--;
      }
      deflated[b + 1] = c;
    }
    // Final columns: root i → product column i (m×k, row stride productStride); deflated column c → block
    // column c. Written to `columns` first (the block is still read for deflated columns), then copied back.
    const columns = this.columns;
    const stride = this.productStride;
    for (let a = 0, b = 0, out = 0; out < m; out++) {
      const takeRoot = b < k && (a >= deflatedCount || values[b] <= diag[lo + deflated[a]]);
      if (takeRoot) {
        this.updated[out] = values[b];
        for (let r = 0; r < m; r++) columns[r * m + out] = product[r * stride + b];
        b++;
      } else {
        const c = deflated[a++];
        this.updated[out] = diag[lo + c];
        for (let r = 0; r < m; r++) columns[r * m + out] = vectors[(lo + r) * n + lo + c];
      }
    }
    for (let r = 0; r < m; r++) {
      const at = (lo + r) * n + lo;
      for (let c = 0; c < m; c++) vectors[at + c] = columns[r * m + c];
    }
    for (let c = 0; c < m; c++) diag[lo + c] = this.updated[c];
  }

  /**
   * Roots of the secular equation for the kept columns, the recomputed ẑ (Gu & Eisenstat), and the k×k
   * eigenvector matrix of D + ρ·ẑ·ẑᵀ, transposed, in `update` (row i ↔ root i, entry t ↔ kept column t).
   */
  private secular(diag: Float64Array, lo: number, k: number, rho: number): void {
    const poles = this.poles;
    const weights = this.weights;
    const kept = this.kept;
    const z = this.z;
    for (let t = 0; t < k; t++) {
      poles[t] = diag[lo + kept[t]];
      const zt = z[kept[t]];
      weights[t] = rho * zt * zt;
    }
    const origin = this.origin;
    const offset = this.offset;
    for (let i = 0; i < k; i++) secularRoot(i, k, poles, weights, origin, offset);
    // ẑ_j² = (λ_j − d_j)·Π_{i≠j} (λ_i − d_j)/(d_i − d_j), with λ_i − d_j = (d_o − d_j) + τ_i formed exactly.
    const zHat = this.updated;
    for (let j = 0; j < k; j++) {
      const dj = poles[j];
      let w = poles[origin[j]] - dj + offset[j];
      for (let i = 0; i < k; i++) {
        if (i === j) continue;
        w *= (poles[origin[i]] - dj + offset[i]) / (poles[i] - dj);
      }
      const magnitude = Math.sqrt(Math.max(w, 0));
      zHat[j] = z[kept[j]] < 0 ? -magnitude : magnitude;
    }
    // Column i of U: ẑ_j/(d_j − λ_i), normalised.
    const u = this.update;
    for (let i = 0; i < k; i++) {
      const base = poles[origin[i]];
      const tau = offset[i];
      let sum = 0;
      for (let j = 0; j < k; j++) {
        const x = zHat[j] / (poles[j] - base - tau);
        u[i * k + j] = x;
        sum += x * x;
      }
      const scale = 1 / Math.sqrt(sum);
      for (let j = i * k, end = j + k; j < end; j++) u[j] *= scale;
    }
  }

  /**
   * product (m×k) = [kept block columns]·U, skipping the zero blocks: kept columns are grouped top-only,
   * mixed, bottom-only; rows 0…n1−1 multiply the first two groups, rows n1…m−1 the last two.
   */
  private multiply(n: number, vectors: Float64Array, lo: number, m: number, n1: number, k: number): void {
    const kept = this.kept;
    const kind = this.kind;
    const grouped = this.grouped;
    let g = 0;
    for (let t = 0; t < k; t++) if (kind[kept[t]] === TOP) grouped[g++] = t;
    for (let t = 0; t < k; t++) if (kind[kept[t]] === (TOP | BOTTOM)) grouped[g++] = t;
    for (let t = 0; t < k; t++) if (kind[kept[t]] === BOTTOM) grouped[g++] = t;
    let topCount = 0;
    let mixedCount = 0;
    for (let t = 0; t < k; t++) {
      if (kind[kept[t]] === TOP) topCount++;
      else if (kind[kept[t]] === (TOP | BOTTOM)) mixedCount++;
    }
    // Gathered operands: the kept columns (m×k) in group order, and Uᵀ's entries (k×k) in the same order.
    const columns = this.columns;
    const u = this.update;
    const rowsU = this.gatheredU;
    const source = this.sorted;
    for (let g2 = 0; g2 < k; g2++) source[g2] = lo + kept[grouped[g2]];
    const simd = this.simd;
    // SIMD operands are padded (eighDivideSimd.ts): stride kp even, a spare zero row, bt rows to k4.
    const kp = simd === null ? k : k + (k & 1);
    const k4 = simd === null ? k : (k + 3) & ~3;
    for (let r = 0; r < m; r++) {
      const at = (lo + r) * n;
      const row = r * kp;
      for (let g2 = 0; g2 < k; g2++) columns[row + g2] = vectors[at + source[g2]];
      if (kp > k) columns[row + k] = 0;
    }
    for (let i = 0; i < k; i++) {
      const row = i * k;
      const to = i * kp;
      for (let g2 = 0; g2 < k; g2++) rowsU[to + g2] = u[row + grouped[g2]];
      if (kp > k) rowsU[to + k] = 0;
    }
    const product = this.product;
    this.productStride = k4;
    if (simd === null) {
      multiplyRows(columns, rowsU, product, 0, n1, 0, topCount + mixedCount, k);
      multiplyRows(columns, rowsU, product, n1, m, topCount, k, k);
      return;
    }
    columns.fill(0, m * kp, (m + 1) * kp);
    rowsU.fill(0, k * kp, k4 * kp);
    const even = (x: number) => x + (x & 1);
    // Rows 0…n1−1 (a pair may run into row n1, which the second call then overwrites), then n1…m−1.
    simd.run(simd.a, simd.bt, simd.out, even(n1), k4, 0, 16 * (even(topCount + mixedCount) >> 1), 8 * kp, 8 * k4);
    simd.run(simd.a + 8 * n1 * kp, simd.bt, simd.out + 8 * n1 * k4, even(m - n1), k4, 16 * (topCount >> 1), 8 * kp, 8 * kp, 8 * k4);
  }

}

/**
 * product[r][i] = Σ_{g = g0…g1−1} a[r][g]·bt[i][g] for rows r0…r1−1 (a, bt: rows of length k; product: k
 * columns). Each entry is a dot product of two contiguous rows; blocks of 2 rows × 4 columns keep eight sums in
 * registers, so each load serves two or four multiply-adds (loads, not flops, bound such loops in V8).
 */
function multiplyRows(
  a: Float64Array, bt: Float64Array, product: Float64Array, r0: number, r1: number, g0: number, g1: number, k: number,
): void {
  let r = r0;
  for (; r + 1 < r1; r += 2) {
    const a0 = r * k;
    const a1 = a0 + k;
    let i = 0;
    for (; i + 3 < k; i += 4) {
      const b0 = i * k;
      const b1 = b0 + k;
      const b2 = b1 + k;
      const b3 = b2 + k;
      let s00 = 0;
      let s01 = 0;
      let s02 = 0;
      let s03 = 0;
      let s10 = 0;
      let s11 = 0;
      let s12 = 0;
      let s13 = 0;
      // `| 0` keeps the index arithmetic in int32 without overflow checks (indices < n², far from 2^31).
      for (let g = g0; g < g1; g = (g + 1) | 0) {
        const x0 = a[(a0 + g) | 0];
        const x1 = a[(a1 + g) | 0];
        const y0 = bt[(b0 + g) | 0];
        const y1 = bt[(b1 + g) | 0];
        const y2 = bt[(b2 + g) | 0];
        const y3 = bt[(b3 + g) | 0];
        s00 += x0 * y0;
        s01 += x0 * y1;
        s02 += x0 * y2;
        s03 += x0 * y3;
        s10 += x1 * y0;
        s11 += x1 * y1;
        s12 += x1 * y2;
        s13 += x1 * y3;
      }
      product[a0 + i] = s00;
      product[a0 + i + 1] = s01;
      product[a0 + i + 2] = s02;
      product[a0 + i + 3] = s03;
      product[a1 + i] = s10;
      product[a1 + i + 1] = s11;
      product[a1 + i + 2] = s12;
      product[a1 + i + 3] = s13;
    }
    for (; i < k; i++) {
      let s0 = 0;
      let s1 = 0;
      for (let g = g0, b = i * k; g < g1; g++) {
        s0 += a[a0 + g] * bt[b + g];
        s1 += a[a1 + g] * bt[b + g];
      }
      product[a0 + i] = s0;
      product[a1 + i] = s1;
    }
  }
  if (r < r1) {
    const a0 = r * k;
    for (let i = 0; i < k; i++) {
      let s0 = 0;
      for (let g = g0, b = i * k; g < g1; g++) s0 += a[a0 + g] * bt[b + g];
      product[a0 + i] = s0;
    }
  }
}
