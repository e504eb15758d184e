/**
 * Golden SVG files of the four sheet figures on three presets, of the η–δ map of the named sheets and of the DEMO energies' energy–η figure, in both looks (numbers rounded to 2 decimals, ids
 * renumbered): regression guards, and a visual gallery — open test/figures/golden/*.svg in a browser.
 */
import { describe, it } from 'vitest';
import { bandsFigure } from '../../src/figures/bands.ts';
import { dosFigure } from '../../src/figures/dos.ts';
import { prepareSheet, prepareState } from '../../src/figures/prepare.ts';
import { serializeFigure } from '../../src/figures/serialize.ts';
import { sheetFigure } from '../../src/figures/sheet.ts';
import { zoneFigure } from '../../src/figures/zone.ts';
import type { FigureStyle } from '../../src/figures/types.ts';
import { etaDeltaFigure } from '../../src/figures/etaDelta.ts';
import { energyHullFigure } from '../../src/figures/energyHull.ts';
import { PARAMS, demoEnergyHull, document, matchesGolden, preset, presetEtaDelta } from './helpers.ts';

describe('figure golden files', () => {
  for (const name of ['alpha', 'honeycomb', 'beta12']) {
    const { sheet, spectra } = preset(name);
    for (const style of ['screen', 'publication'] as FigureStyle[]) {
      const options = { document, style, idPrefix: 'golden' };
      it(`bands ${name} ${style}`, () => matchesGolden(`bands-${name}-${style}`, serializeFigure(bandsFigure(spectra, { ...options, selected: { kIndex: 10, band: 2 } }))));
      it(`dos ${name} ${style}`, () => matchesGolden(`dos-${name}-${style}`, serializeFigure(dosFigure(spectra, options))));
      it(`zone ${name} ${style}`, () => matchesGolden(`zone-${name}-${style}`, serializeFigure(zoneFigure(spectra, { ...options, selectedK: [0.2, 0.1] }))));
      it(`sheet ${name} ${style}`, () => matchesGolden(`sheet-${name}-${style}`, serializeFigure(sheetFigure(sheet, options))));
    }
  }
  it('sheet alpha with a Bloch state, publication', () => {
    const { sheet, spectra } = preset('alpha');
    const state = prepareState(sheet.sheet, PARAMS, spectra.path, 10, 20);
    const withState = prepareSheet({ label: 'alpha', pattern: sheet.pattern }, { bondCutoff: PARAMS.cutoff, repeats: [2, 2], state });
    matchesGolden('sheet-alpha-state-publication', serializeFigure(sheetFigure(withState, { document, style: 'publication', idPrefix: 'golden' })));
  });
  const energyHull = demoEnergyHull();
  for (const style of ['screen', 'publication'] as FigureStyle[]) {
    it(`energy-hull DEMO ${style}`, () => matchesGolden(`energy-hull-demo-${style}`, serializeFigure(energyHullFigure(energyHull, { document, style, idPrefix: 'golden' }))));
  }
  const etaDelta = presetEtaDelta();
  for (const style of ['screen', 'publication'] as FigureStyle[]) {
    it(`eta-delta presets ${style}`, () => matchesGolden(`eta-delta-presets-${style}`, serializeFigure(etaDeltaFigure(etaDelta, { document, style, idPrefix: 'golden' }))));
  }
});
