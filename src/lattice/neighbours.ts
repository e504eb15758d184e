/**
 * Neighbour pairs within a cutoff over all periodic images, for any cell however oblique.
 *
 * Layout: one entry per ordered pair (i, j, image) with 0 < |r_j + n1·A1 + n2·A2 − r_i| < cutoff;
 * both directions are listed, so the list is symmetric. Flat typed arrays, entry e at index e.
 */
import { cartesian, signedArea, type Sheet } from './sheet.ts';

export interface NeighbourList {
  readonly count: number;
  /** Atom the bond starts from. */
  readonly from: Int32Array;
  /** Atom the bond ends on (in image shift1·A1 + shift2·A2). */
  readonly to: Int32Array;
  readonly shift1: Int32Array;
  readonly shift2: Int32Array;
  /** Bond vector r_to + shift − r_from, Å. */
  readonly dx: Float64Array;
  readonly dy: Float64Array;
  readonly dz: Float64Array;
  readonly distance: Float64Array;
}

/**
 * All ordered neighbour pairs closer than `cutoff` (Å), excluding an atom with itself at zero shift.
 * Image range: a displacement r has fractional components r·B_i with B the dual basis, so
 * |n_i| ≤ ceil(cutoff·|B_i|) + 1 covers every pair (the +1 absorbs the in-cell offset).
 */
export function neighbours(sheet: Sheet, cutoff: number): NeighbourList {
  const [[ax, ay], [bx, by]] = sheet.cell;
  const area = signedArea(sheet.cell);
  const dual1 = Math.hypot(by, bx) / Math.abs(area);
  const dual2 = Math.hypot(ay, ax) / Math.abs(area);
  const range1 = Math.ceil(cutoff * dual1) + 1;
  const range2 = Math.ceil(cutoff * dual2) + 1;
  const n = sheet.atoms.length;
  const positions = sheet.atoms.map((_, index) => cartesian(sheet, index));
  const from: number[] = [], to: number[] = [], s1: number[] = [], s2: number[] = [];
  const dx: number[] = [], dy: number[] = [], dz: number[] = [], dist: number[] = [];
  const cutoff2 = cutoff * cutoff;
  for (let i = 0; i < n; i++) {
    const [xi, yi, zi] = positions[i];
    for (let j = 0; j < n; j++) {
      const [xj, yj, zj] = positions[j];
      for (let n1 = -range1; n1 <= range1; n1++) {
        for (let n2 = -range2; n2 <= range2; n2++) {
          if (i === j && n1 === 0 && n2 === 0) continue;
          const x = xj + n1 * ax + n2 * bx - xi;
          const y = yj + n1 * ay + n2 * by - yi;
          const z = zj - zi;
          const d2 = x * x + y * y + z * z;
          if (d2 >= cutoff2) continue;
          from.push(i); to.push(j); s1.push(n1); s2.push(n2);
          dx.push(x); dy.push(y); dz.push(z); dist.push(Math.sqrt(d2));
        }
      }
    }
  }
  return {
    count: from.length,
    from: Int32Array.from(from),
    to: Int32Array.from(to),
    shift1: Int32Array.from(s1),
    shift2: Int32Array.from(s2),
    dx: Float64Array.from(dx),
    dy: Float64Array.from(dy),
    dz: Float64Array.from(dz),
    distance: Float64Array.from(dist),
  };
}

/** Number of neighbours of each atom within `cutoff` (Å). */
export function coordination(sheet: Sheet, cutoff: number): Int32Array {
  const list = neighbours(sheet, cutoff);
  const counts = new Int32Array(sheet.atoms.length);
  for (let e = 0; e < list.count; e++) counts[list.from[e]]++;
  return counts;
}
