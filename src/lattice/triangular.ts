/**
 * The triangular lattice of boron sites and its point group 6mm.
 *
 * Basis (DESIGN.md conventions): a1 = d·(1, 0), a2 = d·(1/2, √3/2), d the nearest-neighbour distance.
 * Lattice points are integer pairs (i, j) meaning i·a1 + j·a2.
 * Integer 2×2 matrices are row-major tuples [m00, m01, m10, m11] acting on column vectors (i, j).
 */

/** Integer 2×2 matrix, row-major [m00, m01, m10, m11], acting on column vectors (i, j). */
export type IntMat2 = readonly [number, number, number, number];

export const SQRT3 = Math.sqrt(3);

/** Cartesian position (Å) of lattice point (i, j) for bond length d. */
export function latticePoint(i: number, j: number, bond: number): [number, number] {
  return [bond * (i + 0.5 * j), bond * (0.5 * SQRT3 * j)];
}

/** The six nearest-neighbour steps of the triangular lattice, counter-clockwise from a1. */
export const NEAREST_STEPS: readonly (readonly [number, number])[] = [
  [1, 0], [0, 1], [-1, 1], [-1, 0], [0, -1], [1, -1],
];

/** Rotation by +60°: a1 → a2, a2 → a2 − a1. */
const ROTATE_60: IntMat2 = [0, -1, 1, 1];
/** Mirror across the a1 (x) axis: a1 → a1, a2 → a1 − a2. */
const MIRROR_X: IntMat2 = [1, 1, 0, -1];

export function multiply(p: IntMat2, q: IntMat2): IntMat2 {
  // `+ 0` keeps −0 (from (−1)·0 + (−0)) out of the integer tables.
  return [
    p[0] * q[0] + p[1] * q[2] + 0, p[0] * q[1] + p[1] * q[3] + 0,
    p[2] * q[0] + p[3] * q[2] + 0, p[2] * q[1] + p[3] * q[3] + 0,
  ];
}

export function determinant(m: IntMat2): number {
  return m[0] * m[3] - m[1] * m[2];
}

/** Applies m to the lattice point (i, j). */
export function apply(m: IntMat2, i: number, j: number): [number, number] {
  return [m[0] * i + m[1] * j, m[2] * i + m[3] * j];
}

function buildPointGroup(): IntMat2[] {
  const ops: IntMat2[] = [];
  let rotation: IntMat2 = [1, 0, 0, 1];
  for (let n = 0; n < 6; n++) {
    ops.push(rotation);
    rotation = multiply(ROTATE_60, rotation);
  }
  for (let n = 0; n < 6; n++) ops.push(multiply(ops[n], MIRROR_X));
  return ops;
}

/**
 * The 12 operations of 6mm in lattice coordinates: the six rotations by n·60° (indices 0–5),
 * then the six mirrors R^n·M (indices 6–11). Index 0 is the identity.
 */
export const POINT_GROUP_6MM: readonly IntMat2[] = buildPointGroup();
