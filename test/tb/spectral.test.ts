/**
 * The spectral function and constant-energy cuts of unfolded bands (src/tb/spectral.ts), and the cut's k grid over
 * the primitive zone (src/tb/unfoldZone.ts).
 */
import { describe, expect, it } from 'vitest';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { constantEnergyCut, spectralEnergies, spectralFunction, unfoldedRange } from '../../src/tb/spectral.ts';
import { unfoldBands } from '../../src/tb/unfold.ts';
import { patternUnfolding } from '../../src/tb/unfoldSheet.ts';
import { primitivePath, primitiveZone, zoneGrid } from '../../src/tb/unfoldZone.ts';
import { HARRISON_1980 } from './fixtures.ts';

const beta12 = patternUnfolding(findSheetPreset('beta12')!.pattern);
const model = new TightBindingModel(beta12.sheet, HARRISON_1980);
const path = primitivePath(beta12, 40);
const result = unfoldBands(model, beta12.sites, path.kpoints);

describe('spectralFunction(result, energies, width)', () => {
  it('integrates over E to Σ_n W_n(k) = 4(1 − η) at every k', () => {
    // ∫ exp(−(x/w)²)/(w√π) dx = 1 (the Gaussian integral); trapezoid sums on a grid of step w/20 are exact to
    // far below 1e-9 for a Gaussian (its Fourier transform decays as exp(−(πw/h)²)).
    const [low, high] = unfoldedRange(result, 2);
    const grid = spectralEnergies(low, high, Math.ceil((high - low) / 0.005) + 1);
    const a = spectralFunction(result, grid, 0.1);
    const step = grid[1] - grid[0];
    for (let k = 0; k < result.count; k++) {
      let integral = 0;
      for (let i = 0; i < grid.length; i++) integral += a.total[k * grid.length + i] * step;
      expect(integral).toBeCloseTo((4 * result.atoms) / result.sites, 9);
    }
  });

  it('has its σ part at most the total, and a defect-free sheet peaks at 1/(w√π) on a primitive band', () => {
    const a = spectralFunction(result, spectralEnergies(-35, 20, 551), 0.1);
    for (let i = 0; i < a.total.length; i++) expect(a.sigma[i]).toBeLessThanOrEqual(a.total[i] + 1e-12);
    const delta6 = patternUnfolding(findSheetPreset('delta6')!.pattern);
    const one = unfoldBands(new TightBindingModel(delta6.sheet, HARRISON_1980), 1, Float64Array.of(0, 0));
    // At Γ the s band is alone at its energy: A = W·δ_w(0) = 1/(w√π) (the Gaussian's peak, analytic).
    const lowest = one.energies[0];
    const peak = spectralFunction(one, Float64Array.of(lowest, lowest + 1), 0.1).total[0];
    expect(peak).toBeCloseTo(1 / (0.1 * Math.sqrt(Math.PI)), 12);
  });
});

describe('constantEnergyCut(result, energy, width)', () => {
  it('equals the spectral function at that energy', () => {
    const grid = spectralEnergies(-20, 5, 251);
    const a = spectralFunction(result, grid, 0.15);
    const at = 137;
    const cut = constantEnergyCut(result, grid[at], 0.15);
    for (let k = 0; k < result.count; k++) {
      expect(cut.total[k]).toBeCloseTo(a.total[k * grid.length + at], 12);
      expect(cut.sigma[k]).toBeCloseTo(a.sigma[k * grid.length + at], 12);
    }
  });
});

describe('zoneGrid(unfolding, side)', () => {
  it('covers the hexagonal zone: pixels inside ≈ its area (3√3/2)·|K|² over the pixel area, one k-point per ±k pair', () => {
    const side = 101;
    const grid = zoneGrid(beta12, side);
    const inside = grid.pixel.reduce((n, p) => n + (p >= 0 ? 1 : 0), 0);
    const radius = 4 * Math.PI / (3 * beta12.bond); // |K| of the triangular lattice (common practice)
    const h = (2 * grid.reach) / side;
    expect(inside / ((1.5 * Math.sqrt(3) * radius * radius) / (h * h))).toBeCloseTo(1, 1);
    expect(grid.kpoints.length / 2).toBe((inside + 1) / 2);
    // Pixel p and its mirror P² − 1 − p are ±k and share one k-point.
    for (let p = 0; p < side * side; p++) expect(grid.pixel[p]).toBe(grid.pixel[side * side - 1 - p]);
  });

  it('puts the zone corners of the path (K) within reach, turned with the sheet', () => {
    const turned = zoneGrid({ bond: 1.69, angle: 0.3 }, 21);
    const zone = primitiveZone({ bond: 1.69, angle: 0.3 });
    for (const [x, y] of zone.corners) expect(Math.max(Math.abs(x), Math.abs(y))).toBeLessThan(turned.reach);
    expect(Math.hypot(...zone.points.find((p) => p.label === 'K')!.k)).toBeCloseTo(4 * Math.PI / (3 * 1.69), 12);
  });
});
