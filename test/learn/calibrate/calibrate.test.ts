import { describe, expect, it } from 'vitest';
import { calibrate, cutoffCandidates } from '../../../src/learn/calibrate/calibrate.ts';
import { estimateFermi } from '../../../src/learn/calibrate/bandWeights.ts';
import { parameterVector, MODEL_PARAMETERS } from '../../../src/learn/calibrate/modelParameters.ts';
import { ParametricBands } from '../../../src/learn/calibrate/parametricBands.ts';
import type { Sheet } from '../../../src/lattice/sheet.ts';
import { fill } from '../../../src/tb/fill.ts';
import { kMesh } from '../../../src/tb/kspace.ts';
import { TightBindingModel } from '../../../src/tb/model.ts';
import { HARRISON_1980, presetSheet } from '../../tb/fixtures.ts';
import { BUCKLED, TRUTH, calibrationSheet, farFrom, modelReference } from './helpers.ts';

/** Starts far from TRUTH: integrals at half and at 1.6 times their size, on-site energies moved by ±3 eV. */
const FAR_STARTS = [farFrom(TRUTH, 0.5, 3, 'far-weak'), farFrom(TRUTH, 1.6, -3, 'far-strong')];

function expectParameters(fitted: Float64Array, truth: Float64Array, digits: number): void {
  for (let j = 0; j < truth.length; j++) expect(fitted[j]).toBeCloseTo(truth[j], digits);
}

describe('calibrate(options): bands made by the model with known parameters are fitted back to them (an exact recovery: the model can reproduce its own bands)', () => {
  const sheets: [string, Sheet][] = [['alpha (planar, 8 atoms)', presetSheet('alpha')], ['chi3 (planar, 4 atoms)', presetSheet('chi3')], ['β12 buckled (5 atoms)', BUCKLED]];
  for (const [name, sheet] of sheets) {
    it(`${name}: every parameter recovered from starts far away, rms ~ 0`, () => {
      const reference = modelReference(sheet, TRUTH);
      const result = calibrate({ sheets: [calibrationSheet(sheet, reference, name)], starts: FAR_STARTS });
      expect(result.rms).toBeLessThan(1e-8);
      expectParameters(parameterVector(result.parameters, TRUTH.d0), parameterVector(TRUTH, TRUTH.d0), 6);
      expect(result.points).toBe(reference.count * reference.bands);
    });
  }

  it('with --shift: a reference on its own zero (+7.3 eV) gives εs − εp, the integrals and the shift back; εp held', () => {
    const reference = modelReference(BUCKLED, TRUTH, { offset: 7.3 });
    const result = calibrate({ sheets: [calibrationSheet(BUCKLED, reference, 'buckled')], starts: [HARRISON_1980, ...FAR_STARTS], shift: true });
    const { s, p } = result.parameters.onsite;
    expect(p).toBe(HARRISON_1980.onsite.p);
    expect(s - p).toBeCloseTo(TRUTH.onsite.s - TRUTH.onsite.p, 6);
    // E_reference = E_truth + 7.3 and E_model = E_truth − (εp,truth − εp,held), so shift = 7.3 + εp,truth − εp,held.
    expect(result.sheets[0].shift).toBeCloseTo(7.3 + TRUTH.onsite.p - HARRISON_1980.onsite.p, 6);
    expect(result.parameters.hopping.pp_sigma).toBeCloseTo(TRUTH.hopping.pp_sigma, 6);
    expect(result.held.some((h) => h.name === 'p')).toBe(true);
  });

  it('the exponent of the distance law is recovered on a buckled sheet (bonds of several lengths) when freed', () => {
    const truth = { ...TRUTH, exponent: 2.8 };
    const reference = modelReference(BUCKLED, truth);
    const result = calibrate({ sheets: [calibrationSheet(BUCKLED, reference, 'buckled')], starts: FAR_STARTS, freeExponent: true });
    expect(result.parameters.exponent).toBeCloseTo(2.8, 6);
    expectParameters(parameterVector(result.parameters, TRUTH.d0), parameterVector(truth, TRUTH.d0), 6);
  });

  it('two sheets at once, each file on its own zero: one shift each, the common parameters recovered', () => {
    const alpha = presetSheet('alpha');
    const result = calibrate({
      sheets: [calibrationSheet(alpha, modelReference(alpha, TRUTH, { offset: -2 }), 'alpha'), calibrationSheet(BUCKLED, modelReference(BUCKLED, TRUTH, { offset: 4 }), 'buckled')],
      starts: FAR_STARTS,
      shift: true,
    });
    expect(result.rms).toBeLessThan(1e-8);
    expect(result.sheets[1].shift - result.sheets[0].shift).toBeCloseTo(6, 6);
    expect(result.parameters.hopping.ss_sigma).toBeCloseTo(TRUTH.hopping.ss_sigma, 6);
  });

  it('reference files with fewer bands (the lowest 12 of 20), or without the lowest two (matched 3–20 ↔ 1–18), are fitted back', () => {
    const sheet = presetSheet('beta12');
    const full = modelReference(sheet, TRUTH);
    const lowest = { ...full, bands: 12, energies: Float64Array.from({ length: full.count * 12 }, (_, i) => full.energies[Math.floor(i / 12) * 20 + (i % 12)]) };
    const fewer = calibrate({ sheets: [calibrationSheet(sheet, lowest, 'beta12')], starts: [HARRISON_1980, ...FAR_STARTS] });
    expect(fewer.sheets[0].modelBands).toEqual([1, 12]);
    expect(fewer.parameters.hopping.pp_pi).toBeCloseTo(TRUTH.hopping.pp_pi, 6);
    const upper = { ...full, bands: 18, energies: Float64Array.from({ length: full.count * 18 }, (_, i) => full.energies[Math.floor(i / 18) * 20 + 2 + (i % 18)]) };
    const offset = calibrate({ sheets: [calibrationSheet(sheet, upper, 'beta12', 'full', { modelFirst: 2, referenceFirst: 0, count: 18 })], starts: [HARRISON_1980, ...FAR_STARTS] });
    expect(offset.sheets[0].modelBands).toEqual([3, 20]);
    expect(offset.rms).toBeLessThan(1e-8);
    expect(offset.parameters.onsite.s).toBeCloseTo(TRUTH.onsite.s, 6);
  });

  it('the cutoff scan finds the second-neighbour shell when the reference couples second neighbours', () => {
    const sheet = presetSheet('beta12');
    const truth = { ...TRUTH, exponent: 4, cutoff: 3.0 };
    const candidates = cutoffCandidates([calibrationSheet(sheet, modelReference(sheet, truth), 'beta12')]);
    // Shells of the triangular lattice: d, √3·d, 2d, √7·d (common practice), so the first cutoffs lie between them.
    expect(candidates[0]).toBeGreaterThan(1.69);
    expect(candidates[0]).toBeLessThan(Math.sqrt(3) * 1.69);
    expect(candidates[1]).toBeGreaterThan(Math.sqrt(3) * 1.69);
    expect(candidates[1]).toBeLessThan(2 * 1.69);
    const result = calibrate({ sheets: [calibrationSheet(sheet, modelReference(sheet, truth), 'beta12')], starts: [{ ...HARRISON_1980, exponent: 4 }, ...FAR_STARTS.map((s) => ({ ...s, exponent: 4 }))], scanCutoff: true, freeExponent: true });
    expect(result.parameters.cutoff).toBe(candidates[1]);
    expect(result.parameters.exponent).toBeCloseTo(4, 5);
    expect(result.rms).toBeLessThan(1e-6);
  });
});

