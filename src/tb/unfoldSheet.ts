/**
 * The sheet an unfolding runs on: its atoms exactly on the sites of a triangular lattice (in-plane; heights kept,
 * so buckled sheets unfold too), the direction of that lattice in the sheet's own frame, and its sites per cell.
 *
 * A pattern is on its lattice by construction (a1 = d·(1, 0)). An explicit sheet is recognised in its own frame
 * (src/lattice/recognise.ts, heights ignored) and moved onto the exact sites: every atom by at most the
 * recognition tolerance (1e-3 Å), so that the unfolded weights are exactly periodic in the primitive reciprocal
 * lattice and the sum rule is exact. Its a1 is the lattice vector nearest the +x axis, so a pattern written out
 * as an explicit sheet unfolds on the same path as the pattern.
 */
import { patternToSheet } from '../lattice/pattern.ts';
import { RECOGNITION_TOLERANCE, triangularSites } from '../lattice/recognise.ts';
import { wrapFraction } from '../lattice/reducedCell.ts';
import type { Pattern, Sheet, Vec2 } from '../lattice/sheet.ts';

/** A sheet ready to unfold. */
export interface UnfoldingSheet {
  /** The sheet the model is built on: in-plane positions exactly on lattice sites, heights as given. */
  sheet: Sheet;
  /** Lattice spacing d (Å). */
  bond: number;
  /** Direction of the primitive vector a1 (radians from +x, in (−π/6, π/6]); a2 is a1 turned by +60°. */
  angle: number;
  /** Lattice sites per cell, N_sites (atoms + vacancies). */
  sites: number;
}

/** The primitive lattice vectors a1, a2 (Å) of an unfolding, in the sheet's frame. */
export function primitiveVectors(unfolding: Pick<UnfoldingSheet, 'bond' | 'angle'>): [Vec2, Vec2] {
  const { bond: d, angle } = unfolding;
  const turned = angle + Math.PI / 3;
  return [[d * Math.cos(angle), d * Math.sin(angle)], [d * Math.cos(turned), d * Math.sin(turned)]];
}

/** A vacancy pattern: its own sheet, a1 = d·(1, 0). */
export function patternUnfolding(pattern: Pattern): UnfoldingSheet {
  return { sheet: patternToSheet(pattern), bond: pattern.bond, angle: 0, sites: pattern.supercell.a * pattern.supercell.c };
}

/** Why `sheetUnfolding` found nothing, in words for an error message. */
export const NOT_TRIANGULAR = `its atoms do not sit on the sites of one triangular lattice (within ${RECOGNITION_TOLERANCE} Å in the plane), so there is no primitive zone to unfold onto`;

/**
 * An explicit sheet on the sites of a triangular lattice (heights ignored), moved exactly onto them; undefined
 * when its atoms sit on no triangular lattice within `tolerance` (Å).
 */
export function sheetUnfolding(sheet: Sheet, tolerance = RECOGNITION_TOLERANCE): UnfoldingSheet | undefined {
  const found = triangularSites(sheet, tolerance);
  if (!found) return undefined;
  const d = Math.hypot(found.a1[0], found.a1[1]);
  const direction = Math.atan2(found.a1[1], found.a1[0]);
  // The exact basis: a1 as found, a2 exactly a1 turned by +60°.
  const a1: Vec2 = [d * Math.cos(direction), d * Math.sin(direction)];
  const a2: Vec2 = [d * Math.cos(direction + Math.PI / 3), d * Math.sin(direction + Math.PI / 3)];
  const [[p, q], [r, s]] = found.rows;
  const cell: Sheet['cell'] = [
    [p * a1[0] + q * a2[0], p * a1[1] + q * a2[1]],
    [r * a1[0] + s * a2[0], r * a1[1] + s * a2[1]],
  ];
  // Lattice point (i, j) is (i, j)·P⁻¹ in fractions of the cell, P = [[p, q], [r, s]].
  const det = p * s - q * r;
  const [f1, f2] = sheet.atoms[found.origin];
  const atoms = sheet.atoms.map(([, , z], k): [number, number, number] => {
    const [i, j] = found.sites[k];
    return [wrapFraction(f1 + (i * s - j * r) / det), wrapFraction(f2 + (-i * q + j * p) / det), z];
  });
  // a1 of the unfolding: of the six shortest lattice vectors, the one nearest the +x axis (ties: the upper one).
  const sixty = Math.PI / 3;
  let angle = direction - sixty * Math.round(direction / sixty);
  if (angle <= -Math.PI / 6 + 1e-12) angle += sixty;
  const snapped: Sheet = { cell, atoms };
  if (sheet.name !== undefined) snapped.name = sheet.name;
  return { sheet: snapped, bond: found.bond, angle, sites: Math.abs(det) };
}
