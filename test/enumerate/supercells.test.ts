import { describe, expect, it } from 'vitest';
import { compareHnf, inequivalentSupercells, isClassRepresentative, stabiliser, transformSupercell } from '../../src/enumerate/supercells.ts';
import { hnfsOfIndex } from '../../src/lattice/hnf.ts';
import { POINT_GROUP_6MM } from '../../src/lattice/triangular.ts';

function sumOfDivisors(n: number): number {
  let sum = 0;
  for (let d = 1; d <= n; d++) if (n % d === 0) sum += d;
  return sum;
}

// OEIS A003051, inequivalent sublattices of index n of the hexagonal lattice under its rotations and
// reflections; Bernstein, Sloane & Wright, Discrete Math. 170, 29 (1997).
const A003051 = [1, 1, 2, 3, 2, 3, 3, 5, 4, 4, 3, 8, 4, 5, 6, 9, 4, 8, 5, 10, 8, 7, 5, 15, 7, 8, 9, 13, 6, 14];

describe('hnfsOfIndex(n)', () => {
  it('lists σ(n) supercells, the sum of divisors, for n = 1…30 (number theory; Hart & Forcade, PRB 77, 224115 (2008))', () => {
    for (let n = 1; n <= 30; n++) expect(hnfsOfIndex(n)).toHaveLength(sumOfDivisors(n));
  });
});

describe('inequivalentSupercells(n)', () => {
  it('follows OEIS A003051 for n = 1…30', () => {
    expect(Array.from({ length: 30 }, (_, i) => inequivalentSupercells(i + 1).length)).toEqual(A003051);
  });

  it('gives classes whose orbits under 6mm partition all σ(n) HNFs, n = 1…30 (orbit–stabiliser theorem)', () => {
    for (let n = 1; n <= 30; n++) {
      const seen = new Set<string>();
      let total = 0;
      for (const h of inequivalentSupercells(n)) {
        const orbit = new Set(POINT_GROUP_6MM.map((op) => JSON.stringify(transformSupercell(op, h))));
        expect(orbit.size * stabiliser(h).length).toBe(12);
        for (const member of orbit) {
          expect(seen.has(member)).toBe(false);
          seen.add(member);
        }
        total += orbit.size;
      }
      expect(total).toBe(sumOfDivisors(n));
    }
  });

  it('picks the first member of each class in hnfsOfIndex order', () => {
    for (const h of inequivalentSupercells(12)) {
      expect(isClassRepresentative(h)).toBe(true);
      for (const op of POINT_GROUP_6MM) expect(compareHnf(transformSupercell(op, h), h)).toBeGreaterThanOrEqual(0);
    }
  });
});

describe('stabiliser(h)', () => {
  it('is all 12 operations for the hexagonal cells 1×1, √3×√3 and 3×3, and holds the 180° rotation always (common practice)', () => {
    expect(stabiliser({ a: 1, b: 0, c: 1 })).toHaveLength(12);
    expect(stabiliser({ a: 3, b: 1, c: 1 })).toHaveLength(12);
    expect(stabiliser({ a: 3, b: 0, c: 3 })).toHaveLength(12);
    for (const h of hnfsOfIndex(12)) {
      expect(stabiliser(h)[0]).toBe(0);
      expect(stabiliser(h)).toContain(3); // R^3 = −1
    }
  });
});
