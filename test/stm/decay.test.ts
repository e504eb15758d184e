import { describe, expect, it } from 'vitest';
import { makePattern, patternToSheet } from '../../src/lattice/pattern.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { findParameterPreset, type ParameterSet } from '../../src/tb/params.ts';
import { reciprocal } from '../../src/tb/kspace.ts';
import { ldosSeries } from '../../src/stm/ldosSeries.ts';
import { decayConstant } from '../../src/stm/barrier.ts';

/*
 * Tersoff & Hamann, PRB 31, 805 (1985): the G Fourier component of the corrugation decays as
 * exp(−2[√(κ² + G²/4) − κ]z). Where it comes from: in the vacuum every state is Σ_G' a_G' e^{i(k+G')·r} e^{−√(κ²+|k+G'|²)z}.
 * The LDOS component at Q = G is Σ a_G' a*_{G'−G} e^{−(γ_{k+G'} + γ_{k+G'−G})z}; the slowest decay is at the zone
 * edge k + G' = G/2, k + G' − G = −G/2, where both wave vectors have length G/2: e^{−2√(κ² + G²/4)z}. The mean (Q = 0)
 * decays slowest at Γ (k = 0, G' = 0): e^{−2κz}. Their ratio is the formula. Here the zone-edge state (k = G/2) gives the
 * G component and the Γ state gives the mean, and the ratio is checked against the formula between heights.
 * The same argument for the Γ state alone (components 0 and −G) gives exp(−[√(κ² + G²) − κ]z), checked too.
 */
const params = findParameterPreset('harrison1980') as ParameterSet;
const sheet = patternToSheet(makePattern({ bond: 2.2, supercell: [[1, 0], [0, 1]], vacancies: [] }));
const model = new TightBindingModel(sheet, params);
const kappa = decayConstant(4.5);
const heights = [5, 6, 7, 8];
const [b1] = reciprocal(sheet.cell);
const G = Math.hypot(b1[0], b1[1]);

function components(k: [number, number]) {
  const series = ldosSeries(model, { kappa, heights, weight: () => 1, kpoints: { kpoints: Float64Array.from(k), weights: Float64Array.of(1) }, accuracy: 1e-12 });
  const { side, order } = series;
  return heights.map((_, j) => {
    const base = j * side * side;
    const mean = series.re[base + order * side + order];
    const at = base + (1 + order) * side + order; // Q = b1
    return { mean, g: Math.hypot(series.re[at], series.im[at]) };
  });
}

describe('Tersoff–Hamann corrugation decay', () => {
  it('zone-edge G component over the Γ mean falls as exp(−2[√(κ² + G²/4) − κ]z) (Tersoff & Hamann, PRB 31, 805 (1985))', () => {
    const edge = components([b1[0] / 2, b1[1] / 2]);
    const centre = components([0, 0]);
    const expected = -2 * (Math.sqrt(kappa * kappa + (G * G) / 4) - kappa);
    for (let j = 1; j < heights.length; j++) {
      const slope = Math.log((edge[j].g / centre[j].mean) / (edge[j - 1].g / centre[j - 1].mean)) / (heights[j] - heights[j - 1]);
      expect(slope / expected).toBeCloseTo(1, 5);
    }
  });

  it('the Γ state alone: its G component over its mean falls as exp(−[√(κ² + G²) − κ]z) (same derivation)', () => {
    const centre = components([0, 0]);
    const expected = -(Math.sqrt(kappa * kappa + G * G) - kappa);
    for (let j = 1; j < heights.length; j++) {
      const slope = Math.log((centre[j].g / centre[j].mean) / (centre[j - 1].g / centre[j - 1].mean)) / (heights[j] - heights[j - 1]);
      expect(slope / expected).toBeCloseTo(1, 3);
    }
  });

  it('the zone-edge decay is the slower of the two, so it sets the corrugation (Tersoff & Hamann 1985)', () => {
    expect(2 * (Math.sqrt(kappa * kappa + (G * G) / 4) - kappa)).toBeLessThan(Math.sqrt(kappa * kappa + G * G) - kappa);
  });
});
