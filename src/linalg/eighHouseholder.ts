/**
 * Householder reduction of a complex Hermitian matrix to tridiagonal form, H = Q·T·Qᴴ
 * (Golub & Van Loan, Matrix Computations, 4th ed., §8.3, written here in complex form).
 *
 * Layout. Working copy `work`: n×n row-major, complex interleaved, lower triangle only (c ≤ r) —
 * element (r, c) is work[2(r·n + c)] + i·work[2(r·n + c) + 1]. Vectors of one step: `lanes`, 8 doubles per
 * index j — [u_j, w_j, v_j, q_j] as (re, im) pairs: u the current reflector, w its rank-2 vector, v the next
 * reflector, q the product A₂₂·v being accumulated — so the hot loop reads one array with one running index.
 * Reflector k is P_k = I − τ_k·u_k·u_kᴴ (τ_k real; P_k Hermitian and unitary) on indices k+1…n−1; u_k is kept
 * for the back-transformation in row k of `reflRe`/`reflIm` (entries k+1…n−1).
 * Results: `diag[k]` = T[k][k] (real), `subRe[k] + i·subIm[k]` = T[k+1][k] (complex).
 *
 * Each step applies A₂₂ ← P·A₂₂·P = A₂₂ − u·wᴴ − w·uᴴ with p = τ·A₂₂·u, w = p − (τ·uᴴp/2)·u, on the lower
 * triangle only. The rank-2 update of step k and the product A₂₂·u_{k+1} of step k+1 share one pass over the
 * triangle (column k+1 is updated first, so u_{k+1} is known before the pass; eighTriangle.ts). The passes run in
 * WebAssembly SIMD where the runtime has it (eighTriangleSimd.ts; `work` and `lanes` then live in its memory),
 * in TypeScript otherwise; the O(n) work of each step (reflector, column k+1, w) is TypeScript on either route.
 */

import { productOnly, updateAndProduct, updateOnly } from './eighTriangle.ts';
import { simdInstance, simdModule } from './simdModule.ts';

/** The three passes of a step on one route, each over rows/columns start…n−1 (eighTriangle.ts). */
interface TrianglePasses {
  productOnly(start: number): void;
  updateOnly(start: number): void;
  updateAndProduct(start: number): void;
}

/** Below this, a sum of squares may have lost precision to underflow (2^−1022/ε ≈ 2^−970); rescale first. */
const SQUARES_UNSAFE = 2 ** -900;
/** Largest entries in this range need no rescaling (their squares and products are safe). */
const SCALE_FREE_LOW = 2 ** -100;
const SCALE_FREE_HIGH = 2 ** 100;
// Offsets inside one 8-double lane are written as literals in the loops: u +0, w +2, v +4, q +6 (re; im +1).
// Module-level constants would be re-read with a hole check on every access by V8's optimiser.

/** Workspaces and results of the reduction for one matrix order n (allocated once, reused). */
export class HermitianTridiagonaliser {
  /** Matrix order. */
  readonly n: number;
  /** Reflector u_k in row k, entries k+1…n−1. */
  readonly reflRe: Float64Array;
  readonly reflIm: Float64Array;
  /** τ_k of each reflector; 0 where the column needed no reflection. */
  readonly tau: Float64Array;
  /** Diagonal of T. */
  readonly diag: Float64Array;
  /** Complex sub-diagonal T[k+1][k], k = 0…n−2. */
  readonly subRe: Float64Array;
  readonly subIm: Float64Array;
  /** True when the passes run in WebAssembly SIMD. */
  readonly simd: boolean;
  private readonly work: Float64Array;
  private readonly lanes: Float64Array;
  private readonly passes: TrianglePasses;

  /** Options: `simd` (default true) runs the passes in WebAssembly SIMD where available; false forces TypeScript. */
  constructor(n: number, options: { simd?: boolean } = {}) {
    this.n = n;
    this.reflRe = new Float64Array(n * n);
    this.reflIm = new Float64Array(n * n);
    this.tau = new Float64Array(n);
    this.diag = new Float64Array(n);
    this.subRe = new Float64Array(n);
    this.subIm = new Float64Array(n);
    const module = options.simd === false || n < 3 ? null : simdModule();
    this.simd = module !== null;
    if (module !== null) {
      const { memory, exports } = simdInstance(module, 16 * n * n + 96 * n);
      this.work = new Float64Array(memory.buffer, 0, 2 * n * n);
      this.lanes = new Float64Array(memory.buffer, 16 * n * n, 8 * n);
      const lanesAt = 16 * n * n;
      const pass = (name: string) => {
        const run = exports[name] as (work: number, lanes: number, swaps: number, n: number, start: number) => void;
        return (start: number) => run(0, lanesAt, lanesAt + 64 * n, n, start);
      };
      this.passes = {
        productOnly: pass('hermitianProduct'),
        updateOnly: pass('hermitianUpdate'),
        updateAndProduct: pass('hermitianUpdateProduct'),
      };
    } else {
      const work = new Float64Array(2 * n * n);
      const lanes = new Float64Array(8 * n);
      this.work = work;
      this.lanes = lanes;
      this.passes = {
        productOnly: (start) => productOnly(n, work, lanes, start),
        updateOnly: (start) => updateOnly(n, work, lanes, start),
        updateAndProduct: (start) => updateAndProduct(n, work, lanes, start),
      };
    }
  }

