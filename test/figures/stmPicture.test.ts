/**
 * The STM picture figure: a golden file of a small simulated picture and of a measured one with its lattice
 * (regression guards, not outside checks), and assertions on what the page and the exports rely on.
 */
import { decode } from 'fast-png';
import { describe, expect, it } from 'vitest';
import { centredOrigin, latticePoints, pngDataUrl, prepareMeasuredPicture, prepareSimulatedPicture } from '../../src/figures/prepareStm.ts';
import { serializeFigure } from '../../src/figures/serialize.ts';
import { stmPictureFigure, wrapWords } from '../../src/figures/stmPicture.ts';
import { toGrey8 } from '../../src/stm/grey.ts';
import type { FigureStyle } from '../../src/figures/types.ts';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import type { Vec2 } from '../../src/lattice/sheet.ts';
import { stmPicture } from '../../src/stm/stmImage.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { PARAMS, document, matchesGolden } from './helpers.ts';

const sheet = patternToSheet(findSheetPreset('beta12')!.pattern);
const { picture } = stmPicture(new TightBindingModel(sheet, PARAMS), { pixels: 32, cells: 2, mesh: 12 });
const simulated = prepareSimulatedPicture(picture, sheet.cell, { label: 'beta12', lines: ['V = +1 V (empty states), tip 4 Å, constant current'] });
const lattice: { vectors: [Vec2, Vec2]; origin: Vec2 } = { vectors: [[2.9, 0.4], [-0.7, 5.0]], origin: [1.1, 0.9] };
const measured = prepareMeasuredPicture(picture, lattice, { label: 'made-up.png', lines: ['fitted lattice: a = 2.93 Å'], demo: 'DEMO: synthetic picture, not a measurement' });

/** The golden text with the embedded PNG cut out (its base64 digits would be "rounded" as numbers); it is checked below. */
const withoutPng = (text: string) => text.replace(/data:image\/png;base64,[^"]*/, 'data:image/png;base64,…');

describe('stmPictureFigure(data, options)', () => {
  for (const style of ['screen', 'publication'] as FigureStyle[]) {
    it(`golden: beta12 simulated and a measured picture, ${style}`, () => {
      matchesGolden(`stm-beta12-${style}`, withoutPng(serializeFigure(stmPictureFigure(simulated, { document, style, idPrefix: 'golden' }))));
      matchesGolden(`stm-measured-${style}`, withoutPng(serializeFigure(stmPictureFigure(measured, { document, style, idPrefix: 'golden' }))));
    });
  }

  it('embeds the picture as a PNG that decodes to the same grey pixels (fast-png as the outside decoder)', () => {
    const svg = stmPictureFigure(simulated, { document });
    const href = svg.querySelector('image')!.getAttribute('href')!;
    expect(href.startsWith('data:image/png;base64,')).toBe(true);
    const png = decode(Buffer.from(href.slice('data:image/png;base64,'.length), 'base64'));
    expect([png.width, png.height, png.channels]).toEqual([32, 32, 1]);
    expect(Array.from(png.data)).toEqual(Array.from(toGrey8(picture.values)));
  });

  it('pngDataUrl agrees with Node\'s base64 for every length remainder (Buffer as the outside encoder)', () => {
    for (const n of [0, 1, 2, 3, 4, 5, 256]) {
      const bytes = Uint8Array.from({ length: n }, (_, i) => (i * 37 + 11) & 255);
      expect(pngDataUrl(bytes)).toBe(`data:image/png;base64,${Buffer.from(bytes).toString('base64')}`);
    }
  });

  it('names the kind: data-figure "stm" or "stm-measured"; one cell outline; a scale bar no longer than a third of the picture', () => {
    const sim = stmPictureFigure(simulated, { document });
    const mea = stmPictureFigure(measured, { document });
    expect(sim.getAttribute('data-figure')).toBe('stm');
    expect(mea.getAttribute('data-figure')).toBe('stm-measured');
    expect(sim.querySelectorAll('[data-role="cell"]').length).toBe(1);
    expect(sim.querySelectorAll('[data-role="lattice-point"]').length).toBe(0);
    expect(mea.querySelectorAll('[data-role="lattice-point"]').length).toBe(measured.points!.length);
    const bar = Number(sim.querySelector('[data-role="scale-bar"]')!.getAttribute('data-length'));
    expect(bar).toBeLessThanOrEqual((picture.width * picture.pixelSize) / 3);
    expect(bar).toBeGreaterThan(0);
    expect(mea.querySelector('[data-role="lines"] text')!.textContent).toMatch(/^DEMO/);
  });

  it('outlines the shortest cell of the sheet (β12: √3d × 3d, Feng et al., Nat. Chem. 8, 563 (2016), with d = 1.69 Å)', () => {
    const [u, v] = simulated.cell!.vectors;
    const lengths = [Math.hypot(...u), Math.hypot(...v)].sort((p, q) => p - q);
    expect(lengths[0]).toBeCloseTo(Math.sqrt(3) * 1.69, 6);
    expect(lengths[1]).toBeCloseTo(3 * 1.69, 6);
  });
});

describe('centredOrigin(origin, vectors, centre) and latticePoints(...)', () => {
  it('moves the origin by whole cells so that the cell\'s middle is the nearest to the centre (brute force over shifts)', () => {
    const vectors: [Vec2, Vec2] = [[5.07, 0], [5.07, 2.93]];
    const centre: Vec2 = [10, 10];
    const o = centredOrigin([0.3, 0.2], vectors, centre);
    const middle = (p: Vec2) => Math.hypot(p[0] + (vectors[0][0] + vectors[1][0]) / 2 - centre[0], p[1] + (vectors[0][1] + vectors[1][1]) / 2 - centre[1]);
    let best = Infinity;
    for (let i = -10; i <= 10; i++) for (let j = -10; j <= 10; j++) {
      best = Math.min(best, middle([0.3 + i * vectors[0][0] + j * vectors[1][0], 0.2 + i * vectors[0][1] + j * vectors[1][1]]));
    }
    // Rounding the fractional coordinates is nearest in the cell's own metric; within one cell of the Euclidean best.
    expect(middle(o)).toBeLessThan(best + Math.hypot(5.07, 2.93));
    const frac = [(o[0] - 0.3 - ((o[1] - 0.2) / 2.93) * 5.07) / 5.07, (o[1] - 0.2) / 2.93];
    for (const f of frac) expect(Math.abs(f - Math.round(f))).toBeLessThan(1e-9);
  });

  it('lists every lattice point inside the rectangle once (a square lattice counted by hand: 11 × 11 points in 10 × 10)', () => {
    expect(latticePoints([0, 0], [[1, 0], [0, 1]], 10, 10)!.length).toBe(121);
    expect(latticePoints([0, 0], [[1, 0], [0, 1]], 100, 100, 500)).toBeUndefined();
  });
});

describe('wrapWords(text, width)', () => {
  it('keeps every word, in order, and no line longer than the width unless one word is', () => {
    const text = 'fitted lattice: a = 2.920 ± 0.007 Å, b = 5.061 ± 0.009 Å, γ = 90.2 ± 0.2°';
    const lines = wrapWords(text, 20);
    expect(lines.join(' ')).toBe(text);
    for (const line of lines) expect(line.length).toBeLessThanOrEqual(20);
    expect(wrapWords('a verylongwordindeed b', 5)).toEqual(['a', 'verylongwordindeed', 'b']);
  });
});
