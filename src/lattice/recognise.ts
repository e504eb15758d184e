/**
 * Explicit sheet → vacancy pattern, when the atoms sit on a triangular lattice.
 *
 * Method: the bond d is the shortest atom–atom distance (periodic images included) and a1 runs along that
 * shortest vector e, a2 = e turned by +60°. Every atom, taken relative to the atom e starts from, and both
 * cell vectors must then be integer combinations of (a1, a2) within the tolerance; the cell rows become the
 * supercell (brought to HNF) and the empty sites the vacancies.
 * The pattern describes the same structure up to a rigid rotation (e onto the x axis) and translation
 * (the starting atom onto the origin), and a shift of all heights to zero.
 * Limitation: when no two atoms are nearest neighbours of the lattice they sit on, the shortest vector is
 * longer than that lattice's spacing; the result is then a coarser triangular lattice when the atoms fit
 * one, or undefined.
 */
import { reduceSite, siteIndex, toHnf } from './hnf.ts';
import { makePattern } from './pattern.ts';
import { shortestSeparation } from './separation.ts';
import { cartesian, type Pattern, type Sheet } from './sheet.ts';

/** Default largest distance (Å) of an atom or cell vector from its ideal lattice position. */
export const RECOGNITION_TOLERANCE = 1e-3;

/**
 * The vacancy pattern of `sheet`, or undefined when its atoms do not sit, within `tolerance` (Å), on the
 * sites of a triangular lattice of which the cell is a supercell (or when the sheet is not planar).
 */
export function sheetToPattern(sheet: Sheet, tolerance: number = RECOGNITION_TOLERANCE): Pattern | undefined {
  const n = sheet.atoms.length;
  if (n === 0) return undefined;
  let zMin = Infinity, zMax = -Infinity;
  for (const atom of sheet.atoms) {
    zMin = Math.min(zMin, atom[2]);
    zMax = Math.max(zMax, atom[2]);
  }
  if (zMax - zMin > tolerance) return undefined;

  const closest = shortestSeparation(sheet, { inPlane: true });
  // Twelve significant digits drop the rounding noise of the distance (1.6899999999999995 → 1.69).
  const bond = Number(closest.distance.toPrecision(12));
  if (!(bond > tolerance)) return undefined;
  const cos = closest.vector[0] / bond, sin = closest.vector[1] / bond;
  // Lattice coordinates (x, y) of a Cartesian vector w: turn w by −θ (θ the angle of e), then
  // y = w'_y / (d·√3/2), x = w'_x / d − y/2, from a1 = d·(1, 0), a2 = d·(1/2, √3/2).
  const toLattice = (wx: number, wy: number): [number, number] => {
    const rx = cos * wx + sin * wy, ry = -sin * wx + cos * wy;
    const y = ry / (bond * Math.sqrt(3) / 2);
    return [rx / bond - y / 2, y];
  };
  const nearInteger = (wx: number, wy: number): [number, number] | undefined => {
    const [x, y] = toLattice(wx, wy);
    const i = Math.round(x), j = Math.round(y);
    // Cartesian miss |(x − i)·a1 + (y − j)·a2|.
    const ex = x - i + (y - j) / 2, ey = (y - j) * Math.sqrt(3) / 2;
    return Math.hypot(ex, ey) * bond <= tolerance ? [i + 0, j + 0] : undefined;
  };

  const row1 = nearInteger(sheet.cell[0][0], sheet.cell[0][1]);
  const row2 = nearInteger(sheet.cell[1][0], sheet.cell[1][1]);
  if (!row1 || !row2) return undefined;
  const supercell = toHnf([row1, row2]);
  if (!supercell || supercell.a * supercell.c < n) return undefined;

  const [ox, oy] = cartesian(sheet, closest.from);
  const occupied = new Uint8Array(supercell.a * supercell.c);
  for (let k = 0; k < n; k++) {
    const [x, y] = cartesian(sheet, k);
    const site = nearInteger(x - ox, y - oy);
    if (!site) return undefined;
    const index = siteIndex(supercell, site[0], site[1]);
    if (occupied[index]) return undefined;
    occupied[index] = 1;
  }
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
