import { describe, expect, it } from 'vitest';
import type { Sheet } from '../../src/lattice/sheet.ts';
import { autoPath, cellType, specialPoints } from '../../src/tb/kspacePath.ts';
import { presetSheet } from './fixtures.ts';

const SQRT3 = Math.sqrt(3);

describe('cellType(cell)', () => {
  it('recognises the five 2D Bravais nets on the presets and on plain cells', () => {
    // α (3×3) and δ6, the honeycomb (√3×√3) are hexagonal; β12 is rectangular 3d × √3d (Feng et al., Nat. Chem. 8,
    // 563 (2016)); χ3's 5-site cell has a mirror but no right angle in its reduced basis: centred-rectangular.
    expect(cellType(presetSheet('delta6').cell)).toBe('hexagonal');
    expect(cellType(presetSheet('alpha').cell)).toBe('hexagonal');
    expect(cellType(presetSheet('honeycomb').cell)).toBe('hexagonal');
    expect(cellType(presetSheet('beta12').cell)).toBe('rectangular');
    expect(cellType(presetSheet('chi3').cell)).toBe('centred-rectangular');
    // The five 2D Bravais nets by their reduced cells (common practice): square |u| = |v| at 90°; oblique, no
    // equal lengths nor right angle (here |u| = 2, |v| ≈ 3.11, u·v = 0.6); centred rectangular when the projection
    // of v on u is half of u (u·v = |u|²/2 = 2 here: the net has a mirror line along u without a right angle).
    expect(cellType([[2, 0], [0, 2]])).toBe('square');
    expect(cellType([[2, 0], [0.3, 3.1]])).toBe('oblique');
    expect(cellType([[2, 0], [1, 3.1]])).toBe('centred-rectangular');
    // A skewed basis of the hexagonal net is still hexagonal after reduction: v − 3u = (1/2, √3/2) (common practice).
    expect(cellType([[1, 0], [3.5, SQRT3 / 2]])).toBe('hexagonal');
  });
});

describe('specialPoints(cell)', () => {
  it('puts M and K of the triangular lattice at 2π/(√3 d) and 4π/(3d) (hexagonal zone, common practice)', () => {
    const d = 1.69;
    const cell: Sheet['cell'] = [[d, 0], [d / 2, (SQRT3 / 2) * d]];
    const { points } = specialPoints(cell);
    expect(points.map((p) => p.label)).toEqual(['Γ', 'M', 'K', 'Γ']);
    expect(Math.hypot(...points[1].k)).toBeCloseTo((2 * Math.PI) / (SQRT3 * d), 12);
    expect(Math.hypot(...points[2].k)).toBeCloseTo((4 * Math.PI) / (3 * d), 12);
  });

  it('puts X, S, Y of a rectangular a × b cell at π/a, (π/a, π/b), π/b', () => {
    // The zone of a rectangular net is the rectangle |kx| ≤ π/a, |ky| ≤ π/b: X, S, Y are its edge midpoints and
    // corner (common practice; labels as Setyawan & Curtarolo, Comput. Mater. Sci. 49, 299 (2010), for the
    // orthorhombic zone's kz = 0 face).
    const { points } = specialPoints([[2, 0], [0, 5]]);
    expect(points.map((p) => p.label)).toEqual(['Γ', 'X', 'S', 'Y', 'Γ']);
    expect(points[1].k[0]).toBeCloseTo(Math.PI / 2, 12);
    expect(points[2].k[0]).toBeCloseTo(Math.PI / 2, 12);
    expect(points[2].k[1]).toBeCloseTo(Math.PI / 5, 12);
    expect(points[3].k[1]).toBeCloseTo(Math.PI / 5, 12);
  });

  it('puts zone corners equidistant from Γ and the two neighbouring reciprocal vectors (Wigner–Seitz construction)', () => {
    const cell: Sheet['cell'] = [[2, 0], [0.3, 3.1]];
    const { points } = specialPoints(cell);
    // Label order: our own choice for oblique and centred-rectangular zones (src/tb/kspacePath.ts), following the
    // X/Y/C/H names of Setyawan & Curtarolo (2010) for the monoclinic zone — a regression guard on that choice.
    expect(points.map((p) => p.label)).toEqual(['Γ', 'X', 'H1', 'Y', 'H2', 'C', 'Γ']);
    const [x, h1, y] = [points[1].k, points[2].k, points[3].k];
    const g1: [number, number] = [2 * x[0], 2 * x[1]];
    const g2: [number, number] = [2 * y[0], 2 * y[1]];
    const r0 = Math.hypot(...h1);
    expect(Math.hypot(h1[0] - g1[0], h1[1] - g1[1])).toBeCloseTo(r0, 12);
    expect(Math.hypot(h1[0] - g2[0], h1[1] - g2[1])).toBeCloseTo(r0, 12);
  });
});

describe('autoPath(cell, points)', () => {
  it('has P points, labels at segment ends, increasing distance and steps spread by length', () => {
    const path = autoPath(presetSheet('alpha').cell, 300);
    expect(path.count).toBe(300);
    expect(path.kpoints.length).toBe(600);
    expect(path.labels.map((l) => l.label)).toEqual(['Γ', 'M', 'K', 'Γ']);
    expect(path.labels[0].index).toBe(0);
    expect(path.labels[3].index).toBe(299);
    for (let i = 1; i < path.count; i++) expect(path.distance[i]).toBeGreaterThan(path.distance[i - 1]);
    // Cumulative distance equals the sum of |Δk|.
    let sum = 0;
    for (let i = 1; i < path.count; i++) {
      sum += Math.hypot(path.kpoints[2 * i] - path.kpoints[2 * i - 2], path.kpoints[2 * i + 1] - path.kpoints[2 * i - 1]);
    }
    expect(path.distance[299]).toBeCloseTo(sum, 10);
    // Steps of all segments agree to within one step's share of rounding.
    const steps = path.labels.slice(1).map((l, s) => (path.distance[l.index] - path.distance[path.labels[s].index]) / (l.index - path.labels[s].index));
    expect(Math.max(...steps) / Math.min(...steps)).toBeLessThan(1.05);
  });

  it('allows one step per segment at the fewest points and refuses fewer', () => {
    const path = autoPath(presetSheet('beta12').cell, 5);
    expect(path.labels.map((l) => l.index)).toEqual([0, 1, 2, 3, 4]);
    expect(() => autoPath(presetSheet('beta12').cell, 4)).toThrow(/invalid points: 4/);
  });
});
