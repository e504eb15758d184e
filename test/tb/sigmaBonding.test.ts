import { describe, expect, it } from 'vitest';
import { holeDensity } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { fillSpectrum } from '../../src/tb/fill.ts';
import { meshSpectrum } from '../../src/tb/meshSpectrum.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { gaussianDos } from '../../src/tb/dos.ts';
import { triangleDos } from '../../src/tb/dosTriangle.ts';
import { reciprocal } from '../../src/tb/kspace.ts';
import { sigmaBonding } from '../../src/tb/sigmaBonding.ts';
import { refinedSigmaBonding } from '../../src/tb/sigmaBondingRefine.ts';
import { blockEigenvalues, HARRISON_1980, presetSheet } from './fixtures.ts';

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

describe('refinedSigmaBonding(model, options) on δ6 (one atom per cell)', () => {
  const model = new TightBindingModel(presetSheet('delta6'), HARRISON_1980);
  const options = { holeDensity: 0 };

  it('does not read the mesh-36 sampling hole inside the s-like band as a pseudogap', () => {
    // The hole itself: on the 36×36 mesh no state lies in −23.30 … −21.82 eV, so the Gaussian sum (σ = 0.1 eV)
    // all but vanishes there, while the bands interpolated between mesh points (triangle method) have states there.
    const coarse = meshSpectrum(model, { mesh: 36 });
    expect(coarse.energies.every((e) => !(e > -23.3 && e < -21.82))).toBe(true);
    const grid = Float64Array.from({ length: 11 }, (_, i) => -22.8 + 0.05 * i);
    expect(Math.max(...gaussianDos(coarse, grid, 0.1).sigma)).toBeLessThan(1e-8);
    expect(Math.min(...triangleDos(coarse, grid).sigma)).toBeGreaterThan(1e-3);
    const { result, meshes } = refinedSigmaBonding(model, options);
    expect(meshes[0]).toBe(36);
    expect(result.kind).toBe('pseudogap');
    expect(result.energy < -24.7 || result.energy > -19.9).toBe(true);
    expect(result.convergence.converged).toBe(true);
  });

  it('fills the lowest σ band — 2 electrons per atom — and finds E* where it meets the next one at K', () => {
    // One atom per cell: the lowest σ band holds exactly 2 electrons per atom (one state per k, two spins; common
    // practice). At K the 3-fold axis makes the lowest two σ bands meet (a two-dimensional representation of the
    // little group; common practice), so the σ DOS vanishes there: the deepest σ pseudogap. The K energies come
    // from one diagonalisation at K, independent of the DOS search.
    const { result } = refinedSigmaBonding(model, options);
    const [b1, b2] = reciprocal(model.sheet.cell);
    const k: [number, number] = [(b1[0] - b2[0]) / 3, (b1[1] - b2[1]) / 3];
    const atK = blockEigenvalues(model, k[0], k[1], 'sigma');
    expect(atK[1] - atK[0]).toBeLessThan(1e-9);
    expect(Math.abs(result.energy - atK[0])).toBeLessThan(0.05);
    expect(result.sigmaCapacity).toBeCloseTo(2, 3);
  });

  it('gives on the default mesh the doping of a four times denser mesh to 0.01 e/atom', () => {
    // Convergence against the same analysis at mesh 144 (where mesh and interpolated counts agree to 1e-4).
    const coarse = refinedSigmaBonding(model, options).result;
    const dense = sigmaBonding(meshSpectrum(model, { mesh: 144 }), { ...options, model });
    expect(Math.abs(dense.fillingDoping - dense.convergence.fillingDoping)).toBeLessThan(1e-3);
    expect(Math.abs(coarse.fillingDoping - dense.fillingDoping)).toBeLessThan(0.01);
    expect(dense.sigmaCapacity).toBeCloseTo(2, 3);
  });

  it('drops a σ gap that only a mesh without K shows, and does not call the answer converged there', () => {
    // The lowest two σ bands meet at K (see above); at M = 35 K is off the mesh, which then shows a σ "gap" around
    // their meeting energy. Without the model it is taken for a gap; with it the band found at K refutes it.
    const spectrum = meshSpectrum(model, { mesh: 35 });
    expect(sigmaBonding(spectrum, options).kind).toBe('gap');
    const checked = sigmaBonding(spectrum, { ...options, model });
    expect(checked.kind).toBe('pseudogap');
    expect(checked.meshGaps?.[0].crossing?.label).toBe('K');
    expect(checked.convergence.converged).toBe(false);
    const refined = refinedSigmaBonding(model, { ...options, mesh: 35 });
    expect(refined.meshes).toEqual([35, 72]);
    expect(refined.result.convergence.converged).toBe(true);
    expect(refined.result.sigmaCapacity).toBeCloseTo(2, 3);
  });

  it('says plainly when an explicit mesh does not resolve the answer, and names the next mesh', () => {
    const { result, suggestedMesh, meshes } = refinedSigmaBonding(model, { ...options, mesh: 12, refine: false });
    expect(meshes).toEqual([12]);
    expect(result.convergence.converged).toBe(false);
    expect(suggestedMesh).toBe(24);
    // Refinement from 12 doubles until converged.
    const refined = refinedSigmaBonding(model, { ...options, mesh: 12 });
    expect(refined.meshes).toEqual([12, 24, 48]);
    expect(refined.result.convergence.converged).toBe(true);
  });
});
