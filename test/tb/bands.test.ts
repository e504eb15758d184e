import { describe, expect, it } from 'vitest';
import { computeBands } from '../../src/tb/bands.ts';
import { autoPath } from '../../src/tb/kspacePath.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { HARRISON_1980, presetSheet } from './fixtures.ts';

describe('computeBands(model, kpoints, options)', () => {
  it('returns ascending bands, 4 per atom, with the parameter set named and progress reported to the end', () => {
    const model = new TightBindingModel(presetSheet('chi3'), HARRISON_1980);
    const path = autoPath(model.sheet.cell, 600);
    const calls: [number, number][] = [];
    const result = computeBands(model, path.kpoints, { onProgress: (done, total) => calls.push([done, total]) });
    expect(result.parameters).toBe('harrison1980');
    expect(result.count).toBe(600);
    expect(result.bands).toBe(16);
    for (let k = 0; k < result.count; k++) {
      for (let b = 1; b < result.bands; b++) expect(result.energies[k * 16 + b]).toBeGreaterThanOrEqual(result.energies[k * 16 + b - 1]);
    }
    expect(calls[calls.length - 1]).toEqual([600, 600]);
    // Trace of H is the sum of on-site energies: Σ_b E_b = atoms·(εs + 3εp) at every k (linear algebra).
    const trace = 4 * (HARRISON_1980.onsite.s + 3 * HARRISON_1980.onsite.p);
    let sum = 0;
    for (let b = 0; b < 16; b++) sum += result.energies[123 * 16 + b];
    expect(sum).toBeCloseTo(trace, 9);
  });

  it('returns empty results for no k-points', () => {
    const result = computeBands(new TightBindingModel(presetSheet('delta6'), HARRISON_1980), new Float64Array(0));
    expect(result.count).toBe(0);
    expect(result.energies.length).toBe(0);
  });
});
