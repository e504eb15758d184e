/**
 * Coincidence fits of a sheet on a metal surface (DESIGN.md, `fit` contract): a supercell of the sheet, turned
 * counter-clockwise by θ, that maps onto a supercell of the substrate with the least strain.
 *
 * Search: every substrate supercell up to `maxSites` surface atoms and every sheet supercell of nearly the same
 * area (both in Hermite normal form, so each sublattice once), each in its right-handed Gauss-reduced basis.
 * Pairs map reduced basis U onto V·G for the unimodular G with entries −1…1 and det +1 (low-strain maps take a
 * reduced basis to a nearly reduced one), F = V·G·U⁻¹. The strain is the largest |principal stretch − 1| of F
 * and θ the rotation of its polar decomposition (src/substrate/stretch.ts); the map from the turned sheet,
 * F·R_θ⁻¹, is then a pure stretch with the same principal stretches.
 *
 * Listed once: not at all a fit that is a supercell of a smaller coincidence with the same map (some sheet lattice
 * point inside its sheet supercell already lands on a substrate lattice point), and once fits
 * related by a symmetry of the two lattices — the substrate's rotations by 60° and its mirror, the sheet's own
 * rotations and mirrors (src/substrate/sheetSymmetry.ts) — which turn θ into θ + 60°, θ + ρ and −θ − 2β. The
 * representative kept is the one with the smallest angle in [0°, 360°). Ranked by area, then strain.
 */
import { gaussReduce } from '../lattice/reduce.ts';
import { hnfsOfIndex, type Hnf } from '../lattice/hnf.ts';
import type { Sheet, Vec2 } from '../lattice/sheet.ts';
import { SQRT3 } from '../lattice/triangular.ts';
import { sheetSymmetry } from '../lattice/sheetSymmetry.ts';
import { principalStretch } from './stretch.ts';

export type IntRows = [[number, number], [number, number]];

export interface FitOptions {
  /** Largest accepted strain, max |principal stretch − 1| (default 0.03). */
  maxStrain?: number;
  /** Largest coincidence cell, in substrate surface atoms (default 30). */
  maxSites?: number;
  /** Most fits returned (default 500). */
  maxFits?: number;
}

export interface CoincidenceFit {
  /** Counter-clockwise rotation of the sheet (degrees, in [0, 360)). */
  angleDeg: number;
  /** max |principal stretch − 1| of the map from the turned sheet supercell to the substrate supercell. */
  strain: number;
  /** The two principal stretches (larger first): > 1 means the sheet is stretched to fit. */
  stretches: [number, number];
  /** Sheet supercell rows in the sheet's cell basis; row i maps onto row i of the substrate supercell. */
  sheetSupercell: IntRows;
  /** Substrate supercell rows in b1 = a_s·(1, 0), b2 = a_s·(1/2, √3/2). */
  substrateSupercell: IntRows;
  /** Substrate surface atoms in the coincidence cell. */
  sites: number;
  /** Sheet cells in the coincidence cell. */
  sheetCells: number;
  /** Area of the coincidence cell on the substrate (Å²). */
  area: number;
  /** The coincidence (moiré) cell on the substrate: reduced lengths (Å), angle, and the orientation of its shortest vector from b1. */
  moire: { a: number; b: number; gammaDeg: number; angleDeg: number };
  /** Wood's notation when the coincidence cell is hexagonal, e.g. "(√7×√7)R19.1°". */
  wood?: string;
}

const DEFAULT_MAX_STRAIN = 0.03;
const DEFAULT_MAX_SITES = 30;
const DEFAULT_MAX_FITS = 500;
export const FIT_DEFAULTS = { maxStrain: DEFAULT_MAX_STRAIN, maxSites: DEFAULT_MAX_SITES, maxFits: DEFAULT_MAX_FITS } as const;

/** The unimodular 2×2 integer matrices with entries in {−1, 0, 1} and determinant +1, row-major. */
const UNIMODULAR: readonly (readonly [number, number, number, number])[] = (() => {
  const out: [number, number, number, number][] = [];
  for (let p = -1; p <= 1; p++) for (let q = -1; q <= 1; q++) for (let r = -1; r <= 1; r++) for (let s = -1; s <= 1; s++) {
    if (p * s - q * r === 1) out.push([p, q, r, s]);
  }
  return out;
})();

