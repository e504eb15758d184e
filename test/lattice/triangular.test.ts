import { describe, expect, it } from 'vitest';
import {
  apply, determinant, latticePoint, multiply, NEAREST_STEPS, POINT_GROUP_6MM, SQRT3,
} from '../../src/lattice/triangular.ts';

// Gram matrix of (a1, a2) for d = 1: a1·a1 = a2·a2 = 1, a1·a2 = 1/2 (DESIGN.md basis, analytic).
const gram = (i1: number, j1: number, i2: number, j2: number) => i1 * i2 + j1 * j2 + 0.5 * (i1 * j2 + j1 * i2);

describe('POINT_GROUP_6MM', () => {
  it('has 12 distinct operations, identity first, closed under products (a group of order 12: 6mm)', () => {
    // Order 12 with 6 rotations and 6 mirrors: International Tables for Crystallography Vol. A, plane group p6mm (from memory).
    const keys = new Set(POINT_GROUP_6MM.map((m) => m.join(',')));
    expect(keys.size).toBe(12);
    expect(POINT_GROUP_6MM[0]).toEqual([1, 0, 0, 1]);
    for (const p of POINT_GROUP_6MM) for (const q of POINT_GROUP_6MM) expect(keys.has(multiply(p, q).join(','))).toBe(true);
  });

  it('indices 0–5 are rotations (det 1), 6–11 mirrors (det −1, order 2)', () => {
    POINT_GROUP_6MM.forEach((m, k) => {
      expect(determinant(m)).toBe(k < 6 ? 1 : -1);
      if (k >= 6) expect(multiply(m, m).map((x) => x + 0)).toEqual([1, 0, 0, 1]);
    });
  });

  it('every operation is an isometry of the lattice: it preserves a1·a1, a1·a2, a2·a2 (analytic)', () => {
    for (const m of POINT_GROUP_6MM) {
      const e1 = apply(m, 1, 0), e2 = apply(m, 0, 1);
      expect(gram(...e1, ...e1)).toBe(1);
      expect(gram(...e2, ...e2)).toBe(1);
      expect(gram(...e1, ...e2)).toBe(0.5);
    }
  });

  it('rotation n is by n·60°: it maps a1 to NEAREST_STEPS[n]', () => {
    for (let n = 0; n < 6; n++) expect(apply(POINT_GROUP_6MM[n], 1, 0)).toEqual(NEAREST_STEPS[n]);
  });
});

describe('latticePoint(i, j, d)', () => {
  it('puts the six nearest steps at distance d, 60° apart (analytic)', () => {
    NEAREST_STEPS.forEach(([i, j], n) => {
      const [x, y] = latticePoint(i, j, 1.69);
      expect(Math.hypot(x, y)).toBeCloseTo(1.69, 12);
      expect(x / 1.69).toBeCloseTo(Math.cos((n * Math.PI) / 3), 12);
      expect(y / 1.69).toBeCloseTo(Math.sin((n * Math.PI) / 3), 12);
    });
  });

  it('a2 = d·(1/2, √3/2)', () => {
    expect(latticePoint(0, 1, 2)).toEqual([1, SQRT3]);
  });
});
