/**
 * The primitive triangular lattice's zone for unfolding, in the sheet's frame: the path Γ–M–K–Γ, the hexagonal
 * zone, and the square grid of k-points over it on which constant-energy cuts are drawn.
 *
 * Everything is that of the one-site cell a1 = d·(1, 0), a2 = d·(1/2, √3/2) (src/lattice/triangular.ts) turned by
 * the unfolding's angle. The special points are fixed here, not left to a reduction's tie-breaking (a pattern is
 * seldom symmetric under the turns that make the six M, or K, equivalent for the one-site lattice): M = (π/d)·(1, 1/√3),
 * the middle of the zone edge at 30° (|M| = 2π/(√3·d)), and K = (4π/(3d), 0), the zone corner along a1 (common
 * practice for the triangular lattice's zone).
 */
import type { Vec2 } from '../lattice/sheet.ts';
import { pathThrough, type KPath } from './kspacePath.ts';
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

/** Γ, M, K (Å⁻¹) of the one-site lattice of spacing d with a1 along +x. */
function specialPoints(bond: number): { label: string; k: Vec2 }[] {
  return [
    { label: 'Γ', k: [0, 0] },
    { label: 'M', k: [Math.PI / bond, Math.PI / (Math.sqrt(3) * bond)] },
    { label: 'K', k: [(4 * Math.PI) / (3 * bond), 0] },
  ];
}

/** The path Γ–M–K–Γ of the primitive lattice with `points` points (at least 4), in the sheet's frame. */
export function primitivePath(unfolding: Orientation, points: number): KPath {
  const rotate = turn(unfolding.angle);
  const corners = specialPoints(unfolding.bond).map((p) => ({ label: p.label, k: rotate(p.k) }));
  return pathThrough([...corners, corners[0]], points, 'hexagonal');
}

/** The primitive zone (hexagon corners counter-clockwise, b1, b2) and its special points, in the sheet's frame. */
export function primitiveZone(unfolding: Orientation): BrillouinZone & { points: { label: string; k: Vec2 }[] } {
  const zone = brillouinZone(oneSiteCell(unfolding.bond));
  const rotate = turn(unfolding.angle);
  return {
    corners: zone.corners.map(rotate),
    reciprocal: [rotate(zone.reciprocal[0]), rotate(zone.reciprocal[1])],
    points: specialPoints(unfolding.bond).map((p) => ({ label: p.label, k: rotate(p.k) })),
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

/** `pad`: pixels whose centres lie up to this many pixels outside the zone count too (a picture clipped to the zone then has no empty rim). */
export function zoneGrid(unfolding: Orientation, side: number, pad = 0): ZoneGrid {
  const { corners } = primitiveZone(unfolding);
  let radius = 0;
  for (const [x, y] of corners) radius = Math.max(radius, Math.hypot(x, y));
  const reach = 1.02 * radius;
  const h = (2 * reach) / side;
  const inside = (kx: number, ky: number) => {
    for (let c = 0; c < corners.length; c++) {
      const [x0, y0] = corners[c];
      const [x1, y1] = corners[(c + 1) % corners.length];
      // Left of every counter-clockwise edge, less the pad (a hair of tolerance keeps the edges in).
      const edge = Math.hypot(x1 - x0, y1 - y0);
      if ((x1 - x0) * (ky - y0) - (y1 - y0) * (kx - x0) < -(pad * h + 1e-12 * radius) * edge) return false;
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
