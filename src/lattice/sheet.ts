/**
 * The two forms of a boron sheet (DESIGN.md, sheet contract), normalised.
 *
 * - `Sheet` is the explicit form: any cell, any atoms, planar or buckled. Every computation runs on it.
 * - `Pattern` is the vacancy-pattern form: a supercell of the triangular lattice with some sites empty.
 *   Patterns are converted to sheets always; sheets to patterns when their atoms sit on a triangular lattice.
 */
import type { Hnf } from './hnf.ts';

/** 2D vector (Å or Å⁻¹). */
export type Vec2 = [number, number];

/** Explicit sheet. */
export interface Sheet {
  name?: string;
  /** Cell vectors as rows, in Å: [[ax, ay], [bx, by]]; positive or negative orientation, non-zero area. */
  cell: [Vec2, Vec2];
  /** Atoms: fractional in-plane coordinates f1, f2 (wrapped to [0, 1)) and height z in Å. */
  atoms: [number, number, number][];
}

/** Vacancy-pattern sheet. */
export interface Pattern {
  name?: string;
  /** Nearest-neighbour B–B distance d in Å. */
  bond: number;
  /** Supercell in Hermite normal form, rows [[a, 0], [b, c]] in the basis (a1, a2). */
  supercell: Hnf;
  /** Vacant lattice points (i, j), reduced to 0 ≤ i < a, 0 ≤ j < c, sorted by j·a + i. */
  vacancies: [number, number][];
}

/** Cartesian position (Å) of atom `index`. */
export function cartesian(sheet: Sheet, index: number): [number, number, number] {
  const [f1, f2, z] = sheet.atoms[index];
  const [[ax, ay], [bx, by]] = sheet.cell;
  return [f1 * ax + f2 * bx, f1 * ay + f2 * by, z];
}

/** Signed cell area ax·by − ay·bx (Å²). */
export function signedArea(cell: [Vec2, Vec2]): number {
  return cell[0][0] * cell[1][1] - cell[0][1] * cell[1][0];
}

/** True when every atom has the same height z (the σ/π blocks of the Hamiltonian then decouple exactly). */
export function isPlanar(sheet: Sheet): boolean {
  const height = sheet.atoms.length > 0 ? sheet.atoms[0][2] : 0;
  return sheet.atoms.every((atom) => atom[2] === height);
}
