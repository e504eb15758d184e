/**
 * The point symmetry of a sheet in the plane: the rotations and mirror lines that map its atoms onto themselves
 * (after some translation), found among the operations of its lattice, each with the permutation of atoms it
 * makes. The coincidence fit uses them to list fits that differ only by a symmetry of the sheet once; the k-mesh
 * solves use them to diagonalise one k-point per star (E(O·k) = E(k) for every symmetry {O|t} of the sheet).
 *
 * Candidates: rotations by 60°, 90°, 120°, 180° (the only ones a 2D lattice allows, crystallographic
 * restriction) and mirror lines along and perpendicular to short lattice vectors (every mirror of a 2D lattice
 * is along a lattice vector, analytic). A candidate O is kept when O maps the lattice onto itself and some
 * translation t maps every atom r onto an atom of the same height: O·r + t ≡ r' (mod the lattice).
 */
import { gaussReduce } from './reduce.ts';
import type { Sheet, Vec2 } from './sheet.ts';

export interface SheetSymmetry {
  /** Rotation angles (degrees, in (0, 360)) of the sheet's symmetry rotations. */
  rotations: number[];
  /** Angles β (degrees, in [0, 180)) of its mirror lines. */
  mirrors: number[];
}

const TOLERANCE = 1e-6;

/** Integer-ness of a fractional vector within the tolerance. */
function nearInteger(x: number): boolean {
  return Math.abs(x - Math.round(x)) < TOLERANCE;
}

function fractional(cell: [Vec2, Vec2], x: number, y: number): Vec2 {
  const [[ax, ay], [bx, by]] = cell;
  const det = ax * by - ay * bx;
  return [(x * by - y * bx) / det, (ay * x * -1 + ax * y) / det];
}

/** Applies the orthogonal map m = [m00, m01, m10, m11] (Cartesian, column vectors). */
function applyMap(m: readonly number[], v: Vec2): Vec2 {
  return [m[0] * v[0] + m[1] * v[1], m[2] * v[0] + m[3] * v[1]];
}

