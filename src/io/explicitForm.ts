/**
 * The explicit form of the sheet file (DESIGN.md, sheet contract): { name?, cell, atoms }, validated.
 * Atoms are [f1, f2] or [f1, f2, z] (fractional in-plane, z in Å, default 0); they come back wrapped to [0, 1).
 */
import { gaussReduce } from '../lattice/reduce.ts';
import { wrapFraction } from '../lattice/reducedCell.ts';
import { shortestSeparation } from '../lattice/separation.ts';
import type { Sheet, Vec2 } from '../lattice/sheet.ts';
import { refuseRendered, requireArray, requireFinite } from '../validate/fields.ts';
import { invalid } from '../validate/invalid.ts';
import {
  MAX_ABS_FRACTION, MAX_ABS_HEIGHT, MAX_ATOMS, MAX_CELL_COMPONENT, MIN_ATOM_SEPARATION, MIN_CELL_SINE,
} from './sheetLimits.ts';

function readCell(value: unknown): [Vec2, Vec2] {
  const rows = requireArray(value, 'cell', 2).map((row, r): Vec2 => {
    const entries = requireArray(row, `cell[${r}]`, 2);
    return [
      requireFinite(entries[0], `cell[${r}][0]`, MAX_CELL_COMPONENT),
      requireFinite(entries[1], `cell[${r}][1]`, MAX_CELL_COMPONENT),
    ];
  });
  const [a, b] = rows as [Vec2, Vec2];
  for (const r of [0, 1]) if (rows[r][0] === 0 && rows[r][1] === 0) invalid(`cell[${r}]`, rows[r], 'zero vector');
  const cross = a[0] * b[1] - a[1] * b[0];
  if (!(Math.abs(cross) > MIN_CELL_SINE * Math.hypot(...a) * Math.hypot(...b))) {
    invalid('cell', value, 'zero area: the two vectors are collinear');
  }
  const { u } = gaussReduce(a, b);
  const shortest = Math.hypot(u[0], u[1]);
  if (shortest < MIN_ATOM_SEPARATION) {
    invalid('cell', value, `a lattice vector of ${shortest.toPrecision(3)} Å is shorter than the minimum atom separation ${MIN_ATOM_SEPARATION} Å`);
  }
  return [a, b];
}

function readAtoms(value: unknown): [number, number, number][] {
  const list = requireArray(value, 'atoms');
  if (list.length === 0) invalid('atoms', value, 'no atoms');
  if (list.length > MAX_ATOMS) refuseRendered('atoms', `${list.length} atoms`, `more than the limit of ${MAX_ATOMS}`);
  return list.map((atom, k): [number, number, number] => {
    const entries = requireArray(atom, `atoms[${k}]`);
    if (entries.length !== 2 && entries.length !== 3) invalid(`atoms[${k}]`, atom, `${entries.length} entries, expected [f1, f2] or [f1, f2, z]`);
    const f1 = requireFinite(entries[0], `atoms[${k}][0]`, MAX_ABS_FRACTION);
    const f2 = requireFinite(entries[1], `atoms[${k}][1]`, MAX_ABS_FRACTION);
    const z = entries.length === 3 ? requireFinite(entries[2], `atoms[${k}][2]`, MAX_ABS_HEIGHT) : 0;
    return [wrapFraction(f1), wrapFraction(f2), z];
  });
}

/** The explicit sheet of a record already known to hold only explicit-form keys. */
export function readExplicitForm(record: Record<string, unknown>, name: string | undefined): Sheet {
  const cell = readCell(record.cell);
  const atoms = readAtoms(record.atoms);
  const sheet: Sheet = { cell, atoms };
  if (name !== undefined) sheet.name = name;
  const closest = shortestSeparation(sheet);
  if (closest.distance < MIN_ATOM_SEPARATION) {
    const [first, second] = closest.from < closest.to ? [closest.from, closest.to] : [closest.to, closest.from];
    const list = record.atoms as unknown[];
    invalid(`atoms[${second}]`, list[second], `${closest.distance.toPrecision(3)} Å from atoms[${first}] (periodic images included), closer than the minimum separation ${MIN_ATOM_SEPARATION} Å`);
  }
  return sheet;
}
