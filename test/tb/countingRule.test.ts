import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { countingRuleDoping, countingRuleHoleDensity } from '../../src/tb/countingRule.ts';

describe('countingRuleDoping(η) and countingRuleHoleDensity(δ)', () => {
  it('give 0 for α, 1/5 for β12, 1/3 for χ3 and 1 for the honeycomb (electron-counting rule, common practice in the field)', () => {
    // δ = 8/(3(1 − η)) − 3 at η = 1/9, 1/6, 1/5, 1/3; the honeycomb value is the MgB2 count of 4 electrons per B.
    expect(countingRuleDoping(1 / 9)).toBeCloseTo(0, 14);
    expect(countingRuleDoping(1 / 6)).toBeCloseTo(1 / 5, 14);
    expect(countingRuleDoping(1 / 5)).toBeCloseTo(1 / 3, 14);
    expect(countingRuleDoping(1 / 3)).toBeCloseTo(1, 14);
    expect(countingRuleDoping(0)).toBeCloseTo(-1 / 3, 14);
    expect(countingRuleHoleDensity(0)).toBeCloseTo(1 / 9, 14);
    expect(countingRuleHoleDensity(1)).toBeCloseTo(1 / 3, 14);
  });

  it('are inverse to each other', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 0.9, noNaN: true }), (eta) =>
      Math.abs(countingRuleHoleDensity(countingRuleDoping(eta)) - eta) < 1e-12));
  });
});
