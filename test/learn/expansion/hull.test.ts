/**
 * lowerHull(eta, energy), hullEnergyAt, aboveHull: the lower convex hull and the chemical potentials of its
 * vertices, checked analytically.
 */
import { describe, expect, it } from 'vitest';
import { aboveHull, hullEnergyAt, lowerHull } from '../../../src/learn/expansion/hull.ts';

describe('lowerHull', () => {
  it('of two points is the line through them: every η between lies at the interpolated energy (analytic)', () => {
    const hull = lowerHull([0, 0.25], [-6, -5]);
    expect(hull.map((v) => v.index)).toEqual([0, 1]);
    for (const eta of [0, 0.05, 0.125, 0.2, 0.25]) expect(hullEnergyAt(hull, eta)).toBeCloseTo(-6 + 4 * eta, 14);
    expect(aboveHull(hull, 0.1, -5)).toBeCloseTo(0.6, 14);
    expect(aboveHull(hull, 0.1, -5.8)).toBeCloseTo(-0.2, 14); // below the line: negative
    expect(hullEnergyAt(hull, 0.3)).toBeNaN(); // outside the points: no hull
  });

  it('keeps the points of a convex parabola and drops those above it, the lowest at equal η (analytic)', () => {
    const eta = [0, 0.1, 0.2, 0.3, 0.15, 0.2, 0.1];
    const energy = eta.map((x, i) => (x - 0.2) ** 2 + (i >= 4 ? 0.01 : 0));
    energy[6] = (0.1 - 0.2) ** 2 - 0.001; // lower at equal η: replaces index 1
    expect(lowerHull(eta, energy).map((v) => v.index)).toEqual([0, 6, 2, 3]);
  });

  it('leaves out a point on a facet (collinear), which lies at zero distance', () => {
    const hull = lowerHull([0, 0.1, 0.2], [0, -1, -2]);
    expect(hull.map((v) => v.index)).toEqual([0, 2]);
    expect(aboveHull(hull, 0.1, -1)).toBeCloseTo(0, 14);
  });

  it('gives each vertex the boron chemical potentials where it is stable: μ from −(right slope) to −(left slope), open at the ends (analytic: minimum of e − μ(1 − η))', () => {
    const hull = lowerHull([0, 0.2, 0.5], [-6, -5.5, -4]);
    // Facet slopes: (−5.5 + 6)/0.2 = 2.5 and (−4 + 5.5)/0.3 = 5.
    expect(hull.map((v) => [v.muLow, v.muHigh])).toEqual([[-2.5, Infinity], [-5, -2.5], [-Infinity, -5]]);
    // Check by brute force: at μ in each range, that vertex minimises e − μ(1 − η) over the three points.
    for (const [mu, winner] of [[-1, 0], [-3, 1], [-7, 2]] as const) {
      const omega = hull.map((v) => v.energy - mu * (1 - v.eta));
      expect(omega.indexOf(Math.min(...omega))).toBe(winner);
    }
  });

  it('keeps its vertices and distances when a line a + bη is added to every energy, and moves μ by −b (a change of energy reference)', () => {
    const eta = [0, 1 / 9, 1 / 6, 1 / 5, 1 / 4, 1 / 3, 2 / 9];
    const energy = [0, -0.04, -0.05, -0.056, -0.06, 0, -0.03];
    const shifted = energy.map((e, i) => e + 3.1 - 6.2 * eta[i]);
    const a = lowerHull(eta, energy);
    const b = lowerHull(eta, shifted);
    expect(b.map((v) => v.index)).toEqual(a.map((v) => v.index));
    a.forEach((v, k) => {
      if (Number.isFinite(v.muLow)) expect(b[k].muLow).toBeCloseTo(v.muLow + 6.2, 12);
      if (Number.isFinite(v.muHigh)) expect(b[k].muHigh).toBeCloseTo(v.muHigh + 6.2, 12);
    });
    eta.forEach((x, i) => expect(aboveHull(b, x, shifted[i])).toBeCloseTo(aboveHull(a, x, energy[i]), 12));
  });
});
