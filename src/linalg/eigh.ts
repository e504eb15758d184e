/**
 * Complex Hermitian eigensolver: Householder reduction to real symmetric tridiagonal form, then implicit QR
 * with Wilkinson shifts (Golub & Van Loan, Matrix Computations, 4th ed., §8.3) for the eigenvalues and, for
 * eigenvectors, QR with rotations below DIVIDE_FROM and divide and conquer from there (eighDivide.ts).
 *
 * Layout (inputs and eigenvectors): an n×n complex matrix is split storage, row-major — element (r, c) is
 * re[r*n + c] + i·im[r*n + c]. Eigenvector m is column m: component r at vecRe[r*n + m] + i·vecIm[r*n + m].
 *
 * Method. H = Q·T·Qᴴ with T tridiagonal and complex off-diagonal e_k (eighHouseholder.ts). The diagonal
 * unitary D = diag(d_k), d₀ = 1, d_{k+1} = d_k·e_k/|e_k|, gives the real T' = Dᴴ·T·D with off-diagonal |e_k|;
 * T' = Z·Λ·Zᵀ (eighTridiagonal.ts or eighDivide.ts), and the eigenvectors of H are V = Q·D·Z, formed by
 * applying the reflectors to D·Z with WebAssembly SIMD where the runtime has it (eighBackTransformSimd.ts),
 * otherwise by forming Q and multiplying (eighBackTransform.ts). Eigenvalues alone use the root-free QR on
 * |e_k|², so no phases and no square roots per rotation are needed.
 */
import { formUnitary, multiplyBasis } from './eighBackTransform.ts';
import { SimdBackTransform } from './eighBackTransformSimd.ts';
import { TridiagonalDivideConquer } from './eighDivide.ts';
import { HermitianTridiagonaliser } from './eighHouseholder.ts';
import { diagonaliseTridiagonal, tridiagonalEigenvaluesRootFree } from './eighTridiagonal.ts';
import { simdModule } from './simdModule.ts';

/**
 * From this order on, eigenvectors of the tridiagonal come from divide and conquer; below it QR with rotations
 * is faster (measured on random matrices, DEVELOPERS.md "linalg").
 */
export const DIVIDE_FROM = 40;

/** Options of HermitianEigensolver (for tests and benchmarks; the defaults pick the fastest route). */
export interface EigensolverOptions {
  /** Tridiagonal eigenvector method: 'auto' (default: by DIVIDE_FROM), 'qr' or 'divide'. */
  tridiagonal?: 'auto' | 'qr' | 'divide';
  /** Use the WebAssembly SIMD kernels when available (default true); false forces TypeScript throughout. */
  simd?: boolean;
  /** Largest block divide and conquer solves by QR (default LEAF_SIZE of eighDivide.ts); tests set it low. */
  leafSize?: number;
}

/**
 * Eigensolver for n×n complex Hermitian matrices with all workspaces preallocated for one n;
 * reuse one object across k-points — calls allocate nothing.
 * Inputs must hold the full matrix (both triangles, consistent); only the lower triangle is read and
 * nothing is modified. If an entry is infinite or NaN, or the QR iteration fails to converge (30 sweeps per
 * eigenvalue), every output is NaN — the documented sentinel; the solver never throws.
 */
export class HermitianEigensolver {
  /** Matrix order. */
  readonly n: number;
  private readonly reduction: HermitianTridiagonaliser;
  private readonly diag: Float64Array;
  private readonly off: Float64Array;
  private readonly phaseRe: Float64Array;
  private readonly phaseIm: Float64Array;
  private readonly order: Int32Array;
  // Zᵀ: rows rotated by the QR sweeps from the identity (n×n real, row-major; row i ↔ diagonal slot i).
  private readonly rows: Float64Array;
  // Q (complex interleaved, see eighBackTransform.ts) and its scratch sums.
  private readonly unitary: Float64Array;
  private readonly sums: Float64Array;
  private readonly rotations: Float64Array;
  private readonly divider: TridiagonalDivideConquer | null;
  private readonly simd: SimdBackTransform | null;

  constructor(n: number, options: EigensolverOptions = {}) {
    this.n = n;
    const method = options.tridiagonal ?? 'auto';
    this.divider = method === 'divide' || (method === 'auto' && n >= DIVIDE_FROM) ? new TridiagonalDivideConquer(n, { simd: options.simd, leafSize: options.leafSize })
      : null;
    const module = options.simd === false ? null : simdModule();
    this.simd = module === null || n < 2 ? null : new SimdBackTransform(n, module);
    this.reduction = new HermitianTridiagonaliser(n, { simd: options.simd });
    this.diag = new Float64Array(n);
    this.off = new Float64Array(n);
    this.phaseRe = new Float64Array(n);
    this.phaseIm = new Float64Array(n);
    this.order = new Int32Array(n);
    this.rows = new Float64Array(n * n);
    this.unitary = this.simd === null ? new Float64Array(2 * n * n) : new Float64Array(0);
    this.sums = new Float64Array(4 * n);
    this.rotations = new Float64Array(2 * n);
  }

