/**
 * Real symmetric eigenproblems (H = A, im = 0), e.g. the planar σ/π blocks at a time-reversal-invariant k.
 *
 * Layout: n×n real symmetric matrix, row-major — element (r, c) is re[r*n + c]; both triangles must hold the
 * matrix (only the lower one is read; nothing is modified). Eigenvector m is column m: component r at vec[r*n + m].
 *
 * Runs the complex kernel of eigh.ts with a zero imaginary part: every reflector and phase is then real, so the
 * eigenvectors come out real (their imaginary parts are exactly zero and dropped).
 */
import { HermitianEigensolver } from './eigh.ts';

/**
 * Eigensolver for n×n real symmetric matrices with workspaces preallocated for one n; calls allocate nothing.
 * Same guarantees and NaN sentinel as HermitianEigensolver: ascending eigenvalues, orthonormal eigenvectors.
 */
export class RealSymmetricEigensolver {
  /** Matrix order. */
  readonly n: number;
  private readonly complex: HermitianEigensolver;
  private readonly zeros: Float64Array;
  private readonly scratch: Float64Array;

  constructor(n: number) {
    this.n = n;
    this.complex = new HermitianEigensolver(n);
    this.zeros = new Float64Array(n * n);
    this.scratch = new Float64Array(n * n);
  }

  /** Ascending eigenvalues into out (length ≥ n); returns out. */
  eigenvalues(re: Float64Array, out: Float64Array): Float64Array {
    return this.complex.eigenvalues(re, this.zeros, out);
  }

  /** Ascending eigenvalues and orthonormal real eigenvectors: column m is eigenvector m, component r at vec[r*n + m]. */
  eigensystem(re: Float64Array, values: Float64Array, vec: Float64Array): void {
    this.complex.eigensystem(re, this.zeros, values, vec, this.scratch);
  }
}
