/**
 * Hole density of an explicit sheet, estimated: η = 1 − atoms·(area per site)/(cell area), with the area per site
 * (√3/2)·d² of the triangular lattice at the sheet's mean nearest-neighbour distance d (the mean over atoms of the
 * distance to the closest other atom or image). Exact for sheets cut from a triangular lattice without strain; an
 * estimate otherwise, and said to be one. Patterns give η exactly (src/lattice/pattern.ts `holeDensity`).
 */
import { neighbours } from '../lattice/neighbours.ts';
import { signedArea, type Sheet } from '../lattice/sheet.ts';

/** An estimated hole density. */
export interface HoleDensityEstimate {
  holeDensity: number;
  /** Always true: computed from the geometry, not from a vacancy pattern. */
  estimated: true;
  /** Mean nearest-neighbour distance used (Å). */
  nearestNeighbour: number;
}

/** The estimated hole density of an explicit sheet. */
export function estimateHoleDensity(sheet: Sheet): HoleDensityEstimate {
  const area = Math.abs(signedArea(sheet.cell));
  const n = sheet.atoms.length;
  // With n atoms in the cell, some neighbour lies within the radius of a disc of area 4·area/n around every atom.
  let radius = Math.max(1, 2 * Math.sqrt((4 * area) / (Math.PI * n)));
  let list = neighbours(sheet, radius);
  while (!Array.from({ length: n }, (_, i) => list.from.includes(i)).every(Boolean)) {
    radius *= 2;
    list = neighbours(sheet, radius);
  }
  const closest = new Float64Array(n).fill(Infinity);
  for (let e = 0; e < list.count; e++) closest[list.from[e]] = Math.min(closest[list.from[e]], list.distance[e]);
  const d = closest.reduce((s, x) => s + x, 0) / n;
  const perSite = (Math.sqrt(3) / 2) * d * d;
  return { holeDensity: 1 - (n * perSite) / area, estimated: true, nearestNeighbour: d };
}
