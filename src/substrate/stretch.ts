/**
 * Principal stretches and rotation of a 2D linear map F = [[a, b], [c, d]] (acting on column vectors), by the
 * closed-form 2×2 singular value decomposition: with E = (a + d)/2, F' = (a − d)/2, G = (c + b)/2, H = (c − b)/2,
 * Q = √(E² + H²), R = √(F'² + G²), the singular values are Q + R and |Q − R|, and for det F > 0 the rotation of
 * the polar decomposition F = R_θ·P is θ = atan2(H, E) (e.g. Blinn, "Consider the lowly 2×2 matrix", IEEE CG&A
 * 16 (1996); the polar angle follows from F + cof(F)ᵀ ∝ R_θ, analytic).
 */

export interface Stretch {
  /** Larger and smaller principal stretch (singular values). */
  major: number;
  minor: number;
  /** Rotation θ (radians, counter-clockwise) of the polar decomposition F = R_θ·P; meaningful when det F > 0. */
  rotation: number;
  /** max |stretch − 1|: the strain of the DESIGN.md `fit` contract. */
  strain: number;
}

export function principalStretch(a: number, b: number, c: number, d: number): Stretch {
  const e = 0.5 * (a + d);
  const f = 0.5 * (a - d);
  const g = 0.5 * (c + b);
  const h = 0.5 * (c - b);
  const q = Math.hypot(e, h);
  const r = Math.hypot(f, g);
  const major = q + r;
  const minor = Math.abs(q - r);
  return { major, minor, rotation: Math.atan2(h, e), strain: Math.max(Math.abs(major - 1), Math.abs(minor - 1)) };
}
