/**
 * Bands unfolded onto the primitive triangular lattice: the spectral weight of every supercell state on the
 * Bloch states of the one-site lattice (Ku, Berlijn & Lee, PRL 104, 216401 (2010); Popescu & Zunger, PRB 85,
 * 085201 (2012)).
 *
 * Method. The weight of supercell state n at a primitive wave vector k is
 *   W_n(k) = (1/N_sites)·Σ_α |Σ_atoms c_{atom,α}(K)·exp(−i(k − K)·r_atom)|²,
 * K the supercell vector k folds to (k − K a reciprocal vector G of the supercell), α = s, px, py, pz. In the
 * Bloch convention of src/tb/model.ts (phases exp(i k·r) on bond vectors, atom positions included) H(K + G) =
 * U†·H(K)·U with U = diag(exp(iG·r_atom)), so the eigenvectors at k itself are c(k) = U†·c(K) and the phase
 * factor is already in them: diagonalising H(k) at k itself,
 *   W_n(k) = (1/N_sites)·Σ_α |Σ_atoms c_{atom,α}(k)|².
 * Derivation: the overlap of the normalised supercell state with the primitive Bloch sum
 * |k, α⟩ = N^(−1/2)·Σ_sites exp(ik·t)|t, α⟩ over all N sites (vacant ones included) is N_sites^(−1/2)·Σ_atoms c.
 *
 * Normalisation. Summing over the 4 orbitals: Σ_n W_n(k) = 4·atoms/sites = 4(1 − η) at every k (completeness of
 * the supercell's states, one Bloch sum per orbital, of which the atoms hold the share atoms/sites); a
 * defect-free supercell gives W = 1 on the states of the primitive bands at k and 0 on the folded copies.
 * `sigmaWeights` is the part from s, px, py (the π part, from pz, is weights − sigmaWeights); planar sheets solve
 * the σ (3n) and π (n) blocks apart (src/tb/model.ts), so each of their states is wholly σ or wholly π.
 *
 * The atoms must sit exactly on the sites of the triangular lattice whose sites per cell are `sites`
 * (src/tb/unfoldSheet.ts makes such a sheet); otherwise the weights are not periodic in its reciprocal lattice.
 *
 * Degenerate states: their individual weights depend on the arbitrary basis the eigensolver picks within the
 * multiplet; each member is given the multiplet's mean weight (the multiplet's total is what is defined).
 *
 * Layout (UnfoldResult): k-major, energies[k·bands + n] ascending at every k, weights and sigmaWeights alike.
 */
import { HermitianEigensolver } from '../linalg/eigh.ts';
import type { HamiltonianBlock, TightBindingModel } from './model.ts';

/** Unfolded bands at a list of primitive k-points. */
export interface UnfoldResult {
  /** Name of the parameter set used. */
  parameters: string;
  /** Number of k-points. */
  count: number;
  /** States per k-point: 4 × atoms. */
  bands: number;
  /** Atoms and lattice sites per cell (sum rule 4·atoms/sites). */
  atoms: number;
  sites: number;
  /** Supercell energies (eV), k-major count × bands, ascending at each k. */
  energies: Float64Array;
  /** W_n(k), same layout. */
  weights: Float64Array;
  /** The s + px + py part of W_n(k), same layout. */
  sigmaWeights: Float64Array;
}

export interface UnfoldOptions {
  /** Called now and then with the k-points done so far and the total. */
  onProgress?: (done: number, total: number) => void;
}

/** How often (in k-points) progress is reported. */
const PROGRESS_EVERY = 64;

/** One block's eigenproblem with its workspaces, and its weights per state. */
class BlockUnfolder {
  readonly size: number;
  readonly values: Float64Array;
  readonly weights: Float64Array;
  private readonly solver: HermitianEigensolver;
  private readonly re: Float64Array;
  private readonly im: Float64Array;
  private readonly vecRe: Float64Array;
  private readonly vecIm: Float64Array;
  /** Orbitals per atom in the block, and whether orbital a of the block is σ. */
  private readonly width: number;
  private readonly sigmaOrbital: boolean[];
  /** σ part of each state's weight. */
  readonly sigma: Float64Array;

  constructor(private readonly model: TightBindingModel, private readonly block: HamiltonianBlock) {
    const n = model.size(block);
    this.size = n;
    this.width = n / Math.max(1, model.atoms);
    const first = block === 'pi' ? 3 : 0;
    this.sigmaOrbital = Array.from({ length: this.width }, (_, a) => first + a < 3);
    this.solver = new HermitianEigensolver(n);
    this.re = new Float64Array(n * n);
    this.im = new Float64Array(n * n);
    this.vecRe = new Float64Array(n * n);
    this.vecIm = new Float64Array(n * n);
    this.values = new Float64Array(n);
    this.weights = new Float64Array(n);
    this.sigma = new Float64Array(n);
  }

