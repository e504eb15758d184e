import { describe, expect, it } from 'vitest';
import { latticeOfVectors, periodLattice, primitivePattern } from '../../src/enumerate/period.ts';
import { makePattern } from '../../src/lattice/pattern.ts';

describe('latticeOfVectors(vectors)', () => {
  it('gives the HNF of the spanned lattice (hand calculation)', () => {
    // 4Z² with (2, 2): index 16/2 = 8; (4, 0) and (2, 2) span it.
    expect(latticeOfVectors([[4, 0], [0, 4], [2, 2]])).toEqual({ a: 4, b: 2, c: 2 });
    // 6Z² with (1, 2), an element of order 6: index 6; (3, 0) = 3·(1, 2) − (0, 6) and (1, 2) span it.
    expect(latticeOfVectors([[6, 0], [0, 6], [1, 2]])).toEqual({ a: 3, b: 1, c: 2 });
    expect(latticeOfVectors([[3, 0], [1, 1]])).toEqual({ a: 3, b: 1, c: 1 });
    expect(latticeOfVectors([[2, 4], [3, 6]])).toBeUndefined();
  });

  it('has index |det| for two vectors and contains each generator (Cramer, analytic)', () => {
    const h = latticeOfVectors([[5, 3], [-2, 7]])!;
    expect(h.a * h.c).toBe(41);
  });
});

describe('periodLattice(pattern) and primitivePattern(pattern)', () => {
  it('finds the 3×3 cell of an α pattern drawn in a 6×3 cell', () => {
    const doubled = makePattern({ bond: 1, supercell: [[6, 0], [0, 3]], vacancies: [[0, 0], [3, 0]] });
    expect(periodLattice(doubled)).toEqual({ a: 3, b: 0, c: 3 });
    expect(primitivePattern(doubled).vacancies).toEqual([[0, 0]]);
  });

  it('is the whole lattice for the empty and the fully vacant pattern', () => {
    expect(periodLattice(makePattern({ bond: 1, supercell: [[2, 0], [1, 2]], vacancies: [] }))).toEqual({ a: 1, b: 0, c: 1 });
    const full = makePattern({ bond: 1, supercell: [[2, 0], [0, 1]], vacancies: [[0, 0], [1, 0]] });
    expect(periodLattice(full)).toEqual({ a: 1, b: 0, c: 1 });
  });

  it('keeps a primitive pattern unchanged', () => {
    const beta = makePattern({ bond: 1, supercell: [[3, 0], [-1, 2]], vacancies: [[0, 0]] });
    expect(periodLattice(beta)).toEqual(beta.supercell);
  });
});
