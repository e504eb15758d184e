/**
 * clusterSet(options), neighbourShells(count): the cluster orbits of the triangular lattice against its geometry.
 */
import { describe, expect, it } from 'vitest';
import { clusterSet, MAX_PAIR_SHELLS, MAX_TRIPLET_SHELLS, neighbourShells } from '../../../src/learn/expansion/clusters.ts';
import { latticePoint } from '../../../src/lattice/triangular.ts';

describe('neighbourShells(count)', () => {
  it('lies at 1, √3, 2, √7, 3, √12, √13, 4 lattice spacings (geometry: i² + ij + j², the Löschian numbers; common practice)', () => {
    expect(neighbourShells(8).map((s) => s.squared)).toEqual([1, 3, 4, 7, 9, 12, 13, 16]);
    for (const shell of neighbourShells(8)) {
      const [x, y] = latticePoint(shell.vector[0], shell.vector[1], 1);
      expect(x * x + y * y).toBeCloseTo(shell.squared, 12); // the vector's Cartesian length (independent route)
    }
  });

  it('has 6 neighbours in each of the first three shells, 12 at √7 and 6 at 3 (triangular-lattice geometry; common practice)', () => {
    expect(neighbourShells(5).map((s) => s.neighbours)).toEqual([6, 6, 6, 12, 6]);
  });

  it('counts the neighbours a brute-force count of Cartesian distances gives, shell by shell (independent route)', () => {
    const shells = neighbourShells(MAX_PAIR_SHELLS);
    const counts = new Map<number, number>();
    for (let i = -12; i <= 12; i++) {
      for (let j = -12; j <= 12; j++) {
        const [x, y] = latticePoint(i, j, 1);
        const q = Math.round(x * x + y * y);
        if (q > 0) counts.set(q, (counts.get(q) ?? 0) + 1);
      }
    }
    for (const shell of shells) expect(counts.get(shell.squared), `√${shell.squared}`).toBe(shell.neighbours);
  });
});

describe('clusterSet(options)', () => {
  it('the default set (pairs to shell 3, no triplets): empty, point, three pair orbits of 3 pairs per site each', () => {
    const set = clusterSet({ pairShells: 3, tripletShells: 0 });
    expect(set.orbits.map((o) => [o.kind, o.shell, o.perSite])).toEqual([
      ['empty', 0, 1], ['point', 0, 1], ['pair', 1, 3], ['pair', 2, 3], ['pair', 3, 3],
    ]);
    // Pairs per site = neighbours / 2: every pair has two ends (common practice).
    expect(set.orbits.slice(2).map((o) => 2 * o.perSite)).toEqual(neighbourShells(3).map((s) => s.neighbours));
  });

  it('nearest-neighbour triangles: 2 per site, up and down (Euler: a triangulated torus has F = 2V; common practice)', () => {
    const set = clusterSet({ pairShells: 0, tripletShells: 1 });
    const triangles = set.orbits.filter((o) => o.kind === 'triplet');
    expect(triangles.map((o) => [o.edges, o.perSite])).toEqual([[[1, 1, 1], 2]]);
  });

  it('triplets within shell 2: equilateral 1-1-1 and √3-√3-√3 (2 per site each) and the bent 1-1-√3 (6 per site: one per pair of nearest-neighbour steps 120° apart at its apex) — geometry', () => {
    const set = clusterSet({ pairShells: 0, tripletShells: 2 });
    expect(set.orbits.filter((o) => o.kind === 'triplet').map((o) => [o.name, o.perSite])).toEqual([
      ['triplet 1-1-1', 2], ['triplet 1-1-2', 6], ['triplet 2-2-2', 2],
    ]);
  });

  it('every figure is a cluster of the orbit: its edges have the orbit\'s lengths, in every figure alike (invariant)', () => {
    const set = clusterSet({ pairShells: MAX_PAIR_SHELLS, tripletShells: MAX_TRIPLET_SHELLS });
    const names = new Set(set.orbits.map((o) => o.name));
    expect(names.size).toBe(set.orbits.length);
    for (const orbit of set.orbits) {
      const lengths = new Set<string>();
      const keys = new Set<string>();
      for (let f = 0; f < orbit.perSite; f++) {
        const points = Array.from({ length: orbit.size }, (_, t) => {
          const k = orbit.figures[f * orbit.size + t];
          return [set.offsets[2 * k], set.offsets[2 * k + 1]];
        });
        keys.add(JSON.stringify(points));
        const edges: number[] = [];
        for (let s = 0; s < points.length; s++) {
          for (let t = s + 1; t < points.length; t++) {
            const [x, y] = latticePoint(points[t][0] - points[s][0], points[t][1] - points[s][1], 1);
            edges.push(Math.round(1e6 * (x * x + y * y)));
          }
        }
        lengths.add(JSON.stringify(edges.sort((p, q) => p - q)));
      }
      expect(lengths.size, orbit.name).toBe(Math.min(1, orbit.perSite));
      expect(keys.size, `${orbit.name}: figures distinct`).toBe(orbit.perSite);
    }
  });
});
