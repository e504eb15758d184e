/**
 * The calibration figure: golden files (regression guards, a visual gallery) on a small fit, and the structure the
 * view relies on.
 */
import { describe, expect, it } from 'vitest';
import { calibrationFigure } from '../../src/figures/calibration.ts';
import { pathDistance, prepareCalibration } from '../../src/figures/prepareCalibration.ts';
import { serializeFigure } from '../../src/figures/serialize.ts';
import type { FigureStyle } from '../../src/figures/types.ts';
import { calibrate } from '../../src/learn/calibrate/calibrate.ts';
import { autoPath } from '../../src/tb/kspacePath.ts';
import { HARRISON_1980, presetSheet } from '../tb/fixtures.ts';
import { TRUTH, calibrationSheet, modelReference } from '../learn/calibrate/helpers.ts';
import { document, matchesGolden } from './helpers.ts';

/** χ3 (16 model bands) fitted to the lowest 12 of a noisy reference with E_F and the path's labels. */
function smallFit(title?: string) {
  const sheet = presetSheet('chi3');
  const full = modelReference(sheet, TRUTH, { points: 24, noise: 0.05, seed: 4, offset: 2 });
  const reference = {
    ...full,
    bands: 12,
    energies: Float64Array.from({ length: full.count * 12 }, (_, i) => full.energies[Math.floor(i / 12) * 16 + (i % 12)]),
    fermi: 1.5,
    labels: autoPath(sheet.cell, 24).labels,
    ...(title ? { title } : {}),
  };
  const result = calibrate({ sheets: [calibrationSheet(sheet, reference, 'chi3')], starts: [HARRISON_1980], shift: true });
  return { result, reference, data: prepareCalibration(result, 0, reference) };
}

describe('calibrationFigure(data, options)', () => {
  const { data } = smallFit();
  for (const style of ['screen', 'publication'] as FigureStyle[]) {
    it(`golden: chi3 fitted to a small reference, ${style}`, () => {
      matchesGolden(`calibration-chi3-${style}`, serializeFigure(calibrationFigure(data, { document, style, idPrefix: 'golden' })));
    });
  }

  it('draws every reference energy as a dot (matched ones filled), every model band as a path (unmatched ones marked), E_F and the rms', () => {
    const svg = calibrationFigure(data, { document });
    expect(svg.getAttribute('data-figure')).toBe('calibration');
    expect(Number(svg.getAttribute('data-reference-dots'))).toBe(24 * 12);
    // One arc pair per dot: every dot drawn once, in the path of its weight.
    const arcs = [...svg.querySelectorAll('g[data-layer="reference"] path')].reduce((n, p) => n + (p.getAttribute('d')!.match(/M/g) ?? []).length, 0);
    expect(arcs).toBe(24 * 12);
    expect(svg.querySelectorAll('g[data-layer="reference"] path[data-unmatched]').length).toBe(0);
    expect(svg.querySelectorAll('g[data-layer="model"] path').length).toBe(16);
    expect(svg.querySelectorAll('g[data-layer="model"] path[data-unmatched]').length).toBe(4);
    expect(svg.querySelector('line[data-fermi]')?.getAttribute('data-fermi')).toBe('1.5');
    expect(Number(svg.getAttribute('data-rms'))).toBeCloseTo(data.rms, 12);
    expect(svg.querySelector('text[data-role="statistics"]')?.textContent).toMatch(/not a prediction/);
    expect(svg.querySelector('text[data-role="demo"]')).toBeNull();
  });

  it('draws reference bands the fit did not match as hollow dots', () => {
    const { result, reference } = smallFit();
    const wider = prepareCalibration(result, 0, reference);
    const shifted = { ...wider, match: { ...wider.match, referenceFirst: 2, count: 10 }, weights: wider.weights.subarray(0, 24 * 10) };
    const svg = calibrationFigure(shifted, { document });
    const unmatched = svg.querySelector('g[data-layer="reference"] path[data-unmatched]')!;
    expect((unmatched.getAttribute('d')!.match(/M/g) ?? []).length).toBe(24 * 2);
  });

  it('says DEMO on the figure when the reference is DEMO data', () => {
    const { data: demo } = smallFit('DEMO — invented');
    const svg = calibrationFigure(demo, { document });
    expect(svg.querySelector('text[data-role="demo"]')?.textContent).toMatch(/^DEMO/);
  });
});

describe('pathDistance(kpoints)', () => {
  it('adds the lengths of the steps (Å⁻¹) and does not advance over a jump to another branch', () => {
    const kpoints = Float64Array.of(0, 0, 0.1, 0, 0.2, 0, 0.3, 0, 2, 2, 2.1, 2);
    const { distance, breaks } = pathDistance(kpoints);
    expect(Array.from(distance).map((d) => Number(d.toFixed(12)))).toEqual([0, 0.1, 0.2, 0.3, 0.3, 0.4]);
    expect(breaks).toEqual([4]);
  });
});
