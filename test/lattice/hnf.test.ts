import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { hnfsOfIndex, isSupercellVector, reduceSite, siteIndex, toHnf } from '../../src/lattice/hnf.ts';

type Rows = [[number, number], [number, number]];
const rowsArb = fc.tuple(
  fc.tuple(fc.integer({ min: -30, max: 30 }), fc.integer({ min: -30, max: 30 })),
  fc.tuple(fc.integer({ min: -30, max: 30 }), fc.integer({ min: -30, max: 30 })),
).filter(([[p, q], [r, s]]) => p * s - q * r !== 0) as fc.Arbitrary<Rows>;

/** Is the integer point (x, y) an integer combination of the rows? (Cramer's rule, analytic.) */
function inLattice([[p, q], [r, s]]: Rows, x: number, y: number): boolean {
  const det = p * s - q * r;
  const m = (x * s - y * r) / det, n = (p * y - q * x) / det;
  return Number.isInteger(m) && Number.isInteger(n);
}

describe('toHnf(rows)', () => {
  it('gives [[a, 0], [b, c]] with a, c > 0, 0 ≤ b < a spanning the same lattice (HNF definition)', () => {
    fc.assert(fc.property(rowsArb, (rows) => {
      const h = toHnf(rows)!;
      expect(h.a).toBeGreaterThan(0);
      expect(h.c).toBeGreaterThan(0);
      expect(h.b).toBeGreaterThanOrEqual(0);
      expect(h.b).toBeLessThan(h.a);
      const [[p, q], [r, s]] = rows;
      expect(h.a * h.c).toBe(Math.abs(p * s - q * r));
      const hnfRows: Rows = [[h.a, 0], [h.b, h.c]];
      expect(inLattice(hnfRows, p, q) && inLattice(hnfRows, r, s)).toBe(true);
      expect(inLattice(rows, h.a, 0) && inLattice(rows, h.b, h.c)).toBe(true);
    }), { numRuns: 2000 });
  });

  it('is unique: the HNF of an HNF is itself, and of row operations on it too', () => {
    expect(toHnf([[3, 0], [1, 1]])).toEqual({ a: 3, b: 1, c: 1 });
    // Honeycomb rows a1 + a2, −a1 + 2a2 (√3 × √3 cell) → [[3, 0], [1, 1]], worked by hand: 3a1 = 2(a1+a2) − (−a1+2a2).
    expect(toHnf([[1, 1], [-1, 2]])).toEqual({ a: 3, b: 1, c: 1 });
    expect(toHnf([[-1, 2], [1, 1]])).toEqual({ a: 3, b: 1, c: 1 });
  });

  it('returns undefined for singular rows', () => {
    expect(toHnf([[1, 2], [2, 4]])).toBeUndefined();
    expect(toHnf([[0, 0], [0, 5]])).toBeUndefined();
    expect(toHnf([[0, 0], [0, 0]])).toBeUndefined();
  });
});

describe('hnfsOfIndex(n)', () => {
  it('lists σ(n) supercells, the number of index-n sublattices of Z² (OEIS A000203)', () => {
    const sigma = [1, 3, 4, 7, 6, 12, 8, 15, 13, 18, 12, 28]; // OEIS A000203, n = 1…12
    sigma.forEach((count, k) => expect(hnfsOfIndex(k + 1)).toHaveLength(count));
  });

  it('gives distinct lattices, each in HNF', () => {
    const list = hnfsOfIndex(12);
    expect(new Set(list.map((h) => `${h.a},${h.b},${h.c}`)).size).toBe(list.length);
    for (const h of list) expect(toHnf([[h.a, 0], [h.b, h.c]])).toEqual(h);
  });
});

describe('reduceSite(h, i, j)', () => {
  it('lands in 0 ≤ i < a, 0 ≤ j < c and differs from (i, j) by a supercell vector', () => {
    fc.assert(fc.property(rowsArb, fc.integer({ min: -1000, max: 1000 }), fc.integer({ min: -1000, max: 1000 }), (rows, i, j) => {
      const h = toHnf(rows)!;
      const [ri, rj] = reduceSite(h, i, j);
      expect(ri >= 0 && ri < h.a && rj >= 0 && rj < h.c).toBe(true);
      expect(isSupercellVector(h, i - ri, j - rj)).toBe(true);
      expect(siteIndex(h, i, j)).toBe(rj * h.a + ri);
    }), { numRuns: 1000 });
  });
});

describe('negative zero', () => {
  // (−2) % 1 is −0 in JavaScript (ECMAScript remainder keeps the dividend's sign); reduced entries must be +0
  // so that deep equality and Object.is treat equal sites as equal.
  it('toHnf([[1, 0], [−2, 1]]) has b = +0, and reduced sites are +0', () => {
    expect(Object.is(toHnf([[1, 0], [-2, 1]])!.b, 0)).toBe(true);
    const [i, j] = reduceSite({ a: 1, b: 0, c: 1 }, -3, -2);
    expect(Object.is(i, 0) && Object.is(j, 0)).toBe(true);
  });
});
