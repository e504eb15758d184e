import { describe, expect, it } from 'vitest';
import { holeDensity } from '../../src/lattice/pattern.ts';
import { SHEET_PRESETS } from '../../src/lattice/presets.ts';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { estimateHoleDensity } from '../../src/tb/holeDensity.ts';
import { rotateSheet } from './fixtures.ts';

describe('estimateHoleDensity(sheet)', () => {
  it('recovers η of every preset pattern from its geometry alone, rotated or not', () => {
    // η = vacancies / sites (DESIGN.md conventions) against 1 − atoms·(√3/2)d²/area for unstrained sheets.
    for (const preset of SHEET_PRESETS) {
      const sheet = patternToSheet(preset.pattern);
      const estimate = estimateHoleDensity(sheet);
      expect(estimate.estimated).toBe(true);
      expect(estimate.holeDensity).toBeCloseTo(holeDensity(preset.pattern), 10);
      expect(estimate.nearestNeighbour).toBeCloseTo(preset.pattern.bond, 10);
      expect(estimateHoleDensity(rotateSheet(sheet, 0.7)).holeDensity).toBeCloseTo(holeDensity(preset.pattern), 10);
    }
  });
});
