/**
 * Pattern → explicit sheet (always possible).
 */
import { latticePoint } from './triangular.ts';
import type { Pattern, Sheet } from './sheet.ts';
import { reduceSite, toHnf, type Hnf } from './hnf.ts';
import { wrapFraction } from './reducedCell.ts';

/** Cell rows (Å) of a pattern's supercell: A1 = a·a1, A2 = b·a1 + c·a2. */
export function patternCell(pattern: Pattern): Sheet['cell'] {
  const { a, b, c } = pattern.supercell;
  return [latticePoint(a, 0, pattern.bond), latticePoint(b, c, pattern.bond)];
}

/**
 * The explicit sheet of a pattern: every site (i, j) with 0 ≤ i < a, 0 ≤ j < c that is not vacant, in the
 * order j·a + i, at fractional coordinates f2 = j/c, f1 = (i − f2·b)/a (wrapped), z = 0.
 */
export function patternToSheet(pattern: Pattern): Sheet {
  const { a, b, c } = pattern.supercell;
  const vacant = new Set(pattern.vacancies.map(([i, j]) => j * a + i));
  const atoms: Sheet['atoms'] = [];
  for (let j = 0; j < c; j++) {
    for (let i = 0; i < a; i++) {
      if (vacant.has(j * a + i)) continue;
      const f2 = j / c;
      atoms.push([wrapFraction((i - f2 * b) / a), wrapFraction(f2), 0]);
    }
  }
  const sheet: Sheet = { cell: patternCell(pattern), atoms };
  if (pattern.name !== undefined) sheet.name = pattern.name;
  return sheet;
}

/** Hole density η = vacancies / lattice sites. */
export function holeDensity(pattern: Pattern): number {
  return pattern.vacancies.length / (pattern.supercell.a * pattern.supercell.c);
}

/**
 * A pattern from trusted parts: supercell rows (any integer rows of non-zero determinant, brought to HNF)
 * and vacant lattice points (any representatives; reduced and sorted, duplicates merged).
 * Untrusted input goes through src/io first, which reports bad fields; here a singular cell is a bug.
 */
export function makePattern(parts: {
  name?: string;
  bond: number;
  supercell: readonly [readonly [number, number], readonly [number, number]];
  vacancies: readonly (readonly [number, number])[];
}): Pattern {
  const supercell = toHnf(parts.supercell);
  if (!supercell) throw new Error('makePattern: singular supercell');
  const byIndex = new Map<number, [number, number]>();
  for (const [i, j] of parts.vacancies) {
    const site = reduceSite(supercell, i, j);
    byIndex.set(site[1] * supercell.a + site[0], site);
  }
  const vacancies = [...byIndex.entries()].sort((x, y) => x[0] - y[0]).map((entry) => entry[1]);
  const pattern: Pattern = { bond: parts.bond, supercell, vacancies };
  if (parts.name !== undefined) pattern.name = parts.name;
  return pattern;
}

/** The contract's row form [[a, 0], [b, c]] of an HNF supercell. */
export function hnfRows(h: Hnf): [[number, number], [number, number]] {
  return [[h.a, 0], [h.b, h.c]];
}
