/**
 * Supercells of the triangular lattice in Hermite normal form (HNF).
 *
 * A supercell is given by integer rows in the basis (a1, a2): A1 = a·a1, A2 = b·a1 + c·a2, written
 * [[a, 0], [b, c]] with a, c > 0 and 0 ≤ b < a (DESIGN.md, sheet contract). Its index is N = a·c sites.
 * Any integer rows of non-zero determinant span a lattice with exactly one such form.
 */

/** A supercell in HNF: rows [[a, 0], [b, c]]. */
export interface Hnf {
  readonly a: number;
  readonly b: number;
  readonly c: number;
}

/** x mod m in [0, m); `+ 0` turns −0 (from e.g. −2 % 1) into +0 so that equal sites compare equal. */
export function mod(x: number, m: number): number {
  const r = x % m;
  return r < 0 ? r + m : r + 0;
}

/**
 * Brings integer rows [[p, q], [r, s]] (the vectors p·a1 + q·a2 and r·a1 + s·a2) to HNF by integer row
 * operations (Euclid on the second column, then reduction of b modulo a).
 * Returns undefined when the rows are singular.
 */
export function toHnf(rows: readonly [readonly [number, number], readonly [number, number]]): Hnf | undefined {
  let [p, q] = rows[0];
  let [r, s] = rows[1];
  // Euclid on the second column until the first row's second entry is zero.
  while (q !== 0) {
    const t = Math.trunc(s / q);
    [p, q, r, s] = [r - t * p, s - t * q, p, q];
  }
  if (p === 0 || s === 0) return undefined;
  if (p < 0) p = -p;
  if (s < 0) {
    s = -s;
    r = -r;
  }
  return { a: p, b: mod(r, p), c: s };
}

/** All HNF supercells of index n, ordered by a ascending then b ascending. There are σ(n) of them. */
export function hnfsOfIndex(n: number): Hnf[] {
  const out: Hnf[] = [];
  for (let a = 1; a <= n; a++) {
    if (n % a !== 0) continue;
    const c = n / a;
    for (let b = 0; b < a; b++) out.push({ a, b, c });
  }
  return out;
}

/** Reduces the lattice point (i, j) into the supercell's canonical cell 0 ≤ i < a, 0 ≤ j < c. */
export function reduceSite(h: Hnf, i: number, j: number): [number, number] {
  const n2 = Math.floor(j / h.c);
  const i1 = i - n2 * h.b;
  return [mod(i1, h.a), j - n2 * h.c];
}

/** Index of a reduced site (0 ≤ i < a, 0 ≤ j < c) in the order j·a + i. */
export function siteIndex(h: Hnf, i: number, j: number): number {
  const [ri, rj] = reduceSite(h, i, j);
  return rj * h.a + ri;
}

/** True when the lattice point (i, j) is a lattice vector of the supercell. */
export function isSupercellVector(h: Hnf, i: number, j: number): boolean {
  const [ri, rj] = reduceSite(h, i, j);
  return ri === 0 && rj === 0;
}
