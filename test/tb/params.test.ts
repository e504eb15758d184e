import { describe, expect, it } from 'vitest';
import { DEFAULT_PARAMETERS, PARAMETER_PRESETS, findParameterPreset } from '../../src/tb/params.ts';

// REGRESSION GUARD, not an outside check: the η values below are copied from each preset's own source string, which
// quotes them from memory of Harrison's books (Electronic Structure and the Properties of Solids (1980); Elementary
// Electronic Structure (1999)), not re-checked against the printed tables. The test guards the conversion
// V(d0) = η·ħ²/(m·d0²), ħ²/m = 7.62 eV·Å² (same books, from memory), and the files against edits. The outside
// check of what these parameters give is the analytic band tests (test/tb/model.test.ts).
const ETA: Record<string, [number, number, number, number]> = {
  harrison1980: [-1.40, 1.84, 3.24, -0.81],
  harrison1999: [-1.32, 1.42, 2.22, -0.63],
};

describe('PARAMETER_PRESETS', () => {
  it('hold V(d0) = η·7.62/d0² for each universal set, exponent 2, and nearest-neighbour cutoffs', () => {
    expect(PARAMETER_PRESETS.map((p) => p.name)).toEqual(['harrison1980', 'harrison1999']);
    for (const p of PARAMETER_PRESETS) {
      const [ss, sp, pps, ppp] = ETA[p.name];
      const unit = 7.62 / (p.d0 * p.d0);
      expect(p.hopping.ss_sigma).toBeCloseTo(ss * unit, 6);
      expect(p.hopping.sp_sigma).toBeCloseTo(sp * unit, 6);
      expect(p.hopping.pp_sigma).toBeCloseTo(pps * unit, 6);
      expect(p.hopping.pp_pi).toBeCloseTo(ppp * unit, 6);
      expect(p.exponent).toBe(2);
      // Nearest neighbours only for d ≈ 1.7–1.8 Å: first shell d < cutoff < second shell √3·d (common practice).
      expect(p.cutoff).toBeGreaterThan(1.8);
      expect(p.cutoff).toBeLessThan(Math.sqrt(3) * 1.69);
      expect(p.source.length).toBeGreaterThan(20);
    }
  });

  it('carry the term values of their sources and mark what is from memory', () => {
    // Regression guard. Boron term values −12.54 / −6.64 eV (Harrison 1980) and −13.46 / −8.43 eV (Harrison 1999):
    // both pairs from memory, as both preset files say in their provenance.
    expect(findParameterPreset('harrison1980')?.onsite).toEqual({ s: -12.54, p: -6.64 });
    expect(findParameterPreset('harrison1999')?.onsite).toEqual({ s: -13.46, p: -8.43 });
    for (const p of PARAMETER_PRESETS) expect(p.provenance).toMatch(/from memory/);
  });

  it('default to harrison1980 and find nothing for unknown names', () => {
    expect(DEFAULT_PARAMETERS).toBe('harrison1980');
    expect(findParameterPreset(DEFAULT_PARAMETERS)).toBeDefined();
    expect(findParameterPreset('nonesuch')).toBeUndefined();
  });
});
