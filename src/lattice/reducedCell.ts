/**
 * A sheet re-expressed in its reduced cell, and the metrics of a cell.
 *
 * The reduced cell is the Gauss-reduced basis (src/lattice/reduce.ts: u a shortest lattice vector, v the
 * shortest independent one, angle in [90°, 120°]) made right-handed by swapping u and v when needed, so the
 * angle stays in [90°, 120°] (120° for a hexagonal cell, the crystallographers' setting) but a may exceed b.
 * Atoms keep their Cartesian positions modulo the lattice.
 */
import { gaussReduce } from './reduce.ts';
import type { Sheet, Vec2 } from './sheet.ts';

/** Lengths and angle of a 2D cell. */
export interface CellMetrics {
  /** |A1|, Å. */
  readonly a: number;
  /** |A2|, Å. */
  readonly b: number;
  /** Angle between A1 and A2, degrees in (0, 180). */
  readonly gammaDeg: number;
  /** |A1 × A2|, Å². */
  readonly area: number;
}

export function cellMetrics(cell: readonly [Vec2, Vec2]): CellMetrics {
  const [[ax, ay], [bx, by]] = cell;
  const a = Math.hypot(ax, ay), b = Math.hypot(bx, by);
  const cross = ax * by - ay * bx;
  return { a, b, gammaDeg: (Math.atan2(Math.abs(cross), ax * bx + ay * by) * 180) / Math.PI, area: Math.abs(cross) };
}

/** Fractions this close to 0 or 1 are rounding noise of a lattice site and come back as exactly 0. */
const WRAP_TOLERANCE = 1e-12;

/** Wraps a fractional coordinate to [0, 1); −0 and values within 1e-12 of 0 or 1 come back as 0. */
export function wrapFraction(f: number): number {
  const w = f - Math.floor(f);
  return w > 1 - WRAP_TOLERANCE || w < WRAP_TOLERANCE ? 0 : w;
}

/** The same sheet in its right-handed reduced cell; atoms re-expressed in it and wrapped to [0, 1). */
export function reducedSheet(sheet: Sheet): Sheet {
  let { transform: [m00, m01, m10, m11] } = gaussReduce(sheet.cell[0], sheet.cell[1]);
  const [[ax, ay], [bx, by]] = sheet.cell;
  const handed = (ax * by - ay * bx) * (m00 * m11 - m01 * m10);
  if (handed < 0) [m00, m01, m10, m11] = [m10, m11, m00, m01];
  const u: Vec2 = [m00 * ax + m01 * bx, m00 * ay + m01 * by];
  const v: Vec2 = [m10 * ax + m11 * bx, m10 * ay + m11 * by];
  // r = f·(A1, A2) = g·(u, v) with (u, v) = M·(A1, A2), so g = f·M⁻¹, M⁻¹ = [[m11, −m01], [−m10, m00]] / det M.
  const det = m00 * m11 - m01 * m10;
  const atoms = sheet.atoms.map(([f1, f2, z]): [number, number, number] => [
    wrapFraction((f1 * m11 - f2 * m10) / det),
    wrapFraction((-f1 * m01 + f2 * m00) / det),
    z,
  ]);
  const out: Sheet = { cell: [u, v], atoms };
  if (sheet.name !== undefined) out.name = sheet.name;
  return out;
}

/**
 * The same sheet turned rigidly about z so that its first cell vector points along +x (the CIF setting);
 * fractional coordinates are unchanged. A left-handed cell keeps its second vector below the x axis.
 */
export function alignFirstVector(sheet: Sheet): Sheet {
  const [[ax, ay], [bx, by]] = sheet.cell;
  const length = Math.hypot(ax, ay);
  const cos = ax / length, sin = ay / length;
  const turn = (x: number, y: number): Vec2 => [cos * x + sin * y + 0, -sin * x + cos * y + 0];
  const first = turn(ax, ay);
  const out: Sheet = { cell: [[first[0], 0], turn(bx, by)], atoms: sheet.atoms.map((atom) => [atom[0], atom[1], atom[2]]) };
  if (sheet.name !== undefined) out.name = sheet.name;
  return out;
}
