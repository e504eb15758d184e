import { describe, expect, it } from 'vitest';
import { canonicalForm } from '../../src/enumerate/canonical.ts';
import { enumerateStructures } from '../../src/enumerate/enumerate.ts';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { analysePicture } from '../../src/stm/analyse.ts';
import { matchPatterns } from '../../src/stm/match.ts';
import { PARAMS, syntheticPicture } from './helpers.ts';

/** The n-th isolated 12-site, 2-hole structure in the enumerator's order. */
function twelve(n: number) {
  return [...enumerateStructures({ sites: [12, 12], holes: [2, 2], isolated: true })][n].pattern;
}

// Synthetic measured pictures made here from the model of a known pattern, rotated, with the pixel size told to
// `match` 3 % off, a background tilt several times the corrugation and Gaussian noise; `match` must name the pattern.
const cases = [
  { name: 'alpha (N = 9, one hole)', pattern: findSheetPreset('alpha')!.pattern, angleDeg: 23, sites: [8, 10] as [number, number], noise: 0.5 },
  { name: 'a 12-site cell with two holes (the enumerator\'s fifth)', pattern: twelve(4), angleDeg: -71, sites: [10, 12] as [number, number], noise: 0.5 },
  // chi3's model picture is nearly stripes: its second direction's peaks are ~400× weaker, so less noise.
  { name: 'chi3 (N = 5)', pattern: findSheetPreset('chi3')!.pattern, angleDeg: 104, sites: [4, 8] as [number, number], noise: 0.25 },
];

describe('matchPatterns(analysis, options)', () => {
  for (const c of cases) {
    it(`names ${c.name} from a rotated, tilted, noisy (σ = ${c.noise} of the corrugation) synthetic picture with a 3 % pixel-size error`, () => {
      const truePixel = 0.21;
      const picture = syntheticPicture(patternToSheet(c.pattern), { pixels: 256, pixelSize: truePixel, angleDeg: c.angleDeg, tilt: 4, noise: c.noise, seed: 11 });
      const analysis = analysePicture({ ...picture, pixelSize: truePixel * 1.03 });
      expect(analysis.ok).toBe(true);
      if (!analysis.ok) return;
      const result = matchPatterns(analysis, { parameters: PARAMS, sites: c.sites, top: 3 });
      expect(result.candidates.length).toBeGreaterThan(0);
      const best = result.candidates[0];
      expect(best.structure.canonical).toBe(canonicalForm(c.pattern));
      expect(best.score).toBeGreaterThan(0.9);
      if (result.candidates.length > 1) expect(best.score - result.candidates[1].score).toBeGreaterThan(0.05);
      expect(best.scale).toBeCloseTo(1.03, 1);
    });
  }
});
