/**
 * Supercells of index N up to the 12 operations of 6mm (Hart & Forcade, Phys. Rev. B 77, 224115 (2008), §III).
 * An operation O maps the supercell lattice L onto O·L, whose rows are rows·Oᵀ; two HNFs are equivalent when
 * one is the image of the other. Each class is represented by its first member in `hnfsOfIndex` order
 * (a ascending, then b ascending) — the same choice `canonicalForm` makes.
 */
import { hnfsOfIndex, isSupercellVector, toHnf, type Hnf } from '../lattice/hnf.ts';
import { apply, POINT_GROUP_6MM, type IntMat2 } from '../lattice/triangular.ts';

/** The HNF of O·L for the operation O (column action on lattice points, so rows·Oᵀ). */
export function transformSupercell(op: IntMat2, h: Hnf): Hnf {
  const first = apply(op, h.a, 0);
  const second = apply(op, h.b, h.c);
  return toHnf([first, second]) as Hnf; // O is unimodular, so the image is never singular
}

/** Orders HNFs of one index as `hnfsOfIndex` lists them. */
export function compareHnf(x: Hnf, y: Hnf): number {
  return x.a - y.a || x.b - y.b || x.c - y.c;
}

/** Indices into POINT_GROUP_6MM of the operations with O·L = L (identity first, ascending). */
export function stabiliser(h: Hnf): number[] {
  const ops: number[] = [];
  POINT_GROUP_6MM.forEach((op, index) => {
    const [i1, j1] = apply(op, h.a, 0);
    const [i2, j2] = apply(op, h.b, h.c);
    if (isSupercellVector(h, i1, j1) && isSupercellVector(h, i2, j2)) ops.push(index);
  });
  return ops;
}

/** True when h is the first member of its class under 6mm. */
export function isClassRepresentative(h: Hnf): boolean {
  return POINT_GROUP_6MM.every((op) => compareHnf(transformSupercell(op, h), h) >= 0);
}

/**
 * One HNF per class of index-n supercells under 6mm, in `hnfsOfIndex` order.
 * Their number is OEIS A003051 (inequivalent sublattices of index n of the hexagonal lattice).
 */
export function inequivalentSupercells(n: number): Hnf[] {
  return hnfsOfIndex(n).filter(isClassRepresentative);
}
