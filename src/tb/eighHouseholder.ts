/**
 * Householder reduction of a complex Hermitian matrix to tridiagonal form, H = Q·T·Qᴴ
 * (Golub & Van Loan, Matrix Computations, 4th ed., §8.3, written here in complex form).
 *
 * Layout: the working copy `workRe`/`workIm` is n×n row-major and only its lower triangle (c ≤ r) is read or
 * written; element (r, c) is workRe[r*n + c] + i·workIm[r*n + c]. Reflector k is P_k = I − τ_k·u_k·u_kᴴ
 * (τ_k real, P_k Hermitian and unitary) acting on indices k+1…n−1; u_k is stored in row k of `reflRe`/`reflIm`
 * (entries k+1…n−1). Results: `diag[k]` = T[k][k] (real), `subRe[k] + i·subIm[k]` = T[k+1][k] (complex).
 *
 * Each step k applies A₂₂ ← P·A₂₂·P = A₂₂ − u·wᴴ − w·uᴴ with p = τ·A₂₂·u, w = p − (τ·uᴴp/2)·u, on the lower
 * triangle only. The rank-2 update of step k and the product A₂₂·u of step k+1 share one pass over the triangle
 * (the updated column k+1 is formed first, so u_{k+1} is known before the pass).
 */

/** Below this, a sum of squares may have lost precision to underflow (2^−1022/ε ≈ 2^−970); rescale first. */
const SQUARES_UNSAFE = 2 ** -900;

/** Workspaces and results of the reduction for one matrix order n (allocated once, reused). */
export class HermitianTridiagonaliser {
  /** Matrix order. */
  readonly n: number;
  /** Working copy (lower triangle); free for the caller's use after `reduce`. */
  readonly workRe: Float64Array;
  readonly workIm: Float64Array;
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
  // Two vector buffers: A₂₂·u of the current step (turned into w) and of the next step.
  private readonly vecARe: Float64Array;
  private readonly vecAIm: Float64Array;
  private readonly vecBRe: Float64Array;
  private readonly vecBIm: Float64Array;

  constructor(n: number) {
    this.n = n;
    this.workRe = new Float64Array(n * n);
    this.workIm = new Float64Array(n * n);
    this.reflRe = new Float64Array(n * n);
    this.reflIm = new Float64Array(n * n);
    this.tau = new Float64Array(n);
    this.diag = new Float64Array(n);
    this.subRe = new Float64Array(n);
    this.subIm = new Float64Array(n);
    this.vecARe = new Float64Array(n);
    this.vecAIm = new Float64Array(n);
    this.vecBRe = new Float64Array(n);
    this.vecBIm = new Float64Array(n);
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
    const wRe = this.workRe;
    const tau = this.tau;
    this.diag[0] = wRe[0];
    if (n === 1) return scale;
    let pRe = this.vecARe;
    let pIm = this.vecAIm;
    let qRe = this.vecBRe;
    let qIm = this.vecBIm;
    this.reflector(0);
    if (tau[0] !== 0) this.productOnly(1, pRe, pIm);
    for (let k = 0; k + 1 < n; k++) {
      const first = k + 1;
      const updating = tau[k] !== 0;
      if (updating) {
        this.toRankTwoVector(k, pRe, pIm);
        this.updateColumn(k, pRe, pIm);
      }
      this.diag[first] = wRe[first * n + first];
      const producing = first + 1 < n && this.reflector(first);
      if (updating && producing) this.updateAndProduct(k, pRe, pIm, qRe, qIm);
      else if (updating) this.updateOnly(k, pRe, pIm);
      else if (producing) this.productOnly(first + 1, qRe, qIm);
      const tRe = pRe;
      const tIm = pIm;
      pRe = qRe;
      pIm = qIm;
      qRe = tRe;
      qIm = tIm;
    }
    return scale;
  }

  /**
   * Copies the lower triangle into the workspace scaled by the power of two 2^−e that brings its largest entry
   * near 1 (exact, so c·H still gives c·λ exactly for c = 2^j); returns 2^e, the factor to undo, or NaN
   * for a matrix with an infinite or NaN entry.
   * With entries of order one, squares over/underflow only for entries below 2^−500, which the kernels treat
   * as negligible or rescale locally.
   */
  private copyLower(re: Float64Array, im: Float64Array): number {
    const n = this.n;
    const wRe = this.workRe;
    const wIm = this.workIm;
    let largest = 0;
    // size − size is 0 for finite entries and NaN for ±∞ or NaN, so `finite` stays 0 only for a finite matrix.
    let finite = 0;
    for (let r = 0; r < n; r++) {
      const row = r * n;
      for (let c = 0; c <= r; c++) {
        const size = Math.max(Math.abs(re[row + c]), Math.abs(im[row + c]));
        finite += size - size;
        if (size > largest) largest = size;
      }
    }
    if (finite !== 0) return NaN;
    const exponent = largest > 0 ? Math.round(Math.log2(largest)) : 0;
    // 2^−e overflows for subnormal inputs (e < −1023): apply it as two exact powers of two.
    const firstFactor = 2 ** Math.min(-exponent, 1000);
    const secondFactor = 2 ** (-exponent - Math.min(-exponent, 1000));
    for (let r = 0; r < n; r++) {
      const row = r * n;
      for (let c = 0; c <= r; c++) {
        wRe[row + c] = re[row + c] * firstFactor * secondFactor;
        wIm[row + c] = im[row + c] * firstFactor * secondFactor;
      }
    }
    return 2 ** exponent;
  }

