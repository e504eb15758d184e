import { describe, expect, it } from 'vitest';
import { gaussReduce } from '../../src/lattice/reduce.ts';
import type { Vec2 } from '../../src/lattice/sheet.ts';
import { CELL_TOLERANCE, correspondences, sublattices } from '../../src/stm/correspondence.ts';

const hexagonal: [Vec2, Vec2] = [[5, 0], [-2.5, 2.5 * Math.sqrt(3)]];
const area = (c: [Vec2, Vec2]) => Math.abs(c[0][0] * c[1][1] - c[0][1] * c[1][0]);

describe('sublattices(cell, maxIndex)', () => {
  it('there are σ(n) sublattices of index n of a 2D lattice: 1, 3, 4, 7 (sum of divisors, OEIS A000203)', () => {
    const list = sublattices(hexagonal, 4);
    expect([1, 2, 3, 4].map((n) => list.filter((s) => s.index === n).length)).toEqual([1, 3, 4, 7]);
    for (const s of list) expect(area(s.vectors) / area(hexagonal)).toBeCloseTo(s.index, 10);
  });
});

describe('correspondences(candidate, measured, tolerance)', () => {
  it('a hexagonal cell fits itself rotated, mirrored and 5 % larger, in all 12 choices of its reduced vectors (the 12 operations of 6mm)', () => {
    const angle = 0.4, s = 1.05;
    const turn = ([x, y]: Vec2): Vec2 => [s * (Math.cos(angle) * x - Math.sin(angle) * y), s * (Math.sin(angle) * x + Math.cos(angle) * y)];
    const measured: [Vec2, Vec2] = [turn(hexagonal[0]), turn(hexagonal[1])];
    const fits = correspondences(hexagonal, measured, CELL_TOLERANCE);
    expect(fits).toHaveLength(12);
    for (const f of fits) expect(f.scale).toBeCloseTo(1.05, 10);
  });

  it('refuses a scale outside the tolerance and a cell of another shape', () => {
    const big: [Vec2, Vec2] = [[5.6, 0], [-2.8, 2.8 * Math.sqrt(3)]];
    expect(correspondences(hexagonal, big, CELL_TOLERANCE)).toHaveLength(0);
    const r = gaussReduce([5, 0], [0, 5 * Math.sqrt(3) / 2 * 1.0]);
    expect(correspondences(hexagonal, [r.u, r.v], CELL_TOLERANCE)).toHaveLength(0);
  });
});
