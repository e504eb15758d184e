import { describe, expect, it } from 'vitest';
import { holeDensity } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { fillSpectrum } from '../../src/tb/fill.ts';
import { meshSpectrum } from '../../src/tb/meshSpectrum.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { sigmaBonding } from '../../src/tb/sigmaBonding.ts';
import { HARRISON_1980, presetSheet } from './fixtures.ts';

function analyse(name: string, buckle = 0) {
  const preset = findSheetPreset(name);
  if (!preset) throw new Error(name);
  const base = presetSheet(name);
  const sheet = buckle === 0 ? base : { ...base, atoms: base.atoms.map((a, i) => [a[0], a[1], i % 2 ? buckle : -buckle] as [number, number, number]) };
  const spectrum = meshSpectrum(new TightBindingModel(sheet, HARRISON_1980), { mesh: 24 });
  return { spectrum, result: sigmaBonding(spectrum, { holeDensity: holeDensity(preset.pattern) }) };
}

describe('sigmaBonding(spectrum, options)', () => {
  it('finds the σ bonding–antibonding gap of the honeycomb holding 3 σ electrons per atom', () => {
    // Three sp² bonding bands per two atoms (the σ bands of the MgB2 boron layer; common practice).
    const { result } = analyse('honeycomb');
    expect(result.kind).toBe('gap');
    expect(result.sigmaCapacity).toBeCloseTo(3, 8);
    expect(result.energy).toBeCloseTo(0.5 * ((result.gap?.lower ?? 0) + (result.gap?.upper ?? 0)), 12);
    expect(result.countingRule).toEqual({ holeDensity: 1 / 3, estimated: false, doping: expect.closeTo(1, 12) });
    expect(result.parameters).toBe('harrison1980');
  });

  it('returns a doping at which fill puts E_F on E*', () => {
    // Both use the same occupation ½·erfc((E − E*)/σ) (consistency of the definitions).
    for (const name of ['alpha', 'beta12', 'chi3']) {
      const { spectrum, result } = analyse(name);
      const filled = fillSpectrum(spectrum, { doping: result.fillingDoping });
      expect(filled.fermi).toBeCloseTo(result.energy, 6);
      expect(filled.sigmaElectronsPerAtom).toBeCloseTo(result.sigmaCapacity, 6);
    }
  });

  it('gives a doping range that brackets the mid-gap doping, and falls back to a pseudogap when buckling closes gaps', () => {
    const { result } = analyse('beta12');
    if (result.fillingRange) {
      expect(result.fillingRange.lower).toBeLessThanOrEqual(result.fillingDoping + 1e-9);
      expect(result.fillingRange.upper).toBeGreaterThanOrEqual(result.fillingDoping - 1e-9);
    }
    const buckled = analyse('beta12', 0.4).result;
    expect(['gap', 'pseudogap']).toContain(buckled.kind);
    expect(Number.isFinite(buckled.energy) && Number.isFinite(buckled.sigmaCapacity)).toBe(true);
    expect(buckled.sigmaCapacity).toBeGreaterThanOrEqual(1.5 - 0.1);
    expect(buckled.sigmaCapacity).toBeLessThanOrEqual(4.5 + 0.1);
  });
});
