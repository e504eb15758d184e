/**
 * Canonical form of a vacancy pattern: one string per structure, the same for every description of it (any of
 * the 12 operations of 6mm, any translation, any supercell — non-primitive or not in HNF).
 *
 * Form: "a,b,c:s1,s2,…" where [[a, 0], [b, c]] is the first HNF (a, then b ascending) among the images O·P of the
 * primitive lattice of periods P, and s1 < s2 < … the lexicographically smallest list of hole sites
 * (HNF index j·a + i) among the images of the holes under the operations that give that HNF and all translations.
 * It matches the enumerator's choice of supercell and labeling, so an enumerated structure's pattern spells it.
 * Examples: the filled lattice "1,0,1:", the α sheet "3,0,3:0".
 */
import { reduceSite, type Hnf } from '../lattice/hnf.ts';
import type { Pattern } from '../lattice/sheet.ts';
import { apply, POINT_GROUP_6MM } from '../lattice/triangular.ts';
import { periodLattice, vacantSites } from './period.ts';
import { compareHnf, transformSupercell } from './supercells.ts';

/** The canonical string of a supercell and its ascending hole sites. */
export function formatCanonical(h: Hnf, holes: ArrayLike<number>, count = holes.length): string {
  let list = '';
  for (let t = 0; t < count; t++) list += t === 0 ? `${holes[t]}` : `,${holes[t]}`;
  return `${h.a},${h.b},${h.c}:${list}`;
}

function compareLists(x: readonly number[], y: readonly number[]): number {
  for (let t = 0; t < x.length; t++) if (x[t] !== y[t]) return x[t] - y[t];
  return 0;
}

/** The canonical string of any pattern (see the module comment). */
export function canonicalForm(pattern: Pattern): string {
  const p = periodLattice(pattern);
  const holes = vacantSites({ ...pattern, supercell: p });
  let bestCell: Hnf | undefined;
  let bestList: number[] = [];
  for (const op of POINT_GROUP_6MM) {
    const cell = transformSupercell(op, p);
    if (bestCell && compareHnf(cell, bestCell) > 0) continue;
    const images = holes.map(([i, j]) => apply(op, i, j));
    // Smallest list among the translations that bring one hole to the origin (others lack site 0).
    let smallest: number[] | undefined;
    for (const [hi, hj] of images) {
      const list = images
        .map(([i, j]) => {
          const [ri, rj] = reduceSite(cell, i - hi, j - hj);
          return rj * cell.a + ri;
        })
        .sort((x, y) => x - y);
      if (!smallest || compareLists(list, smallest) < 0) smallest = list;
    }
    const list = smallest ?? [];
    if (!bestCell || compareHnf(cell, bestCell) < 0 || compareLists(list, bestList) < 0) {
      bestCell = cell;
      bestList = list;
    }
  }
  return formatCanonical(bestCell as Hnf, bestList);
}
