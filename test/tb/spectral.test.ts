/**
 * The spectral function and constant-energy cuts of unfolded bands (src/tb/spectral.ts), and the cut's k grid over
 * the primitive zone (src/tb/unfoldZone.ts).
 */
import { describe, expect, it } from 'vitest';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { constantEnergyCut, gridSpread, pathSpread, spectralEnergies, spectralFunction, spectralImage, unfoldedRange } from '../../src/tb/spectral.ts';
import { unfoldBands } from '../../src/tb/unfold.ts';
import { patternUnfolding } from '../../src/tb/unfoldSheet.ts';
import { primitivePath, primitiveZone, zoneGrid } from '../../src/tb/unfoldZone.ts';
import { HARRISON_1980, withParameters } from './fixtures.ts';

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

describe('spectralImage(result, low, high, rows, width, spread)', () => {
  it('is the mean of A over each energy bin: the midpoint value on fine bins, and Σ bins·bin = Σ_n W_n', () => {
    // Midpoint rule (error O(bin²·A″)): an independent route through spectralFunction at the bin centres.
    const [low, high] = unfoldedRange(result, 2);
    const rows = 4000;
    const bin = (high - low) / rows;
    const image = spectralImage(result, low, high, rows, 0.2);
    const centres = spectralFunction(result, spectralEnergies(low + bin / 2, high - bin / 2, rows), 0.2);
    let worst = 0;
    let peak = 0;
    for (let i = 0; i < image.total.length; i++) {
      worst = Math.max(worst, Math.abs(image.total[i] - centres.total[i]));
      peak = Math.max(peak, centres.total[i]);
    }
    expect(worst / peak).toBeLessThan(1e-3);
    const coarse = spectralImage(result, low, high, 37, 0.2, pathSpread(result));
    for (let k = 0; k < result.count; k++) {
      let sum = 0;
      for (let r = 0; r < 37; r++) sum += coarse.total[k * 37 + r] * ((high - low) / 37);
      expect(sum).toBeCloseTo((4 * result.atoms) / result.sites, 9);
    }
  });
});

describe('gridSpread(result, pixel, side) and pathSpread(result)', () => {
  it('give the change of a band across one step: h·|∇E| of the analytic s band inside the zone', () => {
    // E(k) = εs + 2V·Σ_j cos(k·a_j) (analytic nearest-neighbour s band), ∇E = −2V·Σ_j a_j·sin(k·a_j); the s-only
    // set leaves the p states flat (invented values, analytic check only).
    const sOnly = withParameters(HARRISON_1980, { hopping: { sp_sigma: 0, pp_sigma: 0, pp_pi: 0 } });
    const one = patternUnfolding(findSheetPreset('delta6')!.pattern);
    const side = 41;
    const grid = zoneGrid(one, side);
    const solved = unfoldBands(new TightBindingModel(one.sheet, sOnly), 1, grid.kpoints);
    const spread = gridSpread(solved, grid.pixel, side);
    const h = (2 * grid.reach) / side;
    const v = sOnly.hopping.ss_sigma;
    const a = [[1.69, 0], [0.845, 1.69 * Math.sqrt(3) / 2], [-0.845, 1.69 * Math.sqrt(3) / 2]];
    let checked = 0;
    for (let p = 0; p < side * side; p++) {
      const i = p % side, j = (p - i) / side;
      const k = grid.pixel[p];
      if (k < 0 || [[i - 1, j], [i + 1, j], [i, j - 1], [i, j + 1]].some(([x, y]) => grid.pixel[y * side + x] < 0)) continue;
      const [kx, ky] = [grid.kpoints[2 * k], grid.kpoints[2 * k + 1]];
      // The lowest state is the s band where it lies well below the flat p states (also at the neighbours).
      let gx = 0, gy = 0, e = sOnly.onsite.s;
      for (const [x, y] of a) {
        gx -= 2 * v * x * Math.sin(kx * x + ky * y);
        gy -= 2 * v * y * Math.sin(kx * x + ky * y);
        e += 2 * v * Math.cos(kx * x + ky * y);
      }
      if (!(e < sOnly.onsite.p - 6)) continue;
      const exact = h * Math.hypot(gx, gy);
      expect(Math.abs(spread[k * solved.bands] - exact)).toBeLessThan(0.02 * (h * 8 * Math.abs(v) * 1.69) + 1e-9);
      checked++;
    }
    expect(checked).toBeGreaterThan(300);
    // On a path, the flat p states do not spread; the s band does.
    const along = pathSpread(unfoldBands(new TightBindingModel(one.sheet, sOnly), 1, primitivePath(one, 30).kpoints));
    expect(along[5 * 4 + 3]).toBeLessThan(1e-12);
    expect(along[5 * 4]).toBeGreaterThan(0.1);
  });
});
