import { describe, expect, it } from 'vitest';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { reducedPeriodicity } from '../../src/lattice/periodicity.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { analysePicture } from '../../src/stm/analyse.ts';
import { stmPicture } from '../../src/stm/stmImage.ts';
import { PARAMS, mulberry32 } from './helpers.ts';

describe('analysePicture(picture)', () => {
  // Bloch's theorem: the LDOS, hence the picture, has exactly the sheet's periodicity, so the FFT lattice must be the
  // sheet's reduced cell (src/lattice/periodicity.ts).
  for (const name of ['alpha', 'beta12', 'chi3']) {
    it(`the FFT lattice of the simulated picture of ${name} is the sheet's reduced cell (Bloch's theorem)`, () => {
      const sheet = patternToSheet(findSheetPreset(name)!.pattern);
      const { picture } = stmPicture(new TightBindingModel(sheet, PARAMS), { pixels: 256, cells: 10, mesh: 12 });
      const result = analysePicture(picture);
      expect(result.ok).toBe(true);
      if (!result.ok) return;
      const cell = reducedPeriodicity(sheet.cell);
      const { a, b, gammaDeg, aError, bError, gammaDegError } = result.lattice;
      expect(Math.abs(a - cell.a)).toBeLessThan(Math.max(4 * aError, 2e-3 * cell.a));
      expect(Math.abs(b - cell.b)).toBeLessThan(Math.max(4 * bError, 2e-3 * cell.b));
      expect(Math.abs(gammaDeg - cell.gammaDeg)).toBeLessThan(Math.max(4 * gammaDegError, 0.2));
      expect(aError).toBeLessThan(0.01 * a);
    });
  }

  it('refuses white noise as having no periodicity, and a flat picture as flat', () => {
    const random = mulberry32(7);
    const noise = { width: 128, height: 128, pixelSize: 0.1, values: Float64Array.from({ length: 128 * 128 }, () => random()) };
    const result = analysePicture(noise);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.why).toMatch(/no periodicity/);
    const flat = analysePicture({ width: 64, height: 64, pixelSize: 0.1, values: new Float64Array(64 * 64).fill(3) });
    expect(flat.ok ? '' : flat.why).toMatch(/flat/);
  });
});
