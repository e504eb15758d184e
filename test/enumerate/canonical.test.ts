import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { canonicalForm } from '../../src/enumerate/canonical.ts';
import { enumerateStructures } from '../../src/enumerate/enumerate.ts';
import type { Structure } from '../../src/enumerate/types.ts';
import { makePattern } from '../../src/lattice/pattern.ts';
import type { Pattern } from '../../src/lattice/sheet.ts';
import { apply, POINT_GROUP_6MM } from '../../src/lattice/triangular.ts';

type Point = [number, number];
type Rows = [Point, Point];

const STRUCTURES: Structure[] = [...enumerateStructures({ sites: [1, 12], holes: [0, 12] })];

// Integer matrices [[p, q], [r, s]] whose rows are combinations of the supercell rows: unimodular ones change
// the basis only, the others (determinant 2, 3, 4) pick a superlattice that repeats the pattern.
const UNIMODULAR: Rows[] = [[[1, 0], [0, 1]], [[0, 1], [1, 0]], [[1, 3], [0, 1]], [[2, 1], [1, 1]], [[-1, 0], [4, 1]], [[3, -2], [-1, 1]]];
const SUPERLATTICE: Rows[] = [[[1, 0], [0, 1]], [[2, 0], [0, 1]], [[1, 0], [1, 2]], [[2, 1], [-1, 1]], [[2, 0], [0, 2]]];

const combine = (m: Rows, rows: Rows): Rows => [
  [m[0][0] * rows[0][0] + m[0][1] * rows[1][0], m[0][0] * rows[0][1] + m[0][1] * rows[1][1]],
  [m[1][0] * rows[0][0] + m[1][1] * rows[1][0], m[1][0] * rows[0][1] + m[1][1] * rows[1][1]],
];

/** The structure moved by operation o and translation t, drawn in cell combine(basis, combine(superlattice, ·)). */
function redescribe(s: Structure, o: number, t: Point, superlattice: Rows, basis: Rows, shifts: Point[]): Pattern {
  const op = POINT_GROUP_6MM[o];
  const { a, b, c } = s.pattern.supercell;
  const rows: Rows = [apply(op, a, 0), apply(op, b, c)];
  const moved = s.pattern.vacancies.map(([i, j]) => {
    const [x, y] = apply(op, i, j);
    return [x + t[0], y + t[1]] as Point;
  });
  // Every coset of the old cell in the new one is some p·row1 + q·row2 with 0 ≤ p, q < 4 (4·Z² ⊂ M·Z² for det M ≤ 4).
  const vacancies: Point[] = [];
  for (let p = 0; p < 4; p++) {
    for (let q = 0; q < 4; q++) {
      for (const [x, y] of moved) vacancies.push([x + p * rows[0][0] + q * rows[1][0], y + p * rows[0][1] + q * rows[1][1]]);
    }
  }
  const cell = combine(basis, combine(superlattice, rows));
  // Any representative of each vacancy: shift by integer combinations of the new cell rows.
  const shifted = vacancies.map(([x, y], v) => {
    const [m, n] = shifts[v % shifts.length];
    return [x + m * cell[0][0] + n * cell[1][0], y + m * cell[0][1] + n * cell[1][1]] as Point;
  });
  return makePattern({ bond: 1.69, supercell: cell, vacancies: shifted });
}

const pointArb = fc.tuple(fc.integer({ min: -25, max: 25 }), fc.integer({ min: -25, max: 25 })) as fc.Arbitrary<Point>;

describe('canonicalForm(pattern)', () => {
  it('is unchanged by any of the 12 operations, any translation, any basis and any superlattice (property)', () => {
    fc.assert(fc.property(
      fc.integer({ min: 0, max: STRUCTURES.length - 1 }),
      fc.integer({ min: 0, max: 11 }),
      pointArb,
      fc.constantFrom(...SUPERLATTICE),
      fc.constantFrom(...UNIMODULAR),
      fc.array(fc.tuple(fc.integer({ min: -3, max: 3 }), fc.integer({ min: -3, max: 3 })) as fc.Arbitrary<Point>, { minLength: 1, maxLength: 5 }),
      (index, o, t, superlattice, basis, shifts) => {
        const s = STRUCTURES[index];
        expect(canonicalForm(redescribe(s, o, t, superlattice, basis, shifts))).toBe(s.canonical);
      },
    ), { numRuns: 1500 });
  });

  it('accepts supercells with b outside [0, a) and unreduced vacancies', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: STRUCTURES.length - 1 }), fc.integer({ min: -4, max: 4 }), pointArb, (index, m, [x, y]) => {
      const s = STRUCTURES[index];
      const { a, b, c } = s.pattern.supercell;
      const pattern: Pattern = {
        bond: 1,
        supercell: { a, b: b + m * a, c },
        vacancies: s.pattern.vacancies.map(([i, j]) => [i + x * a + y * (b + m * a), j + y * c]),
      };
      expect(canonicalForm(pattern)).toBe(s.canonical);
    }));
  });

  it('tells different structures apart: all those listed for N ≤ 12 have distinct forms', () => {
    expect(new Set(STRUCTURES.map((s) => canonicalForm(s.pattern))).size).toBe(STRUCTURES.length);
  });

  it('worked examples: the filled lattice "1,0,1:", the fully vacant lattice "1,0,1:0", the α sheet "3,0,3:0" (hand calculation)', () => {
    expect(canonicalForm(makePattern({ bond: 1, supercell: [[2, 0], [1, 3]], vacancies: [] }))).toBe('1,0,1:');
    expect(canonicalForm(makePattern({ bond: 1, supercell: [[2, 0], [0, 1]], vacancies: [[0, 0], [1, 0]] }))).toBe('1,0,1:0');
    expect(canonicalForm(makePattern({ bond: 1, supercell: [[0, 3], [3, 0]], vacancies: [[4, 5]] }))).toBe('3,0,3:0');
  });
});
