import { describe, expect, it } from 'vitest';
import { buildQuotient } from '../../src/enumerate/quotient.ts';
import { LabelingSearch } from '../../src/enumerate/search.ts';
import { stabiliser } from '../../src/enumerate/supercells.ts';
import { hnfsOfIndex, siteIndex, type Hnf } from '../../src/lattice/hnf.ts';
import { apply, POINT_GROUP_6MM } from '../../src/lattice/triangular.ts';

/** Labelings with k holes found by one search over all branches (superperiodic ones too when asked). */
function searchCounts(h: Hnf, superperiodic: boolean, isolated = false): number[] {
  const n = h.a * h.c;
  const wanted = new Uint8Array(n + 1).fill(1);
  const counts = new Array(n + 1).fill(0);
  const search = new LabelingSearch(buildQuotient(h), { maxHoles: n, wanted, isolated, branch: new Uint8Array(n).fill(1), superperiodic });
  while (search.next()) counts[search.size]++;
  return counts;
}

/**
 * Orbits of k-subsets of the n sites under x ↦ O·x + t (O in the stabiliser, t any site), by Burnside's lemma
 * (Cauchy–Frobenius): the average over the group of the subsets each element fixes, which for a permutation with
 * cycle lengths ℓ is the x^k coefficient of Π (1 + x^ℓ). Computed from lattice arithmetic only.
 */
function burnsideCounts(h: Hnf): number[] {
  const n = h.a * h.c;
  const total = new Array(n + 1).fill(0);
  const ops = stabiliser(h);
  for (const opIndex of ops) {
    for (let t = 0; t < n; t++) {
      const image = (s: number) => {
        const [i, j] = apply(POINT_GROUP_6MM[opIndex], s % h.a, Math.floor(s / h.a));
        return siteIndex(h, i + (t % h.a), j + Math.floor(t / h.a));
      };
      let poly = [1];
      const seen = new Uint8Array(n);
      for (let s = 0; s < n; s++) {
        if (seen[s]) continue;
        let length = 0;
        for (let x = s; !seen[x]; x = image(x)) {
          seen[x] = 1;
          length++;
        }
        const next = new Array(poly.length + length).fill(0);
        poly.forEach((c, e) => {
          next[e] += c;
          next[e + length] += c;
        });
        poly = next;
      }
      poly.forEach((c, e) => (total[e] += c));
    }
  }
  return total.map((x) => x / (ops.length * n));
}

describe('LabelingSearch(quotient, plan)', () => {
  it('finds one labeling per orbit of each supercell of index ≤ 12, k ≥ 1, as Burnside\'s lemma counts them', () => {
    for (let n = 1; n <= 12; n++) {
      for (const h of hnfsOfIndex(n)) {
        const expected = burnsideCounts(h);
        expected[0] = 0; // the empty labeling is not searched
        expect(searchCounts(h, true)).toEqual(expected);
      }
    }
  });

  it('skips superperiodic labelings unless asked: the fully vacant cell of 4 sites has period 1', () => {
    const h = { a: 2, b: 0, c: 2 };
    expect(searchCounts(h, true)[4]).toBe(1);
    expect(searchCounts(h, false)[4]).toBe(0);
  });

  it('finds nothing isolated beyond N/3 holes per cell (close packing of isolated vacancies: η ≤ 1/3, common practice)', () => {
    const cells = hnfsOfIndex(12).filter((h) => !buildQuotient(h).selfNeighbour);
    expect(cells.length).toBeGreaterThan(0);
    for (const h of cells) {
      const counts = searchCounts(h, true, true);
      expect(counts.slice(5)).toEqual(new Array(8).fill(0));
    }
  });

  it('starts every labeling at site 0 and keeps it ascending', () => {
    const h = { a: 4, b: 1, c: 2 };
    const n = 8;
    const search = new LabelingSearch(buildQuotient(h), { maxHoles: 4, wanted: new Uint8Array(5).fill(1), isolated: false, branch: new Uint8Array(n).fill(1) });
    while (search.next()) {
      expect(search.holes[0]).toBe(0);
      for (let t = 1; t < search.size; t++) expect(search.holes[t]).toBeGreaterThan(search.holes[t - 1]);
    }
  });
});
