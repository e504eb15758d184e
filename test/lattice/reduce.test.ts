import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { elongation, gaussReduce } from '../../src/lattice/reduce.ts';
import type { Vec2 } from '../../src/lattice/sheet.ts';

const dot = (p: Vec2, q: Vec2) => p[0] * q[0] + p[1] * q[1];

describe('gaussReduce(a, b) on hand-worked examples', () => {
  it('(1, 0), (5, 1) → (1, 0), (0, 1): one subtraction of 5a', () => {
    const r = gaussReduce([1, 0], [5, 1]);
    expect(r.u).toEqual([1, 0]);
    expect(r.v).toEqual([0, 1]);
    expect(r.transform).toEqual([1, 0, -5, 1]);
  });

  it('(1, 0), (7.5, √3/2) → the hexagonal pair at 120°: v = b − 8a = (−1/2, √3/2)', () => {
    const r = gaussReduce([1, 0], [7.5, Math.sqrt(3) / 2]);
    expect(r.v[0]).toBeCloseTo(-0.5, 12);
    expect(r.v[1]).toBeCloseTo(Math.sqrt(3) / 2, 12);
    expect(r.transform).toEqual([1, 0, -8, 1]);
    expect(elongation([1, 0], [7.5, Math.sqrt(3) / 2])).toBeCloseTo(1, 12);
  });

  it('(4, 1), (7, 2) (det 1, so Z²) → (−1, 0), (0, 1) via transform [−2, 1, −7, 4]', () => {
    // By hand: v = b − 2a = (−1, 0), swap; v = (4, 1) + 4·(−1, 0) = (0, 1); u = −2a + b, v = −7a + 4b.
    const r = gaussReduce([4, 1], [7, 2]);
    expect(r.u.map((x) => x + 0)).toEqual([-1, 0]);
    expect(r.v.map((x) => x + 0)).toEqual([0, 1]);
    expect(r.transform).toEqual([-2, 1, -7, 4]);
  });

  it('(0, 10), (1, 0): the shorter vector comes first', () => {
    const r = gaussReduce([0, 10], [1, 0]);
    expect(r.u).toEqual([1, 0]);
    expect(r.v).toEqual([0, 10]);
    expect(r.transform).toEqual([0, 1, 1, 0]);
  });
});

// A random lattice with a nice basis (e1, e2), given through a random unimodular change of basis.
const vec = fc.tuple(fc.double({ min: -5, max: 5, noNaN: true }), fc.double({ min: -5, max: 5, noNaN: true }));
const basisArb = fc.record({ e1: vec, e2: vec, k: fc.integer({ min: -6, max: 6 }), l: fc.integer({ min: -6, max: 6 }) })
  .filter(({ e1, e2 }) => Math.hypot(...e1) > 1 && Math.hypot(...e2) > 1
    && Math.abs(e1[0] * e2[1] - e1[1] * e2[0]) > 0.5 * Math.hypot(...e1) * Math.hypot(...e2))
  .map(({ e1, e2, k, l }) => {
    // a = e1 + k·e2, b = l·a + e2: det of [[1, k], [l, kl + 1]] is 1.
    const a: Vec2 = [e1[0] + k * e2[0], e1[1] + k * e2[1]];
    const b: Vec2 = [l * a[0] + e2[0], l * a[1] + e2[1]];
    return { e1, e2, a, b };
  });

/**
 * Shortest and second-shortest independent lattice vectors by brute force over m·e1 + n·e2, |m|, |n| ≤ R:
 * a vector of length ≤ L has |m| ≤ L·|e2|/area (dual norm), L = max(|e1|, |e2|).
 */
function bruteForce(e1: Vec2, e2: Vec2): [number, number] {
  const area = Math.abs(e1[0] * e2[1] - e1[1] * e2[0]);
  const longest = Math.max(Math.hypot(...e1), Math.hypot(...e2));
  const range = Math.ceil((longest * longest) / area) + 1;
  const each = (visit: (p: Vec2) => void) => {
    for (let m = -range; m <= range; m++) for (let n = -range; n <= range; n++) {
      if (m !== 0 || n !== 0) visit([m * e1[0] + n * e2[0], m * e1[1] + n * e2[1]]);
    }
  };
  let first: Vec2 = e1;
  each((p) => { if (dot(p, p) < dot(first, first)) first = p; });
  let second = Infinity;
  each((p) => { if (Math.abs(p[0] * first[1] - p[1] * first[0]) > 1e-9 * area) second = Math.min(second, dot(p, p)); });
  return [Math.hypot(...first), Math.sqrt(second)];
}

describe('gaussReduce(a, b) invariants (Lagrange–Gauss reduction, Nguyen & Stehlé 2009)', () => {
  it('|u| ≤ |v|, |u·v| ≤ |u|²/2, u·v ≤ 0, |det T| = 1, (u, v) = T(a, b), shortest vectors by brute force', () => {
    fc.assert(fc.property(basisArb, ({ e1, e2, a, b }) => {
      const { u, v, transform: [m00, m01, m10, m11] } = gaussReduce(a, b);
      const scale = Math.max(dot(a, a), dot(b, b));
      expect(dot(u, u)).toBeLessThanOrEqual(dot(v, v) * (1 + 1e-9));
      expect(Math.abs(dot(u, v))).toBeLessThanOrEqual(dot(u, u) / 2 + 1e-9 * scale);
      expect(dot(u, v)).toBeLessThanOrEqual(1e-9 * scale);
      expect(Math.abs(m00 * m11 - m01 * m10)).toBe(1);
      expect(Math.hypot(m00 * a[0] + m01 * b[0] - u[0], m00 * a[1] + m01 * b[1] - u[1])).toBeLessThan(1e-8 * Math.sqrt(scale));
      expect(Math.hypot(m10 * a[0] + m11 * b[0] - v[0], m10 * a[1] + m11 * b[1] - v[1])).toBeLessThan(1e-8 * Math.sqrt(scale));
      const [shortest, second] = bruteForce(e1, e2);
      expect(Math.hypot(...u)).toBeCloseTo(shortest, 8);
      expect(Math.hypot(...v)).toBeCloseTo(second, 8);
    }), { numRuns: 300 });
  });
});
