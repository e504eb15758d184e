/**
 * The primitive triangular lattice's zone for unfolding, in the sheet's frame: the path Γ–M–K–Γ, the hexagonal
 * zone, and the square grid of k-points over it on which constant-energy cuts are drawn.
 *
 * Everything is that of the one-site cell a1 = d·(1, 0), a2 = d·(1/2, √3/2) (src/lattice/triangular.ts) turned by
 * the unfolding's angle, so that a pattern (angle 0) unfolds on exactly the path `bands` takes for the one-atom
 * cell: M = b/2 at |M| = 2π/(√3·d), K a zone corner at |K| = 4π/(3d) (common practice).
 */
import type { Vec2 } from '../lattice/sheet.ts';
import { autoPath, type KPath } from './kspacePath.ts';
import type { UnfoldingSheet } from './unfoldSheet.ts';
import { brillouinZone, type BrillouinZone } from './zone.ts';

type Orientation = Pick<UnfoldingSheet, 'bond' | 'angle'>;

function turn(angle: number): (k: Vec2) => Vec2 {
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  return ([x, y]) => [c * x - s * y, s * x + c * y];
}

/** The one-site cell of spacing d, a1 along +x. */
function oneSiteCell(bond: number): [Vec2, Vec2] {
  return [[bond, 0], [bond / 2, (bond * Math.sqrt(3)) / 2]];
}

/** The path Γ–M–K–Γ of the primitive lattice with `points` points, in the sheet's frame. */
export function primitivePath(unfolding: Orientation, points: number): KPath {
  const path = autoPath(oneSiteCell(unfolding.bond), points);
  if (unfolding.angle === 0) return path;
  const rotate = turn(unfolding.angle);
  const kpoints = new Float64Array(path.kpoints.length);
  for (let p = 0; p < path.count; p++) {
    const [x, y] = rotate([path.kpoints[2 * p], path.kpoints[2 * p + 1]]);
    kpoints[2 * p] = x;
    kpoints[2 * p + 1] = y;
  }
  return { ...path, kpoints };
}

/** The primitive zone (hexagon corners counter-clockwise, b1, b2) and its special points, in the sheet's frame. */
export function primitiveZone(unfolding: Orientation): BrillouinZone & { points: { label: string; k: Vec2 }[] } {
  const zone = brillouinZone(oneSiteCell(unfolding.bond));
  const path = autoPath(oneSiteCell(unfolding.bond), 4);
  const rotate = turn(unfolding.angle);
  return {
    corners: zone.corners.map(rotate),
    reciprocal: [rotate(zone.reciprocal[0]), rotate(zone.reciprocal[1])],
    points: path.labels.slice(0, -1).map((l) => ({ label: l.label, k: rotate([path.kpoints[2 * l.index], path.kpoints[2 * l.index + 1]]) })),
  };
}

/**
 * A square grid of side × side pixels over the primitive zone: pixel (column i, row j, row 0 at the top) has its
 * centre at kx = −reach + (i + ½)·h, ky = reach − (j + ½)·h, h = 2·reach/side, reach 2% beyond the zone's corners.
 * Only pixels whose centres lie in the zone are k-points, and of each pair ±k only the first: W(−k) = W(k) and
 * E(−k) = E(k), since H(−k) is the complex conjugate of H(k) for real hoppings (time reversal).
 */
export interface ZoneGrid {
  side: number;
  /** Half-width (Å⁻¹) of the square. */
  reach: number;
  /** The k-points computed (Å⁻¹, interleaved). */
  kpoints: Float64Array;
  /** Per pixel (row-major, row 0 at the top): the index of its k-point in `kpoints` (−k's for the second of a pair), or −1 outside the zone. */
  pixel: Int32Array;
}

export function zoneGrid(unfolding: Orientation, side: number): ZoneGrid {
  const { corners } = primitiveZone(unfolding);
  let radius = 0;
  for (const [x, y] of corners) radius = Math.max(radius, Math.hypot(x, y));
  const reach = 1.02 * radius;
  const h = (2 * reach) / side;
  const inside = (kx: number, ky: number) => {
    for (let c = 0; c < corners.length; c++) {
      const [x0, y0] = corners[c];
      const [x1, y1] = corners[(c + 1) % corners.length];
      // Left of every counter-clockwise edge (a hair of tolerance keeps the edges in).
      if ((x1 - x0) * (ky - y0) - (y1 - y0) * (kx - x0) < -1e-12 * radius * radius) return false;
    }
    return true;
  };
  const total = side * side;
  const pixel = new Int32Array(total).fill(-1);
  const points: number[] = [];
  for (let p = 0; p < total; p++) {
    const mirror = total - 1 - p;
    if (mirror < p) {
      pixel[p] = pixel[mirror];
      continue;
    }
    const i = p % side;
    const j = (p - i) / side;
    const kx = -reach + (i + 0.5) * h;
    const ky = reach - (j + 0.5) * h;
    if (!inside(kx, ky)) continue;
    pixel[p] = points.length / 2;
    points.push(kx, ky);
  }
  return { side, reach, kpoints: Float64Array.from(points), pixel };
}
