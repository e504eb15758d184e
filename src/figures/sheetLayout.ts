/**
 * What the sheet figure places: every lattice site (or atom) of the repeated cell with its Cartesian position,
 * the computational atom it is, and the lattice translation R from that atom's home-cell position (so a Bloch
 * state's phase there is phase + k·R). Pure geometry, no DOM.
 */
import { reduceSite } from '../lattice/hnf.ts';
import { cartesian, type Vec2 } from '../lattice/sheet.ts';
import { gaussReduce } from '../lattice/reduce.ts';
import { latticePoint } from '../lattice/triangular.ts';
import type { SheetData } from './types.ts';

export interface PlacedSite {
  /** Lattice coordinates (i, j) of the site, for a pattern; undefined for an explicit sheet. */
  site?: [number, number];
  x: number;
  y: number;
  /** Height (Å): bonds are cut on the 3D distance. */
  z: number;
  /** Atom index in data.sheet, or −1 for a vacant site. */
  atom: number;
  /** Translation from the atom's home-cell position (Å). */
  rx: number;
  ry: number;
  /** A hexagonal hole (vacant sites only). */
  hexagonal: boolean;
}

/** The edited cell's vectors (Å): the pattern's supercell, or the sheet's cell. */
export function editedCell(data: SheetData): [Vec2, Vec2] {
  if (!data.pattern) return [data.sheet.cell[0], data.sheet.cell[1]];
  const { a, b, c } = data.pattern.supercell;
  return [latticePoint(a, 0, data.pattern.bond), latticePoint(b, c, data.pattern.bond)];
}

/**
 * The vectors along which copies are laid: the Gauss-reduced basis of the edited cell's lattice (same lattice,
 * shortest vectors, counter-clockwise), so a long, sheared HNF cell still fills a compact patch of sheet. For a
 * pattern also in integer lattice coordinates.
 */
export function copyBasis(data: SheetData): { cartesian: [Vec2, Vec2]; lattice?: [[number, number], [number, number]] } {
  const [A1, A2] = editedCell(data);
  const { u, v, transform: t } = gaussReduce(A1, A2);
  // Counter-clockwise (positive area), so the parallelogram test below needs one sign only.
  const flip = u[0] * v[1] - u[1] * v[0] < 0 ? -1 : 1;
  const cartesianBasis: [Vec2, Vec2] = [u, [flip * v[0], flip * v[1]]];
  if (!data.pattern) return { cartesian: cartesianBasis };
  const { a, b, c } = data.pattern.supercell;
  // Rows of the HNF in (i, j): A1 = (a, 0), A2 = (b, c); u = t0·A1 + t1·A2, v = t2·A1 + t3·A2.
  const U: [number, number] = [t[0] * a + t[1] * b, t[1] * c];
  const V: [number, number] = [flip * (t[2] * a + t[3] * b), flip * t[3] * c];
  return { cartesian: cartesianBasis, lattice: [U, V] };
}

export function placeSites(data: SheetData): PlacedSite[] {
  const [r1, r2] = data.repeats;
  const out: PlacedSite[] = [];
  if (!data.pattern) {
    const [A1, A2] = data.sheet.cell;
    for (let n2 = 0; n2 < r2; n2++) {
      for (let n1 = 0; n1 < r1; n1++) {
        const rx = n1 * A1[0] + n2 * A2[0];
        const ry = n1 * A1[1] + n2 * A2[1];
        data.sheet.atoms.forEach((_, atom) => {
          const [x, y, z] = cartesian(data.sheet, atom);
          out.push({ x: x + rx, y: y + ry, z, atom, rx, ry, hexagonal: false });
        });
      }
    }
    return out;
  }
  const pattern = data.pattern;
  const cell = data.cellPattern ?? pattern;
  const { a, b, c } = pattern.supercell;
  const vacant = new Set(pattern.vacancies.map(([i, j]) => j * a + i));
  const hexagonal = new Set(data.hexagonalHoles.map(([i, j]) => { const [ri, rj] = reduceSite(pattern.supercell, i, j); return rj * a + ri; }));
  // Atom index of each site of the computational cell, in patternToSheet's order (j·a + i, vacancies skipped).
  const h = cell.supercell;
  const cellVacant = new Set(cell.vacancies.map(([i, j]) => j * h.a + i));
  const atomOf = new Int32Array(h.a * h.c).fill(-1);
  let next = 0;
  for (let j = 0; j < h.c; j++) for (let i = 0; i < h.a; i++) if (!cellVacant.has(j * h.a + i)) atomOf[j * h.a + i] = next++;
  const [[u1, u2], [v1, v2]] = copyBasis(data).lattice!;
  const area = u1 * v2 - u2 * v1; // = a·c > 0
  for (let n2 = 0; n2 < r2; n2++) {
    for (let n1 = 0; n1 < r1; n1++) {
      for (let j = 0; j < c; j++) {
        for (let i = 0; i < a; i++) {
          // The representative of (i, j) inside the parallelogram of the reduced vectors U, V: its coordinates
          // there are ((i·v2 − j·v1)/area, (u1·j − u2·i)/area); subtract their floors (exact in integers), then
          // translate the copy by n1·U + n2·V.
          const fu = Math.floor((i * v2 - j * v1) / area);
          const fv = Math.floor((u1 * j - u2 * i) / area);
          const I = i - fu * u1 - fv * v1 + n1 * u1 + n2 * v1;
          const J = j - fu * u2 - fv * v2 + n1 * u2 + n2 * v2;
          const [x, y] = latticePoint(I, J, pattern.bond);
          if (vacant.has(j * a + i)) {
            out.push({ site: [I, J], x, y, z: 0, atom: -1, rx: 0, ry: 0, hexagonal: hexagonal.has(j * a + i) });
            continue;
          }
          const [ri, rj] = reduceSite(h, I, J);
          const atom = atomOf[rj * h.a + ri];
          const [tx, ty] = cartesian(data.sheet, atom);
          out.push({ site: [I, J], x, y, z: 0, atom, rx: x - tx, ry: y - ty, hexagonal: false });
        }
      }
    }
  }
  return out;
}

/** Pairs of placed atoms closer than `cutoff` (Å), each once, by a grid of cutoff-sized cells. */
export function placedBonds(sites: PlacedSite[], cutoff: number): [number, number][] {
  const grid = new Map<string, number[]>();
  const key = (gx: number, gy: number) => `${gx},${gy}`;
  sites.forEach((s, n) => {
    if (s.atom < 0) return;
    const k = key(Math.floor(s.x / cutoff), Math.floor(s.y / cutoff));
    const list = grid.get(k);
    if (list) list.push(n);
    else grid.set(k, [n]);
  });
  const pairs: [number, number][] = [];
  sites.forEach((s, n) => {
    if (s.atom < 0) return;
    const gx = Math.floor(s.x / cutoff);
    const gy = Math.floor(s.y / cutoff);
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        for (const m of grid.get(key(gx + dx, gy + dy)) ?? []) {
          if (m <= n) continue;
          const d = Math.hypot(sites[m].x - s.x, sites[m].y - s.y, sites[m].z - s.z);
          if (d > 0 && d < cutoff) pairs.push([n, m]);
        }
      }
    }
  });
  return pairs.sort((p, q) => p[0] - q[0] || p[1] - q[1]);
}
