/**
 * Gauss (Lagrange) reduction of a 2D lattice basis — the 2D case of Niggli reduction.
 * Result: |u| ≤ |v| and |u·v| ≤ |u|²/2, so u is a shortest lattice vector and v the shortest independent one;
 * the angle between them lies in [60°, 120°]. We then pick the sign of v with u·v ≤ 0, so the angle lies in
 * [90°, 120°] (120° for a hexagonal cell). The handedness may differ from the input's: det(transform) = ±1 says.
 * Source: the Lagrange–Gauss algorithm, e.g. Nguyen & Stehlé, "Low-dimensional lattice basis reduction
 * revisited", ACM Trans. Algorithms 5, 46 (2009).
 */
import type { Vec2 } from './sheet.ts';

export interface ReducedBasis {
  /** Shortest lattice vector. */
  readonly u: Vec2;
  /** Shortest lattice vector independent of u, with u·v ≤ 0. */
  readonly v: Vec2;
  /** Integer rows expressing (u, v) in the input basis (a, b): u = m00·a + m01·b, v = m10·a + m11·b. */
  readonly transform: [number, number, number, number];
}

const dot = (p: Vec2, q: Vec2) => p[0] * q[0] + p[1] * q[1];

export function gaussReduce(a: Vec2, b: Vec2): ReducedBasis {
  let u: Vec2 = [a[0], a[1]];
  let v: Vec2 = [b[0], b[1]];
  // Rows of the transform: u = t[0]·a + t[1]·b, v = t[2]·a + t[3]·b.
  let t: [number, number, number, number] = [1, 0, 0, 1];
  if (dot(u, u) > dot(v, v)) {
    [u, v] = [v, u];
    t = [t[2], t[3], t[0], t[1]];
  }
  for (let guard = 0; guard < 10_000; guard++) {
    const m = Math.round(dot(u, v) / dot(u, u));
    v = [v[0] - m * u[0], v[1] - m * u[1]];
    t = [t[0], t[1], t[2] - m * t[0], t[3] - m * t[1]];
    if (dot(v, v) >= dot(u, u) * (1 - 1e-12)) break;
    [u, v] = [v, u];
    t = [t[2], t[3], t[0], t[1]];
  }
  if (dot(u, v) > 0) {
    v = [-v[0], -v[1]];
    t = [t[0], t[1], -t[2], -t[3]];
  }
  return { u, v, transform: t };
}

/** Elongation of a cell: |v| / |u| of its reduced basis (1 for square and hexagonal cells). */
export function elongation(a: Vec2, b: Vec2): number {
  const { u, v } = gaussReduce(a, b);
  return Math.sqrt(dot(v, v) / dot(u, u));
}
