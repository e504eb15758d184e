/**
 * The spectrum on the Γ-centred M×M mesh (src/tb/kspace.ts), the common input of filling, DOS and σ-bonding
 * analysis: compute it once, then fill at many dopings.
 *
 * Layout: k-major rows, point p = i·M + j (the kMesh order), energies[p·bands + b]; every k-point has the weight
 * 1/M². Row order: planar sheets keep the σ block (3n bands, ascending) then the π block (n bands, ascending), so
 * bands stay continuous within each block for the triangle method; buckled sheets are ascending.
 * `groups` lists the [first, end) band ranges within which each row is ascending.
 *
 * Symmetry: one diagonalisation per star of the mesh (meshStars.ts: the sheet's rotations and mirrors, and time
 * reversal k → −k), copied to every point of the star — the same numbers as solving every point, for a fraction
 * of the cost (a sixth to a twelfth of the mesh for a hexagonal pattern, half for one with a 2-fold axis only).
 */
import { diagonaliseRows } from './bands.ts';
import { kMesh } from './kspace.ts';
import { meshStars } from './meshStars.ts';
import type { TightBindingModel } from './model.ts';
import type { SheetOperation } from '../lattice/sheetSymmetry.ts';

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
  /** false: time reversal alone — no rotations or mirrors, no real form (tests compare the two). */
  symmetry?: boolean;
}

/** The identity as a sheet operation: with it alone, meshStars pairs k with −k only. */
const IDENTITY = { matrix: [1, 0, 0, 1], kind: 'rotation', degrees: 0, atomMap: new Int32Array(0) } as const satisfies SheetOperation;

/** Default mesh side of filling and DOS. */
export const DEFAULT_MESH = 36;

export function meshSpectrum(model: TightBindingModel, options: MeshOptions = {}): MeshSpectrum {
  const mesh = options.mesh ?? DEFAULT_MESH;
  const kpoints = kMesh(model.sheet.cell, mesh);
  const count = mesh * mesh;
  const bands = model.size('full');
  const stars = meshStars(model.sheet, mesh, options.symmetry === false ? [IDENTITY] : model.operations);
  const representatives = stars.representatives;
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
    progress && ((done, total) => progress(done === total ? count : Math.min(count, Math.round(done * scale)), count)),
    options.symmetry !== false);
  const energies = new Float64Array(count * bands);
  const sigmaWeight = new Float64Array(count * bands);
  for (let p = 0; p < count; p++) {
    const r = stars.starOf[p];
    energies.set(repEnergies.subarray(r * bands, (r + 1) * bands), p * bands);
    sigmaWeight.set(repWeights.subarray(r * bands, (r + 1) * bands), p * bands);
  }
  const groups: [number, number][] = model.planar
    ? [[0, model.size('sigma')], [model.size('sigma'), bands]]
    : [[0, bands]];
  return { parameters: model.parameters.name, atoms: model.atoms, planar: model.planar, mesh, count, bands, energies, sigmaWeight, groups };
}
