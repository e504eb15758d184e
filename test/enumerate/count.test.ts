import { describe, expect, it } from 'vitest';
import { countStructures } from '../../src/enumerate/count.ts';
import { enumerateStructures } from '../../src/enumerate/enumerate.ts';
import type { EnumerateOptions } from '../../src/enumerate/types.ts';

// OEIS A003051 (Bernstein, Sloane & Wright, Discrete Math. 170, 29 (1997)): a structure with one hole per cell
// is its supercell lattice, so one-hole structures are the inequivalent supercells.
const A003051 = [1, 1, 2, 3, 2, 3, 3, 5, 4, 4, 3, 8, 4, 5, 6, 9, 4, 8, 5, 10];

const countOf = (rows: ReturnType<typeof countStructures>, sites: number, holes: number) =>
  rows.find((r) => r.sites === sites && r.holes === holes)?.structures;

describe('countStructures(options)', () => {
  it('gives one row per (N, k), K1 ≤ k ≤ min(K2, N), ordered, zeros included', () => {
    const rows = countStructures({ sites: [2, 4], holes: [1, 3] });
    expect(rows.map((r) => [r.sites, r.holes])).toEqual([[2, 1], [2, 2], [3, 1], [3, 2], [3, 3], [4, 1], [4, 2], [4, 3]]);
    expect(countOf(rows, 2, 2)).toBe(0); // the fully vacant 2-site cell has period 1
  });

  it('counts one-hole structures as the inequivalent supercells, OEIS A003051, N = 1…20', () => {
    const rows = countStructures({ sites: [1, 20], holes: [1, 1] });
    expect(rows.map((r) => r.structures)).toEqual(A003051);
  });

  it('is symmetric without constraints, a(N, k) = a(N, N − k), N ≤ 16 (exchanging holes and atoms; Hart & Forcade 2008)', () => {
    const rows = countStructures({ sites: [1, 16], holes: [0, 16] });
    for (const r of rows) expect(r.structures).toBe(countOf(rows, r.sites, r.sites - r.holes));
  });

  it('has a single structure at k = 0, the filled lattice at N = 1, isolated or not (common practice)', () => {
    for (const isolated of [false, true]) {
      const rows = countStructures({ sites: [1, 8], holes: [0, 0], isolated });
      expect(rows.map((r) => r.structures)).toEqual([1, 0, 0, 0, 0, 0, 0, 0]);
    }
  });

  it('agrees with the listing for every option set', () => {
    const cases: EnumerateOptions[] = [
      { sites: [1, 12], holes: [0, 12] },
      { sites: [1, 18], holes: [0, 5], isolated: true },
      { sites: [4, 14], holes: [2, 6], holeDensity: [0.15, 0.3], maxElongation: 2 },
    ];
    for (const options of cases) {
      const tally = new Map<string, number>();
      for (const s of enumerateStructures(options)) tally.set(`${s.sites}/${s.holes}`, (tally.get(`${s.sites}/${s.holes}`) ?? 0) + 1);
      for (const r of countStructures(options)) expect(r.structures).toBe(tally.get(`${r.sites}/${r.holes}`) ?? 0);
    }
  });

  it('reports rows only for k/N inside a hole-density range (η = vacancies / sites, DESIGN.md conventions)', () => {
    const rows = countStructures({ sites: [1, 12], holes: [0, 12], holeDensity: [0.15, 0.2] });
    expect(rows.length).toBeGreaterThan(0);
    for (const r of rows) {
      expect(r.holes / r.sites).toBeGreaterThanOrEqual(0.15 - 1e-12);
      expect(r.holes / r.sites).toBeLessThanOrEqual(0.2 + 1e-12);
    }
    expect(rows).toContainEqual({ sites: 6, holes: 1, structures: 3 }); // one hole in 6 sites: A003051(6) = 3
  });

  it('reports progress ending at fraction 1 with the total found', () => {
    let last = { examined: 0, found: 0, fraction: 0 };
    const rows = countStructures({ sites: [1, 24], holes: [0, 5], isolated: true, onProgress: (p) => (last = { ...p }) });
    expect(last.fraction).toBe(1);
    expect(last.found).toBe(rows.reduce((sum, r) => sum + r.structures, 0));
    expect(last.examined).toBeGreaterThan(last.found);
  });
});