describe('calibrate: the graphene π band', () => {
  it('recovers t = 2.7 eV from the nearest-neighbour dispersion E = ±t|1 + e^{ik·a1} + e^{ik·a2}| (Wallace, Phys. Rev. 71, 622 (1947); t ≈ 2.7 eV as commonly quoted — common practice, from memory)', () => {
    // Graphene: C–C 1.42 Å, lattice constant √3·1.42 = 2.46 Å (common practice, from memory).
    const a = Math.sqrt(3) * 1.42;
    const graphene: Sheet = { cell: [[a, 0], [a / 2, (a * Math.sqrt(3)) / 2]], atoms: [[1 / 3, 1 / 3, 0], [2 / 3, 2 / 3, 0]] };
    const t = 2.7;
    const count = 120;
    const kpoints = new Float64Array(2 * count);
    const energies = new Float64Array(2 * count);
    // Γ → K → M → Γ, K at (4π/(3a), 0) and M at (π/a, π/(√3a)) (common practice).
    const corners = [[0, 0], [(4 * Math.PI) / (3 * a), 0], [Math.PI / a, Math.PI / (Math.sqrt(3) * a)], [0, 0]];
    for (let i = 0; i < count; i++) {
      const s = (3 * i) / (count - 1);
      const leg = Math.min(2, Math.floor(s));
      const f = s - leg;
      const kx = corners[leg][0] + f * (corners[leg + 1][0] - corners[leg][0]);
      const ky = corners[leg][1] + f * (corners[leg + 1][1] - corners[leg][1]);
      kpoints.set([kx, ky], 2 * i);
      const re = 1 + Math.cos(kx * a) + Math.cos(kx * a / 2 + ky * a * Math.sqrt(3) / 2);
      const im = Math.sin(kx * a) + Math.sin(kx * a / 2 + ky * a * Math.sqrt(3) / 2);
      const magnitude = t * Math.hypot(re, im);
      energies.set([-magnitude, magnitude], 2 * i);
    }
    const reference = { count, bands: 2, kpoints, energies };
    const start = { ...HARRISON_1980, d0: 1.42 };
    const result = calibrate({ sheets: [calibrationSheet(graphene, reference, 'graphene', 'pi')], starts: [start] });
    // On a bipartite sheet the sign of the integrals is not fixed either; the magnitude is.
    expect(Math.abs(result.parameters.hopping.pp_pi)).toBeCloseTo(t, 8);
    expect(result.parameters.onsite.p).toBeCloseTo(0, 8);
    expect(result.rms).toBeLessThan(1e-8);
    // Only the π block was matched: the σ integrals and εs are held, as the bands do not depend on them.
    expect(result.fitted).toEqual(['p', 'pp_pi']);
  });
});

