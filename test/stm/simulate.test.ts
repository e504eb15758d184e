import { describe, expect, it } from 'vitest';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { windowWeight } from '../../src/stm/biasWindow.ts';
import { heightForCurrent } from '../../src/stm/constantCurrent.ts';
import { halfMesh } from '../../src/stm/halfMesh.ts';
import { evaluateStm, stmModel } from '../../src/stm/simulate.ts';
import { PARAMS } from './helpers.ts';

describe('bias window', () => {
  it('V > 0 counts empty states (E_F < E < E_F + eV), V < 0 filled ones (sign convention stated in biasWindow.ts)', () => {
    const up = { fermi: 0, bias: 1, smearing: 0.01 };
    const down = { fermi: 0, bias: -1, smearing: 0.01 };
    expect(windowWeight(up, 0.5)).toBeCloseTo(1, 12);
    expect(windowWeight(up, -0.5)).toBeCloseTo(0, 12);
    expect(windowWeight(down, -0.5)).toBeCloseTo(1, 12);
    expect(windowWeight(down, 0.5)).toBeCloseTo(0, 12);
    expect(windowWeight(up, 0)).toBeCloseTo(0.5, 12); // half-occupied at the edge: ½·erfc(0)
  });
});

describe('heightForCurrent(below, middle, above, lnTarget, step)', () => {
  it('is exact for I = C·e^{−2κz} and for ln I quadratic in z (analytic)', () => {
    const kappa = 1.1, h = 4, step = 0.5;
    const current = (z: number) => 3 * Math.exp(-2 * kappa * z);
    for (const target of [3.7, 4, 4.6]) {
      expect(h + heightForCurrent(current(h - step), current(h), current(h + step), Math.log(current(target)), step)).toBeCloseTo(target, 12);
    }
    const curved = (z: number) => Math.exp(-2 * z + 0.1 * (z - 4) ** 2);
    expect(h + heightForCurrent(curved(h - step), curved(h), curved(h + step), Math.log(curved(4.3)), step)).toBeCloseTo(4.3, 12);
  });
});

describe('halfMesh(cell, M)', () => {
  it('keeps one of each pair k, −k of the Γ-centred mesh; weights sum to 1 (time reversal, common practice)', () => {
    const cell = patternToSheet(findSheetPreset('alpha')!.pattern).cell;
    for (const m of [1, 4, 5, 24]) {
      const { kpoints, weights } = halfMesh(cell, m);
      expect(weights.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
      expect(kpoints.length).toBe(2 * weights.length);
      // Points that are their own partner: i, j ∈ {0, M/2} — 4 for even M, 1 for odd M.
      const selfPartners = m % 2 === 0 ? 4 : 1;
      expect(weights.length).toBe((m * m + selfPartners) / 2);
    }
  });
});

describe('stmModel / evaluateStm', () => {
  it('the picture has the sheet\'s periodicity (Bloch\'s theorem) and constant current stays within ±2Δ of h', () => {
    const sheet = patternToSheet(findSheetPreset('beta12')!.pattern);
    const stm = stmModel(new TightBindingModel(sheet, PARAMS), { mesh: 8 });
    const [[ax, ay], [bx, by]] = sheet.cell;
    const x = Float64Array.of(0.3, 0.3 + ax, 0.3 + bx - ax, 1.7), y = Float64Array.of(0.2, 0.2 + ay, 0.2 + by - ay, 0.9);
    const out = evaluateStm(stm, x, y, new Float64Array(4));
    expect(out[1]).toBeCloseTo(out[0], 10);
    expect(out[2]).toBeCloseTo(out[0], 10);
    for (const v of out) expect(Math.abs(v - 4)).toBeLessThanOrEqual(1);
    expect(stm.states).toBeGreaterThan(0);
  });
});