  /**
   * Reflector k from column k (rows k+1…n−1) of the updated working copy: P·x = −phase(x₀)·‖x‖·e₁ with
   * u = x + phase(x₀)·‖x‖·e₁ (no cancellation) and τ = 2/(uᴴu) = 1/(‖x‖·(‖x‖ + |x₀|)).
   * Returns false (τ = 0, T[k+1][k] = x₀) when x is already a multiple of e₁.
   */
  private reflector(k: number): boolean {
    const n = this.n;
    const wRe = this.workRe;
    const wIm = this.workIm;
    const first = k + 1;
    let alphaRe = wRe[first * n + k];
    let alphaIm = wIm[first * n + k];
    let tail = 0;
    for (let r = first + 1; r < n; r++) {
      const a = wRe[r * n + k];
      const b = wIm[r * n + k];
      tail += a * a + b * b;
    }
    // u and τ may be computed from x/s for any s > 0 (P is unchanged); s is a power of two (exact), ≠ 1 only
    // for tiny columns whose squares lose precision.
    let s = 1;
    let inverse = 1;
    if (tail + alphaRe * alphaRe + alphaIm * alphaIm < SQUARES_UNSAFE) {
      let largest = 0;
      for (let r = first; r < n; r++) largest = Math.max(largest, Math.abs(wRe[r * n + k]), Math.abs(wIm[r * n + k]));
      if (largest > 0) {
        s = 2 ** Math.max(-1000, Math.round(Math.log2(largest)));
        inverse = 1 / s;
      }
      alphaRe *= inverse;
      alphaIm *= inverse;
      tail = 0;
      for (let r = first + 1; r < n; r++) {
        const a = wRe[r * n + k] * inverse;
        const b = wIm[r * n + k] * inverse;
        tail += a * a + b * b;
      }
    }
    if (tail === 0) {
      this.tau[k] = 0;
      this.subRe[k] = alphaRe * s;
      this.subIm[k] = alphaIm * s;
      return false;
    }
    // |α| and its phase without squaring a possibly tiny α: the phase must have modulus 1 exactly enough.
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
    const uRow = k * n;
    uRe[uRow + first] = alphaRe + phRe * norm;
    uIm[uRow + first] = alphaIm + phIm * norm;
    for (let r = first + 1; r < n; r++) {
      uRe[uRow + r] = wRe[r * n + k] * inverse;
      uIm[uRow + r] = wIm[r * n + k] * inverse;
    }
    return true;
  }

  /** Turns p = A₂₂·u_k (entries k+1…n−1) into w = τp − (τ²·uᴴp/2)·u in place. */
  private toRankTwoVector(k: number, pRe: Float64Array, pIm: Float64Array): void {
    const n = this.n;
    const tau = this.tau[k];
    const uRe = this.reflRe;
    const uIm = this.reflIm;
    const uRow = k * n;
    let uhp = 0;
    for (let i = k + 1; i < n; i++) {
      pRe[i] *= tau;
      pIm[i] *= tau;
      uhp += uRe[uRow + i] * pRe[i] + uIm[uRow + i] * pIm[i];
    }
    const half = 0.5 * tau * uhp;
    for (let i = k + 1; i < n; i++) {
      pRe[i] -= half * uRe[uRow + i];
      pIm[i] -= half * uIm[uRow + i];
    }
  }

  /** Applies −u·wᴴ − w·uᴴ of step k to column k+1 (rows k+1…n−1), the column the next reflector reads. */
  private updateColumn(k: number, wVecRe: Float64Array, wVecIm: Float64Array): void {
    const n = this.n;
    const wRe = this.workRe;
    const wIm = this.workIm;
    const uRe = this.reflRe;
    const uIm = this.reflIm;
    const uRow = k * n;
    const c = k + 1;
    const ucRe = uRe[uRow + c];
    const ucIm = uIm[uRow + c];
    const wcRe = wVecRe[c];
    const wcIm = wVecIm[c];
    for (let i = c; i < n; i++) {
      const uiRe = uRe[uRow + i];
      const uiIm = uIm[uRow + i];
      const wiRe = wVecRe[i];
      const wiIm = wVecIm[i];
      wRe[i * n + c] -= uiRe * wcRe + uiIm * wcIm + wiRe * ucRe + wiIm * ucIm;
      wIm[i * n + c] -= uiIm * wcRe - uiRe * wcIm + wiIm * ucRe - wiRe * ucIm;
    }
  }

