import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeBands } from '../../src/tb/bands.ts';
import { erfc } from '../../src/tb/erfc.ts';
import { FermiSolver, fermiVersusDoping } from '../../src/tb/fermi.ts';
import { fill, fillSpectrum } from '../../src/tb/fill.ts';
import { kMesh } from '../../src/tb/kspace.ts';
import { meshSpectrum, type MeshSpectrum } from '../../src/tb/meshSpectrum.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { findParameterPreset } from '../../src/tb/params.ts';
import { sigmaBonding } from '../../src/tb/sigmaBonding.ts';
import { HARRISON_1980, presetSheet, withParameters } from './fixtures.ts';

const spectra = new Map<string, MeshSpectrum>();
function spectrumOf(name: string, mesh = 24): MeshSpectrum {
  const key = `${name}/${mesh}`;
  if (!spectra.has(key)) spectra.set(key, meshSpectrum(new TightBindingModel(presetSheet(name), HARRISON_1980), { mesh }));
  return spectra.get(key) as MeshSpectrum;
}

describe('fill(model, options)', () => {
  it('counts 3 + δ electrons per atom at E_F to 1e-10 for any doping and width', () => {
    // The contract's own requirement (DESIGN.md, fill); the count is recomputed here from the definition.
    fc.assert(fc.property(
      fc.constantFrom('delta6', 'alpha', 'beta12', 'chi3', 'honeycomb'),
      fc.double({ min: -2.9, max: 4.9, noNaN: true }),
      fc.double({ min: 0.005, max: 2, noNaN: true }),
      (name, doping, smearing) => {
        const spectrum = spectrumOf(name);
        const result = fillSpectrum(spectrum, { doping, smearing });
        let states = 0;
        for (const e of spectrum.energies) states += 0.5 * erfc((e - result.fermi) / smearing);
        const count = (2 * states) / (spectrum.count * spectrum.atoms);
        return Math.abs(count - (3 + doping)) <= 1e-10 && Math.abs(result.electronsPerAtom - (3 + doping)) <= 1e-10
          && Math.abs(result.sigmaElectronsPerAtom + result.piElectronsPerAtom - (3 + doping)) <= 1e-10;
      },
    ), { numRuns: 150 });
  });

  it('puts E_F = 0 at half filling of a spectrum symmetric about zero', () => {
    // Bipartite lattice, nearest-neighbour hopping only, zero on-site energies: H anticommutes with the sublattice
    // sign, so E ↔ −E (chiral symmetry; common practice, e.g. Castro Neto et al., Rev. Mod. Phys. 81, 109 (2009)).
    // Half filling of 8 states per atom is 4 electrons, δ = 1. On-site values invented for the check.
    const params = withParameters(HARRISON_1980, { onsite: { s: 0, p: 0 } });
    const result = fill(new TightBindingModel(presetSheet('honeycomb'), params), { doping: 1, mesh: 30 });
    expect(Math.abs(result.fermi)).toBeLessThan(1e-9);
    expect(result.electronsPerAtom).toBeCloseTo(4, 10);
  });

  it('puts E_F at the π Dirac point of the honeycomb for δ = 1 when the σ bonding bands lie below it (the MgB2 count)', () => {
    // With σ bonding bands full (3 e/atom) and the π bands symmetric about εp (nearest-neighbour Wallace bands,
    // Wallace, Phys. Rev. 71, 622 (1947)), the 4th electron per atom half-fills π: E_F = εp, the Dirac point.
    let checked = 0;
    for (const name of ['harrison1980', 'harrison1999']) {
      const params = findParameterPreset(name);
      if (!params) throw new Error(name);
      const model = new TightBindingModel(presetSheet('honeycomb'), params);
      const spectrum = meshSpectrum(model, { mesh: 36 });
      const gap = sigmaBonding(spectrum, { holeDensity: 1 / 3 }).gap;
      expect(gap).toBeDefined();
      if (!gap || !(gap.lower + 1 < params.onsite.p && params.onsite.p < gap.upper - 1)) continue;
      const result = fillSpectrum(spectrum, { doping: 1 });
      expect(result.fermi).toBeCloseTo(params.onsite.p, 8);
      expect(result.sigmaElectronsPerAtom).toBeCloseTo(3, 8);
      expect(result.piElectronsPerAtom).toBeCloseTo(1, 8);
      checked++;
    }
    // Both presets place εp well inside the σ gap (−15.4 … −2.5 eV and −14.2 … −4.8 eV on this mesh).
    expect(checked).toBe(2);
  });

  it('places E_F mid-gap, and calls it a gap of the sheet only when the model confirms it', () => {
    // Honeycomb, δ = 0: 3 electrons per atom fill the three σ bonding bands of two atoms exactly (common practice).
    const spectrum = spectrumOf('honeycomb');
    const unchecked = fillSpectrum(spectrum, { doping: 0 });
    expect(unchecked.inGap).toBeUndefined();
    expect(unchecked.meshGap).toMatchObject({ checked: false });
    const empty = unchecked.meshGap as { lower: number; upper: number };
    const result = fillSpectrum(spectrum, { doping: 0, model: new TightBindingModel(presetSheet('honeycomb'), HARRISON_1980) });
    expect(result.meshGap).toBeUndefined();
    const gap = result.inGap as { lower: number; upper: number };
    expect(gap.lower).toBeGreaterThanOrEqual(empty.lower);
    expect(gap.upper).toBeLessThanOrEqual(empty.upper);
    expect(result.fermi).toBe(0.5 * (empty.lower + empty.upper));
    expect(Math.abs(result.electronsPerAtom - 3)).toBeLessThan(1e-10);
    expect(result.sigmaElectronsPerAtom).toBeCloseTo(3, 10);
  });

  it('matches an independent sum over the mesh for counts and band energy, with the contract defaults', () => {
    // Band energy per atom 2·Σ f·E / (M²·atoms) (DESIGN.md, fill), recomputed through computeBands on kMesh.
    const model = new TightBindingModel(presetSheet('chi3'), HARRISON_1980);
    const result = fill(model);
    expect(result).toMatchObject({ parameters: 'harrison1980', mesh: 36, smearing: 0.1, doping: 0 });
    const bands = computeBands(model, kMesh(model.sheet.cell, 36));
    let band = 0, sigma = 0, count = 0;
    for (let i = 0; i < bands.energies.length; i++) {
      const f = 0.5 * erfc((bands.energies[i] - result.fermi) / 0.1);
      band += f * bands.energies[i];
      sigma += f * bands.sigmaWeight[i];
      count += f;
    }
    const norm = 2 / (bands.count * model.atoms);
    expect(count * norm).toBeCloseTo(3, 9);
    expect(sigma * norm).toBeCloseTo(result.sigmaElectronsPerAtom, 9);
    expect(band * norm).toBeCloseTo(result.bandEnergyPerAtom, 9);
  });

  it('refuses impossible options with the field named', () => {
    const model = new TightBindingModel(presetSheet('delta6'), HARRISON_1980);
    expect(() => fill(model, { doping: -3 })).toThrow(/invalid doping: -3/);
    expect(() => fill(model, { doping: 5 })).toThrow(/invalid doping: 5/);
    expect(() => fill(model, { doping: NaN })).toThrow(/invalid doping: NaN/);
    expect(() => fill(model, { smearing: 0 })).toThrow(/invalid smearing: 0/);
    expect(() => fill(model, { mesh: 2.5 })).toThrow(/invalid mesh: 2.5/);
  });
});

describe('fermiVersusDoping(spectrum, dopings, smearing)', () => {
  it('rises with doping (the count is increasing in E_F)', () => {
    const dopings = Array.from({ length: 21 }, (_, i) => -1 + 0.1 * i);
    const levels = fermiVersusDoping(spectrumOf('beta12'), dopings, 0.1);
    for (let i = 1; i < levels.length; i++) expect(levels[i]).toBeGreaterThan(levels[i - 1]);
  });

  it('agrees with solving each doping alone', () => {
    const spectrum = spectrumOf('alpha');
    const solver = new FermiSolver(spectrum);
    const [level] = fermiVersusDoping(spectrum, [0.3], 0.2);
    expect(level).toBe(solver.solve(3.3, 0.2).fermi);
  });
});
