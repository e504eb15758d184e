/**
 * The point symmetry of a sheet in the plane: the rotations and mirror lines that map its atoms onto themselves
 * (after some translation), found among the operations of its lattice. The coincidence fit uses them to list
 * fits that differ only by a symmetry of the sheet once.
 *
 * Candidates: rotations by 60°, 90°, 120°, 180° (the only ones a 2D lattice allows, crystallographic
 * restriction) and mirror lines along and perpendicular to short lattice vectors (every mirror of a 2D lattice
 * is along a lattice vector, analytic). A candidate O is kept when O maps the lattice onto itself and some
 * translation t maps every atom r onto an atom of the same height: O·r + t ≡ r' (mod the lattice).
 */
import { gaussReduce } from '../lattice/reduce.ts';
import type { Sheet, Vec2 } from '../lattice/sheet.ts';

export interface SheetSymmetry {
  /** Rotation angles (degrees, in (0, 360)) of the sheet's symmetry rotations. */
  rotations: number[];
  /** Angles β (degrees, in [0, 180)) of its mirror lines. */
  mirrors: number[];
}

const TOLERANCE = 1e-6;

/** Integer-ness of a fractional vector within the tolerance. */
function nearInteger(x: number): boolean {
  return Math.abs(x - Math.round(x)) < TOLERANCE;
}

function fractional(cell: [Vec2, Vec2], x: number, y: number): Vec2 {
  const [[ax, ay], [bx, by]] = cell;
  const det = ax * by - ay * bx;
  return [(x * by - y * bx) / det, (ay * x * -1 + ax * y) / det];
}

/** Applies the orthogonal map m = [m00, m01, m10, m11] (Cartesian, column vectors). */
function applyMap(m: readonly number[], v: Vec2): Vec2 {
  return [m[0] * v[0] + m[1] * v[1], m[2] * v[0] + m[3] * v[1]];
}

function mapsLattice(sheet: Sheet, m: readonly number[]): boolean {
  return sheet.cell.every((vector) => fractional(sheet.cell, ...applyMap(m, vector)).every(nearInteger));
}

function mapsAtoms(sheet: Sheet, m: readonly number[]): boolean {
  const [[ax, ay], [bx, by]] = sheet.cell;
  const positions = sheet.atoms.map(([f1, f2, z]): [number, number, number] => [f1 * ax + f2 * bx, f1 * ay + f2 * by, z]);
  if (positions.length === 0) return true;
  const image = positions.map(([x, y, z]): [number, number, number] => [...applyMap(m, [x, y]), z]);
  const matches = (p: [number, number, number], q: [number, number, number], t: Vec2) =>
    Math.abs(p[2] - q[2]) < TOLERANCE && fractional(sheet.cell, p[0] + t[0] - q[0], p[1] + t[1] - q[1]).every(nearInteger);
  return positions.some((target) => {
    const t: Vec2 = [target[0] - image[0][0], target[1] - image[0][1]];
    return image.every((p) => positions.some((q) => matches(p, q, t)));
  });
}

export function sheetSymmetry(sheet: Sheet): SheetSymmetry {
  const rotations: number[] = [];
  for (const degrees of [60, 90, 120, 180, 240, 270, 300]) {
    const t = (degrees * Math.PI) / 180;
    const m = [Math.cos(t), -Math.sin(t), Math.sin(t), Math.cos(t)];
    if (mapsLattice(sheet, m) && mapsAtoms(sheet, m)) rotations.push(degrees);
  }
  const { u, v } = gaussReduce(sheet.cell[0], sheet.cell[1]);
  const directions: Vec2[] = [u, v, [u[0] + v[0], u[1] + v[1]], [u[0] - v[0], u[1] - v[1]], [u[0] + 2 * v[0], u[1] + 2 * v[1]], [2 * u[0] + v[0], 2 * u[1] + v[1]]];
  const candidates = new Set<number>();
  for (const [x, y] of directions) {
    const along = (((Math.atan2(y, x) * 180) / Math.PI) % 180 + 180) % 180;
    candidates.add(Math.round(along * 1e6) / 1e6 % 180);
    candidates.add(Math.round(((along + 90) % 180) * 1e6) / 1e6 % 180);
  }
  const mirrors: number[] = [];
  for (const beta of [...candidates].sort((p, q) => p - q)) {
    const t = (2 * beta * Math.PI) / 180;
    const m = [Math.cos(t), Math.sin(t), Math.sin(t), -Math.cos(t)];
    if (mapsLattice(sheet, m) && mapsAtoms(sheet, m)) mirrors.push(beta);
  }
  return { rotations, mirrors };
}