  /** A₂₂·u_{start−1} over rows/columns start…n−1 into q (Hermitian product from the lower triangle). */
  private productOnly(start: number, qRe: Float64Array, qIm: Float64Array): void {
    const n = this.n;
    const wRe = this.workRe;
    const wIm = this.workIm;
    const vRe = this.reflRe;
    const vIm = this.reflIm;
    const vRow = (start - 1) * n;
    qRe.fill(0, start, n);
    qIm.fill(0, start, n);
    for (let i = start; i < n; i++) {
      const row = i * n;
      const viRe = vRe[vRow + i];
      const viIm = vIm[vRow + i];
      let sRe = 0;
      let sIm = 0;
      for (let j = start; j < i; j++) {
        const a = wRe[row + j];
        const b = wIm[row + j];
        const vjRe = vRe[vRow + j];
        const vjIm = vIm[vRow + j];
        sRe += a * vjRe - b * vjIm;
        sIm += a * vjIm + b * vjRe;
        qRe[j] += a * viRe + b * viIm;
        qIm[j] += a * viIm - b * viRe;
      }
      const d = wRe[row + i];
      qRe[i] += sRe + d * viRe;
      qIm[i] += sIm + d * viIm;
    }
  }

  /** Rank-2 update of step k over rows/columns k+2…n−1 (no product: step k+1 needs no reflection). */
  private updateOnly(k: number, wVecRe: Float64Array, wVecIm: Float64Array): void {
    const n = this.n;
    const wRe = this.workRe;
    const wIm = this.workIm;
    const uRe = this.reflRe;
    const uIm = this.reflIm;
    const uRow = k * n;
    const start = k + 2;
    for (let i = start; i < n; i++) {
      const row = i * n;
      const uiRe = uRe[uRow + i];
      const uiIm = uIm[uRow + i];
      const wiRe = wVecRe[i];
      const wiIm = wVecIm[i];
      for (let j = start; j <= i; j++) {
        const ujRe = uRe[uRow + j];
        const ujIm = uIm[uRow + j];
        const wjRe = wVecRe[j];
        const wjIm = wVecIm[j];
        wRe[row + j] -= uiRe * wjRe + uiIm * wjIm + wiRe * ujRe + wiIm * ujIm;
        wIm[row + j] -= uiIm * wjRe - uiRe * wjIm + wiIm * ujRe - wiRe * ujIm;
      }
    }
  }

  /**
   * Rank-2 update of step k over rows/columns k+2…n−1 fused with q = A₂₂·u_{k+1} on the updated entries:
   * one pass over the triangle instead of two.
   */
  private updateAndProduct(
    k: number, wVecRe: Float64Array, wVecIm: Float64Array, qRe: Float64Array, qIm: Float64Array,
  ): void {
    const n = this.n;
    const wRe = this.workRe;
    const wIm = this.workIm;
    const uRe = this.reflRe;
    const uIm = this.reflIm;
    const uRow = k * n;
    const vRow = uRow + n;
    const start = k + 2;
    qRe.fill(0, start, n);
    qIm.fill(0, start, n);
    for (let i = start; i < n; i++) {
      const row = i * n;
      const uiRe = uRe[uRow + i];
      const uiIm = uIm[uRow + i];
      const wiRe = wVecRe[i];
      const wiIm = wVecIm[i];
      const viRe = uRe[vRow + i];
      const viIm = uIm[vRow + i];
      let sRe = 0;
      let sIm = 0;
      for (let j = start; j < i; j++) {
        const ujRe = uRe[uRow + j];
        const ujIm = uIm[uRow + j];
        const wjRe = wVecRe[j];
        const wjIm = wVecIm[j];
        const a = wRe[row + j] - (uiRe * wjRe + uiIm * wjIm + wiRe * ujRe + wiIm * ujIm);
        const b = wIm[row + j] - (uiIm * wjRe - uiRe * wjIm + wiIm * ujRe - wiRe * ujIm);
        wRe[row + j] = a;
        wIm[row + j] = b;
        const vjRe = uRe[vRow + j];
        const vjIm = uIm[vRow + j];
        sRe += a * vjRe - b * vjIm;
        sIm += a * vjIm + b * vjRe;
        qRe[j] += a * viRe + b * viIm;
        qIm[j] += a * viIm - b * viRe;
      }
      const d = wRe[row + i] - 2 * (uiRe * wiRe + uiIm * wiIm);
      wRe[row + i] = d;
      qRe[i] += sRe + d * viRe;
      qIm[i] += sIm + d * viIm;
    }
  }
}
