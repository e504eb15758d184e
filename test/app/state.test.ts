import { describe, expect, it } from 'vitest';
import { defaultState, readHash, writeHash } from '../../src/app/state.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';

describe('readHash(hash, base) and writeHash(state)', () => {
  it('reads #sheet=NAME as that preset with the CLI defaults (DESIGN.md, the web page contract)', () => {
    const { state, errors } = readHash('#sheet=beta12', defaultState());
    expect(errors).toEqual([]);
    expect(state.sheet).toEqual({ kind: 'preset', name: 'beta12' });
    expect(state.params).toEqual({ kind: 'preset', name: 'harrison1980' });
    // The CLI's defaults: mesh by its rule (36 for the presets' cells), width 0.1 eV, doping 0.
    expect([state.mesh, state.smearing, state.doping]).toEqual([undefined, 0.1, 0]);
    expect(writeHash(state)).toBe('#sheet=beta12');
  });

  it('round-trips an edited pattern, an own parameter set and the search', () => {
    const state = defaultState();
    state.sheet = { kind: 'pattern', label: 'my sheet', pattern: { ...findSheetPreset('chi3')!.pattern, name: undefined } };
    delete (state.sheet.pattern as { name?: string }).name;
    state.doping = 0.25;
    state.pick = { kIndex: 12, band: 3 };
    state.search = { sites: [2, 9], holes: [1, 2], isolated: false, eta: [0.1, 0.2], cell: { a: 5.1, b: 2.95, gamma: 90, lengthTolerance: 0.2, angleTolerance: 2 } };
    state.metal = { name: 'al111', model: { sheetWorkFunction: 4.5, dipole: -0.25, distance: 2.1, d0: 1.5 } };
    const hash = writeHash(state);
    expect(hash).toContain('metal=al111&sheet-work-function=4.5&dipole=-0.25&distance=2.1&d0=1.5');
    const { state: back, errors } = readHash(hash, defaultState());
    expect(errors).toEqual([]);
    expect(back).toEqual(state);
  });

  it('reports each bad field by its key and keeps the rest', () => {
    const { state, errors } = readHash('#sheet=alpha&doping=abc&mesh=0&sites=9-3&colour=red', defaultState());
    expect(state.sheet).toEqual({ kind: 'preset', name: 'alpha' });
    expect(state.doping).toBe(0);
    expect(state.mesh).toBeUndefined();
    expect(errors.map((e) => e.message)).toEqual([
      'invalid URL colour: "red" (unknown key; known: sheet, params, doping, smearing, mesh, repeats, pick, label, sites, holes, eta, isolated, cell, tolerance, metal, sheet-work-function, dipole, distance, d0, bias, tip-height, tip-mode, match-sites, match-top, match-metal, cut-energy, unfold-part)',
      'invalid URL doping: "abc" (not a number)',
      'invalid URL mesh: "0" (must be from 1 to 400)',
      'invalid URL sites: "9-3" (the range is empty (low end above high end))',
    ]);
  });

  it('validates a sheet given as JSON in the hash with the sheet-file parser (field path named)', () => {
    const hash = `#sheet=${encodeURIComponent('{"bond":1.69,"supercell":[[3,0],[0,0]],"vacancies":[]}')}`;
    const { errors } = readHash(hash, defaultState());
    expect(errors).toHaveLength(1);
    expect(errors[0].message).toMatch(/^invalid supercell/);
  });

  it('keeps the metal at Ag(111) with the estimated model when the hash says nothing of it (so #sheet=NAME stays short)', () => {
    const { state } = readHash('#sheet=chi3', defaultState());
    expect(state.metal).toEqual({ name: 'ag111', model: {} });
    expect(writeHash(state)).toBe('#sheet=chi3');
  });

  it('refuses an unknown metal and out-of-range model fields by key, keeping the others', () => {
    const { state, errors } = readHash('#sheet=alpha&metal=pt111&sheet-work-function=48&dipole=0.5&distance=x', defaultState());
    expect(state.metal).toEqual({ name: 'ag111', model: { dipole: 0.5 } });
    expect(errors.map((e) => e.message)).toEqual([
      'invalid URL metal: "pt111" (unknown substrate; substrates: al111, ag111, cu111, au111)',
      'invalid URL sheet-work-function: "48" (must lie in [1, 8])',
      'invalid URL distance: "x" (not a number)',
    ]);
  });

  it('refuses d < d0 naming the field given and keeps the other (d − d0 is a thickness; Giovannetti et al., PRL 101, 026803 (2008))', () => {
    const { state, errors } = readHash('#sheet=alpha&distance=2&d0=2.5', defaultState());
    expect(errors.map((e) => e.field)).toEqual(['URL distance']);
    expect(state.metal.model).toEqual({ d0: 2.5 });
    const alone = readHash('#sheet=alpha&d0=3.5', defaultState());
    expect(alone.errors.map((e) => e.field)).toEqual(['URL d0']);
    expect(alone.state.metal.model).toEqual({});
  });

  it('round-trips the STM panel\'s tip and match settings, and leaves them out at their defaults', () => {
    const state = defaultState();
    state.sheet = { kind: 'preset', name: 'beta12' };
    state.stm = { bias: -0.75, height: 5.5, mode: 'constant-height', sites: [4, 10], top: 20, metal: 'cu111' };
    const hash = writeHash(state);
    expect(hash).toBe('#sheet=beta12&bias=-0.75&tip-height=5.5&tip-mode=height&match-sites=4-10&match-top=20&match-metal=cu111');
    const { state: back, errors } = readHash(hash, defaultState());
    expect(errors).toEqual([]);
    expect(back).toEqual(state);
    expect(writeHash(readHash('#sheet=beta12', defaultState()).state)).toBe('#sheet=beta12');
  });

  it('round-trips the Unfolded bands panel\'s cut energy and part, and refuses bad ones by name (regression guard of our keys)', () => {
    const state = defaultState();
    state.sheet = { kind: 'preset', name: 'honeycomb' };
    state.unfold = { cut: -0.25, part: 'sigma' };
    const hash = writeHash(state);
    expect(hash).toBe('#sheet=honeycomb&cut-energy=-0.25&unfold-part=sigma');
    const { state: back, errors } = readHash(hash, defaultState());
    expect(errors).toEqual([]);
    expect(back).toEqual(state);
    const bad = readHash('#sheet=honeycomb&cut-energy=99&unfold-part=d', defaultState());
    expect(bad.errors.map((e) => e.message)).toEqual([
      'invalid URL cut-energy: "99" (must lie in [-50, 50] eV from E_F)',
      'invalid URL unfold-part: "d" (must be total, sigma, pi)',
    ]);
    expect(bad.state.unfold).toEqual({ cut: 0, part: 'total' });
  });

  it('refuses bad STM keys by name and keeps the others (zero bias: an empty window, as the CLI\'s --bias)', () => {
    const { state, errors } = readHash('#sheet=alpha&bias=0&tip-height=0.5&tip-mode=sideways&match-sites=3-30&match-top=7&match-metal=pt111', defaultState());
    expect(state.stm).toEqual({ bias: 1, height: 4, mode: 'constant-current', sites: [1, 12], top: 7, metal: null });
    expect(errors.map((e) => e.message)).toEqual([
      'invalid URL bias: "0" (|V| must be at least 0.01 V: the window E_F … E_F + eV is empty at zero bias)',
      'invalid URL tip-height: "0.5" (must lie in [1.5, 15])',
      'invalid URL tip-mode: "sideways" (must be current or height)',
      'invalid URL match-sites: "30" (must be from 1 to 16)',
      'invalid URL match-metal: "pt111" (unknown substrate; substrates: al111, ag111, cu111, au111)',
    ]);
  });
});
