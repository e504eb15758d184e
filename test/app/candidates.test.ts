import { describe, expect, it } from 'vitest';
import { findCandidates, sortCandidates } from '../../src/app/candidates.ts';

describe('findCandidates(search, bond)', () => {
  it('a measured 5.1 × 2.95 Å rectangle at d = 1.69 Å picks the β12 cell (√3d × 3d; Feng et al., Nat. Chem. 8, 563 (2016))', () => {
    const list = findCandidates({ sites: [1, 12], holes: [1, 3], isolated: true, cell: { a: 5.1, b: 2.95, gamma: 90, lengthTolerance: 0.15, angleTolerance: 3 } }, 1.69);
    expect(list.candidates.map((c) => c.phase)).toContain('beta12');
    for (const c of list.candidates) {
      // Reduced cell lengths a ≤ b: the rectangle's sides √3·1.69 = 2.927 and 3·1.69 = 5.07 Å (geometry of the lattice).
      expect(Math.abs(c.lattice.a - 2.95)).toBeLessThanOrEqual(0.15);
      expect(Math.abs(c.lattice.b - 5.1)).toBeLessThanOrEqual(0.15);
    }
  });

  it('lists every isolated-hole pattern of up to 9 sites once (regression guard on the enumerator\u2019s counts)', () => {
    const list = findCandidates({ sites: [1, 9], holes: [1, 9], isolated: true }, 1.69);
    // Per N = 3…9: 1, 2, 1, 2, 2+1, 4+2, 3+4 — the enumerator's counts, which test/enumerate checks against an
    // independent torus brute force.
    expect(list.matched).toBe(1 + 2 + 1 + 2 + 3 + 6 + 7);
  });

  it('orders by band energy within equal η, unranked last', () => {
    const list = findCandidates({ sites: [1, 9], holes: [1, 2], isolated: true }, 1.69).candidates;
    list.forEach((c, index) => (c.bandEnergy = index % 2 === 0 ? -index : undefined));
    const sorted = sortCandidates(list, 'band');
    for (let i = 1; i < sorted.length; i++) {
      expect(sorted[i].eta).toBeGreaterThanOrEqual(sorted[i - 1].eta);
      if (sorted[i].eta === sorted[i - 1].eta && sorted[i].bandEnergy !== undefined) {
        expect(sorted[i - 1].bandEnergy).toBeLessThanOrEqual(sorted[i].bandEnergy!);
      }
    }
  });
});
