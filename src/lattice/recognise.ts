/**
 * Explicit sheet → vacancy pattern, when the atoms sit on a triangular lattice.
 *
 * Method: the shortest atom–atom vector e (periodic images included) suggests the lattice: a1 = e,
 * a2 = e turned by +60°. The cell vectors, rounded to integer combinations of that guess, give the supercell
 * rows; the lattice basis is then taken exactly from the cell, (a1, a2) = rows⁻¹·(A1, A2), and must be
 * triangular within the tolerance (|a2 − a1 turned by 60°| ≤ tolerance). Every atom, relative to the atom e
 * starts from, must lie within the tolerance of a lattice point; the empty sites are the vacancies.
 * The pattern describes the same structure up to a rigid rotation (a1 onto the x axis), a translation (the
 * starting atom onto the origin) and a common shift of the heights to zero.
 * `triangularSites` is that recognition alone, in the sheet's own frame and for any heights (unfolding uses it).
 * Limitation: when no two atoms are nearest neighbours of the lattice they sit on, e is longer than that
 * lattice's spacing; the result is then a coarser triangular lattice when the atoms fit one, or undefined.
 */
import { reduceSite, siteIndex, toHnf, type Hnf } from './hnf.ts';
import { makePattern } from './pattern.ts';
import { shortestSeparation } from './separation.ts';
import { cartesian, type Pattern, type Sheet, type Vec2 } from './sheet.ts';

/** Default largest distance (Å) of an atom or cell vector from its ideal lattice position. */
export const RECOGNITION_TOLERANCE = 1e-3;

/** Default largest supercell (sites) recognised: a sparse sheet in a huge cell is not worth a vacancy list. */
export const RECOGNITION_MAX_SITES = 4096;

/** A sheet's atoms as sites of a triangular lattice, in the sheet's own frame (heights ignored). */
export interface TriangularSites {
  /** Lattice spacing d (Å), to twelve significant digits. */
  bond: number;
  /** The lattice basis in the sheet's frame, exactly from the cell; a2 is a1 turned by +60° within the tolerance. */
  a1: Vec2;
  a2: Vec2;
  /** The cell vectors as integer rows in the basis (a1, a2); their determinant is ± the sites per cell. */
  rows: [[number, number], [number, number]];
  supercell: Hnf;
  /** The atom taken as the lattice origin. */
  origin: number;
  /** Per atom, its lattice point (i, j) relative to the origin atom (not reduced modulo the supercell). */
  sites: [number, number][];
}

/**
 * The triangular lattice whose sites `sheet`'s atoms occupy (in-plane positions only: heights are not looked at),
 * or undefined when there is none within `tolerance` (Å) of which the cell is a supercell of at most `maxSites`
 * sites, or when two atoms share a site.
 */
export function triangularSites(
  sheet: Sheet,
  tolerance: number = RECOGNITION_TOLERANCE,
  maxSites: number = RECOGNITION_MAX_SITES,
): TriangularSites | undefined {
  const n = sheet.atoms.length;
  if (n === 0) return undefined;
  const closest = shortestSeparation(sheet, { inPlane: true });
  const guess = closest.distance;
  if (!(guess > tolerance)) return undefined;
  const [ex, ey] = closest.vector;
  // Integer coordinates of a cell vector in the guessed basis e, e turned by 60° (loosely: checked below).
  const guessRow = (wx: number, wy: number): [number, number] => {
    const along = (ex * wx + ey * wy) / (guess * guess), across = (ex * wy - ey * wx) / (guess * guess);
    const y = across / (Math.sqrt(3) / 2);
    return [Math.round(along - y / 2) + 0, Math.round(y) + 0];
  };
  const [[A1x, A1y], [A2x, A2y]] = sheet.cell;
  const [p, q] = guessRow(A1x, A1y);
  const [r, s] = guessRow(A2x, A2y);
  const det = p * s - q * r;
  if (det === 0 || Math.abs(det) > maxSites) return undefined;
  const supercell = toHnf([[p, q], [r, s]]);
  if (!supercell || supercell.a * supercell.c < n) return undefined;
  // Exact basis from the cell: (a1; a2) = [[p, q], [r, s]]⁻¹ · (A1; A2).
  const a1: Vec2 = [(s * A1x - q * A2x) / det, (s * A1y - q * A2y) / det];
  const a2: Vec2 = [(-r * A1x + p * A2x) / det, (-r * A1y + p * A2y) / det];
  const c60 = 0.5, s60 = Math.sqrt(3) / 2;
  if (Math.hypot(a2[0] - (c60 * a1[0] - s60 * a1[1]), a2[1] - (s60 * a1[0] + c60 * a1[1])) > tolerance) return undefined;
  const basisDet = a1[0] * a2[1] - a1[1] * a2[0];
  // Twelve significant digits drop rounding noise (1.6899999999999995 → 1.69).
  const bond = Number(Math.hypot(a1[0], a1[1]).toPrecision(12));
  const nearInteger = (wx: number, wy: number): [number, number] | undefined => {
    const x = (wx * a2[1] - wy * a2[0]) / basisDet, y = (a1[0] * wy - a1[1] * wx) / basisDet;
    const i = Math.round(x), j = Math.round(y);
    const missX = (x - i) * a1[0] + (y - j) * a2[0], missY = (x - i) * a1[1] + (y - j) * a2[1];
    return Math.hypot(missX, missY) <= tolerance ? [i + 0, j + 0] : undefined;
  };

  const [ox, oy] = cartesian(sheet, closest.from);
  const occupied = new Uint8Array(supercell.a * supercell.c);
  const sites: [number, number][] = [];
  for (let k = 0; k < n; k++) {
    const [x, y] = cartesian(sheet, k);
    const site = nearInteger(x - ox, y - oy);
    if (!site) return undefined;
    const index = siteIndex(supercell, site[0], site[1]);
    if (occupied[index]) return undefined;
    occupied[index] = 1;
    sites.push(site);
  }
  return { bond, a1, a2, rows: [[p, q], [r, s]], supercell, origin: closest.from, sites };
}

/**
 * The vacancy pattern of `sheet`, or undefined when its atoms do not sit, within `tolerance` (Å), on the
 * sites of a triangular lattice of which the cell is a supercell of at most `maxSites` sites (or when the
 * sheet is not planar).
 */
export function sheetToPattern(
  sheet: Sheet,
  tolerance: number = RECOGNITION_TOLERANCE,
  maxSites: number = RECOGNITION_MAX_SITES,
): Pattern | undefined {
  let zMin = Infinity, zMax = -Infinity;
  for (const atom of sheet.atoms) {
    zMin = Math.min(zMin, atom[2]);
    zMax = Math.max(zMax, atom[2]);
  }
  if (zMax - zMin > tolerance) return undefined;
  const found = triangularSites(sheet, tolerance, maxSites);
  if (!found) return undefined;
  const { supercell, bond } = found;
  const occupied = new Uint8Array(supercell.a * supercell.c);
  for (const [i, j] of found.sites) occupied[siteIndex(supercell, i, j)] = 1;
  const vacancies: [number, number][] = [];
  for (let j = 0; j < supercell.c; j++) {
    for (let i = 0; i < supercell.a; i++) if (!occupied[j * supercell.a + i]) vacancies.push(reduceSite(supercell, i, j));
  }
  return makePattern({
    ...(sheet.name !== undefined ? { name: sheet.name } : {}),
    bond,
    supercell: [[supercell.a, 0], [supercell.b, supercell.c]],
    vacancies,
  });
}