function mapsLattice(sheet: Sheet, m: readonly number[]): boolean {
  return sheet.cell.every((vector) => fractional(sheet.cell, ...applyMap(m, vector)).every(nearInteger));
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/** Lookup grid: fractional coordinates and heights are binned at 1/GRID; matches are then checked to TOLERANCE. */
const GRID = 1e5;

/** Atoms by binned fractional coordinates (wrapped into [0, 1)): a match is found in O(1); heights are compared after. */
class AtomIndex {
  private readonly bins = new Map<number, number[]>();
  constructor(private readonly fractions: [number, number, number][]) {
    fractions.forEach(([f1, f2], atom) => {
      const key = AtomIndex.key(Math.round(f1 * GRID), Math.round(f2 * GRID));
      const list = this.bins.get(key);
      if (list) list.push(atom);
      else this.bins.set(key, [atom]);
    });
  }

  private static key(b1: number, b2: number): number {
    return (((b1 % GRID) + GRID) % GRID) * GRID + (((b2 % GRID) + GRID) % GRID);
  }

  /** The atom at (f1, f2, z) up to lattice translations and TOLERANCE, or −1. Neighbouring bins are searched too. */
  find(f1: number, f2: number, z: number): number {
    const b1 = Math.round(f1 * GRID);
    const b2 = Math.round(f2 * GRID);
    for (let d1 = -1; d1 <= 1; d1++) {
      for (let d2 = -1; d2 <= 1; d2++) {
        const list = this.bins.get(AtomIndex.key(b1 + d1, b2 + d2));
        if (!list) continue;
        for (const atom of list) {
          const [g1, g2, h] = this.fractions[atom];
          if (nearInteger(f1 - g1) && nearInteger(f2 - g2) && Math.abs(z - h) < TOLERANCE) return atom;
        }
      }
    }
    return -1;
  }
}

/**
 * The permutation of atoms made by the orthogonal map m, if some translation t makes m·r + t an atom of the same
 * height for every atom r (mod the lattice): atomMap[a] is the image of atom a; undefined if there is none.
 * The translation is fixed by where atom 0 goes, so every atom is tried as its image: O(n²) lookups at most.
 */
function atomMapOf(sheet: Sheet, m: readonly number[], index: AtomIndex, fractions: [number, number, number][]): Int32Array | undefined {
  const atomMap = new Int32Array(fractions.length);
  if (fractions.length === 0) return atomMap;
  const [[ax, ay], [bx, by]] = sheet.cell;
  // Images m·r in fractional coordinates of the sheet's cell.
  const image = fractions.map(([f1, f2, z]): [number, number, number] => {
    const [x, y] = applyMap(m, [f1 * ax + f2 * bx, f1 * ay + f2 * by]);
    return [...fractional(sheet.cell, x, y), z];
  });
  // A wrong translation of a vacancy pattern still lands most atoms on atoms (those beside a hole fail): checking
  // the atoms in a scattered order finds a failure after about 1/η atoms instead of about n/2.
  const n = fractions.length;
  let stride = Math.max(1, Math.round(n * 0.618));
  while (gcd(stride, n) !== 1) stride++;
  for (const target of fractions) {
    const t1 = target[0] - image[0][0];
    const t2 = target[1] - image[0][1];
    let found = true;
    for (let k = 0, a = 0; k < n; k++, a = (a + stride) % n) {
      const [f1, f2, z] = image[a];
      atomMap[a] = index.find(f1 + t1, f2 + t2, z);
      if (atomMap[a] < 0) {
        found = false;
        break;
      }
    }
    if (found) return atomMap;
  }
  return undefined;
}

/** One symmetry operation {O|t} of a sheet: the orthogonal map O and the permutation of atoms it makes. */
export interface SheetOperation {
  /** O as [O00, O01, O10, O11], Cartesian, acting on column vectors (x, y); z is left alone. */
  matrix: [number, number, number, number];
  /** 'rotation' by `degrees` (0 for the identity), or 'mirror' in the line at `degrees` from x. */
  kind: 'rotation' | 'mirror';
  degrees: number;
  /** atomMap[a]: the atom that atom a lands on. */
  atomMap: Int32Array;
}

/** Mirror-line angles worth trying: along and across the short lattice vectors (every lattice mirror is one). */
function mirrorCandidates(sheet: Sheet): number[] {
  const { u, v } = gaussReduce(sheet.cell[0], sheet.cell[1]);
  const directions: Vec2[] = [u, v, [u[0] + v[0], u[1] + v[1]], [u[0] - v[0], u[1] - v[1]], [u[0] + 2 * v[0], u[1] + 2 * v[1]], [2 * u[0] + v[0], 2 * u[1] + v[1]]];
  const candidates = new Set<number>();
  for (const [x, y] of directions) {
    const along = (((Math.atan2(y, x) * 180) / Math.PI) % 180 + 180) % 180;
    candidates.add(Math.round(along * 1e6) / 1e6 % 180);
    candidates.add(Math.round(((along + 90) % 180) * 1e6) / 1e6 % 180);
  }
  return [...candidates].sort((p, q) => p - q);
}

/** Every symmetry operation of the sheet, the identity first, then rotations by increasing angle, then mirrors. */
export function sheetOperations(sheet: Sheet): SheetOperation[] {
  const operations: SheetOperation[] = [];
  const fractions = sheet.atoms.map(([f1, f2, z]): [number, number, number] => [f1, f2, z]);
  const index = new AtomIndex(fractions);
  const keep = (matrix: [number, number, number, number], kind: 'rotation' | 'mirror', degrees: number) => {
    if (!mapsLattice(sheet, matrix)) return;
    const atomMap = atomMapOf(sheet, matrix, index, fractions);
    if (atomMap) operations.push({ matrix, kind, degrees, atomMap });
  };
  for (const degrees of [0, 60, 90, 120, 180, 240, 270, 300]) {
    const t = (degrees * Math.PI) / 180;
    keep([Math.cos(t), -Math.sin(t), Math.sin(t), Math.cos(t)], 'rotation', degrees);
  }
  for (const beta of mirrorCandidates(sheet)) {
    const t = (2 * beta * Math.PI) / 180;
    keep([Math.cos(t), Math.sin(t), Math.sin(t), -Math.cos(t)], 'mirror', beta);
  }
  return operations;
}

export function sheetSymmetry(sheet: Sheet): SheetSymmetry {
  const operations = sheetOperations(sheet);
  return {
    rotations: operations.filter((o) => o.kind === 'rotation' && o.degrees !== 0).map((o) => o.degrees),
    mirrors: operations.filter((o) => o.kind === 'mirror').map((o) => o.degrees),
  };
}
