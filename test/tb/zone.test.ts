import { describe, expect, it } from 'vitest';
import type { Sheet, Vec2 } from '../../src/lattice/sheet.ts';
import { brillouinZone } from '../../src/tb/zone.ts';
import { presetSheet } from './fixtures.ts';

const SQRT3 = Math.sqrt(3);

/** Shoelace area, positive for counter-clockwise corners. */
function area(corners: Vec2[]): number {
  let sum = 0;
  corners.forEach((p, i) => {
    const q = corners[(i + 1) % corners.length];
    sum += p[0] * q[1] - p[1] * q[0];
  });
  return sum / 2;
}

function cellArea(cell: Sheet['cell']): number {
  return Math.abs(cell[0][0] * cell[1][1] - cell[0][1] * cell[1][0]);
}

/** Every corner is as close to Γ as to the nearest other reciprocal lattice point (definition of the zone). */
function onZoneBoundary(corner: Vec2, b: [Vec2, Vec2]): boolean {
  const r0 = Math.hypot(corner[0], corner[1]);
  let nearest = Infinity;
  for (let i = -3; i <= 3; i++) {
    for (let j = -3; j <= 3; j++) {
      if (i === 0 && j === 0) continue;
      const g: Vec2 = [i * b[0][0] + j * b[1][0], i * b[0][1] + j * b[1][1]];
      nearest = Math.min(nearest, Math.hypot(corner[0] - g[0], corner[1] - g[1]));
    }
  }
  return Math.abs(nearest - r0) <= 1e-9 * r0;
}

describe('brillouinZone(cell)', () => {
  it('is the hexagon with corners K at |K| = 4π/(3d) for the triangular lattice (analytic)', () => {
    const d = 1.69;
    const zone = brillouinZone([[d, 0], [d / 2, (SQRT3 / 2) * d]]);
    expect(zone.corners).toHaveLength(6);
    for (const c of zone.corners) expect(Math.hypot(...c)).toBeCloseTo((4 * Math.PI) / (3 * d), 12);
    // Reciprocal-cell area (2π)²/A_cell (analytic).
    expect(area(zone.corners)).toBeCloseTo((4 * Math.PI ** 2) / ((SQRT3 / 2) * d * d), 10);
  });

  it('is a square of corners (±π/a, ±π/a) for a square cell and a rectangle for a rectangular one (analytic)', () => {
    const square = brillouinZone([[2, 0], [0, 2]]);
    expect(square.corners).toHaveLength(4);
    for (const c of square.corners) {
      expect(Math.abs(c[0])).toBeCloseTo(Math.PI / 2, 12);
      expect(Math.abs(c[1])).toBeCloseTo(Math.PI / 2, 12);
    }
    const rectangle = brillouinZone([[2, 0], [0, 5]]);
    expect(rectangle.corners).toHaveLength(4);
    expect(area(rectangle.corners)).toBeCloseTo((4 * Math.PI ** 2) / 10, 10);
    // β12 is rectangular 3d × √3d (Feng et al., Nat. Chem. 8, 563 (2016)).
    expect(brillouinZone(presetSheet('beta12').cell).corners).toHaveLength(4);
  });

  it('is a hexagon of area (2π)²/A on the zone boundary for oblique cells, counter-clockwise', () => {
    for (const cell of [[[2, 0], [0.3, 3.1]], [[1.3, 0.4], [-2.2, 2.9]], [[2, 0], [1, 3.1]]] as Sheet['cell'][]) {
      const zone = brillouinZone(cell);
      expect(zone.corners).toHaveLength(6);
      expect(area(zone.corners)).toBeCloseTo((4 * Math.PI ** 2) / cellArea(cell), 9);
      for (const c of zone.corners) expect(onZoneBoundary(c, zone.reciprocal)).toBe(true);
    }
  });

  it('returns b1, b2 with b_i·a_j = 2π·δ_ij for the reduced cell of the presets (definition)', () => {
    for (const name of ['alpha', 'chi3', 'honeycomb']) {
      const zone = brillouinZone(presetSheet(name).cell);
      expect(area(zone.corners)).toBeGreaterThan(0);
      const [b1, b2] = zone.reciprocal;
      const cross = Math.abs(b1[0] * b2[1] - b1[1] * b2[0]);
      expect(cross).toBeCloseTo((4 * Math.PI ** 2) / cellArea(presetSheet(name).cell), 9);
      for (const c of zone.corners) expect(onZoneBoundary(c, zone.reciprocal)).toBe(true);
    }
  });
});
