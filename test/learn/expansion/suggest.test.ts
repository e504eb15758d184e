/**
 * suggestNext(candidates, options): the stated criterion — ground states of the fit not computed first (deepest
 * below the hull of the calculations first), then the least certain within the window of the fit's hull; never a
 * computed pattern, an extrapolation, or two patterns the clusters cannot tell apart. These check our own stated
 * rule (regression guards of the criterion), not an outside fact.
 */
import { describe, expect, it } from 'vitest';
import { suggestNext, type SuggestionCandidate } from '../../../src/learn/expansion/suggest.ts';

const pattern = { bond: 1.69, supercell: { a: 1, b: 0, c: 1 }, vacancies: [] as [number, number][] };
let made = 0;
function candidate(part: Partial<SuggestionCandidate>): SuggestionCandidate & { id: number } {
  return { pattern, eta: 0.1 + 0.001 * made, energyPerSite: -5 - 0.001 * made, aboveHull: 0.001, aboveFitHull: 0.001, fitGroundState: false, uncertainty: 0.001, computed: false, ...part, id: made++ };
}

describe('suggestNext', () => {
  it('orders ground states of the fit by depth below the hull, then near ones by uncertainty, up to the count (the criterion in suggest.ts)', () => {
    const shallow = candidate({ fitGroundState: true, aboveHull: -0.001, aboveFitHull: 0 });
    const deep = candidate({ fitGroundState: true, aboveHull: -0.004, aboveFitHull: 0 });
    const sure = candidate({ aboveFitHull: 0.002, uncertainty: 0.0005 });
    const unsure = candidate({ aboveFitHull: 0.003, uncertainty: 0.002 });
    const far = candidate({ aboveFitHull: 0.05, uncertainty: 0.01 });
    const out = suggestNext([sure, far, shallow, unsure, deep], { count: 4, window: 0.004 });
    expect(out.map((s) => (s.candidate as { id: number }).id)).toEqual([deep.id, shallow.id, unsure.id, sure.id]);
    expect(out.map((s) => s.reason)).toEqual(['ground-state', 'ground-state', 'uncertain', 'uncertain']);
    expect(out[0].why).toMatch(/4\.0 meV\/site below the hull of your calculations/);
    expect(out[2].why).toMatch(/within 2 × CV \(4\.0 meV\/site\)/);
    expect(suggestNext([sure, far, shallow, unsure, deep], { count: 1, window: 0.004 }).length).toBe(1);
  });

  it('never suggests a computed pattern or one outside the calculations\' η range (an extrapolation)', () => {
    const computed = candidate({ fitGroundState: true, aboveHull: -0.01, computed: true });
    const outside = candidate({ aboveHull: NaN, aboveFitHull: NaN, uncertainty: 1 });
    expect(suggestNext([computed, outside], { count: 5, window: 1 })).toEqual([]);
  });

  it('suggests one of two patterns with equal η, prediction and uncertainty (equal correlations)', () => {
    const one = candidate({ aboveFitHull: 0.001, uncertainty: 0.003 });
    const twin = { ...one, id: -1 };
    expect(suggestNext([one, twin], { count: 5, window: 0.01 }).length).toBe(1);
  });
});
