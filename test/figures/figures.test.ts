import { describe, expect, it } from 'vitest';
import { bandsFigure, bandsPick, setSelected } from '../../src/figures/bands.ts';
import { dosFigure } from '../../src/figures/dos.ts';
import { setFermi, setRule } from '../../src/figures/energyPlot.ts';
import { fillSpectrum } from '../../src/tb/fill.ts';
import { countingRuleDoping } from '../../src/tb/countingRule.ts';
import { prepareSheet, prepareState } from '../../src/figures/prepare.ts';
import { svgText } from '../../src/figures/serialize.ts';
import { sheetFigure } from '../../src/figures/sheet.ts';
import { setZoneMarker, zoneFigure } from '../../src/figures/zone.ts';
import { PARAMS, document, preset } from './helpers.ts';

const alpha = preset('alpha');

describe('bandsFigure(data, options)', () => {
  it('is one <svg data-figure="bands"> with every band a curve carrying data-band', () => {
    const svg = bandsFigure(alpha.spectra, { document });
    expect(svg.getAttribute('data-figure')).toBe('bands');
    const bands = svg.querySelectorAll('path[data-band]');
    expect(bands.length).toBe(32);
    expect(bands[31].getAttribute('data-band')).toBe('31');
    // Planar α: σ bands in the σ colour, π bands in the π colour.
    expect(new Set([...bands].map((b) => b.getAttribute('stroke'))).size).toBe(2);
  });

  it('carries E_F at full precision (String(fermi)) on the one E_F line: the value fill computes', () => {
    const svg = bandsFigure(alpha.spectra, { document });
    const lines = svg.querySelectorAll('[data-fermi]');
    expect(lines.length).toBe(1);
    expect(lines[0].getAttribute('data-fermi')).toBe(String(alpha.spectra.fermi));
  });

  it('setRule draws the E_F of the counting rule\u2019s doping; for α (η = 1/9, δ = 0) it is the neutral E_F', () => {
    // The counting rule puts the neutral α sheet exactly at σ filling: δ(1/9) = 8/(3·8/9) − 3 = 0 (common practice).
    expect(countingRuleDoping(1 / 9)).toBeCloseTo(0, 14);
    const rule = fillSpectrum(alpha.spectra.spectrum, { doping: countingRuleDoping(1 / 9), smearing: alpha.spectra.smearing }).fermi;
    for (const svg of [bandsFigure(alpha.spectra, { document }), dosFigure(alpha.spectra, { document })]) {
      const group = svg.querySelector('g[data-layer="rule"]')!;
      expect(group.getAttribute('visibility')).toBe('hidden');
      setRule(svg, rule);
      expect(group.getAttribute('visibility')).toBe('visible');
      const line = svg.querySelector('line[data-rule]')!;
      expect(Number(line.getAttribute('data-rule'))).toBeCloseTo(alpha.spectra.fermi, 12);
      expect(Number(line.getAttribute('y1'))).toBeCloseTo(Number(svg.querySelector('line[data-fermi]')!.getAttribute('y1')), 9);
      setRule(svg, null);
      expect(group.getAttribute('visibility')).toBe('hidden');
    }
  });

  it('setFermi moves the line, its attribute and the occupied/empty clips without re-rendering', () => {
    for (const svg of [bandsFigure(alpha.spectra, { document }), dosFigure(alpha.spectra, { document })]) {
      const line = svg.querySelector('line[data-fermi]')!;
      const before = Number(line.getAttribute('y1'));
      const elements = svg.querySelectorAll('*').length;
      setFermi(svg, alpha.spectra.fermi + 1.5);
      expect(line.getAttribute('data-fermi')).toBe(String(alpha.spectra.fermi + 1.5));
      const after = Number(line.getAttribute('y1'));
      expect(after).toBeLessThan(before);
      expect(Number(svg.querySelector('rect[data-clip="occupied"]')!.getAttribute('y'))).toBe(after);
      expect(Number(svg.querySelector('rect[data-clip="empty"]')!.getAttribute('height'))).toBe(after);
      expect(svg.querySelectorAll('*').length).toBe(elements);
      // Far above the window: the line hides, everything is occupied.
      setFermi(svg, 1e6);
      expect(line.getAttribute('visibility')).toBe('hidden');
      expect(svg.querySelector('rect[data-clip="occupied"]')!.getAttribute('y')).toBe('0');
    }
  });

  it('bandsPick finds the state under a pointer placed on it, and setSelected marks it', () => {
    const svg = bandsFigure(alpha.spectra, { document });
    const path = alpha.spectra.path;
    const [left, top] = svg.getAttribute('data-plot')!.split(' ').map(Number);
    const kIndex = 17;
    const band = 28;
    const x = left + (Number(svg.getAttribute('data-k-scale')!.split(' ')[3]) * path.distance[kIndex]) / path.distance[path.count - 1];
    const [e0, e1, y0, y1] = svg.getAttribute('data-energy-scale')!.split(' ').map(Number);
    const energy = path.energies[kIndex * path.bands + band];
    const y = top + y0 + ((energy - e0) / (e1 - e0)) * (y1 - y0);
    expect(bandsPick(svg, alpha.spectra, x, y)).toEqual({ kIndex, band, energy });
    expect(bandsPick(svg, alpha.spectra, 0, 0)).toBeUndefined();
    setSelected(svg, alpha.spectra, { kIndex, band });
    const mark = svg.querySelector('circle[data-selected]')!;
    expect(Number(mark.getAttribute('cx')) + left).toBeCloseTo(x, 9);
    expect(Number(mark.getAttribute('cy')) + top).toBeCloseTo(y, 9);
    setSelected(svg, alpha.spectra, null);
    expect(mark.getAttribute('visibility')).toBe('hidden');
  });

  it('names the model in its caption (a model estimate, not a prediction) and uses no colliding ids', () => {
    const a = bandsFigure(alpha.spectra, { document });
    const b = bandsFigure(alpha.spectra, { document });
    expect(a.querySelector('title')!.textContent).toContain('harrison1980');
    const ids = (svg: Element) => [...svg.querySelectorAll('[id]')].map((e) => e.getAttribute('id'));
    expect(ids(a).filter((id) => ids(b).includes(id))).toEqual([]);
    expect(new Set(ids(a)).size).toBe(ids(a).length);
  });

  it('publication look: white background, axis title with units, no selection or handle chrome in sheet', () => {
    const svg = bandsFigure(alpha.spectra, { document, style: 'publication' });
    expect(svg.querySelector('rect[data-layer="background"]')!.getAttribute('fill')).toBe('#ffffff');
    expect([...svg.querySelectorAll('[data-role="axis-title"]')].map((t) => t.textContent)).toContain('E (eV)');
    expect(svgText(svg)).toMatch(/^<\?xml version="1.0" encoding="UTF-8"\?>\n<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
  });
});

describe('dosFigure / zoneFigure', () => {
  it('DOS has total, σ and π curves, its own E_F line and the DOS axis title in publication', () => {
    const svg = dosFigure(alpha.spectra, { document, style: 'publication' });
    expect(svg.getAttribute('data-figure')).toBe('dos');
    expect([...svg.querySelectorAll('[data-curve]')].map((c) => c.getAttribute('data-curve'))).toEqual(['sigma', 'pi', 'total']);
    expect(svg.querySelector('line[data-fermi]')!.getAttribute('data-fermi')).toBe(String(alpha.spectra.fermi));
    expect([...svg.querySelectorAll('[data-role="axis-title"]')].map((t) => t.textContent)).toEqual(['E (eV)', 'DOS (states/eV/atom)']);
  });

  it('bands and DOS share the energy scale, so they line up side by side', () => {
    const range: [number, number] = [-15, 0];
    const bands = bandsFigure(alpha.spectra, { document, energyRange: range });
    const dos = dosFigure(alpha.spectra, { document, energyRange: range, energyLabels: false });
    expect(dos.getAttribute('data-energy-scale')).toBe(bands.getAttribute('data-energy-scale'));
    expect(dos.getAttribute('data-plot')!.split(' ')[1]).toBe(bands.getAttribute('data-plot')!.split(' ')[1]);
  });

  it('zone: the hexagon, b1 and b2, the path Γ–M–K–Γ, and setZoneMarker', () => {
    const svg = zoneFigure(alpha.spectra, { document });
    expect(svg.getAttribute('data-figure')).toBe('zone');
    expect(svg.querySelector('polygon[data-layer="zone"]')!.getAttribute('points')!.split(' ')).toHaveLength(6);
    expect(svg.querySelectorAll('line[data-vector]').length).toBe(2);
    expect([...svg.querySelectorAll('[data-k-label]')].map((c) => c.getAttribute('data-k-label'))).toEqual(['Γ', 'M', 'K']);
    const mark = svg.querySelector('circle[data-selected-k]')!;
    setZoneMarker(svg, [0, 0]);
    const gamma = svg.querySelector('[data-k-label="Γ"]')!;
    expect(Number(mark.getAttribute('cx'))).toBeCloseTo(Number(gamma.getAttribute('cx')), 1);
    expect(Number(mark.getAttribute('cy'))).toBeCloseTo(Number(gamma.getAttribute('cy')), 1);
    setZoneMarker(svg, null);
    expect(mark.getAttribute('visibility')).toBe('hidden');
  });
});

describe('sheetFigure(data, options)', () => {
  it('draws α repeated 3×3: 72 atoms and 9 vacant sites, each with data-site, atoms with data-coordination', () => {
    // α: 8 atoms and 1 hexagonal hole per 3×3 cell (Tang & Ismail-Beigi, Phys. Rev. Lett. 99, 115501 (2007)).
    const svg = sheetFigure(alpha.sheet, { document });
    expect(svg.getAttribute('data-figure')).toBe('sheet');
    const content = svg.querySelector('g[data-layer="content"]')!;
    expect(content.querySelectorAll('circle[data-atom]').length).toBe(72);
    expect(content.querySelectorAll('circle[data-vacant]').length).toBe(9);
    expect(content.querySelectorAll('[data-site]').length).toBe(81);
    expect(content.querySelectorAll('[data-hole]').length).toBe(9);
    for (const atom of content.querySelectorAll('circle[data-atom]')) expect(['5', '6']).toContain(atom.getAttribute('data-coordination'));
    expect(content.querySelector('[data-site="3,3"]')!.hasAttribute('data-vacant')).toBe(true);
    expect(svg.querySelectorAll('[data-handle]').length).toBe(2);
    expect(svg.querySelector('[data-handle="A1"]')).not.toBeNull();
  });

  it('puts the handles at the tips of the cell vectors and leaves them out of the publication look', () => {
    const svg = sheetFigure(alpha.sheet, { document });
    const [ox, oy, s] = svg.getAttribute('data-frame')!.split(' ').map(Number);
    const a1 = svg.querySelector('[data-handle="A1"]')!;
    expect(Number(a1.getAttribute('cx'))).toBeCloseTo(ox + s * 3 * 1.69, 1);
    expect(Number(a1.getAttribute('cy'))).toBeCloseTo(oy, 1);
    const print = sheetFigure(alpha.sheet, { document, style: 'publication' });
    expect(print.querySelectorAll('[data-handle]').length).toBe(0);
    expect(print.querySelectorAll('title').length).toBe(1);
  });

  it('draws a Bloch state as one disc per atom, area ∝ weight, coloured by phase + k·R', () => {
    const state = prepareState(alpha.sheet.sheet, PARAMS, alpha.spectra.path, 0, 24);
    const data = prepareSheet({ label: 'alpha', pattern: alpha.sheet.pattern }, { bondCutoff: PARAMS.cutoff, repeats: [2, 2], state });
    const svg = sheetFigure(data, { document });
    const discs = [...svg.querySelectorAll('[data-state-atom]')];
    expect(discs.length).toBeLessThanOrEqual(32);
    // At Γ, k·R = 0: every copy of an atom has the same colour (Bloch's theorem).
    const byAtom = new Map<string, Set<string>>();
    for (const d of discs) {
      const key = d.getAttribute('data-state-atom')!;
      byAtom.set(key, (byAtom.get(key) ?? new Set()).add(d.getAttribute('fill')!));
    }
    for (const colours of byAtom.values()) expect(colours.size).toBe(1);
  });
});

describe('figures of sheets that are not presets', () => {
  it('draws an explicit (buckled) sheet: atoms per repeat, no lattice sites, bonds cut on the 3D distance', async () => {
    const { readFileSync } = await import('node:fs');
    const { parseSheetText } = await import('../../src/io/sheetFile.ts');
    const file = 'presets/demo/hsl-0427-sheet.json';
    const parsed = parseSheetText(readFileSync(file, 'utf8'), file);
    const data = prepareSheet({ label: 'demo', sheet: parsed.sheet, pattern: parsed.pattern }, { bondCutoff: PARAMS.cutoff, repeats: [2, 3] });
    const svg = sheetFigure(data, { document });
    expect(svg.querySelectorAll('circle[data-atom]').length).toBe(5 * 6);
    expect(svg.querySelectorAll('[data-site]').length).toBe(0);
    expect(svg.querySelectorAll('[data-handle]').length).toBe(2);
  });

  it('draws the oblique zone as a hexagon with the path Γ–X–H1–Y–H2–C–Γ', async () => {
    const { prepareSpectra } = await import('../../src/figures/prepare.ts');
    const spectra = prepareSpectra({ cell: [[2.9, 0], [0.5, 3.3]], atoms: [[0, 0, 0]] }, PARAMS, { label: 'oblique', mesh: 4, pathPoints: 30 });
    const svg = zoneFigure(spectra, { document, style: 'publication' });
    expect(svg.querySelector('polygon[data-layer="zone"]')!.getAttribute('points')!.split(' ')).toHaveLength(6);
    expect([...svg.querySelectorAll('[data-k-label]')].map((c) => c.getAttribute('data-k-label'))).toEqual(['Γ', 'X', 'H1', 'Y', 'H2', 'C']);
    expect([...svg.querySelectorAll('[data-role="axis-title"]')].map((t) => t.textContent)).toEqual(['kx (Å⁻¹)', 'ky (Å⁻¹)']);
  });
});