  /** Energies and weights at k (Å⁻¹); `scale` = 1/N_sites. */
  solve(kx: number, ky: number, scale: number): void {
    const n = this.size;
    const { width, vecRe, vecIm } = this;
    const atoms = this.model.atoms;
    this.model.hamiltonian(kx, ky, this.block, this.re, this.im);
    this.solver.eigensystem(this.re, this.im, this.values, vecRe, vecIm);
    for (let m = 0; m < n; m++) {
      let total = 0;
      let sigma = 0;
      for (let a = 0; a < width; a++) {
        // Σ_atoms c_{atom,a}: component r = width·atom + a of eigenvector column m.
        let sumRe = 0;
        let sumIm = 0;
        for (let atom = 0, r = a; atom < atoms; atom++, r += width) {
          sumRe += vecRe[r * n + m];
          sumIm += vecIm[r * n + m];
        }
        const part = sumRe * sumRe + sumIm * sumIm;
        total += part;
        if (this.sigmaOrbital[a]) sigma += part;
      }
      this.weights[m] = total * scale;
      this.sigma[m] = sigma * scale;
    }
    shareWithinMultiplets(this.values, this.weights, this.sigma, n);
  }
}

/** Eigenvalues closer than this (eV) are one degenerate level split by rounding. */
const DEGENERATE = 1e-9;

/**
 * Within a degenerate multiplet the eigensolver's basis is arbitrary, and so is each member's weight; only the
 * multiplet's total is defined. Every member gets the multiplet's mean, so the weights never depend on the basis
 * (nor on the eigensolver's route).
 */
function shareWithinMultiplets(values: Float64Array, weights: Float64Array, sigma: Float64Array, n: number): void {
  for (let first = 0; first < n;) {
    let end = first + 1;
    while (end < n && values[end] - values[end - 1] <= DEGENERATE) end++;
    if (end - first > 1) {
      let total = 0;
      let sigmaTotal = 0;
      for (let m = first; m < end; m++) {
        total += weights[m];
        sigmaTotal += sigma[m];
      }
      weights.fill(total / (end - first), first, end);
      sigma.fill(sigmaTotal / (end - first), first, end);
    }
    first = end;
  }
}

/**
 * Unfolded bands of `model` at `kpoints` (primitive k in the sheet's frame, Å⁻¹, kx, ky interleaved), for a
 * sheet whose atoms sit exactly on the sites of a triangular lattice with `sites` sites per cell.
 */
export function unfoldBands(model: TightBindingModel, sites: number, kpoints: Float64Array, options: UnfoldOptions = {}): UnfoldResult {
  const count = kpoints.length / 2;
  const bands = model.size('full');
  const energies = new Float64Array(count * bands);
  const weights = new Float64Array(count * bands);
  const sigmaWeights = new Float64Array(count * bands);
  const scale = 1 / sites;
  const report = (k: number) => {
    if (options.onProgress && ((k + 1) % PROGRESS_EVERY === 0 || k + 1 === count)) options.onProgress(k + 1, count);
  };
  if (model.planar) {
    const sigma = new BlockUnfolder(model, 'sigma');
    const pi = new BlockUnfolder(model, 'pi');
    for (let k = 0; k < count; k++) {
      sigma.solve(kpoints[2 * k], kpoints[2 * k + 1], scale);
      pi.solve(kpoints[2 * k], kpoints[2 * k + 1], scale);
      // Merge the two ascending lists, σ first on ties (as src/tb/bands.ts), a tie being within DEGENERATE: a σ and
      // a π state at one energy keep one order whatever the rounding.
      let i = 0;
      let j = 0;
      for (let b = 0, row = k * bands; b < bands; b++, row++) {
        if (j >= pi.size || (i < sigma.size && sigma.values[i] <= pi.values[j] + DEGENERATE)) {
          energies[row] = sigma.values[i];
          weights[row] = sigma.weights[i];
          sigmaWeights[row] = sigma.weights[i];
          i++;
        } else {
          energies[row] = pi.values[j];
          weights[row] = pi.weights[j];
          sigmaWeights[row] = 0;
          j++;
        }
      }
      report(k);
    }
  } else {
    const full = new BlockUnfolder(model, 'full');
    for (let k = 0; k < count; k++) {
      full.solve(kpoints[2 * k], kpoints[2 * k + 1], scale);
      const row = k * bands;
      energies.set(full.values, row);
      weights.set(full.weights, row);
      sigmaWeights.set(full.sigma, row);
      report(k);
    }
  }
  return { parameters: model.parameters.name, count, bands, atoms: model.atoms, sites, energies, weights, sigmaWeights };
}