/** A supercell in its right-handed reduced basis: integer rows in the parent basis and Cartesian vectors. */
interface Reduced {
  hnf: Hnf;
  rows: IntRows;
  u: Vec2;
  v: Vec2;
  /** |u| and |v|: the two successive minima of the lattice (Å). */
  shortest: number;
  second: number;
}


/** Rows [[a, 0], [b, c]] of an HNF turned into the right-handed reduced basis (same lattice). */
function reduced(h: Hnf, cell: [Vec2, Vec2]): Reduced {
  const [[ax, ay], [bx, by]] = cell;
  const rowsH: IntRows = [[h.a, 0], [h.b, h.c]];
  const vec = (r: [number, number]): Vec2 => [r[0] * ax + r[1] * bx, r[0] * ay + r[1] * by];
  const A1 = vec(rowsH[0]);
  const A2 = vec(rowsH[1]);
  let [m00, m01, m10, m11] = gaussReduce(A1, A2).transform;
  const u0: Vec2 = [m00 * A1[0] + m01 * A2[0], m00 * A1[1] + m01 * A2[1]];
  const v0: Vec2 = [m10 * A1[0] + m11 * A2[0], m10 * A1[1] + m11 * A2[1]];
  if (u0[0] * v0[1] - u0[1] * v0[0] < 0) [m00, m01, m10, m11] = [m10, m11, m00, m01];
  const rows: IntRows = [
    [m00 * h.a + m01 * h.b + 0, m01 * h.c + 0],
    [m10 * h.a + m11 * h.b + 0, m11 * h.c + 0],
  ];
  const u = vec(rows[0]);
  const v = vec(rows[1]);
  // Making the basis right-handed may have swapped u and v, so the minima are the smaller and larger length.
  const lengths = [Math.hypot(u[0], u[1]), Math.hypot(v[0], v[1])].sort((x, y) => x - y);
  return { hnf: h, rows, u, v, shortest: lengths[0], second: lengths[1] };
}

function sortedByShortest(list: Reduced[]): Reduced[] {
  return list.sort((x, y) => x.shortest - y.shortest);
}

