import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { smithNormalForm } from '../../src/enumerate/smith.ts';
import { determinant, multiply, type IntMat2 } from '../../src/lattice/triangular.ts';

function gcd(x: number, y: number): number {
  x = Math.abs(x);
  y = Math.abs(y);
  while (y) [x, y] = [y, x % y];
  return x;
}

const matrixArb = fc
  .tuple(fc.integer({ min: -40, max: 40 }), fc.integer({ min: -40, max: 40 }), fc.integer({ min: -40, max: 40 }), fc.integer({ min: -40, max: 40 }))
  .map((m) => m as unknown as IntMat2);

describe('smithNormalForm(m)', () => {
  it('gives U·m·V = diag(d1, d2) with U, V unimodular and d1 | d2 (definition of the Smith normal form)', () => {
    fc.assert(fc.property(matrixArb, (m) => {
      const { diagonal: [d1, d2], left, right } = smithNormalForm(m);
      expect(multiply(multiply(left, m), right).map((x) => x + 0)).toEqual([d1, 0, 0, d2]);
      expect(Math.abs(determinant(left))).toBe(1);
      expect(Math.abs(determinant(right))).toBe(1);
      expect(d1).toBeGreaterThanOrEqual(0);
      expect(d2).toBeGreaterThanOrEqual(0);
      if (d1 !== 0) expect(d2 % d1).toBe(0);
      else expect(d2).toBe(0);
    }), { numRuns: 2000 });
  });

  it('has d1 = gcd of the entries and d1·d2 = |det m| (determinantal divisors; Smith, Phil. Trans. R. Soc. 151, 293 (1861))', () => {
    fc.assert(fc.property(matrixArb, (m) => {
      const { diagonal: [d1, d2] } = smithNormalForm(m);
      expect(d1).toBe(gcd(gcd(m[0], m[1]), gcd(m[2], m[3])));
      expect(d1 * d2).toBe(Math.abs(determinant(m)));
    }), { numRuns: 2000 });
  });

  it('worked examples: diag(2, 3) → (1, 6); [[2, 4], [6, 8]] → (2, 4); the zero matrix → (0, 0) (hand calculation)', () => {
    expect(smithNormalForm([2, 0, 0, 3]).diagonal).toEqual([1, 6]);
    expect(smithNormalForm([2, 4, 6, 8]).diagonal).toEqual([2, 4]);
    expect(smithNormalForm([0, 0, 0, 0]).diagonal).toEqual([0, 0]);
  });
});