describe('calibrate: uncertainties', () => {
  it('over 20 noise draws (0.05 eV, fixed seeds) the truth lies within 2σ in ≥ 85% and within 3σ in ≥ 97% of cases, and σ matches the scatter of the fits (Monte Carlo check of the linearised covariance)', () => {
    const truth = { ...TRUTH, exponent: 2.4 };
    const truthVector = parameterVector(truth, truth.d0);
    const draws = 20;
    const fits: Float64Array[] = [];
    const sigmas: number[][] = [];
    let within2 = 0;
    let within3 = 0;
    let total = 0;
    for (let draw = 0; draw < draws; draw++) {
      const reference = modelReference(BUCKLED, truth, { noise: 0.05, seed: 100 + draw });
      const result = calibrate({ sheets: [calibrationSheet(BUCKLED, reference, 'buckled')], starts: [{ ...HARRISON_1980, exponent: 2 }], freeExponent: true, weightWidth: null });
      const fitted = parameterVector(result.parameters, truth.d0);
      fits.push(fitted);
      sigmas.push(MODEL_PARAMETERS.map((name) => result.uncertainties[name]!));
      MODEL_PARAMETERS.forEach((name, j) => {
        const z = Math.abs(fitted[j] - truthVector[j]) / result.uncertainties[name]!;
        total++;
        if (z <= 2) within2++;
        if (z <= 3) within3++;
      });
    }
    expect(within2 / total).toBeGreaterThanOrEqual(0.85);
    expect(within3 / total).toBeGreaterThanOrEqual(0.97);
    MODEL_PARAMETERS.forEach((_, j) => {
      const values = fits.map((f) => f[j]);
      const mean = values.reduce((a, b) => a + b) / draws;
      const scatter = Math.sqrt(values.reduce((sum, v) => sum + (v - mean) ** 2, 0) / (draws - 1));
      const sigma = sigmas.reduce((sum, s) => sum + s[j], 0) / draws;
      expect(scatter / sigma).toBeGreaterThan(0.5);
      expect(scatter / sigma).toBeLessThan(2);
    });
  });
});

describe('calibrate: the sign convention of V_spσ', () => {
  it('bands with V_spσ < 0 are the bands with V_spσ > 0 (flipping every s orbital; analytic), and the fit reports V_spσ ≥ 0', () => {
    const negative = { ...TRUTH, hopping: { ...TRUTH.hopping, sp_sigma: -TRUTH.hopping.sp_sigma } };
    const positive = modelReference(BUCKLED, TRUTH);
    const flipped = modelReference(BUCKLED, negative);
    for (let i = 0; i < positive.energies.length; i++) expect(flipped.energies[i]).toBeCloseTo(positive.energies[i], 10);
    const start = { ...HARRISON_1980, hopping: { ...HARRISON_1980.hopping, sp_sigma: -HARRISON_1980.hopping.sp_sigma } };
    const result = calibrate({ sheets: [calibrationSheet(BUCKLED, flipped, 'buckled')], starts: [start] });
    expect(result.parameters.hopping.sp_sigma).toBeCloseTo(TRUTH.hopping.sp_sigma, 6);
    expect(result.signConvention).toMatch(/≥ 0/);
  });
});

describe('estimateFermi(reference, match, atoms, block)', () => {
  it('on a full k-mesh equals the Fermi level of fill (src/tb/fill.ts, an independent route) within the level spacing', () => {
    const sheet = presetSheet('beta12');
    const mesh = 24;
    const kpoints = kMesh(sheet.cell, mesh);
    const bands = new ParametricBands(sheet, kpoints, { cutoff: 2.1, d0: 1.69, block: 'full' });
    const energies = new Float64Array(bands.count * bands.bands);
    bands.evaluate(parameterVector(HARRISON_1980, 1.69), energies, null);
    const estimate = estimateFermi({ count: bands.count, bands: bands.bands, kpoints, energies }, { modelFirst: 0, referenceFirst: 0, count: 20 }, 5, 'full')!;
    const fermi = fill(new TightBindingModel(sheet, HARRISON_1980), { mesh, smearing: 0.01 }).fermi;
    expect(Math.abs(estimate - fermi)).toBeLessThan(0.05);
    expect(estimateFermi({ count: bands.count, bands: bands.bands, kpoints, energies }, { modelFirst: 0, referenceFirst: 0, count: 5 }, 5, 'pi')).toBeUndefined();
  });
});
