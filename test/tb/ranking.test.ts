import { describe, expect, it } from 'vitest';
import { makePattern } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { rankByBandEnergy } from '../../src/tb/ranking.ts';
import { HARRISON_1980 } from './fixtures.ts';

describe('rankByBandEnergy(patterns, params, options)', () => {
  it('groups by hole density, sorts each group by band energy per atom and says the comparison is within one η', () => {
    const alpha = findSheetPreset('alpha')?.pattern;
    const delta6 = findSheetPreset('delta6')?.pattern;
    if (!alpha || !delta6) throw new Error('presets');
    // Another isolated-hole pattern at η = 1/9: cell 9a1, 3a1 + a2, hole images at least √7·d apart (our example).
    const stripe = makePattern({ bond: 1.69, supercell: [[9, 0], [3, 1]], vacancies: [[0, 0]] });
    const result = rankByBandEnergy(
      [{ name: 'stripe', pattern: stripe }, { name: 'delta6', pattern: delta6 }, { name: 'alpha', pattern: alpha }],
      HARRISON_1980, { mesh: 12 },
    );
    expect(result.parameters).toBe('harrison1980');
    // η: δ6 has no holes (η = 0) and α one hole in a 3×3 cell, η = 1/9 (Tang & Ismail-Beigi, PRL 99, 115501
    // (2007)); the stripe has 1 hole in 9 sites by construction.
    expect(result.groups.map((g) => g.holeDensity)).toEqual([0, 1 / 9]);
    const group = result.groups[1];
    expect(group.patterns.map((p) => p.name).sort()).toEqual(['alpha', 'stripe']);
    expect(group.patterns[0].bandEnergyPerAtom).toBeLessThanOrEqual(group.patterns[1].bandEnergyPerAtom);
    expect(group.patterns[0].aboveLowest).toBe(0);
    expect(result.note).toMatch(/not across η/);
  });
});