  /**
   * Reduces the Hermitian matrix re + i·im (split, row-major, lower triangle read; inputs untouched).
   * Returns the power of two by which T's entries must be multiplied to undo the rescaling, or NaN (and does
   * nothing more) when an entry is infinite or NaN.
   */
  reduce(re: Float64Array, im: Float64Array): number {
    const n = this.n;
    const scale = this.copyLower(re, im);
    if (Number.isNaN(scale)) return scale;
    const work = this.work;
    const tau = this.tau;
    this.diag[0] = work[0];
    if (n === 1) return scale;
    const passes = this.passes;
    if (this.reflector(0, false)) passes.productOnly(1);
    for (let k = 0; k + 1 < n; k++) {
      const first = k + 1;
      const updating = tau[k] !== 0;
      if (updating) this.toRankTwoVector(k);
      const producing = this.reflector(first, updating);
      if (updating && producing) passes.updateAndProduct(k + 2);
      else if (updating) passes.updateOnly(k + 2);
      else if (producing) passes.productOnly(first + 1);
    }
    return scale;
  }

  /**
   * Copies the lower triangle into the workspace; returns 1, or NaN for a matrix with an infinite or NaN entry.
   * When the largest entry lies outside [2^−100, 2^100] the copy is scaled by the power of two 2^−e that brings
   * it near 1 (exact) and 2^e, the factor to undo, is returned. Entries then stay in a range where the squares
   * the kernels form neither overflow nor lose precision, except entries below 2^−500 relative to the largest,
   * which the kernels treat as negligible or rescale locally.
   */
  private copyLower(re: Float64Array, im: Float64Array): number {
    const n = this.n;
    const work = this.work;
    let largest = 0;
    // x − x is 0 for finite x and NaN for ±∞ or NaN, so `finite` stays 0 only for a finite matrix.
    let finite = 0;
    for (let r = 0; r < n; r++) {
      const row = r * n;
      for (let c = 0, a = 2 * row; c <= r; c++, a += 2) {
        const x = re[row + c];
        const y = im[row + c];
        work[a] = x;
        work[a + 1] = y;
        finite += x - x + (y - y);
        const size = Math.max(Math.abs(x), Math.abs(y));
        if (size > largest) largest = size;
      }
    }
    if (finite !== 0) return NaN;
    if (largest === 0 || (largest >= SCALE_FREE_LOW && largest <= SCALE_FREE_HIGH)) return 1;
    const exponent = Math.round(Math.log2(largest));
    // 2^−e overflows for subnormal inputs (e < −1023): apply it as two exact powers of two.
    const firstFactor = 2 ** Math.min(-exponent, 1000);
    const secondFactor = 2 ** (-exponent - Math.min(-exponent, 1000));
    for (let r = 0; r < n; r++) {
      for (let a = 2 * r * n, end = a + 2 * (r + 1); a < end; a++) work[a] = work[a] * firstFactor * secondFactor;
    }
    return 2 ** exponent;
  }

