/**
 * Test helpers: random patterns and rigid motions / basis changes of sheets (fast-check arbitraries).
 */
import fc from 'fast-check';
import { toHnf } from '../../src/lattice/hnf.ts';
import { makePattern } from '../../src/lattice/pattern.ts';
import { wrapFraction } from '../../src/lattice/reducedCell.ts';
import type { Pattern, Sheet } from '../../src/lattice/sheet.ts';

/** A pattern with 1…maxSites sites, random supercell rows (not in HNF), some sites vacant but not all. */
export function patternArb(maxSites = 16): fc.Arbitrary<Pattern> {
  const entry = fc.integer({ min: -4, max: 4 });
  return fc.record({
    rows: fc.tuple(fc.tuple(entry, entry), fc.tuple(entry, entry))
      .filter(([[p, q], [r, s]]) => { const n = Math.abs(p * s - q * r); return n >= 1 && n <= maxSites; }),
    bond: fc.double({ min: 1, max: 3, noNaN: true }),
    picks: fc.array(fc.tuple(fc.integer({ min: -20, max: 20 }), fc.integer({ min: -20, max: 20 })), { maxLength: maxSites }),
  }).map(({ rows, bond, picks }) => {
    const h = toHnf(rows)!;
    const n = h.a * h.c;
    const pattern = makePattern({ bond, supercell: rows, vacancies: picks });
    // Keep at least one atom.
    return pattern.vacancies.length < n ? pattern : makePattern({ bond, supercell: rows, vacancies: pattern.vacancies.slice(1) });
  });
}

/** Options of `moveSheet`. */
export interface Motion {
  /** Rotation angle about z, radians. */
  readonly angle: number;
  /** Translation, fractional (of the sheet's own cell). */
  readonly shift: readonly [number, number];
  /** Unimodular change of cell basis [m00, m01, m10, m11]: new rows = M·(old rows). */
  readonly basis: readonly [number, number, number, number];
  /** Mirror y → −y before turning. */
  readonly mirror?: boolean;
  /** Height added to every atom. */
  readonly lift?: number;
}

export const motionArb: fc.Arbitrary<Motion> = fc.record({
  angle: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
  shift: fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true })),
  basis: fc.tuple(fc.integer({ min: -3, max: 3 }), fc.integer({ min: -3, max: 3 })).map(([k, l]): [number, number, number, number] => [1, k, l, k * l + 1]),
  lift: fc.double({ min: -1, max: 1, noNaN: true }),
});

/** The same structure after a rigid motion (and optional mirror) in another cell basis. */
export function moveSheet(sheet: Sheet, motion: Motion): Sheet {
  const [m00, m01, m10, m11] = motion.basis;
  const det = m00 * m11 - m01 * m10;
  const c = Math.cos(motion.angle), s = Math.sin(motion.angle);
  const turn = ([x, y]: [number, number]): [number, number] => {
    const yy = motion.mirror ? -y : y;
    return [c * x - s * yy, s * x + c * yy];
  };
  const [A1, A2] = sheet.cell.map(turn);
  const cell: Sheet['cell'] = [
    [m00 * A1[0] + m01 * A2[0], m00 * A1[1] + m01 * A2[1]],
    [m10 * A1[0] + m11 * A2[0], m10 * A1[1] + m11 * A2[1]],
  ];
  const atoms = sheet.atoms.map(([f1, f2, z]): [number, number, number] => {
    const g1 = f1 + motion.shift[0], g2 = f2 + motion.shift[1];
    return [wrapFraction((g1 * m11 - g2 * m10) / det), wrapFraction((-g1 * m01 + g2 * m00) / det), z + (motion.lift ?? 0)];
  });
  return { cell, atoms };
}
