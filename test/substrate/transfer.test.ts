import { describe, expect, it } from 'vitest';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { cellMetrics } from '../../src/lattice/reducedCell.ts';
import { countingRuleCurve, dopingMap } from '../../src/substrate/dopingMap.ts';
import { findSubstrate, SUBSTRATES } from '../../src/substrate/substrates.ts';
import { alignmentParameters, electronTransfer } from '../../src/substrate/transfer.ts';
import { meshSpectrum } from '../../src/tb/meshSpectrum.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { findParameterPreset } from '../../src/tb/params.ts';

const params = findParameterPreset('harrison1980')!;
const beta12 = findSheetPreset('beta12')!;
const sheet = patternToSheet(beta12.pattern);
const spectrum = meshSpectrum(new TightBindingModel(sheet, params), { mesh: 8 });
const ag = findSubstrate('ag111')!;

describe('electronTransfer(spectrum, options)', () => {
  it('β12: the counting rule asks δ = 1/5 at η = 1/6 (electron-counting rule, common practice)', () => {
    const r = electronTransfer(spectrum, { substrate: ag, holeDensity: 1 / 6, cellArea: cellMetrics(sheet.cell).area });
    expect(r.countingRule.doping).toBeCloseTo(0.2, 12);
    // η*(δ) = (1 + 3δ)/(9 + 3δ) at the doping the metal gives (the rule inverted, analytic)
    const d = r.alignment.electronsPerAtom;
    expect(r.preferredHoleDensity).toBeCloseTo((1 + 3 * d) / (9 + 3 * d), 12);
    // Ag(111) gives electrons: W_S + Δc = 5.7 eV > W_M = 4.74 eV (sign of the Giovannetti et al. 2008 balance)
    expect(d).toBeGreaterThan(0);
  });

  it('gives nothing when W_S + Δc = W_M: the crossover of Giovannetti et al. (2008), here on the β12 spectrum', () => {
    const r = electronTransfer(spectrum, { substrate: ag, holeDensity: 1 / 6, cellArea: cellMetrics(sheet.cell).area, sheetWorkFunction: 3.84, dipole: 0.9 });
    expect(Math.abs(r.alignment.electronsPerAtom)).toBeLessThan(1e-12);
  });
});

describe('alignmentParameters(given, fields)', () => {
  it('fills in the labelled defaults (graphene values of Giovannetti et al. 2008, from memory)', () => {
    expect(alignmentParameters({})).toEqual({ sheetWorkFunction: 4.8, dipole: 0.9, distance: 3.3, d0: 2.4 });
  });
  it('refuses d < d0 naming the input that was given', () => {
    expect(() => alignmentParameters({ distance: 2 }, { distance: '--distance', d0: '--d0' })).toThrow(/^invalid --distance: 2 /);
    expect(() => alignmentParameters({ d0: 3.4 }, { distance: '--distance', d0: '--d0' })).toThrow(/^invalid --d0: 3.4 /);
  });
});

describe('dopingMap(patterns, options)', () => {
  it('counting-rule curve: δ(0) = −1/3, δ(1/9) = 0, δ(2/9) = 3/7, δ(1/3) = 1 (the rule, common practice)', () => {
    const curve = countingRuleCurve(0, 1 / 3, 4);
    expect(curve.map((p) => p.doping)).toEqual([expect.closeTo(-1 / 3, 12), expect.closeTo(0, 12), expect.closeTo(3 / 7, 12), expect.closeTo(1, 12)]);
  });

  it('one point per pattern, each metal ordered by work function in what it gives (Giovannetti et al. 2008: the shift follows W_M)', () => {
    const map = dopingMap(['beta12', 'chi3'].map((name) => ({ name, pattern: findSheetPreset(name)!.pattern })), { substrates: SUBSTRATES, parameters: params, mesh: 6 });
    expect(map.points.map((p) => p.name)).toEqual(['beta12', 'chi3']);
    for (const p of map.points) {
      const given = SUBSTRATES.map((s) => p.alignment[s.name].doping); // SUBSTRATES is ordered by W_M
      expect([...given].sort((a, b) => b - a)).toEqual(given);
    }
    expect(map.observed.find((o) => o.substrate === 'ag111')!.holeDensities).toEqual([1 / 6, 1 / 5]); // Feng et al. 2016
    expect(map.observed.find((o) => o.substrate === 'al111')!.doping).toBe(1); // Li et al. 2018
  });
});
