/**
 * Test helper: are two patterns the same structure? Same bond, and some point operation g of 6mm with a
 * translation t maps the first's supercell lattice onto the second's and its vacancies onto the second's
 * (the definition of equivalence in DESIGN.md's enumerate contract). Written for the tests, independent of
 * src/enumerate.
 */
import { reduceSite, toHnf } from '../../src/lattice/hnf.ts';
import type { Pattern } from '../../src/lattice/sheet.ts';
import { apply, POINT_GROUP_6MM, type IntMat2 } from '../../src/lattice/triangular.ts';

/** The six rotations of 6mm (proper motions only). */
export const ROTATIONS: readonly IntMat2[] = POINT_GROUP_6MM.slice(0, 6);

export function patternsEquivalent(p: Pattern, q: Pattern, ops: readonly IntMat2[] = POINT_GROUP_6MM, bondTolerance = 1e-9): boolean {
  if (Math.abs(p.bond - q.bond) > bondTolerance * q.bond) return false;
  const h = q.supercell;
  if (p.supercell.a * p.supercell.c !== h.a * h.c || p.vacancies.length !== q.vacancies.length) return false;
  const key = ([i, j]: [number, number]) => j * h.a + i;
  const target = new Set(q.vacancies.map(key));
  for (const g of ops) {
    const image = toHnf([apply(g, p.supercell.a, 0), apply(g, p.supercell.b, p.supercell.c)]);
    if (!image || image.a !== h.a || image.b !== h.b || image.c !== h.c) continue;
    const moved = p.vacancies.map(([i, j]) => apply(g, i, j));
    if (moved.length === 0) return true;
    for (const [ti, tj] of q.vacancies) {
      const [si, sj] = moved[0];
      if (moved.every(([i, j]) => target.has(key(reduceSite(h, i + ti - si, j + tj - sj))))) return true;
    }
  }
  return false;
}
