/**
 * The smallest cell of a vacancy pattern: its lattice of periods P (all t with V + t = V), which contains the
 * supercell lattice L, and the vacancies taken modulo P.
 */
import { reduceSite, toHnf, type Hnf } from '../lattice/hnf.ts';
import type { Pattern } from '../lattice/sheet.ts';

function gcd(x: number, y: number): number {
  x = Math.abs(x);
  y = Math.abs(y);
  while (y !== 0) [x, y] = [y, x % y];
  return x;
}

/**
 * HNF of the lattice spanned by integer vectors (i, j) (at least two independent ones; otherwise undefined).
 * Euclid on the second components folds all vectors into one with j = gcd and the rest with j = 0, whose first
 * components then reduce to their gcd (integer row operations keep the lattice).
 */
export function latticeOfVectors(vectors: readonly (readonly [number, number])[]): Hnf | undefined {
  let pivot: [number, number] | undefined;
  let first = 0;
  for (const [i, j] of vectors) {
    if (j === 0) {
      first = gcd(first, i);
      continue;
    }
    if (!pivot) {
      pivot = [i, j];
      continue;
    }
    let [p, q] = pivot;
    let [r, s] = [i, j];
    while (s !== 0) {
      const t = Math.trunc(q / s);
      [p, q, r, s] = [r, s, p - t * r, q - t * s];
    }
    pivot = [p, q];
    first = gcd(first, r);
  }
  if (!pivot || first === 0) return undefined;
  return toHnf([[first, 0], pivot]);
}

/** Distinct vacant sites of a pattern as reduced points, ascending by HNF index j·a + i. */
export function vacantSites(pattern: Pattern): [number, number][] {
  const h = pattern.supercell;
  const byIndex = new Map<number, [number, number]>();
  for (const [i, j] of pattern.vacancies) {
    const site = reduceSite(h, i, j);
    byIndex.set(site[1] * h.a + site[0], site);
  }
  return [...byIndex.entries()].sort((x, y) => x[0] - y[0]).map((entry) => entry[1]);
}

/** The lattice of periods of a pattern's vacancies (Z² itself when there are none, or all sites are vacant). */
export function periodLattice(pattern: Pattern): Hnf {
  const h = pattern.supercell;
  const sites = vacantSites(pattern);
  const generators: [number, number][] = [[h.a, 0], [h.b, h.c]];
  if (sites.length === 0) return { a: 1, b: 0, c: 1 };
  const occupied = new Set(sites.map(([i, j]) => j * h.a + i));
  const [i0, j0] = sites[0];
  for (const [i, j] of sites) {
    const di = i - i0;
    const dj = j - j0;
    const keeps = sites.every(([x, y]) => {
      const [ri, rj] = reduceSite(h, x + di, y + dj);
      return occupied.has(rj * h.a + ri);
    });
    if (keeps) generators.push([di, dj]);
  }
  return latticeOfVectors(generators) as Hnf; // contains L, so never singular
}

/** The same vacancy pattern on its smallest cell (HNF of the period lattice, vacancies reduced and sorted). */
export function primitivePattern(pattern: Pattern): Pattern {
  const p = periodLattice(pattern);
  const byIndex = new Map<number, [number, number]>();
  for (const [i, j] of pattern.vacancies) {
    const site = reduceSite(p, i, j);
    byIndex.set(site[1] * p.a + site[0], site);
  }
  const vacancies = [...byIndex.entries()].sort((x, y) => x[0] - y[0]).map((entry) => entry[1]);
  const out: Pattern = { bond: pattern.bond, supercell: p, vacancies };
  if (pattern.name !== undefined) out.name = pattern.name;
  return out;
}
