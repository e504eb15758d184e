/**
 * The unfolded-bands and constant-energy-cut figures: golden SVG files (regression guards, the embedded PNG cut out),
 * the PNG read back with fast-png (an outside decoder), the colour scale against d3's viridis, and the live E_F.
 */
import { decode } from 'fast-png';
import { interpolateViridis, rgb } from 'd3';
import { describe, expect, it } from 'vitest';
import { cutFigure } from '../../src/figures/cut.ts';
import { setFermi } from '../../src/figures/energyPlot.ts';
import { prepareCut, prepareUnfolded, solveUnfolding } from '../../src/figures/prepareUnfold.ts';
import { serializeFigure } from '../../src/figures/serialize.ts';
import type { FigureStyle } from '../../src/figures/types.ts';
import { unfoldedFigure } from '../../src/figures/unfolded.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { patternUnfolding } from '../../src/tb/unfoldSheet.ts';
import { PARAMS, document, matchesGolden } from './helpers.ts';

const solution = solveUnfolding(patternUnfolding(findSheetPreset('honeycomb')!.pattern), PARAMS, { label: 'honeycomb', pathPoints: 60, cutPixels: 25 });
const fermi = -6.64;
const unfolded = prepareUnfolded(solution, { smearing: 0.1, fermi, energyRange: [-25, 10], rows: 80 });
const cut = prepareCut(solution, { smearing: 0.1, fermi, energy: fermi + 1, part: 'pi' });

const withoutPng = (text: string) => text.replace(/data:image\/png;base64,[^"]*/, 'data:image/png;base64,…');
const pngOf = (svg: SVGSVGElement) => decode(Buffer.from(svg.querySelector('image')!.getAttribute('href')!.slice('data:image/png;base64,'.length), 'base64'));

describe('unfoldedFigure(data, options) and cutFigure(data, options)', () => {
  for (const style of ['screen', 'publication'] as FigureStyle[]) {
    it(`golden: honeycomb unfolded and a π cut at E_F + 1 eV, ${style}`, () => {
      matchesGolden(`unfolded-honeycomb-${style}`, withoutPng(serializeFigure(unfoldedFigure(unfolded, { document, style, idPrefix: 'golden' }))));
      matchesGolden(`cut-honeycomb-${style}`, withoutPng(serializeFigure(cutFigure(cut, { document, style, idPrefix: 'golden' }))));
    });
  }

  it('embeds one column per path point and one row per energy bin, the largest value at the top of d3\'s viridis', () => {
    const png = pngOf(unfoldedFigure(unfolded, { document }));
    expect([png.width, png.height, png.channels]).toEqual([60, 80, 4]);
    // The brightest pixel is viridis(1) (d3-scale-chromatic, an outside implementation of the scale), the dimmest viridis(0).
    const top = rgb(interpolateViridis(1));
    const bottom = rgb(interpolateViridis(0));
    let brightest = 0;
    let sawBottom = false;
    for (let p = 0; p < png.width * png.height; p++) {
      const [r, g, b] = [png.data[4 * p], png.data[4 * p + 1], png.data[4 * p + 2]];
      if (r === top.r && g === top.g && b === top.b) brightest++;
      if (r === bottom.r && g === bottom.g && b === bottom.b) sawBottom = true;
    }
    expect(brightest).toBeGreaterThan(0);
    expect(sawBottom).toBe(true);
  });

  it('leaves the cut transparent outside the zone and opaque at Γ', () => {
    const png = pngOf(cutFigure(cut, { document }));
    expect([png.width, png.height, png.channels]).toEqual([25, 25, 4]);
    expect(png.data[3]).toBe(0); // top-left corner: outside the hexagon
    expect(png.data[4 * (12 * 25 + 12) + 3]).toBe(255); // the centre pixel, Γ
  });

  it('marks what it shows: data-part, the cut energy, a colour bar with its maximum; E_F moves with setFermi', () => {
    const svg = unfoldedFigure(unfolded, { document });
    expect(svg.getAttribute('data-figure')).toBe('unfolded');
    expect(svg.getAttribute('data-part')).toBe('total');
    expect(Number(svg.querySelector('[data-scale-max]')!.getAttribute('data-scale-max'))).toBe(unfolded.scaleMax);
    setFermi(svg, -2);
    expect(svg.querySelector('line[data-fermi]')!.getAttribute('data-fermi')).toBe('-2');
    const drawnCut = cutFigure(cut, { document });
    expect(drawnCut.getAttribute('data-figure')).toBe('cut');
    expect(drawnCut.getAttribute('data-part')).toBe('pi');
    expect(Number(drawnCut.getAttribute('data-cut-energy'))).toBe(fermi + 1);
    expect(drawnCut.querySelectorAll('[data-k-label]')).toHaveLength(3);
  });

  it('draws the σ and π parts on the scale of the total, so the three compare', () => {
    const sigma = prepareUnfolded(solution, { smearing: 0.1, fermi, energyRange: [-25, 10], rows: 80, part: 'sigma' });
    const pi = prepareUnfolded(solution, { smearing: 0.1, fermi, energyRange: [-25, 10], rows: 80, part: 'pi' });
    expect(sigma.scaleMax).toBe(unfolded.scaleMax);
    expect(pi.scaleMax).toBe(unfolded.scaleMax);
  });
});
