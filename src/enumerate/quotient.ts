/**
 * The sites of one supercell as the quotient group Z²/L, with the tables the labeling search reads.
 *
 * Layout (all Int32Array, n = a·c sites; a site is its HNF index s = j·a + i of the reduced point (i, j)):
 * - `groupOfSite[s]` = g1·d2 + g2, the Smith label (g1, g2) ∈ Z_d1 × Z_d2 of site s; `siteOfGroup` its inverse;
 * - `difference[x·n + y]` = the site of x − y (the group operation, so translations are table look-ups);
 * - `permutation[o·n + s]` = the site of O_o·s for the o-th operation of the stabiliser (o = 0 is the identity);
 *   each is a group automorphism (a rotation or mirror about the origin fixes site 0);
 * - `neighbour[s·6 + t]` = the site of s + NEAREST_STEPS[t].
 * Built once per supercell, O(n²) memory; after Hart & Forcade, Phys. Rev. B 77, 224115 (2008), §IV.
 */
import { isSupercellVector, mod, type Hnf } from '../lattice/hnf.ts';
import { apply, NEAREST_STEPS, POINT_GROUP_6MM } from '../lattice/triangular.ts';
import { smithNormalForm } from './smith.ts';
import { stabiliser } from './supercells.ts';

/** Precomputed group tables of one supercell (layout in the module comment). */
export interface SupercellQuotient {
  readonly supercell: Hnf;
  /** Number of sites n = a·c. */
  readonly sites: number;
  /** Invariant factors (d1, d2) of the supercell matrix: Z²/L ≅ Z_d1 × Z_d2. */
  readonly factors: readonly [number, number];
  /** Indices into POINT_GROUP_6MM of the stabiliser, identity first. */
  readonly operations: readonly number[];
  readonly groupOfSite: Int32Array;
  readonly siteOfGroup: Int32Array;
  readonly difference: Int32Array;
  readonly permutation: Int32Array;
  readonly neighbour: Int32Array;
  /** True when a nearest-neighbour step is a supercell vector, so every hole neighbours its own image. */
  readonly selfNeighbour: boolean;
}

export function buildQuotient(h: Hnf): SupercellQuotient {
  const n = h.a * h.c;
  // Columns of the supercell matrix are its vectors (a, 0) and (b, c).
  const { diagonal, left } = smithNormalForm([h.a, h.b, 0, h.c]);
  const [d1, d2] = diagonal;
  const [u00, u01, u10, u11] = left;
  const label = (i: number, j: number) => mod(u00 * i + u01 * j, d1) * d2 + mod(u10 * i + u11 * j, d2);

  const groupOfSite = new Int32Array(n);
  const siteOfGroup = new Int32Array(n);
  for (let s = 0; s < n; s++) {
    const g = label(s % h.a, Math.floor(s / h.a));
    groupOfSite[s] = g;
    siteOfGroup[g] = s;
  }
  const difference = new Int32Array(n * n);
  for (let x = 0; x < n; x++) {
    const gx = groupOfSite[x];
    for (let y = 0; y < n; y++) {
      const gy = groupOfSite[y];
      const g1 = mod(Math.floor(gx / d2) - Math.floor(gy / d2), d1);
      const g2 = mod((gx % d2) - (gy % d2), d2);
      difference[x * n + y] = siteOfGroup[g1 * d2 + g2];
    }
  }
  const operations = stabiliser(h);
  const permutation = new Int32Array(operations.length * n);
  operations.forEach((opIndex, o) => {
    const op = POINT_GROUP_6MM[opIndex];
    for (let s = 0; s < n; s++) {
      const [i, j] = apply(op, s % h.a, Math.floor(s / h.a));
      permutation[o * n + s] = siteOfGroup[label(i, j)];
    }
  });
  const neighbour = new Int32Array(n * 6);
  for (let s = 0; s < n; s++) {
    NEAREST_STEPS.forEach(([di, dj], t) => {
      neighbour[s * 6 + t] = siteOfGroup[label((s % h.a) + di, Math.floor(s / h.a) + dj)];
    });
  }
  const selfNeighbour = NEAREST_STEPS.some(([di, dj]) => isSupercellVector(h, di, dj));
  return {
    supercell: h, sites: n, factors: [d1, d2], operations,
    groupOfSite, siteOfGroup, difference, permutation, neighbour, selfNeighbour,
  };
}
