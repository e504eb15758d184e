import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { coordination, neighbours } from '../../src/lattice/neighbours.ts';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { cartesian, type Sheet } from '../../src/lattice/sheet.ts';
import { SQRT3 } from '../../src/lattice/triangular.ts';

/** All (i, j, n1, n2) closer than `cutoff`, by brute force over |n1|, |n2| ≤ range. */
function bruteForce(sheet: Sheet, cutoff: number, range: number): string[] {
  const [[ax, ay], [bx, by]] = sheet.cell;
  const out: string[] = [];
  sheet.atoms.forEach((_, i) => {
    const [xi, yi, zi] = cartesian(sheet, i);
    sheet.atoms.forEach((__, j) => {
      const [xj, yj, zj] = cartesian(sheet, j);
      for (let n1 = -range; n1 <= range; n1++) for (let n2 = -range; n2 <= range; n2++) {
        if (i === j && n1 === 0 && n2 === 0) continue;
        const d = Math.hypot(xj + n1 * ax + n2 * bx - xi, yj + n1 * ay + n2 * by - yi, zj - zi);
        if (d < cutoff) out.push(`${i},${j},${n1},${n2}`);
      }
    });
  });
  return out.sort();
}

function listed(sheet: Sheet, cutoff: number): string[] {
  const list = neighbours(sheet, cutoff);
  const out: string[] = [];
  for (let e = 0; e < list.count; e++) out.push(`${list.from[e]},${list.to[e]},${list.shift1[e]},${list.shift2[e]}`);
  return out.sort();
}

describe('coordination(sheet, cutoff) on the presets (nearest neighbours, cutoff 1.2 d)', () => {
  // δ6: every atom has 6 neighbours; honeycomb: 3 (common practice). α: the hole's six neighbours are
  // 5-coordinated, the other two atoms 6-coordinated (counted by hand on the 3×3 cell; Tang & Ismail-Beigi 2007).
  const cases: [string, number[]][] = [
    ['delta6', [6]],
    ['honeycomb', [3, 3]],
    ['alpha', [5, 5, 5, 5, 5, 5, 6, 6]],
  ];
  for (const [name, expected] of cases) {
    it(name, () => {
      const pattern = findSheetPreset(name)!.pattern;
      expect([...coordination(patternToSheet(pattern), 1.2 * pattern.bond)].sort()).toEqual(expected);
    });
  }
});

describe('neighbours(sheet, cutoff)', () => {
  it('matches a brute force over ±60 images on very oblique cells of the triangular lattice', () => {
    // Cell (d, 0), (k·d + d/2, √3d/2): the same triangular lattice in an ever more oblique basis (analytic).
    for (const k of [0, 3, 11, 25]) {
      const d = 1.69;
      const sheet: Sheet = { cell: [[d, 0], [k * d + d / 2, (SQRT3 / 2) * d]], atoms: [[0, 0, 0]] };
      const brute = bruteForce(sheet, 1.2 * d, 60);
      expect(brute).toHaveLength(6);
      expect(listed(sheet, 1.2 * d)).toEqual(brute);
      expect(listed(sheet, 2.1 * d)).toEqual(bruteForce(sheet, 2.1 * d, 60));
    }
  });

  it('matches a brute force on random oblique cells with buckled atoms', () => {
    const fraction = fc.double({ min: 0, max: 1, maxExcluded: true, noNaN: true });
    fc.assert(fc.property(
      fc.double({ min: 1, max: 4, noNaN: true }), fc.integer({ min: -8, max: 8 }), fc.double({ min: 1, max: 4, noNaN: true }),
      fc.array(fc.tuple(fraction, fraction, fc.double({ min: -1, max: 1, noNaN: true })), { minLength: 1, maxLength: 3 }),
      fc.double({ min: 0.5, max: 5, noNaN: true }),
      (a, shear, height, atoms, cutoff) => {
        const sheet: Sheet = { cell: [[a, 0], [shear * a + 0.3, height]], atoms };
        expect(listed(sheet, cutoff)).toEqual(bruteForce(sheet, cutoff, 45));
      },
    ), { numRuns: 60 });
  });

  it('a buckled honeycomb: three bonds of length √(d² + (2h)²) per atom, six same-sublattice neighbours at √3·d (analytic)', () => {
    const d = 1.7, h = 0.4, a = SQRT3 * d;
    const sheet: Sheet = { cell: [[a, 0], [a / 2, (SQRT3 / 2) * a]], atoms: [[1 / 3, 1 / 3, h], [2 / 3, 2 / 3, -h]] };
    const bond = Math.hypot(d, 2 * h);
    const first = neighbours(sheet, bond * 1.01);
    expect(first.count).toBe(6);
    for (let e = 0; e < first.count; e++) {
      expect(first.distance[e]).toBeCloseTo(bond, 12);
      expect(Math.abs(first.dz[e])).toBeCloseTo(2 * h, 12);
    }
    expect([...coordination(sheet, 1.01 * SQRT3 * d)]).toEqual([9, 9]);
  });

  it('is symmetric: every bond i → j (shift n) has j → i (shift −n) with the opposite vector', () => {
    const sheet = patternToSheet(findSheetPreset('beta12')!.pattern);
    const list = neighbours(sheet, 3.5);
    const keys = new Map<string, number>();
    for (let e = 0; e < list.count; e++) keys.set(`${list.from[e]},${list.to[e]},${list.shift1[e]},${list.shift2[e]}`, e);
    for (let e = 0; e < list.count; e++) {
      const back = keys.get(`${list.to[e]},${list.from[e]},${-list.shift1[e]},${-list.shift2[e]}`)!;
      expect(back).toBeDefined();
      expect(list.dx[back]).toBeCloseTo(-list.dx[e], 12);
      expect(list.dy[back]).toBeCloseTo(-list.dy[e], 12);
      expect(list.distance[e]).toBeCloseTo(Math.hypot(list.dx[e], list.dy[e], list.dz[e]), 12);
    }
  });
});