  /**
   * Column k (rows k…n−1) brought up to date by the rank-2 update of step k−1 when `updating` (−u·wᴴ − w·uᴴ, u and
   * w in the lanes), T[k][k] read, then reflector k from rows k+1…n−1: P·x = −phase(x₀)·‖x‖·e₁ with
   * u = x + phase(x₀)·‖x‖·e₁ (no cancellation) and τ = 2/(uᴴu) = 1/(‖x‖·(‖x‖ + |x₀|)). One strided pass over the
   * column: x goes to row k of reflRe/reflIm as it is read. Writes u there and into the v lanes. Returns false
   * (τ = 0, T[k+1][k] = x₀; row k of reflRe/reflIm then unused) when x is already a multiple of e₁, or when k is
   * the last index.
   */
  private reflector(k: number, updating: boolean): boolean {
    const n = this.n;
    const work = this.work;
    const lanes = this.lanes;
    const uRe = this.reflRe;
    const uIm = this.reflIm;
    const uRow = k * n;
    const first = k + 1;
    if (updating) {
      const ucRe = lanes[8 * k];
      const ucIm = lanes[8 * k + 1];
      const wcRe = lanes[8 * k + 2];
      const wcIm = lanes[8 * k + 3];
      for (let i = k, at = 2 * (k * n + k); i < n; i++, at += 2 * n) {
        const uiRe = lanes[8 * i];
        const uiIm = lanes[8 * i + 1];
        const wiRe = lanes[8 * i + 2];
        const wiIm = lanes[8 * i + 3];
        const x = work[at] - (uiRe * wcRe + uiIm * wcIm + wiRe * ucRe + wiIm * ucIm);
        const y = work[at + 1] - (uiIm * wcRe - uiRe * wcIm + wiIm * ucRe - wiRe * ucIm);
        work[at] = x;
        work[at + 1] = y;
        uRe[uRow + i] = x;
        uIm[uRow + i] = y;
      }
    } else {
      for (let i = k, at = 2 * (k * n + k); i < n; i++, at += 2 * n) {
        uRe[uRow + i] = work[at];
        uIm[uRow + i] = work[at + 1];
      }
    }
    this.diag[k] = uRe[uRow + k];
    if (first >= n) return false;
    let alphaRe = uRe[uRow + first];
    let alphaIm = uIm[uRow + first];
    let tail = 0;
    for (let r = first + 1; r < n; r++) tail += uRe[uRow + r] * uRe[uRow + r] + uIm[uRow + r] * uIm[uRow + r];
    // u and τ may be computed from x/s for any s > 0 (P is unchanged); s is a power of two (exact), ≠ 1 only
    // for tiny columns whose squares lose precision.
    let s = 1;
    if (tail + alphaRe * alphaRe + alphaIm * alphaIm < SQUARES_UNSAFE) {
      let largest = 0;
      for (let r = first; r < n; r++) largest = Math.max(largest, Math.abs(uRe[uRow + r]), Math.abs(uIm[uRow + r]));
      if (largest > 0) s = 2 ** Math.max(-1000, Math.round(Math.log2(largest)));
      const inverse = 1 / s;
      tail = 0;
      for (let r = first; r < n; r++) {
        const a = uRe[uRow + r] * inverse;
        const b = uIm[uRow + r] * inverse;
        uRe[uRow + r] = a;
        uIm[uRow + r] = b;
        if (r > first) tail += a * a + b * b;
      }
      alphaRe = uRe[uRow + first];
      alphaIm = uIm[uRow + first];
    }
    if (tail === 0) {
      this.tau[k] = 0;
      this.subRe[k] = alphaRe * s;
      this.subIm[k] = alphaIm * s;
      return false;
    }
    // |α| and its phase without squaring a possibly tiny α: the phase must have modulus 1 to full precision.
    const big = Math.max(Math.abs(alphaRe), Math.abs(alphaIm));
    let absAlpha = 0;
    let phRe = 1;
    let phIm = 0;
    if (big > 0) {
      const ratioRe = alphaRe / big;
      const ratioIm = alphaIm / big;
      const h = Math.sqrt(ratioRe * ratioRe + ratioIm * ratioIm);
      absAlpha = big * h;
      phRe = ratioRe / h;
      phIm = ratioIm / h;
    }
    const norm = Math.sqrt(absAlpha * absAlpha + tail);
    this.tau[k] = 1 / (norm * (norm + absAlpha));
    this.subRe[k] = -phRe * norm * s;
    this.subIm[k] = -phIm * norm * s;
    uRe[uRow + first] = alphaRe + phRe * norm;
    uIm[uRow + first] = alphaIm + phIm * norm;
    for (let r = first; r < n; r++) {
      lanes[8 * r + 4] = uRe[uRow + r];
      lanes[8 * r + 5] = uIm[uRow + r];
    }
    return true;
  }

  /**
   * Starts step k: the next reflector v (v lanes) becomes u, its product q = A₂₂·u becomes p, turned into
   * w = τp − (τ²·uᴴp/2)·u in the w lanes (indices k+1…n−1).
   */
  private toRankTwoVector(k: number): void {
    const lanes = this.lanes;
    const tau = this.tau[k];
    const start = 8 * (k + 1);
    const end = 8 * this.n;
    let uhp = 0;
    for (let j = start; j < end; j += 8) {
      const uRe = lanes[j + 4];
      const uIm = lanes[j + 5];
      const pRe = tau * lanes[j + 6];
      const pIm = tau * lanes[j + 7];
      lanes[j] = uRe;
      lanes[j + 1] = uIm;
      lanes[j + 2] = pRe;
      lanes[j + 3] = pIm;
      uhp += uRe * pRe + uIm * pIm;
    }
    const half = 0.5 * tau * uhp;
    for (let j = start; j < end; j += 8) {
      lanes[j + 2] -= half * lanes[j];
      lanes[j + 3] -= half * lanes[j + 1];
    }
  }
}
