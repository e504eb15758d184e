/**
 * The k-mesh that follows the cell: a k-point density (spacing in Å⁻¹) turned into the side M of the contract's
 * square Γ-centred M×M mesh (kspace.ts), and the one rule that picks the mesh of a job when the user gave none.
 *
 * A supercell of N sites folds the parent zone N times, so the same M on every cell gives an N-site cell N times
 * the k-point density of the parent lattice (and N times the cost for nothing). A spacing gives every cell the
 * same density instead, so band energies per atom of different cells compare on equal terms.
 */
import type { Sheet } from '../lattice/sheet.ts';
import { reciprocal } from './kspace.ts';
import { DEFAULT_MESH } from './meshSpectrum.ts';

/**
 * Default k-spacing (Å⁻¹) where the density rule applies: the coarsest of the spacings we measured (0.12, 0.1,
 * 0.09, 0.08, 0.07, 0.06) that keeps the band energies per atom of `rank --sites 1-20 --holes 1-2 --isolated`
 * (reduced cells) within 1e-3 eV of their mesh-36 values at Gaussian width 0.1 eV: 7.6e-4 eV at 0.06, 1.1e-3 at
 * 0.07, 3.3e-3 at 0.12 (about mesh 36 on the 1-site cell at the 1.69 Å bond). Against a converged mesh
 * (spacing 0.025) mesh 36 itself is within 4.5e-4 eV on those cells, 0.12 Å⁻¹ off by up to 3.6e-3 eV: a width
 * of 0.1 eV needs this density. bench/meshDensity.ts prints the figures. A 20-site cell gets about 18×18.
 */
export const DEFAULT_KSPACING = 0.06;

/** Cells up to this many atoms keep the documented default mesh 36 (the presets' cells: `fill NAME` stays as it was). */
export const FIXED_MESH_MAX_ATOMS = 12;

/** Largest mesh side the density rule gives (a very elongated cell would otherwise ask for a huge square mesh). */
export const MAX_DENSITY_MESH = 400;

/**
 * The smallest M with |b_i|/M ≤ spacing for both reciprocal vectors b1, b2 of the cell as given: M = ⌈max|b_i|/spacing⌉,
 * at least 1 and at most `maxMesh`. A ratio within 1e-9 of an integer counts as that integer (no extra row for
 * rounding noise).
 */
export function meshForSpacing(cell: Sheet['cell'], spacing: number, maxMesh = MAX_DENSITY_MESH): number {
  const [b1, b2] = reciprocal(cell);
  const longest = Math.max(Math.hypot(b1[0], b1[1]), Math.hypot(b2[0], b2[1]));
  const m = Math.ceil(longest / spacing - 1e-9);
  return Math.min(maxMesh, Math.max(1, m));
}

/** The largest spacing |b_i|/M of a cell on an M×M mesh (Å⁻¹): what a mesh means as a density. */
export function meshSpacing(cell: Sheet['cell'], mesh: number): number {
  const [b1, b2] = reciprocal(cell);
  return Math.max(Math.hypot(b1[0], b1[1]), Math.hypot(b2[0], b2[1])) / mesh;
}

/**
 * Why a job got its mesh: `mesh` (given by the user), `kspacing` (the user's spacing), `default_mesh` (the
 * documented mesh 36, for cells up to FIXED_MESH_MAX_ATOMS atoms), `default_kspacing` (DEFAULT_KSPACING, for
 * larger cells and for jobs that compare cells).
 */
export type MeshRule = 'mesh' | 'kspacing' | 'default_mesh' | 'default_kspacing';

export interface MeshChoice {
  mesh: number;
  rule: MeshRule;
  /** The spacing asked for, when the rule is a spacing (Å⁻¹). */
  kspacing?: number;
  /** One line for people: the mesh and why. */
  why: string;
}

export interface MeshChoiceOptions {
  /** An explicit mesh side. */
  mesh?: number;
  /** An explicit spacing (Å⁻¹); exclusive with mesh (the boundary refuses both). */
  kspacing?: number;
  /** Use the spacing rule for every cell, small ones too (a job that compares cells, e.g. a ranking). */
  equalDensity?: boolean;
}

/** The mesh of a job on `sheet`, by the rule above. */
export function chooseMesh(sheet: Pick<Sheet, 'cell' | 'atoms'>, options: MeshChoiceOptions = {}): MeshChoice {
  if (options.mesh !== undefined) return { mesh: options.mesh, rule: 'mesh', why: `${options.mesh}×${options.mesh} mesh (given)` };
  if (options.kspacing !== undefined) {
    const mesh = meshForSpacing(sheet.cell, options.kspacing);
    return { mesh, rule: 'kspacing', kspacing: options.kspacing, why: `${mesh}×${mesh} mesh (k-spacing ${options.kspacing} Å⁻¹, given)` };
  }
  if (!options.equalDensity && sheet.atoms.length <= FIXED_MESH_MAX_ATOMS) {
    return { mesh: DEFAULT_MESH, rule: 'default_mesh', why: `${DEFAULT_MESH}×${DEFAULT_MESH} mesh (default for cells up to ${FIXED_MESH_MAX_ATOMS} atoms)` };
  }
  const mesh = meshForSpacing(sheet.cell, DEFAULT_KSPACING);
  const reason = options.equalDensity ? 'the same density for every cell' : `cells over ${FIXED_MESH_MAX_ATOMS} atoms`;
  return { mesh, rule: 'default_kspacing', kspacing: DEFAULT_KSPACING, why: `${mesh}×${mesh} mesh (default k-spacing ${DEFAULT_KSPACING} Å⁻¹ for ${reason})` };
}
