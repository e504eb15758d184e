import { describe, expect, it } from 'vitest';
import { buildQuotient } from '../../src/enumerate/quotient.ts';
import { hnfsOfIndex, siteIndex } from '../../src/lattice/hnf.ts';
import { apply, NEAREST_STEPS, POINT_GROUP_6MM } from '../../src/lattice/triangular.ts';

const cells = [1, 2, 3, 4, 6, 7, 9, 12].flatMap((n) => hnfsOfIndex(n));

describe('buildQuotient(h)', () => {
  it('labels the n sites by Z_d1 × Z_d2 with d1·d2 = n, one label per site (Hart & Forcade, PRB 77, 224115 (2008), §IV)', () => {
    for (const h of cells) {
      const q = buildQuotient(h);
      expect(q.factors[0] * q.factors[1]).toBe(q.sites);
      expect(q.factors[1] % q.factors[0]).toBe(0);
      expect(new Set(q.groupOfSite).size).toBe(q.sites);
      for (let s = 0; s < q.sites; s++) expect(q.siteOfGroup[q.groupOfSite[s]]).toBe(s);
    }
  });

  it('subtracts sites as lattice points modulo the supercell', () => {
    for (const h of cells) {
      const q = buildQuotient(h);
      for (let x = 0; x < q.sites; x++) {
        for (let y = 0; y < q.sites; y++) {
          const expected = siteIndex(h, (x % h.a) - (y % h.a), Math.floor(x / h.a) - Math.floor(y / h.a));
          expect(q.difference[x * q.sites + y]).toBe(expected);
        }
      }
    }
  });

  it('maps sites by the stabiliser as group automorphisms, O(x − y) = O(x) − O(y)', () => {
    for (const h of cells) {
      const q = buildQuotient(h);
      q.operations.forEach((opIndex, o) => {
        for (let x = 0; x < q.sites; x++) {
          const [i, j] = apply(POINT_GROUP_6MM[opIndex], x % h.a, Math.floor(x / h.a));
          expect(q.permutation[o * q.sites + x]).toBe(siteIndex(h, i, j));
          for (let y = 0; y < q.sites; y++) {
            const left = q.permutation[o * q.sites + q.difference[x * q.sites + y]];
            const right = q.difference[q.permutation[o * q.sites + x] * q.sites + q.permutation[o * q.sites + y]];
            expect(left).toBe(right);
          }
        }
      });
    }
  });

  it('finds the six nearest neighbours of every site and flags cells with a step as a supercell vector', () => {
    for (const h of cells) {
      const q = buildQuotient(h);
      for (let s = 0; s < q.sites; s++) {
        NEAREST_STEPS.forEach(([di, dj], t) => {
          expect(q.neighbour[s * 6 + t]).toBe(siteIndex(h, (s % h.a) + di, Math.floor(s / h.a) + dj));
        });
      }
      expect(q.selfNeighbour).toBe(NEAREST_STEPS.some(([di, dj]) => siteIndex(h, di, dj) === 0));
    }
    expect(buildQuotient({ a: 1, b: 0, c: 5 }).selfNeighbour).toBe(true);
    expect(buildQuotient({ a: 3, b: 1, c: 1 }).selfNeighbour).toBe(false);
  });
});
