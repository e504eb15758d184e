/**
 * The spectrum on the Γ-centred M×M mesh (src/tb/kspace.ts), the common input of filling, DOS and σ-bonding
 * analysis: compute it once, then fill at many dopings.
 *
 * Layout: k-major rows, point p = i·M + j (the kMesh order), energies[p·bands + b]; every k-point has the weight
 * 1/M². Row order: planar sheets keep the σ block (3n bands, ascending) then the π block (n bands, ascending), so
 * bands stay continuous within each block for the triangle method; buckled sheets are ascending.
 * `groups` lists the [first, end) band ranges within which each row is ascending.
 *
 * Time reversal: the Slater–Koster blocks are real, so H(−k) = H(k)* has the same eigenvalues and σ weights;
 * mesh point (i, j) and its partner (−i mod M, −j mod M) share one diagonalisation.
 */
import { diagonaliseRows } from './bands.ts';
import { kMesh } from './kspace.ts';
import type { TightBindingModel } from './model.ts';

export interface MeshSpectrum {
  /** Name of the parameter set used. */
  parameters: string;
  atoms: number;
  planar: boolean;
  /** Mesh side M; count = M². */
  mesh: number;
  count: number;
  bands: number;
  energies: Float64Array;
  sigmaWeight: Float64Array;
  /** Band ranges [first, end) ascending within each row (σ then π for planar sheets, else one range). */
  groups: [number, number][];
}

export interface MeshOptions {
  /** Mesh side M (default 36). */
  mesh?: number;
  onProgress?: (done: number, total: number) => void;
}

/** Default mesh side of filling and DOS. */
export const DEFAULT_MESH = 36;

export function meshSpectrum(model: TightBindingModel, options: MeshOptions = {}): MeshSpectrum {
  const mesh = options.mesh ?? DEFAULT_MESH;
  const kpoints = kMesh(model.sheet.cell, mesh);
  const count = mesh * mesh;
  const bands = model.size('full');
  // Representatives: the first of each pair {p, partner(p)} in mesh order.
  const partner = new Int32Array(count);
  const representatives: number[] = [];
  for (let i = 0; i < mesh; i++) {
    for (let j = 0; j < mesh; j++) {
      const p = i * mesh + j;
      partner[p] = ((mesh - i) % mesh) * mesh + ((mesh - j) % mesh);
      if (partner[p] >= p) representatives.push(p);
    }
  }
  const repKpoints = new Float64Array(2 * representatives.length);
  representatives.forEach((p, r) => {
    repKpoints[2 * r] = kpoints[2 * p];
    repKpoints[2 * r + 1] = kpoints[2 * p + 1];
  });
  const repEnergies = new Float64Array(representatives.length * bands);
  const repWeights = new Float64Array(representatives.length * bands);
  const progress = options.onProgress;
  const scale = count / representatives.length;
  diagonaliseRows(model, repKpoints, repEnergies, repWeights, 'blocks',
    progress && ((done, total) => progress(done === total ? count : Math.min(count, Math.round(done * scale)), count)));
  const energies = new Float64Array(count * bands);
  const sigmaWeight = new Float64Array(count * bands);
  representatives.forEach((p, r) => {
    const source = repEnergies.subarray(r * bands, (r + 1) * bands);
    const weights = repWeights.subarray(r * bands, (r + 1) * bands);
    energies.set(source, p * bands);
    sigmaWeight.set(weights, p * bands);
    energies.set(source, partner[p] * bands);
    sigmaWeight.set(weights, partner[p] * bands);
  });
  const groups: [number, number][] = model.planar
    ? [[0, model.size('sigma')], [model.size('sigma'), bands]]
    : [[0, bands]];
  return { parameters: model.parameters.name, atoms: model.atoms, planar: model.planar, mesh, count, bands, energies, sigmaWeight, groups };
}
