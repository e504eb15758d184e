/**
 * Band energies and σ weights at a list of k-points.
 *
 * Layout (BandResult): k-major, energies[k·bands + b], bands ascending at every k; sigmaWeight in the same layout
 * is the s + px + py share Σ_atoms Σ_{α∈s,px,py} |c_α|² of each state (its π share is 1 − sigmaWeight).
 * Planar sheets diagonalise the σ (3n) and π (n) blocks separately — weights exactly 1 and 0, no eigenvectors —
 * in their real form when the sheet has a 2-fold axis (realForm.ts); buckled sheets diagonalise the full 4n block
 * with eigenvectors.
 */
import { HermitianEigensolver } from '../linalg/eigh.ts';
import { SymmetricEigenvalues } from '../linalg/symmetricEigenvalues.ts';
import type { HamiltonianBlock, TightBindingModel } from './model.ts';
import { realForm, type RealForm } from './realForm.ts';

/** Bands at a list of k-points. */
export interface BandResult {
  /** Name of the parameter set used. */
  parameters: string;
  /** Number of k-points. */
  count: number;
  /** Bands per k-point: 4 × atoms. */
  bands: number;
  /** Energies (eV), k-major count × bands, ascending at each k. */
  energies: Float64Array;
  /** σ share (s + px + py) of each state, same layout. */
  sigmaWeight: Float64Array;
}

/** Options of computeBands. */
export interface BandOptions {
  /** Called now and then with the k-points done so far and the total. */
  onProgress?: (done: number, total: number) => void;
}

/**
 * Eigenvalues of one block of H(k), solved in the real form (realForm.ts) when the sheet has a 2-fold axis —
 * the same numbers for about half the work — else as the complex Hermitian matrix. Workspaces kept across k.
 */
class BlockEigenvalues {
  private readonly re: Float64Array;
  private readonly im: Float64Array;
  private readonly real: Float64Array | undefined;
  private readonly form: RealForm | undefined;
  private readonly complexSolver: HermitianEigensolver | undefined;
  private readonly realSolver: SymmetricEigenvalues | undefined;

  constructor(private readonly model: TightBindingModel, private readonly block: HamiltonianBlock, realFormAllowed: boolean) {
    const n = model.size(block);
    this.re = new Float64Array(n * n);
    this.im = new Float64Array(n * n);
    this.form = realFormAllowed ? realForm(model, block) : undefined;
    if (this.form) {
      this.real = new Float64Array(n * n);
      this.realSolver = new SymmetricEigenvalues(n);
    } else {
      this.complexSolver = new HermitianEigensolver(n);
    }
  }

  solve(kx: number, ky: number, out: Float64Array): void {
    this.model.hamiltonian(kx, ky, this.block, this.re, this.im);
    if (this.form) {
      this.form.transform(this.re, this.im, this.real!);
      this.realSolver!.eigenvalues(this.real!, out);
    } else {
      this.complexSolver!.eigenvalues(this.re, this.im, out);
    }
  }
}

/** How often (in k-points) progress is reported. */
const PROGRESS_EVERY = 256;

/**
 * Diagonalises H(k) at every point of `kpoints` (Å⁻¹, kx, ky interleaved) and writes one row per k into
 * `energies` and `sigmaWeight` starting at row `firstRow`, each row in the order produced by `rowOrder`:
 * 'ascending' merges the planar σ and π blocks into one ascending list; 'blocks' leaves them as σ block
 * (ascending) then π block (ascending).
 */
export function diagonaliseRows(
  model: TightBindingModel,
  kpoints: Float64Array,
  energies: Float64Array,
  sigmaWeight: Float64Array,
  rowOrder: 'ascending' | 'blocks',
  onProgress?: (done: number, total: number) => void,
  realFormAllowed = true,
): void {
  const count = kpoints.length / 2;
  const bands = model.size('full');
  if (model.planar) {
    const nSigma = model.size('sigma');
    const nPi = model.size('pi');
    const sigma = new BlockEigenvalues(model, 'sigma', realFormAllowed);
    const pi = new BlockEigenvalues(model, 'pi', realFormAllowed);
    const sigmaValues = new Float64Array(nSigma);
    const piValues = new Float64Array(nPi);
    for (let k = 0; k < count; k++) {
      const kx = kpoints[2 * k];
      const ky = kpoints[2 * k + 1];
      sigma.solve(kx, ky, sigmaValues);
      pi.solve(kx, ky, piValues);
      const row = k * bands;
      if (rowOrder === 'blocks') {
        for (let b = 0; b < nSigma; b++) {
          energies[row + b] = sigmaValues[b];
          sigmaWeight[row + b] = 1;
        }
        for (let b = 0; b < nPi; b++) {
          energies[row + nSigma + b] = piValues[b];
          sigmaWeight[row + nSigma + b] = 0;
        }
      } else {
        // Merge two ascending lists.
        let i = 0;
        let j = 0;
        for (let b = 0; b < bands; b++) {
          if (j >= nPi || (i < nSigma && sigmaValues[i] <= piValues[j])) {
            energies[row + b] = sigmaValues[i++];
            sigmaWeight[row + b] = 1;
          } else {
            energies[row + b] = piValues[j++];
            sigmaWeight[row + b] = 0;
          }
        }
      }
      if (onProgress && ((k + 1) % PROGRESS_EVERY === 0 || k + 1 === count)) onProgress(k + 1, count);
    }
    return;
  }
  const solver = new HermitianEigensolver(bands);
  const re = new Float64Array(bands * bands);
  const im = new Float64Array(bands * bands);
  const values = new Float64Array(bands);
  const vecRe = new Float64Array(bands * bands);
  const vecIm = new Float64Array(bands * bands);
  for (let k = 0; k < count; k++) {
    model.hamiltonian(kpoints[2 * k], kpoints[2 * k + 1], 'full', re, im);
    solver.eigensystem(re, im, values, vecRe, vecIm);
    const row = k * bands;
    for (let m = 0; m < bands; m++) {
      energies[row + m] = values[m];
      // Rows 4·atom + 0…2 are s, px, py.
      let sigma = 0;
      for (let r = 0; r < bands; r++) {
        if ((r & 3) === 3) continue;
        const a = vecRe[r * bands + m];
        const b = vecIm[r * bands + m];
        sigma += a * a + b * b;
      }
      // Rounding can push the sum of an orthonormal vector's squares a few ulps past 1.
      sigmaWeight[row + m] = sigma > 1 ? 1 : sigma;
    }
    if (onProgress && ((k + 1) % PROGRESS_EVERY === 0 || k + 1 === count)) onProgress(k + 1, count);
  }
}

/** Bands and σ weights at `kpoints` (Å⁻¹, kx, ky interleaved), ascending at every k. */
export function computeBands(model: TightBindingModel, kpoints: Float64Array, options: BandOptions = {}): BandResult {
  const count = kpoints.length / 2;
  const bands = model.size('full');
  const energies = new Float64Array(count * bands);
  const sigmaWeight = new Float64Array(count * bands);
  diagonaliseRows(model, kpoints, energies, sigmaWeight, 'ascending', options.onProgress);
  return { parameters: model.parameters.name, count, bands, energies, sigmaWeight };
}
