/**
 * The σ-bonding analysis on a mesh fine enough for it: start at a mesh (default 36, the CLI's), and while the
 * answer is not converged (src/tb/sigmaBonding.ts: mesh and interpolated counts differ by more than
 * CONVERGENCE_TOLERANCE, or E* sits in a hole of the mesh) go to nextMesh (at least double), as long as the next mesh's work stays within a budget. When the budget
 * stops it first, the result says so and names the next mesh to try.
 *
 * Work of a mesh: M²·(4n)³ — diagonalisations times the cube of the matrix size, how the eigensolver's cost grows.
 * Default budget 144²·8³: the two-atom honeycomb up to mesh 144, the one-atom δ6 up to 288, well under a second
 * each; cells of more than about 6 atoms are not refined past mesh 36 (a choice of ours).
 */
import { MAX_FILL_MESH } from './fill.ts';
import { DEFAULT_MESH, meshSpectrum, type MeshSpectrum } from './meshSpectrum.ts';
import type { TightBindingModel } from './model.ts';
import { sigmaBonding, type SigmaBondingOptions, type SigmaBondingResult } from './sigmaBonding.ts';

/** Default work budget of the refinement (see the module comment). */
export const REFINE_BUDGET = 144 * 144 * 8 ** 3;

/** Options of the refined analysis. */
export interface RefinedBondingOptions extends Omit<SigmaBondingOptions, 'model'> {
  /** Starting mesh side M (default 36). */
  mesh?: number;
  /** Double the mesh while not converged (default true); false analyses the starting mesh only. */
  refine?: boolean;
  /** Largest M²·(4n)³ a refined mesh may cost (default REFINE_BUDGET). */
  budget?: number;
  /** Progress of each mesh's diagonalisations. */
  onProgress?: (done: number, total: number) => void;
}

/** The analysis, the spectrum it used, and the meshes tried. */
export interface RefinedBonding {
  result: SigmaBondingResult;
  /** The spectrum of the last mesh (the result's). */
  spectrum: MeshSpectrum;
  /** Mesh sides tried, in order; the last is the result's. */
  meshes: number[];
  /** When not converged: the mesh side to try next. */
  suggestedMesh?: number;
}

/**
 * The next mesh: at least twice as dense and a multiple of 6, so that it holds Γ, M and K of a hexagonal zone and
 * X, S, Y of a rectangular one (their fractional coordinates have denominators 2 and 3) — band crossings at those
 * points are then on the mesh.
 */
export function nextMesh(mesh: number): number {
  return 6 * Math.ceil((2 * mesh) / 6);
}

export function refinedSigmaBonding(model: TightBindingModel, options: RefinedBondingOptions): RefinedBonding {
  const budget = options.budget ?? REFINE_BUDGET;
  const size = model.size('full');
  const work = (m: number) => m * m * size ** 3;
  let mesh = options.mesh ?? DEFAULT_MESH;
  const meshes: number[] = [];
  for (;;) {
    const spectrum = meshSpectrum(model, { mesh, onProgress: options.onProgress });
    const result = sigmaBonding(spectrum, { ...options, model });
    meshes.push(mesh);
    if (result.convergence.converged) return { result, spectrum, meshes };
    const next = nextMesh(mesh);
    if (options.refine === false || work(next) > budget || next > MAX_FILL_MESH) return { result, spectrum, meshes, suggestedMesh: next };
    mesh = next;
  }
}
