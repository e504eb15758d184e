/**
 * The lower convex hull of energy per lattice site e against hole density η, the distance of any point above it,
 * and the boron chemical potential over which each hull pattern is the stable one.
 *
 * With μ the chemical potential of boron (eV per atom) and a vacancy costing nothing, a pattern minimises the grand
 * energy per site ω = e − μ(1 − η); on the hull, vertex v is the minimum for −s_right ≤ μ ≤ −s_left, s the slopes
 * de/dη of the facets on either side (unbounded at the ends of the hull). Adding any line a + bη to every e
 * (the empty and point terms of the expansion, or another energy reference) moves μ by −b and leaves which
 * patterns lie on the hull, and how far above it the others lie, unchanged.
 */

/** Points closer than this (eV per site) to a facet count as on it (a point on a facet is not a vertex). */
export const HULL_TOLERANCE = 1e-9;

export interface HullVertex {
  /** Index of the point in the input. */
  index: number;
  eta: number;
  energy: number;
  /** Boron chemical potential range (eV per B atom) over which this vertex is stable; ±Infinity when open. */
  muLow: number;
  muHigh: number;
}

/** Indices of the lower hull's vertices (ascending η) of points (eta[i], energy[i]); at equal η the lowest counts. */
export function lowerHull(eta: ArrayLike<number>, energy: ArrayLike<number>): HullVertex[] {
  const order = Array.from({ length: eta.length }, (_, i) => i).filter((i) => Number.isFinite(eta[i]) && Number.isFinite(energy[i]));
  order.sort((p, q) => eta[p] - eta[q] || energy[p] - energy[q]);
  const chain: number[] = [];
  for (const i of order) {
    if (chain.length > 0 && eta[chain[chain.length - 1]] === eta[i]) continue; // higher at the same η
    // Andrew's monotone chain: drop the last vertex while it does not lie strictly below the segment to i.
    while (chain.length >= 2) {
      const o = chain[chain.length - 2];
      const a = chain[chain.length - 1];
      const onSegment = energy[o] + ((energy[i] - energy[o]) * (eta[a] - eta[o])) / (eta[i] - eta[o]);
      if (energy[a] < onSegment - HULL_TOLERANCE) break;
      chain.pop();
    }
    chain.push(i);
  }
  return chain.map((index, v) => {
    const left = v > 0 ? slope(chain[v - 1], index) : -Infinity;
    const right = v < chain.length - 1 ? slope(index, chain[v + 1]) : Infinity;
    return { index, eta: eta[index], energy: energy[index], muLow: -right, muHigh: -left };
  });

  function slope(p: number, q: number): number {
    return (energy[q] - energy[p]) / (eta[q] - eta[p]);
  }
}

/** The hull's energy at η (linear between vertices); NaN outside the hull's η range or for an empty hull. */
export function hullEnergyAt(hull: readonly HullVertex[], eta: number): number {
  if (hull.length === 0 || !(eta >= hull[0].eta - 1e-12 && eta <= hull[hull.length - 1].eta + 1e-12)) return NaN;
  if (hull.length === 1) return hull[0].energy;
  let v = 1;
  while (v < hull.length - 1 && hull[v].eta < eta) v++;
  const a = hull[v - 1];
  const b = hull[v];
  return a.energy + ((b.energy - a.energy) * (eta - a.eta)) / (b.eta - a.eta);
}

/** e − hull(η): ≥ 0 for the points the hull was built from, negative below it, NaN outside its η range. */
export function aboveHull(hull: readonly HullVertex[], eta: number, energy: number): number {
  return energy - hullEnergyAt(hull, eta);
}
