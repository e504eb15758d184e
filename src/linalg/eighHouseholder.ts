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
 * triangle (column k+1 is updated first, so u_{k+1} is known before the pass; eighTriangle.ts). The passes and the
 * O(n) column step before each reflector (w, column k+1's update, its copy) run in WebAssembly SIMD where the runtime
 * has it (eighTriangleSimd.ts; `work`, `lanes` and reflRe/reflIm then live in its memory), in TypeScript otherwise;
 * the reflector's scalars and the rescaling of tiny columns are TypeScript on either route.
 */

import { productOnly, updateAndProduct, updateOnly } from './eighTriangle.ts';
import { simdInstance, simdModule } from './simdModule.ts';

/** The kernels of one route: the three passes over rows/columns start…n−1 (eighTriangle.ts) and the column step. */
interface StepKernels {
  productOnly(start: number): void;
  updateOnly(start: number): void;
  updateAndProduct(start: number): void;
  /** See HermitianTridiagonaliser.column; returns Σ_{r ≥ k+2} |x_r|². */
  column(k: number, updating: boolean): number;
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
  /** Reflector u_k in row k, entries k+1…n−1 (the row is not used where τ_k = 0). */
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
  private readonly kernels: StepKernels;

  /**
   * Options: `simd` (default true) runs the passes and the column steps in WebAssembly SIMD where available and
   * needed (n ≥ 3: smaller orders have no pass); false forces TypeScript.
   */
  constructor(n: number, options: { simd?: boolean } = {}) {
    this.n = n;
    this.tau = new Float64Array(n);
    this.diag = new Float64Array(n);
    this.subRe = new Float64Array(n);
    this.subIm = new Float64Array(n);
    const module = options.simd === false || n < 3 ? null : simdModule();
    this.simd = module !== null;
    if (module !== null) {
      // Bytes: work (16n²), lanes (64n), swaps (32n), reflRe and reflIm (8n² each), the tail (8).
      const lanesAt = 16 * n * n;
      const swapsAt = lanesAt + 64 * n;
      const reflReAt = swapsAt + 32 * n;
      const reflImAt = reflReAt + 8 * n * n;
      const tailAt = reflImAt + 8 * n * n;
      const { memory, exports } = simdInstance(module, tailAt + 8);
      this.work = new Float64Array(memory.buffer, 0, 2 * n * n);
      this.lanes = new Float64Array(memory.buffer, lanesAt, 8 * n);
      this.reflRe = new Float64Array(memory.buffer, reflReAt, n * n);
      this.reflIm = new Float64Array(memory.buffer, reflImAt, n * n);
      const tail = new Float64Array(memory.buffer, tailAt, 1);
      const pass = (name: string) => {
        const run = exports[name] as (work: number, lanes: number, swaps: number, n: number, start: number) => void;
        return (start: number) => run(0, lanesAt, swapsAt, n, start);
      };
      const column = exports.hermitianColumn as (
        work: number, lanes: number, reflRe: number, reflIm: number, tailAt: number, n: number, k: number,
        tau: number, updating: number,
      ) => void;
      const tau = this.tau;
      this.kernels = {
        productOnly: pass('hermitianProduct'),
        updateOnly: pass('hermitianUpdate'),
        updateAndProduct: pass('hermitianUpdateProduct'),
        column: (k, updating) => {
          column(0, lanesAt, reflReAt, reflImAt, tailAt, n, k, updating ? tau[k - 1] : 0, updating ? 1 : 0);
          return tail[0];
        },
      };
    } else {
      const work = new Float64Array(2 * n * n);
      const lanes = new Float64Array(8 * n);
      this.work = work;
      this.lanes = lanes;
      this.reflRe = new Float64Array(n * n);
      this.reflIm = new Float64Array(n * n);
      this.kernels = {
        productOnly: (start) => productOnly(n, work, lanes, start),
        updateOnly: (start) => updateOnly(n, work, lanes, start),
        updateAndProduct: (start) => updateAndProduct(n, work, lanes, start),
        column: (k, updating) => this.column(k, updating),
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
    const kernels = this.kernels;
    if (this.reflector(0, false)) kernels.productOnly(1);
    for (let k = 0; k + 1 < n; k++) {
      const first = k + 1;
      const updating = tau[k] !== 0;
      const producing = this.reflector(first, updating);
      if (updating && producing) kernels.updateAndProduct(k + 2);
      else if (updating) kernels.updateOnly(k + 2);
      else if (producing) kernels.productOnly(first + 1);
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
   * Reflector k from column k (rows k+1…n−1) once the column step has run (see `column`): P·x = −phase(x₀)·‖x‖·e₁
   * with u = x + phase(x₀)·‖x‖·e₁ (no cancellation) and τ = 2/(uᴴu) = 1/(‖x‖·(‖x‖ + |x₀|)). Leaves u in row k of
   * reflRe/reflIm and in the v lanes; reads T[k][k]. Returns false (τ = 0, T[k+1][k] = x₀) when x is already a
   * multiple of e₁, or when k is the last index.
   */
  private reflector(k: number, updating: boolean): boolean {
    const n = this.n;
    const first = k + 1;
    let tail = this.kernels.column(k, updating);
    this.diag[k] = this.work[2 * (k * n + k)];
    if (first >= n) return false;
    const lanes = this.lanes;
    const uRe = this.reflRe;
    const uIm = this.reflIm;
    const uRow = k * n;
    let alphaRe = uRe[uRow + first];
    let alphaIm = uIm[uRow + first];
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
        lanes[8 * r + 4] = a;
        lanes[8 * r + 5] = b;
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
    lanes[8 * first + 4] = uRe[uRow + first];
    lanes[8 * first + 5] = uIm[uRow + first];
    return true;
  }

  /**
   * The O(n) work before reflector k (the TypeScript route; eighTriangleSimd.ts has the SIMD one): when `updating`,
   * w of step k−1 formed (toRankTwoVector) and its rank-2 update −u·wᴴ − w·uᴴ applied to column k (rows k…n−1),
   * the column the reflector reads; then the column below the diagonal copied to row k of reflRe/reflIm and to the
   * v lanes. Returns Σ_{r ≥ k+2} |x_r|².
   */
  private column(k: number, updating: boolean): number {
    const n = this.n;
    const work = this.work;
    const lanes = this.lanes;
    const uRe = this.reflRe;
    const uIm = this.reflIm;
    const uRow = k * n;
    if (updating) {
      this.toRankTwoVector(k - 1);
      const ucRe = lanes[8 * k];
      const ucIm = lanes[8 * k + 1];
      const wcRe = lanes[8 * k + 2];
      const wcIm = lanes[8 * k + 3];
      for (let i = k, at = 2 * (k * n + k); i < n; i++, at += 2 * n) {
        const uiRe = lanes[8 * i];
        const uiIm = lanes[8 * i + 1];
        const wiRe = lanes[8 * i + 2];
        const wiIm = lanes[8 * i + 3];
        work[at] -= uiRe * wcRe + uiIm * wcIm + wiRe * ucRe + wiIm * ucIm;
        work[at + 1] -= uiIm * wcRe - uiRe * wcIm + wiIm * ucRe - wiRe * ucIm;
      }
    }
    let tail = 0;
    for (let i = k + 1, at = 2 * ((k + 1) * n + k); i < n; i++, at += 2 * n) {
      const x = work[at];
      const y = work[at + 1];
      uRe[uRow + i] = x;
      uIm[uRow + i] = y;
      lanes[8 * i + 4] = x;
      lanes[8 * i + 5] = y;
      if (i > k + 1) tail += x * x + y * y;
    }
    return tail;
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
