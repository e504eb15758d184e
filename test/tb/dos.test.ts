import { describe, expect, it } from 'vitest';
import { energyGrid, gaussianDos, integrate } from '../../src/tb/dos.ts';
import { triangleDos } from '../../src/tb/dosTriangle.ts';
import { fillSpectrum } from '../../src/tb/fill.ts';
import { meshSpectrum } from '../../src/tb/meshSpectrum.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { HARRISON_1980, presetSheet, withParameters } from './fixtures.ts';

describe('gaussianDos and triangleDos', () => {
  for (const name of ['alpha', 'chi3']) {
    it(`integrate to 8 states per atom (4 orbitals × 2 spins), 6 σ and 2 π, for ${name}`, () => {
      // Normalisation by construction: s, px, py, pz on every atom, two spins (common practice).
      const spectrum = meshSpectrum(new TightBindingModel(presetSheet(name), HARRISON_1980), { mesh: 18 });
      const grid = energyGrid(spectrum, { points: 3001 });
      for (const dos of [gaussianDos(spectrum, grid, 0.1), triangleDos(spectrum, grid)]) {
        expect(integrate(grid, dos.total)).toBeCloseTo(8, 9);
        expect(integrate(grid, dos.sigma)).toBeCloseTo(6, 9);
        expect(integrate(grid, dos.pi)).toBeCloseTo(2, 9);
        expect(dos.parameters).toBe('harrison1980');
      }
    });
  }

  it('Gaussian DOS integrated up to E_F gives the electron count of fill at the same width', () => {
    // The broadening is the derivative of the occupation ½·erfc((E − E_F)/σ), so ∫^{E_F} g = N(E_F).
    const spectrum = meshSpectrum(new TightBindingModel(presetSheet('beta12'), HARRISON_1980), { mesh: 18 });
    const result = fillSpectrum(spectrum, { doping: 0.2, smearing: 0.2 });
    const grid = energyGrid(spectrum, { points: 20001, margin: 2 });
    const dos = gaussianDos(spectrum, grid, 0.2);
    let count = 0;
    for (let i = 1; i < grid.length && grid[i] <= result.fermi; i++) count += 0.5 * (dos.total[i] + dos.total[i - 1]) * (grid[i] - grid[i - 1]);
    expect(count).toBeCloseTo(3.2, 2);
  });
});

describe('triangleDos of the one-atom triangular s band', () => {
  // E = εs + 2t[cos k·a1 + cos k·a2 + cos k·(a1 − a2)], t = V_ssσ < 0 (analytic tight-binding band): band from
  // εs + 6t (Γ) to εs − 3t (K). Near Γ, E ≈ εs + 6t + (3/2)|t|d²k², a 2D free band whose DOS per atom, both spins,
  // is A_cell/(2π·(3/2)|t|d²) = √3/(6π|t|) (A_cell = (√3/2)d²; 2D free-electron DOS, e.g. Ashcroft & Mermin (1976)).
  // V_spσ = 0 and εp far above isolate the s band (invented values, for the analytic check only).
  const params = withParameters(HARRISON_1980, { hopping: { sp_sigma: 0 }, onsite: { p: 80 } });
  const spectrum = meshSpectrum(new TightBindingModel(presetSheet('delta6'), params), { mesh: 120 });
  const t = params.hopping.ss_sigma;
  const bottom = params.onsite.s + 6 * t;
  const top = params.onsite.s - 3 * t;
  const step = 0.01;
  const points = Math.round((top - bottom + 2) / step) + 1;
  const grid = Float64Array.from({ length: points }, (_, i) => bottom - 1 + i * step);
  const dos = triangleDos(spectrum, grid);

  it('vanishes outside [εs + 6t, εs − 3t] and holds 2 states per atom inside', () => {
    let inside = 0;
    for (let i = 0; i < points; i++) {
      if (grid[i] < bottom - step || grid[i] > top + step) expect(dos.total[i]).toBe(0);
      else inside += dos.total[i] * step;
    }
    expect(inside).toBeCloseTo(2, 9);
  });

  it('approaches √3/(6π|t|) just above the band bottom', () => {
    const expected = Math.sqrt(3) / (6 * Math.PI * Math.abs(t));
    // Mean over 0.1 … 0.3 eV above the bottom (the band is quadratic there to ~1 %).
    let sum = 0, n = 0;
    for (let i = 0; i < points; i++) {
      if (grid[i] > bottom + 0.1 && grid[i] < bottom + 0.3) {
        sum += dos.total[i];
        n++;
      }
    }
    expect(Math.abs(sum / n - expected) / expected).toBeLessThan(0.03);
  });
});
