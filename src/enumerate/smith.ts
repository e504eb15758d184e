/**
 * Smith normal form of a 2×2 integer matrix: U·M·V = D = diag(d1, d2) with U, V unimodular, d1, d2 ≥ 0, d1 | d2.
 * For a supercell whose vectors are the columns of M, p ↦ (U·p) mod (d1, d2) is an isomorphism of the quotient
 * Z²/L onto Z_d1 × Z_d2 (U·L = D·V⁻¹·Z² = D·Z²) — the site labels of Hart & Forcade, Phys. Rev. B 77, 224115 (2008).
 * Method: the textbook elimination (pivot on the smallest entry, reduce its row and column, repeat; then fix
 * divisibility by adding the second row to the first), e.g. Newman, "Integral Matrices" (1972), ch. II.
 */
import { multiply, type IntMat2 } from '../lattice/triangular.ts';

/** Result of `smithNormalForm`: `left · m · right = diag(diagonal[0], diagonal[1])`. */
export interface SmithForm {
  /** Invariant factors d1 | d2, both ≥ 0 (d1·d2 = |det m|; d1 = gcd of the entries of m). */
  readonly diagonal: readonly [number, number];
  /** Unimodular row transform U (row-major). */
  readonly left: IntMat2;
  /** Unimodular column transform V (row-major). */
  readonly right: IntMat2;
}

/** Smith normal form of the integer matrix m (row-major [m00, m01, m10, m11]). */
export function smithNormalForm(m: IntMat2): SmithForm {
  // Working copy A = [[p, q], [r, s]]; U and V accumulate the row and column operations.
  let [p, q, r, s] = m;
  let left: IntMat2 = [1, 0, 0, 1];
  let right: IntMat2 = [1, 0, 0, 1];
  const rowOp = (e: IntMat2) => {
    [p, q, r, s] = multiply(e, [p, q, r, s]);
    left = multiply(e, left);
  };
  const colOp = (e: IntMat2) => {
    [p, q, r, s] = multiply([p, q, r, s], e);
    right = multiply(right, e);
  };
  for (let guard = 0; guard < 10_000; guard++) {
    if (p === 0 && q === 0 && r === 0 && s === 0) break;
    // Pivot: the entry of smallest non-zero magnitude goes to the top left.
    const entries = [p, q, r, s];
    let best = -1;
    for (let e = 0; e < 4; e++) {
      if (entries[e] !== 0 && (best < 0 || Math.abs(entries[e]) < Math.abs(entries[best]))) best = e;
    }
    if (best >= 2) rowOp([0, 1, 1, 0]);
    if (best % 2 === 1) colOp([0, 1, 1, 0]);
    // Reduce the rest of the first column and first row by the pivot; remainders are smaller than it.
    if (r !== 0) rowOp([1, 0, -Math.trunc(r / p), 1]);
    if (q !== 0) colOp([1, -Math.trunc(q / p), 0, 1]);
    if (r !== 0 || q !== 0) continue;
    if (s % p !== 0) {
      rowOp([1, 1, 0, 1]); // bring s into the first row; the next pivot is gcd-smaller
      continue;
    }
    break;
  }
  if (p < 0) rowOp([-1, 0, 0, 1]);
  if (s < 0) rowOp([1, 0, 0, -1]);
  return { diagonal: [p, s], left, right };
}
