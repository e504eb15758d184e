/**
 * Complex Hermitian eigensolver: Householder reduction to real symmetric tridiagonal form, then implicit QR
 * with Wilkinson shifts (Golub & Van Loan, Matrix Computations, 4th ed., §8.3).
 *
 * Layout (inputs and eigenvectors): an n×n complex matrix is split storage, row-major — element (r, c) is
 * re[r*n + c] + i·im[r*n + c]. Eigenvector m is column m: component r at vecRe[r*n + m] + i·vecIm[r*n + m].
 *
 * Method. Each Householder step uses the Hermitian reflector P = I − τ·u·uᴴ (τ real) that sends the column
 * below the diagonal to a complex multiple of e₁, so H = Q·T·Qᴴ with T tridiagonal and complex off-diagonal
 * e_k. The diagonal unitary D = diag(d_k), d₀ = 1, d_{k+1} = d_k·e_k/|e_k|, gives the real T' = Dᴴ·T·D with
 * off-diagonal |e_k|; T' = Z·Λ·Zᵀ, and the eigenvectors of H are V = Q·D·Z.
 * Only the lower triangle of the working copy is read or updated (the Hermitian rank-2 update on one triangle).
 */
import { diagonaliseTridiagonal } from './eighTridiagonal.ts';

/** Beyond these magnitudes squares of entries would over/underflow; the working copy is rescaled by 2^k. */
const SAFE_LARGE = 2 ** 400;
const SAFE_SMALL = 2 ** -400;

/**
 * Eigensolver for n×n complex Hermitian matrices with all workspaces preallocated for one n;
 * reuse one object across k-points — calls allocate nothing.
 * If the QR iteration fails to converge (pathological input, e.g. NaN entries), every output is NaN.
 */
export class HermitianEigensolver {
  /** Matrix order. */
  readonly n: number;
  // Working copy (lower triangle), later the accumulated Q and the basis rows (Q·D)ᵀ.
  private readonly workRe: Float64Array;
  private readonly workIm: Float64Array;
  // Householder vectors: row k holds u_k in entries k+1…n−1.
  private readonly reflRe: Float64Array;
  private readonly reflIm: Float64Array;
  private readonly tau: Float64Array;
  private readonly diag: Float64Array;
  private readonly off: Float64Array;
  // Complex sub-diagonal e_k of T before the phases are removed.
  private readonly subRe: Float64Array;
  private readonly subIm: Float64Array;
  private readonly phaseRe: Float64Array;
  private readonly phaseIm: Float64Array;
  private readonly pRe: Float64Array;
  private readonly pIm: Float64Array;
  private readonly order: Int32Array;

  constructor(n: number) {
    this.n = n;
    this.workRe = new Float64Array(n * n);
    this.workIm = new Float64Array(n * n);
    this.reflRe = new Float64Array(n * n);
    this.reflIm = new Float64Array(n * n);
    this.tau = new Float64Array(n);
    this.diag = new Float64Array(n);
    this.off = new Float64Array(n);
    this.subRe = new Float64Array(n);
    this.subIm = new Float64Array(n);
    this.phaseRe = new Float64Array(n);
    this.phaseIm = new Float64Array(n);
    this.pRe = new Float64Array(n);
    this.pIm = new Float64Array(n);
    this.order = new Int32Array(n);
  }

  /** Ascending eigenvalues into out (length ≥ n); returns out. */
  eigenvalues(re: Float64Array, im: Float64Array, out: Float64Array): Float64Array {
    const n = this.n;
    if (n === 0) return out;
    const scale = this.copyLower(re, im);
    this.tridiagonalise();
    const diag = this.diag;
    const off = this.off;
    for (let k = 0; k + 1 < n; k++) {
      const a = this.subRe[k];
      const b = this.subIm[k];
      off[k] = Math.sqrt(a * a + b * b);
    }
    off[n - 1] = 0;
    if (!diagonaliseTridiagonal(diag, off, n)) {
      out.fill(NaN, 0, n);
      return out;
    }
    // Insertion sort: the QR output is nearly ordered in blocks and n is small.
    for (let i = 0; i < n; i++) {
      const v = diag[i];
      let j = i - 1;
      while (j >= 0 && out[j] > v * scale) {
        out[j + 1] = out[j];
        j--;
      }
      out[j + 1] = v * scale;
    }
    return out;
  }

  /** Ascending eigenvalues and orthonormal eigenvectors: column m is eigenvector m, component r at vecRe[r*n + m] + i·vecIm[r*n + m]. */
  eigensystem(
    re: Float64Array, im: Float64Array, values: Float64Array, vecRe: Float64Array, vecIm: Float64Array,
  ): void {
    const n = this.n;
    if (n === 0) return;
    const scale = this.copyLower(re, im);
    this.tridiagonalise();
    this.phases();
    this.accumulateQ();
    const rowsRe = this.workRe;
    const rowsIm = this.workIm;
    this.basisRows();
    if (!diagonaliseTridiagonal(this.diag, this.off, n, rowsRe, rowsIm)) {
      values.fill(NaN, 0, n);
      vecRe.fill(NaN, 0, n * n);
      vecIm.fill(NaN, 0, n * n);
      return;
    }
    const diag = this.diag;
    const order = this.order;
    for (let i = 0; i < n; i++) {
      const v = diag[i];
      let j = i - 1;
      while (j >= 0 && diag[order[j]] > v) {
        order[j + 1] = order[j];
        j--;
      }
      order[j + 1] = i;
    }
    for (let m = 0; m < n; m++) {
      const src = order[m];
      values[m] = diag[src] * scale;
      const row = src * n;
      for (let r = 0; r < n; r++) {
        vecRe[r * n + m] = rowsRe[row + r];
        vecIm[r * n + m] = rowsIm[row + r];
      }
    }
  }