/** First index whose shortest vector is at least `length` (list sorted by it). */
function lowerBound(list: readonly Reduced[], length: number): number {
  let lo = 0;
  let hi = list.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (list[mid].shortest < length) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

function reducedSupercells(index: number, cell: [Vec2, Vec2]): Reduced[] {
  return hnfsOfIndex(index).map((h) => reduced(h, cell));
}

const mod = (x: number, m: number) => ((x % m) + m) % m;

/** Angles (degrees mod 60) equivalent to θ under the lattices' symmetries; the smallest is the orbit's name. */
function canonicalAngle(theta: number, rotations: number[], mirrors: number[]): number {
  const fold = (x: number) => {
    const r = mod(x, 60);
    return r > 60 - 1e-7 ? 0 : r;
  };
  const seen: number[] = [fold(theta)];
  for (let i = 0; i < seen.length && seen.length < 64; i++) {
    const next = [...rotations.map((rho) => seen[i] + rho), ...mirrors.map((beta) => -seen[i] - 2 * beta)].map(fold);
    for (const x of next) if (!seen.some((y) => Math.abs(y - x) < 1e-7)) seen.push(x);
  }
  return Math.min(...seen);
}

function wood(sites: number, moire: CoincidenceFit['moire']): string | undefined {
  if (!(Math.abs(moire.a - moire.b) < 1e-6 * moire.a && Math.abs(moire.gammaDeg - 120) < 1e-6)) return undefined;
  const root = Math.round(Math.sqrt(sites));
  const side = root * root === sites ? String(root) : `√${sites}`;
  const turn = Math.min(moire.angleDeg, 60 - moire.angleDeg);
  return turn < 1e-6 ? `(${side}×${side})` : `(${side}×${side})R${turn.toFixed(1)}°`;
}

function moireCell(u: Vec2, v: Vec2): CoincidenceFit['moire'] {
  const { u: p, v: q } = gaussReduce(u, v);
  const a = Math.hypot(...p);
  const b = Math.hypot(...q);
  const gammaDeg = (Math.acos(Math.max(-1, Math.min(1, (p[0] * q[0] + p[1] * q[1]) / (a * b)))) * 180) / Math.PI;
  let angle = mod((Math.atan2(p[1], p[0]) * 180) / Math.PI, 60);
  if (angle > 60 - 1e-7 || angle < 1e-7) angle = 0;
  return { a, b, gammaDeg, angleDeg: angle };
}

/** A fit found at one level (one substrate cell size), before it is written out. */
interface Found {
  angleDeg: number;
  strain: number;
  major: number;
  minor: number;
  sheet: Reduced;
  substrate: Reduced;
  g: readonly [number, number, number, number];
  cells: number;
}

/** True when no sheet lattice point inside the sheet supercell (other than 0) maps onto a substrate lattice point. */
function primitive(found: Found, map: readonly number[], sheetCell: [Vec2, Vec2], substrateSpacing: number): boolean {
  const { a, c } = found.sheet.hnf;
  const [[ax, ay], [bx, by]] = sheetCell;
  const s = substrateSpacing;
  for (let j = 0; j < c; j++) {
    for (let i = 0; i < a; i++) {
      if (i === 0 && j === 0) continue;
      const x = i * ax + j * bx, y = i * ay + j * by;
      const fx = map[0] * x + map[1] * y, fy = map[2] * x + map[3] * y;
      // Fractional in b1 = s(1, 0), b2 = s(1/2, √3/2): f2 = 2y/(√3 s), f1 = x/s − f2/2.
      const f2 = (2 * fy) / (SQRT3 * s);
      const f1 = fx / s - f2 / 2;
      if (Math.abs(f1 - Math.round(f1)) < 1e-6 && Math.abs(f2 - Math.round(f2)) < 1e-6) return false;
    }
  }
  return true;
}

function written(found: Found, sites: number, area: number): CoincidenceFit {
  const [g00, g01, g10, g11] = found.g;
  const m = found.substrate;
  const p: Vec2 = [g00 * m.u[0] + g10 * m.v[0], g00 * m.u[1] + g10 * m.v[1]];
  const q: Vec2 = [g01 * m.u[0] + g11 * m.v[0], g01 * m.u[1] + g11 * m.v[1]];
  const fit: CoincidenceFit = {
    angleDeg: found.angleDeg,
    strain: found.strain,
    stretches: [found.major, found.minor],
    sheetSupercell: [[...found.sheet.rows[0]], [...found.sheet.rows[1]]],
    substrateSupercell: [
      [g00 * m.rows[0][0] + g10 * m.rows[1][0] + 0, g00 * m.rows[0][1] + g10 * m.rows[1][1] + 0],
      [g01 * m.rows[0][0] + g11 * m.rows[1][0] + 0, g01 * m.rows[0][1] + g11 * m.rows[1][1] + 0],
    ],
    sites,
    sheetCells: found.cells,
    area,
    moire: moireCell(p, q),
  };
  const w = wood(sites, fit.moire);
  return w ? { ...fit, wood: w } : fit;
}

/**
 * Coincidence fits of `sheet` (its cell; its atoms for the symmetry) on a triangular substrate of
 * nearest-neighbour distance `substrateSpacing` (Å), best first: smallest area, then least strain. At most
 * `maxFits` are returned (the search stops after the cell size at which that many are found).
 */
export function coincidenceFits(sheet: Sheet, substrateSpacing: number, options: FitOptions = {}): CoincidenceFit[] {
  const maxStrain = options.maxStrain ?? DEFAULT_MAX_STRAIN;
  const maxSites = options.maxSites ?? DEFAULT_MAX_SITES;
  const maxFits = options.maxFits ?? DEFAULT_MAX_FITS;
  const { rotations, mirrors } = sheetSymmetry(sheet);
  const substrateCell: [Vec2, Vec2] = [[substrateSpacing, 0], [substrateSpacing / 2, (substrateSpacing * SQRT3) / 2]];
  const siteArea = (substrateSpacing * substrateSpacing * SQRT3) / 2;
  const [[ax, ay], [bx, by]] = sheet.cell;
  const sheetArea = Math.abs(ax * by - ay * bx);
  const sheetCells = new Map<number, Reduced[]>();
  const out: CoincidenceFit[] = [];
  for (let sites = 1; sites <= maxSites && out.length < maxFits; sites++) {
    const area = sites * siteArea;
    // det F = product of the stretches lies in [(1 − s)², (1 + s)²].
    const low = Math.max(1, Math.ceil(area / ((1 + maxStrain) ** 2 * sheetArea) - 1e-9));
    const high = Math.floor(area / ((1 - maxStrain) ** 2 * sheetArea) + 1e-9);
    if (low > high) continue;
    const substrate = reducedSupercells(sites, substrateCell);
    // One entry per symmetry orbit (sites, sheet cells, strain, canonical angle); null when not primitive.
    const orbits = new Map<string, Found | null>();
    for (let cells = low; cells <= high; cells++) {
      let sheetSupercells = sheetCells.get(cells);
      if (!sheetSupercells) sheetCells.set(cells, (sheetSupercells = sortedByShortest(reducedSupercells(cells, sheet.cell))));
      for (const m of substrate) {
        // A map with stretches in [1 − s, 1 + s] scales both successive minima (the lengths of a reduced basis) by
        // a factor in that range (their minimax characterisation), so only sheet cells in this window can fit.
        const first = lowerBound(sheetSupercells, (m.shortest / (1 + maxStrain)) * (1 - 1e-9));
        for (let k = first; k < sheetSupercells.length; k++) {
          const s = sheetSupercells[k];
          if (s.shortest > (m.shortest / (1 - maxStrain)) * (1 + 1e-9)) break;
          const ratio = m.second / s.second;
          if (!(ratio >= (1 - maxStrain) * (1 - 1e-9) && ratio <= (1 + maxStrain) * (1 + 1e-9))) continue;
          // U⁻¹ for columns u, v.
          const det = s.u[0] * s.v[1] - s.u[1] * s.v[0];
          const i00 = s.v[1] / det, i01 = -s.v[0] / det, i10 = -s.u[1] / det, i11 = s.u[0] / det;
          for (const g of UNIMODULAR) {
            const [g00, g01, g10, g11] = g;
            // Columns of V·G: the substrate vectors that the sheet's u and v map onto; F = V·G·U⁻¹.
            const px = g00 * m.u[0] + g10 * m.v[0], py = g00 * m.u[1] + g10 * m.v[1];
            const qx = g01 * m.u[0] + g11 * m.v[0], qy = g01 * m.u[1] + g11 * m.v[1];
            const map = [px * i00 + qx * i10, px * i01 + qx * i11, py * i00 + qy * i10, py * i01 + qy * i11];
            const stretch = principalStretch(map[0], map[1], map[2], map[3]);
            if (!(stretch.strain <= maxStrain + 1e-12)) continue;
            let angleDeg = mod((stretch.rotation * 180) / Math.PI, 360);
            if (angleDeg > 360 - 1e-9 || angleDeg < 1e-9) angleDeg = 0;
            const key = `${cells}|${Math.round(stretch.strain * 1e8)}|${Math.round(canonicalAngle(angleDeg, rotations, mirrors) * 1e6)}`;
            const kept = orbits.get(key);
            const found: Found = { angleDeg, strain: stretch.strain, major: stretch.major, minor: stretch.minor, sheet: s, substrate: m, g, cells };
            if (kept === undefined) orbits.set(key, primitive(found, map, sheet.cell, substrateSpacing) ? found : null);
            else if (kept !== null && angleDeg < kept.angleDeg - 1e-9) orbits.set(key, found);
          }
        }
      }
    }
    // Strains equal to rounding (1e-10) rank by angle, so the order does not hang on the last bits.
    const rank = (x: Found) => Math.round(x.strain * 1e10);
    const level = [...orbits.values()].filter((f): f is Found => f !== null);
    level.sort((x, y) => rank(x) - rank(y) || x.cells - y.cells || x.angleDeg - y.angleDeg);
    for (const found of level) out.push(written(found, sites, area));
  }
  return out.slice(0, maxFits);
}
