/**
 * Eigenvalues of a real symmetric matrix: Householder reduction to tridiagonal form (Golub & Van Loan, Matrix
 * Computations, 4th ed., Algorithm 8.3.1), then the root-free QR of eighTridiagonal.ts.
 *
 * Why a real kernel beside the complex one: a Bloch Hamiltonian that can be made real (a sheet with a 2-fold axis,
 * src/tb/realForm.ts) costs a quarter of the multiplications of the complex reduction.
 *
 * Layout: n×n row-major; only the lower triangle (c ≤ r) is read, the input is untouched.
 * Each step k applies the reflector P = I − τ·u·uᵀ on indices k+1…n−1 to the trailing block, A₂₂ ← P·A₂₂·P =
 * A₂₂ − u·wᵀ − w·uᵀ with p = τ·A₂₂·u, w = p − (τ·pᵀu/2)·u, on the lower triangle. The reduction runs in WebAssembly
 * SIMD, as one call (symmetricTriangleSimd.ts), from n = SYMMETRIC_SIMD_FROM where the runtime has it, and in
 * TypeScript (`reduce` with symmetricTriangle.ts) otherwise.
 */
import { tridiagonalEigenvaluesRootFree } from './eighTridiagonal.ts';
import { simdInstance, simdModule } from './simdModule.ts';
import { product, updateAndProduct } from './symmetricTriangle.ts';

/** The largest entry is brought into [2^−1, 1) by a power of two, so squares neither overflow nor underflow. */
function powerOfTwoBelow(x: number): number {
  return 2 ** Math.ceil(Math.log2(x));
}

/**
 * Below this order the default route is TypeScript: the two routes take the same time there (measured at n = 4–6;
 * at n = 3 TypeScript is faster), and TypeScript needs no WebAssembly memory (64 KiB a solver, however small n).
 */
export const SYMMETRIC_SIMD_FROM = 8;

/** Options of SymmetricEigenvalues (tests and benchmarks; the default picks the fastest route). */
export interface SymmetricEigenvaluesOptions {
  /**
   * The reduction: in WebAssembly SIMD where available from n = SYMMETRIC_SIMD_FROM (default), wherever available
   * and needed (true: n ≥ 3; tests), or in TypeScript (false).
   */
  simd?: boolean;
}

/**
 * Eigenvalues of n×n real symmetric matrices with workspaces preallocated for one n; calls allocate nothing.
 * Ascending output. An infinite or NaN entry, or a QR iteration that fails to converge, gives NaN everywhere —
 * the sentinel of HermitianEigensolver; it never throws.
 */
export class SymmetricEigenvalues {
  readonly n: number;
  /** True when the reduction runs in WebAssembly SIMD (symmetricTriangleSimd.ts), false for TypeScript. */
  readonly simd: boolean;
  private readonly work: Float64Array;
  // Reflectors of the current and the next step (swapped each step), the rank-2 vector w, the product q = A₂₂·v.
  private readonly u: Float64Array;
  private readonly v: Float64Array;
  private readonly w: Float64Array;
  private readonly q: Float64Array;
  private readonly diag: Float64Array;
  private readonly offSquared: Float64Array;
  /** The whole reduction in one WebAssembly call (symmetricReduce), or null on the TypeScript route. */
  private readonly reduceSimd: (() => void) | null;

  constructor(n: number, options: SymmetricEigenvaluesOptions = {}) {
    this.n = n;
    const wanted = options.simd ?? n >= SYMMETRIC_SIMD_FROM;
    const module = !wanted || n < 3 ? null : simdModule();
    this.simd = module !== null;
    if (module !== null) {
      // In the kernels' memory (f64 units): work (n²), then u, v, w, q, diag, offSquared (n each), ‖x‖² (1).
      const { memory, exports } = simdInstance(module, 8 * (n * n + 6 * n + 1));
      const view = (at: number, length: number) => new Float64Array(memory.buffer, 8 * at, length);
      const at = (i: number) => n * n + i * n;
      this.work = view(0, n * n);
      [this.u, this.v, this.w, this.q, this.diag, this.offSquared] = [0, 1, 2, 3, 4, 5].map((i) => view(at(i), n));
      const run = exports.symmetricReduce as (...addresses: number[]) => void;
      const bytes = [0, 1, 2, 3, 4, 5, 6].map((i) => 8 * at(i));
      this.reduceSimd = () => run(0, ...bytes, n);
    } else {
      this.work = new Float64Array(n * n);
      this.u = new Float64Array(n);
      this.v = new Float64Array(n);
      this.w = new Float64Array(n);
      this.q = new Float64Array(n);
      this.diag = new Float64Array(n);
      this.offSquared = new Float64Array(n);
      this.reduceSimd = null;
    }
  }