  /** Ascending eigenvalues into out (length ≥ n); returns out. */
  eigenvalues(re: Float64Array, im: Float64Array, out: Float64Array): Float64Array {
    const n = this.n;
    if (n === 0) return out;
    const reduction = this.reduction;
    const scale = reduction.reduce(re, im);
    if (Number.isNaN(scale)) return out.fill(NaN, 0, n);
    const diag = this.diag;
    const offSquared = this.off;
    diag.set(reduction.diag);
    for (let k = 0; k + 1 < n; k++) {
      const a = reduction.subRe[k];
      const b = reduction.subIm[k];
      offSquared[k] = a * a + b * b;
    }
    offSquared[n - 1] = 0;
    if (!tridiagonalEigenvaluesRootFree(diag, offSquared, n)) return out.fill(NaN, 0, n);
    // Insertion sort: n is small and deflated blocks come out partly ordered.
    for (let i = 0; i < n; i++) {
      const v = diag[i] * scale;
      let j = i - 1;
      while (j >= 0 && out[j] > v) {
        out[j + 1] = out[j];
        j--;
      }
      out[j + 1] = v;
    }
    return out;
  }

  /**
   * The route eigensystem takes (for tests and benchmarks): `simd` for the back-transformation, `reductionSimd`
   * for the Householder passes (eigenvalues and eigensystem).
   */
  get route(): { tridiagonal: 'qr' | 'divide'; simd: boolean; reductionSimd: boolean } {
    return {
      tridiagonal: this.divider === null ? 'qr' : 'divide', simd: this.simd !== null, reductionSimd: this.reduction.simd,
    };
  }

  /** Ascending eigenvalues and orthonormal eigenvectors: column m is eigenvector m, component r at vecRe[r*n + m] + i·vecIm[r*n + m]. */
  eigensystem(
    re: Float64Array, im: Float64Array, values: Float64Array, vecRe: Float64Array, vecIm: Float64Array,
  ): void {
    const n = this.n;
    if (n === 0) return;
    const reduction = this.reduction;
    const scale = reduction.reduce(re, im);
    const rows = this.rows;
    let converged = !Number.isNaN(scale);
    const divider = this.divider;
    if (converged) {
      this.diag.set(reduction.diag);
      this.phases();
      if (divider !== null) {
        // Z (eigenvector m in column m) with ascending eigenvalues.
        converged = divider.solve(this.diag, this.off, n, rows);
      } else {
        rows.fill(0);
        for (let i = 0; i < n; i++) rows[i * n + i] = 1;
        converged = diagonaliseTridiagonal(this.diag, this.off, n, rows, this.rotations);
      }
    }
    if (!converged) {
      values.fill(NaN, 0, n);
      vecRe.fill(NaN, 0, n * n);
      vecIm.fill(NaN, 0, n * n);
      return;
    }
    const diag = this.diag;
    const order = this.order;
    if (divider !== null) {
      for (let m = 0; m < n; m++) values[m] = diag[m] * scale;
      if (this.simd !== null) {
        this.simd.apply(reduction.tau, reduction.reflRe, reduction.reflIm, this.phaseRe, this.phaseIm, rows, false, null, vecRe, vecIm);
        return;
      }
      // The TypeScript route multiplies by Zᵀ's rows: transpose in place.
      for (let r = 0; r < n; r++) {
        order[r] = r;
        for (let c = 0; c < r; c++) {
          const t = rows[r * n + c];
          rows[r * n + c] = rows[c * n + r];
          rows[c * n + r] = t;
        }
      }
      formUnitary(n, reduction.tau, reduction.reflRe, reduction.reflIm, this.unitary, this.sums);
      multiplyBasis(n, this.unitary, this.phaseRe, this.phaseIm, rows, order, vecRe, vecIm);
      return;
    }
    for (let i = 0; i < n; i++) {
      const v = diag[i];
      let j = i - 1;
      while (j >= 0 && diag[order[j]] > v) {
        order[j + 1] = order[j];
        j--;
      }
      order[j + 1] = i;
    }
    for (let m = 0; m < n; m++) values[m] = diag[order[m]] * scale;
    if (this.simd !== null) {
      this.simd.apply(reduction.tau, reduction.reflRe, reduction.reflIm, this.phaseRe, this.phaseIm, rows, true, order, vecRe, vecIm);
      return;
    }
    formUnitary(n, reduction.tau, reduction.reflRe, reduction.reflIm, this.unitary, this.sums);
    multiplyBasis(n, this.unitary, this.phaseRe, this.phaseIm, rows, order, vecRe, vecIm);
  }

  /** Real off-diagonal |e_k| and the phases d_k of D (d₀ = 1, d_{k+1} = d_k·e_k/|e_k|). */
  private phases(): void {
    const n = this.n;
    const subRe = this.reduction.subRe;
    const subIm = this.reduction.subIm;
    let dRe = 1;
    let dIm = 0;
    this.phaseRe[0] = 1;
    this.phaseIm[0] = 0;
    for (let k = 0; k + 1 < n; k++) {
      const a = subRe[k];
      const b = subIm[k];
      // |e_k| and e_k/|e_k| without squaring a possibly tiny e_k (the phase must keep modulus 1).
      const big = Math.max(Math.abs(a), Math.abs(b));
      if (big > 0) {
        const ratioRe = a / big;
        const ratioIm = b / big;
        const h = Math.sqrt(ratioRe * ratioRe + ratioIm * ratioIm);
        this.off[k] = big * h;
        const cRe = ratioRe / h;
        const cIm = ratioIm / h;
        const nextRe = dRe * cRe - dIm * cIm;
        dIm = dRe * cIm + dIm * cRe;
        dRe = nextRe;
      } else {
        this.off[k] = 0;
      }
      this.phaseRe[k + 1] = dRe;
      this.phaseIm[k + 1] = dIm;
    }
    this.off[n - 1] = 0;
  }
}
