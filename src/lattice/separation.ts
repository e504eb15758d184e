/**
 * Shortest distances between the atoms of a periodic sheet, periodic images included.
 *
 * Method: in a Gauss-reduced basis (u, v) of the cell, a displacement with reduced coordinates (x, y), each
 * wrapped to [−½, ½], has its nearest image among the nine (x + n1, y + n2), n1, n2 ∈ {−1, 0, 1}.
 * Why: |u·v| ≤ |u|²/2 and |u| ≤ |v| give |X·u + Y·v|² ≥ ¾·Y²·|v|², so |Y| ≥ 3/2 is longer than the wrapped
 * candidate (≤ |v|); for fixed Y the best X lies within ½ of −Y·(u·v)/|u|², so |X| ≤ 5/4.
 * An atom's own images are at least |u| away (u is a shortest lattice vector).
 * Cost: N(N−1)/2 pairs × 9 images, no allocation in the loop.
 *
 * Layout: Cartesian positions in one Float64Array [x0, y0, z0, x1, y1, z1, …] (Å).
 */
import { gaussReduce } from './reduce.ts';
import type { Sheet } from './sheet.ts';

/** The closest pair of atoms of a sheet. */
export interface Separation {
  /** Shortest distance between two atoms or an atom and an image of itself, Å. */
  readonly distance: number;
  /** Index of the atom the shortest vector starts from. */
  readonly from: number;
  /** Index of the atom (possibly `from` itself) whose image ends the shortest vector. */
  readonly to: number;
  /** Vector from atom `from` to the nearest image of atom `to`, Å. */
  readonly vector: readonly [number, number, number];
}

/** Options of the separation scans. */
export interface SeparationOptions {
  /** Measure in-plane distances only (ignore z). Default false. */
  readonly inPlane?: boolean;
}

function positionsOf(sheet: Sheet, inPlane: boolean): Float64Array {
  const [[ax, ay], [bx, by]] = sheet.cell;
  const out = new Float64Array(3 * sheet.atoms.length);
  sheet.atoms.forEach(([f1, f2, z], k) => {
    out[3 * k] = f1 * ax + f2 * bx;
    out[3 * k + 1] = f1 * ay + f2 * by;
    out[3 * k + 2] = inPlane ? 0 : z;
  });
  return out;
}

/**
 * Scans all pairs; writes each atom's nearest distance into `perAtom` when given; returns the closest pair.
 * A sheet without atoms gives distance Infinity and from = to = −1.
 */
function scan(sheet: Sheet, inPlane: boolean, perAtom?: Float64Array): Separation {
  const n = sheet.atoms.length;
  if (n === 0) return { distance: Infinity, from: -1, to: -1, vector: [0, 0, 0] };
  const { u, v } = gaussReduce(sheet.cell[0], sheet.cell[1]);
  const det = u[0] * v[1] - u[1] * v[0];
  const positions = positionsOf(sheet, inPlane);
  const self2 = u[0] * u[0] + u[1] * u[1];
  let best2 = self2, bestFrom = 0, bestTo = 0, bestX = u[0], bestY = u[1], bestZ = 0;
  if (perAtom) perAtom.fill(Math.sqrt(self2));
  for (let i = 0; i < n; i++) {
    const xi = positions[3 * i], yi = positions[3 * i + 1], zi = positions[3 * i + 2];
    for (let j = i + 1; j < n; j++) {
      const dx = positions[3 * j] - xi, dy = positions[3 * j + 1] - yi, dz = positions[3 * j + 2] - zi;
      let p = (dx * v[1] - dy * v[0]) / det;
      let q = (u[0] * dy - u[1] * dx) / det;
      p -= Math.round(p);
      q -= Math.round(q);
      let pair2 = Infinity, pairX = 0, pairY = 0;
      for (let n1 = -1; n1 <= 1; n1++) {
        for (let n2 = -1; n2 <= 1; n2++) {
          const x = (p + n1) * u[0] + (q + n2) * v[0];
          const y = (p + n1) * u[1] + (q + n2) * v[1];
          const d2 = x * x + y * y + dz * dz;
          if (d2 < pair2) {
            pair2 = d2; pairX = x; pairY = y;
          }
        }
      }
      if (perAtom) {
        const d = Math.sqrt(pair2);
        if (d < perAtom[i]) perAtom[i] = d;
        if (d < perAtom[j]) perAtom[j] = d;
      }
      if (pair2 < best2) {
        best2 = pair2; bestFrom = i; bestTo = j; bestX = pairX; bestY = pairY; bestZ = dz;
      }
    }
  }
  return { distance: Math.sqrt(best2), from: bestFrom, to: bestTo, vector: [bestX, bestY, bestZ] };
}

/** The closest pair of atoms of a sheet over all periodic images (one atom: its shortest lattice vector). */
export function shortestSeparation(sheet: Sheet, options: SeparationOptions = {}): Separation {
  return scan(sheet, options.inPlane ?? false);
}

/** Each atom's distance (Å) to its nearest other atom or own image, periodic images included. */
export function nearestDistances(sheet: Sheet, options: SeparationOptions = {}): Float64Array {
  const out = new Float64Array(sheet.atoms.length);
  scan(sheet, options.inPlane ?? false, out);
  return out;
}
