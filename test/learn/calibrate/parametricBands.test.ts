import { describe, expect, it } from 'vitest';
import { ParametricBands } from '../../../src/learn/calibrate/parametricBands.ts';
import { parameterVector } from '../../../src/learn/calibrate/modelParameters.ts';
import { computeBands } from '../../../src/tb/bands.ts';
import { autoPath } from '../../../src/tb/kspacePath.ts';
import { TightBindingModel } from '../../../src/tb/model.ts';
import { HARRISON_1980, presetSheet } from '../../tb/fixtures.ts';
import { BUCKLED } from './helpers.ts';

describe('ParametricBands(sheet, kpoints, options).evaluate(values, energies, derivatives)', () => {
  for (const [name, sheet] of [['alpha (planar)', presetSheet('alpha')], ['buckled β12', BUCKLED]] as const) {
    it(`${name}: the bands equal computeBands of the same model (an independent route: src/tb/bands.ts)`, () => {
      const params = { ...HARRISON_1980, exponent: 2.6, cutoff: 3.0 };
      const path = autoPath(sheet.cell, 40);
      const reference = computeBands(new TightBindingModel(sheet, params), path.kpoints);
      const bands = new ParametricBands(sheet, path.kpoints, { cutoff: params.cutoff, d0: params.d0, block: 'full' });
      const energies = new Float64Array(bands.count * bands.bands);
      bands.evaluate(parameterVector(params, params.d0), energies, new Float64Array(energies.length * 7));
      for (let i = 0; i < energies.length; i++) expect(energies[i]).toBeCloseTo(reference.energies[i], 10);
    });

    it(`${name}: Hellmann–Feynman derivatives agree with central differences of the bands (Hellmann 1937, Feynman 1939)`, () => {
      const params = { ...HARRISON_1980, exponent: 2.6, cutoff: 3.0 };
      const path = autoPath(sheet.cell, 25);
      const bands = new ParametricBands(sheet, path.kpoints, { cutoff: params.cutoff, d0: params.d0, block: 'full' });
      const values = parameterVector(params, params.d0);
      const size = bands.count * bands.bands;
      const energies = new Float64Array(size);
      const slopes = new Float64Array(size * 7);
      bands.evaluate(values, energies, slopes);
      const up = new Float64Array(size);
      const down = new Float64Array(size);
      const h = 1e-5;
      let checked = 0;
      for (let j = 0; j < 7; j++) {
        const plus = values.slice();
        const minus = values.slice();
        plus[j] += h;
        minus[j] -= h;
        bands.evaluate(plus, up, null);
        bands.evaluate(minus, down, null);
        for (let i = 0; i < size; i++) {
          // Skip accidental crossings, where a sorted band has no derivative.
          const b = i % bands.bands;
          const gapBelow = b > 0 ? energies[i] - energies[i - 1] : Infinity;
          const gapAbove = b + 1 < bands.bands ? energies[i + 1] - energies[i] : Infinity;
          if ((gapBelow > 1e-9 && gapBelow < 1e-3) || (gapAbove > 1e-9 && gapAbove < 1e-3)) continue;
          expect(slopes[i * 7 + j]).toBeCloseTo((up[i] - down[i]) / (2 * h), 5);
          checked++;
        }
      }
      expect(checked).toBeGreaterThan(0.9 * 7 * size);
    });
  }

  it('the π block of a planar sheet alone: the pz bands of src/tb/model.ts', () => {
    const sheet = presetSheet('honeycomb');
    const path = autoPath(sheet.cell, 30);
    const bands = new ParametricBands(sheet, path.kpoints, { cutoff: 2.1, d0: 1.69, block: 'pi' });
    expect(bands.bands).toBe(sheet.atoms.length);
    const energies = new Float64Array(bands.count * bands.bands);
    bands.evaluate(parameterVector(HARRISON_1980, 1.69), energies, null);
    const model = new TightBindingModel(sheet, HARRISON_1980);
    const re = new Float64Array(4);
    const im = new Float64Array(4);
    for (let k = 0; k < bands.count; k++) {
      model.hamiltonian(path.kpoints[2 * k], path.kpoints[2 * k + 1], 'pi', re, im);
      // 2×2 Hermitian: eigenvalues (a + d)/2 ± √(((a − d)/2)² + |b|²) (closed form).
      const half = (re[0] - re[3]) / 2;
      const root = Math.sqrt(half * half + re[1] ** 2 + im[1] ** 2);
      expect(energies[2 * k]).toBeCloseTo((re[0] + re[3]) / 2 - root, 10);
      expect(energies[2 * k + 1]).toBeCloseTo((re[0] + re[3]) / 2 + root, 10);
    }
  });
});