  /** Ascending eigenvalues of `matrix` into out (length ≥ n); returns out. */
  eigenvalues(matrix: Float64Array, out: Float64Array): Float64Array {
    const n = this.n;
    if (n === 0) return out;
    let largest = 0;
    for (let r = 0; r < n; r++) {
      for (let i = r * n, end = i + r + 1; i < end; i++) {
        const a = Math.abs(matrix[i]);
        if (!(a <= largest)) largest = a; // also catches NaN, which then stays
      }
    }
    if (!Number.isFinite(largest)) return out.fill(NaN, 0, n);
    const scale = largest > 0 ? powerOfTwoBelow(largest) : 1;
    const work = this.work;
    const inverse = 1 / scale;
    for (let r = 0; r < n; r++) {
      for (let i = r * n, end = i + r + 1; i < end; i++) work[i] = matrix[i] * inverse;
    }
    if (this.reduceSimd !== null) this.reduceSimd();
    else this.reduce();
    this.lastEntries();
    const diag = this.diag;
    if (!tridiagonalEigenvaluesRootFree(diag, this.offSquared, n)) return out.fill(NaN, 0, n);
    // Insertion sort: n is small and deflated blocks come out partly ordered.
    for (let i = 0; i < n; i++) {
      const value = diag[i] * scale;
      let j = i - 1;
      while (j >= 0 && out[j] > value) {
        out[j + 1] = out[j];
        j--;
      }
      out[j + 1] = value;
    }
    return out;
  }

  /**
   * Tridiagonalises `work` (lower triangle) in place, the TypeScript route (symmetricReduce of
   * symmetricTriangleSimd.ts is the same, step for step): diag and offSquared up to n−3 (lastEntries does the rest).
   * The rank-2 update of step k and the product A₂₂·v of step k+1 share one pass over the triangle (column k+1
   * is updated first, so the next reflector v is known before the pass): typed-array accesses, not flops,
   * bound these loops in V8, so one pass instead of two is what pays.
   */
  private reduce(): void {
    const { n, work, diag, w, q } = this;
    let u = this.u;
    let v = this.v;
    let tau = n >= 3 ? this.reflector(0, this.column(0, 0, u, u), u) : 0;
    if (tau !== 0) product(n, work, u, q, 1);
    for (let k = 0; k + 2 < n; k++) {
      diag[k] = work[k * n + k];
      const start = k + 1;
      const norm2 = this.column(start, tau, u, v);
      const nextTau = k + 3 < n ? this.reflector(start, norm2, v) : 0;
      if (tau !== 0) updateAndProduct(n, work, u, w, v, q, start + 1, nextTau !== 0);
      else if (nextTau !== 0) product(n, work, v, q, start + 1);
      [u, v] = [v, u];
      tau = nextTau;
    }
  }

  /** The last 2×2 of T, which no reflector touches: diag[n−2], diag[n−1], offSquared[n−2] (offSquared[n−1] = 0). */
  private lastEntries(): void {
    const { n, work, diag, offSquared } = this;
    if (n >= 2) {
      diag[n - 2] = work[(n - 2) * n + n - 2];
      const last = work[(n - 1) * n + n - 2];
      offSquared[n - 2] = last * last;
    }
    diag[n - 1] = work[n * n - 1];
    offSquared[n - 1] = 0;
  }

  /**
   * The O(n) work before the reflector of column `start` (the TypeScript route; symmetricTriangleSimd.ts has the
   * SIMD one). When τ of the current reflector u is not 0: w = τ·q − (τ²·qᵀu/2)·u, and column `start` (rows
   * start…n−1) gets its rank-2 update ahead of the pass. Then the column below the diagonal is copied into `out`;
   * returns its ‖x‖².
   */
  private column(start: number, tau: number, u: Float64Array, out: Float64Array): number {
    const { n, work, w, q } = this;
    if (tau !== 0) {
      let qu = 0;
      for (let i = start; i < n; i++) qu += q[i] * u[i];
      const half = 0.5 * tau * tau * qu;
      for (let i = start; i < n; i++) w[i] = tau * q[i] - half * u[i];
      const us = u[start];
      const ws = w[start];
      for (let i = start; i < n; i++) work[i * n + start] -= u[i] * ws + w[i] * us;
    }
    let norm2 = 0;
    for (let i = start + 1; i < n; i++) {
      const x = work[i * n + start];
      norm2 += x * x;
      out[i] = x;
    }
    return norm2;
  }

  /**
   * The reflector of column `col` (rows col+1…n−1, copied into `out` with ‖x‖² = norm2 by the column step):
   * v = x − β·e₁, β = −sign(x₀)·‖x‖ (no cancellation in v₀), vᵀv = 2α(α + |x₀|) so τ = 1/(α(α + |x₀|)). Sets
   * offSquared[col] = β². Returns τ, or 0 when the column is already reduced (nothing below its first
   * sub-diagonal entry).
   */
  private reflector(col: number, norm2: number, out: Float64Array): number {
    const x0 = out[col + 1];
    this.offSquared[col] = norm2;
    if (norm2 === x0 * x0) return 0;
    const alpha = Math.sqrt(norm2);
    out[col + 1] = x0 >= 0 ? x0 + alpha : x0 - alpha;
    return 1 / (alpha * (alpha + Math.abs(x0)));
  }
}