  /** Copies the lower triangle into the workspace, rescaled by a power of two if needed; returns the factor to undo. */
  private copyLower(re: Float64Array, im: Float64Array): number {
    const n = this.n;
    const wRe = this.workRe;
    const wIm = this.workIm;
    let largest = 0;
    for (let r = 0; r < n; r++) {
      const row = r * n;
      for (let c = 0; c <= r; c++) {
        const a = re[row + c];
        const b = im[row + c];
        wRe[row + c] = a;
        wIm[row + c] = b;
        const size = Math.abs(a) + Math.abs(b);
        if (size > largest) largest = size;
      }
    }
    if ((largest > SAFE_SMALL && largest < SAFE_LARGE) || largest === 0 || !Number.isFinite(largest)) return 1;
    const exponent = Math.round(Math.log2(largest));
    const factor = 2 ** -exponent;
    for (let r = 0; r < n; r++) {
      const row = r * n;
      for (let c = 0; c <= r; c++) {
        wRe[row + c] *= factor;
        wIm[row + c] *= factor;
      }
    }
    return 2 ** exponent;
  }

  /**
   * Householder reduction of the working copy's lower triangle (Golub & Van Loan Algorithm 8.3.1, complex form):
   * fills diag, subRe/subIm (complex e_k = T[k+1][k]), the reflectors u_k and τ_k.
   */
  private tridiagonalise(): void {
    const n = this.n;
    const wRe = this.workRe;
    const wIm = this.workIm;
    const uAllRe = this.reflRe;
    const uAllIm = this.reflIm;
    const pRe = this.pRe;
    const pIm = this.pIm;
    for (let k = 0; k + 1 < n; k++) {
      const first = k + 1;
      const alphaRe = wRe[first * n + k];
      const alphaIm = wIm[first * n + k];
      let tail = 0;
      for (let r = first + 1; r < n; r++) {
        const a = wRe[r * n + k];
        const b = wIm[r * n + k];
        tail += a * a + b * b;
      }
      this.diag[k] = wRe[k * n + k];
      if (tail === 0) {
        // Already a multiple of e₁: no reflection; the phase of alpha is removed later by D.
        this.tau[k] = 0;
        this.subRe[k] = alphaRe;
        this.subIm[k] = alphaIm;
        continue;
      }
      const absAlpha = Math.sqrt(alphaRe * alphaRe + alphaIm * alphaIm);
      const norm = Math.sqrt(absAlpha * absAlpha + tail);
      const phRe = absAlpha === 0 ? 1 : alphaRe / absAlpha;
      const phIm = absAlpha === 0 ? 0 : alphaIm / absAlpha;
      // u = x + phase·‖x‖·e₁ avoids cancellation; P·x = −phase·‖x‖·e₁; τ = 2/(uᴴu) = 1/(‖x‖(‖x‖ + |α|)).
      const tau = 1 / (norm * (norm + absAlpha));
      this.tau[k] = tau;
      this.subRe[k] = -phRe * norm;
      this.subIm[k] = -phIm * norm;
      const uRow = k * n;
      uAllRe[uRow + first] = alphaRe + phRe * norm;
      uAllIm[uRow + first] = alphaIm + phIm * norm;
      for (let r = first + 1; r < n; r++) {
        uAllRe[uRow + r] = wRe[r * n + k];
        uAllIm[uRow + r] = wIm[r * n + k];
      }
      // p = τ·A₂₂·u from the lower triangle: row i gives p_i += A_ij u_j and p_j += conj(A_ij) u_i.
      for (let i = first; i < n; i++) {
        pRe[i] = 0;
        pIm[i] = 0;
      }
      for (let i = first; i < n; i++) {
        const row = i * n;
        const uiRe = uAllRe[uRow + i];
        const uiIm = uAllIm[uRow + i];
        let sRe = 0;
        let sIm = 0;
        for (let j = first; j < i; j++) {
          const a = wRe[row + j];
          const b = wIm[row + j];
          const ujRe = uAllRe[uRow + j];
          const ujIm = uAllIm[uRow + j];
          sRe += a * ujRe - b * ujIm;
          sIm += a * ujIm + b * ujRe;
          pRe[j] += a * uiRe + b * uiIm;
          pIm[j] += a * uiIm - b * uiRe;
        }
        const d = wRe[row + i];
        pRe[i] += sRe + d * uiRe;
        pIm[i] += sIm + d * uiIm;
      }
      // K = τ·(uᴴp)/2 (real for Hermitian A); w = p − K·u, stored over p.
      let uhp = 0;
      for (let i = first; i < n; i++) {
        pRe[i] *= tau;
        pIm[i] *= tau;
        uhp += uAllRe[uRow + i] * pRe[i] + uAllIm[uRow + i] * pIm[i];
      }
      const half = 0.5 * tau * uhp;
      for (let i = first; i < n; i++) {
        pRe[i] -= half * uAllRe[uRow + i];
        pIm[i] -= half * uAllIm[uRow + i];
      }
      // A₂₂ ← A₂₂ − u·wᴴ − w·uᴴ on the lower triangle.
      for (let i = first; i < n; i++) {
        const row = i * n;
        const uiRe = uAllRe[uRow + i];
        const uiIm = uAllIm[uRow + i];
        const wiRe = pRe[i];
        const wiIm = pIm[i];
        for (let j = first; j <= i; j++) {
          const ujRe = uAllRe[uRow + j];
          const ujIm = uAllIm[uRow + j];
          const wjRe = pRe[j];
          const wjIm = pIm[j];
          wRe[row + j] -= uiRe * wjRe + uiIm * wjIm + wiRe * ujRe + wiIm * ujIm;
          wIm[row + j] -= uiIm * wjRe - uiRe * wjIm + wiIm * ujRe - wiRe * ujIm;
        }
      }
    }
    this.diag[n - 1] = wRe[(n - 1) * n + n - 1];
  }

