/**
 * One Bloch state of the tight-binding model: its eigenvector at one k, as weights and phases per atom.
 *
 * Bloch convention (src/tb/model.ts): H(k) sums exp(i k·r) over bond vectors r, so an eigenvector c of H(k)
 * gives the amplitude c_{iα}·exp(i k·(R + τ_i)) on orbital α of atom i in the cell translated by R, up to one
 * global phase. Here the phase of atom i is that of its dominant orbital amplitude in the home cell,
 * arg(c_{iα*}) + k·τ_i, with the global phase fixed so that the largest amplitude of all is real and positive.
 * Planar sheets solve only the block (σ: s, px, py; π: pz) the band belongs to, in the band order of
 * `diagonaliseRows` (src/tb/bands.ts): 'blocks' = σ block ascending then π block ascending, 'ascending' = merged.
 *
 * Layout: orbitalWeight[4·atom + α], α = s, px, py, pz (src/tb/slaterKoster.ts).
 */
import { cartesian } from '../lattice/sheet.ts';
import { HermitianEigensolver } from '../linalg/eigh.ts';
import type { HamiltonianBlock, TightBindingModel } from './model.ts';
import { ORBITALS } from './slaterKoster.ts';

/** One state: energy, σ share and per-atom weights and phases. */
export interface BlochState {
  kx: number;
  ky: number;
  /** Band index in the requested row order. */
  band: number;
  /** E (eV). */
  energy: number;
  /** Per atom: Σ_orbitals |c|² (sums to 1). */
  weight: Float64Array;
  /** Per atom: phase (radians, in (−π, π]) of its dominant orbital amplitude in the home cell, Bloch factor included. */
  phase: Float64Array;
  /** Per atom and orbital |c|², layout 4·atom + α. */
  orbitalWeight: Float64Array;
  /** s + px + py share. */
  sigma: number;
  /** The block solved and its eigenvector (component r at vectorRe[r] + i·vectorIm[r], row order of model.ts). */
  block: HamiltonianBlock;
  vectorRe: Float64Array;
  vectorIm: Float64Array;
}

/** The block and the index within it of band `band` (row order as in diagonaliseRows). */
function locateBand(model: TightBindingModel, kx: number, ky: number, band: number, order: 'blocks' | 'ascending'): { block: HamiltonianBlock; index: number } {
  if (!model.planar) return { block: 'full', index: band };
  const nSigma = model.size('sigma');
  if (order === 'blocks') return band < nSigma ? { block: 'sigma', index: band } : { block: 'pi', index: band - nSigma };
  // Replays the merge of diagonaliseRows: σ first on ties.
  const values = (block: HamiltonianBlock) => {
    const n = model.size(block);
    const re = new Float64Array(n * n);
    const im = new Float64Array(n * n);
    model.hamiltonian(kx, ky, block, re, im);
    return new HermitianEigensolver(n).eigenvalues(re, im, new Float64Array(n));
  };
  const sigma = values('sigma');
  const pi = values('pi');
  let i = 0;
  let j = 0;
  for (let b = 0; b < band; b++) {
    if (j >= pi.length || (i < sigma.length && sigma[i] <= pi[j])) i++;
    else j++;
  }
  return j >= pi.length || (i < sigma.length && sigma[i] <= pi[j]) ? { block: 'sigma', index: i } : { block: 'pi', index: j };
}

/** The state of band `band` (row order `order`, default 'blocks') at k = (kx, ky) Å⁻¹. */
export function blochState(model: TightBindingModel, kx: number, ky: number, band: number, order: 'blocks' | 'ascending' = 'blocks'): BlochState {
  const atoms = model.atoms;
  const { block, index } = locateBand(model, kx, ky, band, order);
  const n = model.size(block);
  const width = n / atoms;
  const first = block === 'pi' ? 3 : 0;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  model.hamiltonian(kx, ky, block, re, im);
  const values = new Float64Array(n);
  const vecRe = new Float64Array(n * n);
  const vecIm = new Float64Array(n * n);
  new HermitianEigensolver(n).eigensystem(re, im, values, vecRe, vecIm);

  const weight = new Float64Array(atoms);
  const phase = new Float64Array(atoms);
  const orbitalWeight = new Float64Array(ORBITALS * atoms);
  const ampRe = new Float64Array(atoms);
  const ampIm = new Float64Array(atoms);
  let sigma = 0;
  let largest = -1;
  let largestAtom = 0;
  for (let atom = 0; atom < atoms; atom++) {
    let dominant = -1;
    for (let a = 0; a < width; a++) {
      const r = width * atom + a;
      const x = vecRe[r * n + index];
      const y = vecIm[r * n + index];
      const w = x * x + y * y;
      orbitalWeight[ORBITALS * atom + first + a] = w;
      weight[atom] += w;
      if (first + a < 3) sigma += w;
      if (w > dominant) {
        dominant = w;
        // Bloch factor exp(i k·τ) of the home cell.
        const [tx, ty] = cartesian(model.sheet, atom);
        const t = kx * tx + ky * ty;
        ampRe[atom] = x * Math.cos(t) - y * Math.sin(t);
        ampIm[atom] = x * Math.sin(t) + y * Math.cos(t);
      }
    }
    if (dominant > largest) {
      largest = dominant;
      largestAtom = atom;
    }
  }
  const reference = Math.atan2(ampIm[largestAtom], ampRe[largestAtom]);
  for (let atom = 0; atom < atoms; atom++) {
    let p = Math.atan2(ampIm[atom], ampRe[atom]) - reference;
    // Into (−π, π].
    p -= 2 * Math.PI * Math.ceil((p - Math.PI) / (2 * Math.PI));
    phase[atom] = p;
  }
  phase[largestAtom] = 0;
  const vectorRe = new Float64Array(n);
  const vectorIm = new Float64Array(n);
  for (let r = 0; r < n; r++) {
    vectorRe[r] = vecRe[r * n + index];
    vectorIm[r] = vecIm[r * n + index];
  }
  // Planar blocks are exactly σ or π, as in diagonaliseRows.
  const share = block === 'sigma' ? 1 : block === 'pi' ? 0 : Math.min(1, sigma);
  return { kx, ky, band, energy: values[index], weight, phase, orbitalWeight, sigma: share, block, vectorRe, vectorIm };
}
