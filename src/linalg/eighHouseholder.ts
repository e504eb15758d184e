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
 * triangle (column k+1 is updated first, so u_{k+1} is known before the pass; eighTriangle.ts).
 */

import { productOnly, updateAndProduct, updateOnly } from './eighTriangle.ts';

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
  private readonly work: Float64Array;
  private readonly lanes: Float64Array;

  constructor(n: number) {
    this.n = n;
    this.reflRe = new Float64Array(n * n);
    this.reflIm = new Float64Array(n * n);
    this.tau = new Float64Array(n);
    this.diag = new Float64Array(n);
    this.subRe = new Float64Array(n);
    this.subIm = new Float64Array(n);
    this.work = new Float64Array(2 * n * n);
    this.lanes = new Float64Array(8 * n);
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
    if (this.reflector(0)) productOnly(n, this.work, this.lanes, 1);
    for (let k = 0; k + 1 < n; k++) {
      const first = k + 1;
      const updating = tau[k] !== 0;
      if (updating) {
        this.promote(first);
        this.toRankTwoVector(k);
        this.updateColumn(k);
      }
      this.diag[first] = work[2 * (first * n + first)];
      const producing = first + 1 < n && this.reflector(first);
      if (updating && producing) updateAndProduct(n, work, this.lanes, k + 2);
      else if (updating) updateOnly(n, work, this.lanes, k + 2);
      else if (producing) productOnly(n, work, this.lanes, first + 1);
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
   * Reflector k from column k (rows k+1…n−1) of the updated working copy: P·x = −phase(x₀)·‖x‖·e₁ with
   * u = x + phase(x₀)·‖x‖·e₁ (no cancellation) and τ = 2/(uᴴu) = 1/(‖x‖·(‖x‖ + |x₀|)).
   * Writes u into row k of reflRe/reflIm and into the v lanes. Returns false (τ = 0, T[k+1][k] = x₀)
   * when x is already a multiple of e₁.
   */
  private reflector(k: number): boolean {
    const n = this.n;
    const work = this.work;
    const first = k + 1;
    let alphaRe = work[2 * (first * n + k)];
    let alphaIm = work[2 * (first * n + k) + 1];
    let tail = 0;
    for (let r = first + 1; r < n; r++) {
      const a = work[2 * (r * n + k)];
      const b = work[2 * (r * n + k) + 1];
      tail += a * a + b * b;
    }
    // u and τ may be computed from x/s for any s > 0 (P is unchanged); s is a power of two (exact), ≠ 1 only
    // for tiny columns whose squares lose precision.
    let s = 1;
    let inverse = 1;
    if (tail + alphaRe * alphaRe + alphaIm * alphaIm < SQUARES_UNSAFE) {
      let largest = 0;
      for (let r = first; r < n; r++) {
        largest = Math.max(largest, Math.abs(work[2 * (r * n + k)]), Math.abs(work[2 * (r * n + k) + 1]));
      }
      if (largest > 0) {
        s = 2 ** Math.max(-1000, Math.round(Math.log2(largest)));
        inverse = 1 / s;
      }
      alphaRe *= inverse;
      alphaIm *= inverse;
      tail = 0;
      for (let r = first + 1; r < n; r++) {
        const a = work[2 * (r * n + k)] * inverse;
        const b = work[2 * (r * n + k) + 1] * inverse;
        tail += a * a + b * b;
      }
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
    const uRe = this.reflRe;
    const uIm = this.reflIm;
    const lanes = this.lanes;
    const uRow = k * n;
    uRe[uRow + first] = alphaRe + phRe * norm;
    uIm[uRow + first] = alphaIm + phIm * norm;
    for (let r = first + 1; r < n; r++) {
      uRe[uRow + r] = work[2 * (r * n + k)] * inverse;
      uIm[uRow + r] = work[2 * (r * n + k) + 1] * inverse;
    }
    for (let r = first; r < n; r++) {
      lanes[8 * r + 4] = uRe[uRow + r];
      lanes[8 * r + 5] = uIm[uRow + r];
    }
    return true;
  }

  /** Starts a step at index `first`: the next reflector v becomes the current u, its product q becomes p (in w). */
  private promote(first: number): void {
    const lanes = this.lanes;
    for (let j = 8 * first, end = 8 * this.n; j < end; j += 8) {
      lanes[j] = lanes[j + 4];
      lanes[j + 1] = lanes[j + 5];
      lanes[j + 2] = lanes[j + 6];
      lanes[j + 3] = lanes[j + 7];
    }
  }

  /** Turns p = A₂₂·u_k in the w lanes (indices k+1…n−1) into w = τp − (τ²·uᴴp/2)·u. */
  private toRankTwoVector(k: number): void {
    const lanes = this.lanes;
    const tau = this.tau[k];
    const start = 8 * (k + 1);
    const end = 8 * this.n;
    let uhp = 0;
    for (let j = start; j < end; j += 8) {
      const pRe = tau * lanes[j + 2];
      const pIm = tau * lanes[j + 3];
      lanes[j + 2] = pRe;
      lanes[j + 3] = pIm;
      uhp += lanes[j] * pRe + lanes[j + 1] * pIm;
    }
    const half = 0.5 * tau * uhp;
    for (let j = start; j < end; j += 8) {
      lanes[j + 2] -= half * lanes[j];
      lanes[j + 3] -= half * lanes[j + 1];
    }
  }

  /** Applies −u·wᴴ − w·uᴴ of step k to column k+1 (rows k+1…n−1), the column the next reflector reads. */
  private updateColumn(k: number): void {
    const n = this.n;
    const work = this.work;
    const lanes = this.lanes;
    const c = k + 1;
    const ucRe = lanes[8 * c];
    const ucIm = lanes[8 * c + 1];
    const wcRe = lanes[8 * c + 2];
    const wcIm = lanes[8 * c + 3];
    for (let i = c; i < n; i++) {
      const uiRe = lanes[8 * i];
      const uiIm = lanes[8 * i + 1];
      const wiRe = lanes[8 * i + 2];
      const wiIm = lanes[8 * i + 3];
      const at = 2 * (i * n + c);
      work[at] -= uiRe * wcRe + uiIm * wcIm + wiRe * ucRe + wiIm * ucIm;
      work[at + 1] -= uiIm * wcRe - uiRe * wcIm + wiIm * ucRe - wiRe * ucIm;
    }
  }
}