  /** Real off-diagonal |e_k| and the phases d_k of D (d₀ = 1, d_{k+1} = d_k·e_k/|e_k|). */
  private phases(): void {
    const n = this.n;
    let dRe = 1;
    let dIm = 0;
    this.phaseRe[0] = 1;
    this.phaseIm[0] = 0;
    for (let k = 0; k + 1 < n; k++) {
      const a = this.subRe[k];
      const b = this.subIm[k];
      const size = Math.sqrt(a * a + b * b);
      this.off[k] = size;
      if (size > 0) {
        const cRe = a / size;
        const cIm = b / size;
        const nextRe = dRe * cRe - dIm * cIm;
        dIm = dRe * cIm + dIm * cRe;
        dRe = nextRe;
      }
      this.phaseRe[k + 1] = dRe;
      this.phaseIm[k + 1] = dIm;
    }
    this.off[n - 1] = 0;
  }

  /** Q = P₀·P₁·…·P_{n−2} into the workspace (row-major), applied right to left so each P_k touches a trailing block. */
  private accumulateQ(): void {
    const n = this.n;
    const qRe = this.workRe;
    const qIm = this.workIm;
    const sRe = this.pRe;
    const sIm = this.pIm;
    qRe.fill(0);
    qIm.fill(0);
    for (let i = 0; i < n; i++) qRe[i * n + i] = 1;
    for (let k = n - 2; k >= 0; k--) {
      const tau = this.tau[k];
      if (tau === 0) continue;
      const first = k + 1;
      const uRow = k * n;
      // s = uᴴ·Q (row vector over columns first…n−1), then Q ← Q − τ·u·s.
      for (let c = first; c < n; c++) {
        sRe[c] = 0;
        sIm[c] = 0;
      }
      for (let r = first; r < n; r++) {
        const urRe = this.reflRe[uRow + r];
        const urIm = this.reflIm[uRow + r];
        const row = r * n;
        for (let c = first; c < n; c++) {
          const a = qRe[row + c];
          const b = qIm[row + c];
          sRe[c] += urRe * a + urIm * b;
          sIm[c] += urRe * b - urIm * a;
        }
      }
      for (let r = first; r < n; r++) {
        const tRe = tau * this.reflRe[uRow + r];
        const tIm = tau * this.reflIm[uRow + r];
        const row = r * n;
        for (let c = first; c < n; c++) {
          const a = sRe[c];
          const b = sIm[c];
          qRe[row + c] -= tRe * a - tIm * b;
          qIm[row + c] -= tRe * b + tIm * a;
        }
      }
    }
  }

  /** Turns Q in the workspace into the basis rows (Q·D)ᵀ: row m is column m of Q times d_m. */
  private basisRows(): void {
    const n = this.n;
    const wRe = this.workRe;
    const wIm = this.workIm;
    for (let m = 0; m < n; m++) {
      for (let r = 0; r < m; r++) {
        const a = m * n + r;
        const b = r * n + m;
        let t = wRe[a];
        wRe[a] = wRe[b];
        wRe[b] = t;
        t = wIm[a];
        wIm[a] = wIm[b];
        wIm[b] = t;
      }
    }
    for (let m = 0; m < n; m++) {
      const dRe = this.phaseRe[m];
      const dIm = this.phaseIm[m];
      const row = m * n;
      for (let r = 0; r < n; r++) {
        const a = wRe[row + r];
        const b = wIm[row + r];
        wRe[row + r] = a * dRe - b * dIm;
        wIm[row + r] = a * dIm + b * dRe;
      }
    }
  }
}
