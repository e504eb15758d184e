import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { prepareSheet, prepareSpectra, prepareState, refill } from '../../src/figures/prepare.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { makePattern, patternToSheet } from '../../src/lattice/pattern.ts';
import { fill } from '../../src/tb/fill.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { PARAMS } from './helpers.ts';

const alpha = findSheetPreset('alpha')!.pattern;

describe('prepareSpectra(sheet, params, options)', () => {
  it('puts E_F exactly at fill()’s value, and at the CLI golden fill-alpha (8 digits)', () => {
    const sheet = patternToSheet(alpha);
    const data = prepareSpectra(sheet, PARAMS, { label: 'alpha', mesh: 12, pathPoints: 40 });
    expect(data.fermi).toBe(fill(new TightBindingModel(sheet, PARAMS), { mesh: 12 }).fermi);
    const golden = JSON.parse(readFileSync(join(import.meta.dirname, '../cli/golden/fill-alpha.json'), 'utf8'));
    expect(Number(data.fermi.toPrecision(8))).toBe(golden.fermi);
    const doped = prepareSpectra(sheet, PARAMS, { label: 'alpha', mesh: 12, pathPoints: 40, doping: 0.2, smearing: 0.05 });
    expect(doped.fermi).toBe(fill(new TightBindingModel(sheet, PARAMS), { mesh: 12, doping: 0.2, smearing: 0.05 }).fermi);
    expect(refill(data, 0.2)).toBe(fill(new TightBindingModel(sheet, PARAMS), { mesh: 12, doping: 0.2 }).fermi);
  });

  it('keeps planar path bands in block order (σ ascending, then π ascending) with weights 1 and 0', () => {
    const data = prepareSpectra(patternToSheet(alpha), PARAMS, { label: 'alpha', mesh: 6, pathPoints: 30 });
    const { bands, energies, sigmaWeight, groups } = data.path;
    expect(groups).toEqual([[0, 24], [24, 32]]);
    for (let k = 0; k < data.path.count; k++) {
      for (const [first, end] of groups) for (let b = first + 1; b < end; b++) expect(energies[k * bands + b]).toBeGreaterThanOrEqual(energies[k * bands + b - 1]);
      expect(sigmaWeight[k * bands + 23]).toBe(1);
      expect(sigmaWeight[k * bands + 24]).toBe(0);
    }
    expect(data.zone.corners).toHaveLength(6);
    expect(data.dos.energy.length).toBe(2001);
  });

  it('is structured-cloneable (typed arrays and plain objects only) and reports mesh progress', () => {
    const calls: number[] = [];
    const data = prepareSpectra(patternToSheet(alpha), PARAMS, { label: 'alpha', mesh: 6, pathPoints: 20, onProgress: (done) => calls.push(done) });
    expect(structuredClone(data)).toEqual(data);
    expect(calls[calls.length - 1]).toBe(36);
  });

  it('refuses a bad mesh, doping or smearing in the project’s error form', () => {
    const sheet = patternToSheet(alpha);
    expect(() => prepareSpectra(sheet, PARAMS, { label: 'a', mesh: 0 })).toThrow(/^invalid mesh: 0 \(/);
    expect(() => prepareSpectra(sheet, PARAMS, { label: 'a', mesh: 2, doping: 6 })).toThrow(/^invalid doping: 6 \(/);
    expect(() => prepareSpectra(sheet, PARAMS, { label: 'a', mesh: 2, smearing: 0 })).toThrow(/^invalid smearing: 0 \(/);
  });
});

describe('prepareSheet(source, options)', () => {
  it('gives α its coordination (four atoms of 6, … from its hexagonal hole) and one hexagonal hole', () => {
    const data = prepareSheet({ label: 'alpha', pattern: alpha }, { bondCutoff: PARAMS.cutoff });
    // α: 8 atoms per 3×3 cell; the 6 atoms around the hole have 5 neighbours, the other 2 have 6
    // (Tang & Ismail-Beigi, Phys. Rev. Lett. 99, 115501 (2007)).
    expect(data.sheet.atoms).toHaveLength(8);
    expect([...data.coordination].sort()).toEqual([5, 5, 5, 5, 5, 5, 6, 6]);
    expect(data.hexagonalHoles).toEqual([[0, 0]]);
    expect(structuredClone(data)).toEqual(data);
  });

  it('computes on the smallest cell of a pattern given in a larger one (src/enumerate/period.ts)', () => {
    const doubled = makePattern({ bond: 1.69, supercell: [[6, 0], [0, 3]], vacancies: [[0, 0], [3, 0]] });
    const data = prepareSheet({ label: 'α in 6×3', pattern: doubled }, { bondCutoff: PARAMS.cutoff });
    expect(data.cellPattern!.supercell).toEqual({ a: 3, b: 0, c: 3 });
    expect(data.sheet.atoms).toHaveLength(8);
    expect(data.pattern).toBe(doubled);
  });

  it('prepareState gives the state at a path point in the bands’ order', () => {
    const data = prepareSheet({ label: 'alpha', pattern: alpha }, { bondCutoff: PARAMS.cutoff });
    const spectra = prepareSpectra(data.sheet, PARAMS, { label: 'alpha', mesh: 4, pathPoints: 20 });
    const state = prepareState(data.sheet, PARAMS, spectra.path, 5, 26);
    expect(state.energy).toBeCloseTo(spectra.path.energies[5 * 32 + 26], 10);
    expect(state.sigma).toBe(0);
    expect(state.weight.reduce((s, w) => s + w, 0)).toBeCloseTo(1, 12);
    expect(() => prepareState(data.sheet, PARAMS, spectra.path, 20, 0)).toThrow(/^invalid kIndex: 20/);
  });
});
