import { lab } from 'd3';
import { describe, expect, it } from 'vitest';
import { etaDeltaFigure, setMetalFocus } from '../../src/figures/etaDelta.ts';
import { readLinear } from '../../src/figures/frame.ts';
import { METAL_COLOURS } from '../../src/figures/palette.ts';
import { countingRuleDoping } from '../../src/tb/countingRule.ts';
import { document, presetEtaDelta } from './helpers.ts';

const data = presetEtaDelta();

describe('etaDeltaFigure(data, options)', () => {
  it('is one <svg data-figure="eta-delta"> with a marker per candidate and metal, carrying exact η and δ', () => {
    const svg = etaDeltaFigure(data, { document });
    expect(svg.getAttribute('data-figure')).toBe('eta-delta');
    const markers = svg.querySelectorAll('[data-layer="points"] path[data-metal]');
    expect(markers.length).toBe(data.points.length * data.metals.length);
    const beta = data.points.find((p) => p.label === 'beta12')!;
    const agBeta = svg.querySelector('[data-point="beta12"] path[data-metal="ag111"]')!;
    expect(agBeta.getAttribute('data-doping')).toBe(String(beta.dopings.ag111));
    expect(Number(agBeta.getAttribute('data-eta'))).toBe(1 / 6);
    // One shape per metal: the four marker paths of one candidate all differ.
    const shapes = new Set([...svg.querySelectorAll('[data-point="beta12"] path[data-metal]')].map((p) => p.getAttribute('d')));
    expect(shapes.size).toBe(4);
  });

  it('draws the counting-rule curve through δ(0) = −1/3 and δ(1/5) = 1/3 (common practice: the δ6 and χ3 counts)', () => {
    const svg = etaDeltaFigure(data, { document });
    const x = readLinear(svg, 'eta-scale')!;
    const y = readLinear(svg, 'doping-scale')!;
    const d = svg.querySelector('path[data-curve="counting-rule"]')!.getAttribute('d')!;
    const points = [...d.matchAll(/(-?[\d.]+),(-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);
    const [left, top] = [x.range[0], y.range[1]];
    const at = (eta: number) => points.find(([px]) => Math.abs(px + left - x(eta)) < 0.5)!;
    expect(y.invert(at(0)[1] + top)).toBeCloseTo(-1 / 3, 1);
    expect(y.invert(at(0.2)[1] + top)).toBeCloseTo(1 / 3, 1);
    expect(countingRuleDoping(0.2)).toBeCloseTo(1 / 3, 12);
  });

  it('marks the observations apart from the model and says they are observations', () => {
    const svg = etaDeltaFigure(data, { document });
    // Li et al., Sci. Bull. 63, 282 (2018): about one electron per B on Al(111) (from memory, as observed.ts says).
    const al = svg.querySelector('[data-observed="al111"] path')!;
    expect([Number(al.getAttribute('data-eta')), Number(al.getAttribute('data-doping'))]).toEqual([1 / 3, 1]);
    // Feng et al., Nat. Chem. 8, 563 (2016): η = 1/6 and 1/5 on Ag(111).
    expect([...svg.querySelectorAll('[data-observed="ag111"] path')].map((p) => Number(p.getAttribute('data-eta')))).toEqual([1 / 6, 1 / 5]);
    expect(svg.querySelector('[data-observed="ag111"] [data-role="observed-label"]')!.textContent).toContain('Ag(111) seen');
    expect(svg.querySelector('[data-legend="observed"]')!.textContent).toBe('observed (experiment)');
    expect(svg.querySelector('desc')!.textContent).toMatch(/observations from experiment, not model output.*not predictions of stability/);
  });

  it('marks the page\u2019s sheet by its η', () => {
    const svg = etaDeltaFigure(data, { document });
    expect(Number(svg.querySelector('[data-layer="current"]')!.getAttribute('data-eta'))).toBe(1 / 9);
    expect(etaDeltaFigure({ ...data, current: undefined }, { document }).querySelector('[data-layer="current"]')).toBeNull();
  });

  it('setMetalFocus fades the other metals’ markers and legend entries, and null brings them back, without redrawing', () => {
    const svg = etaDeltaFigure(data, { document });
    const elements = svg.querySelectorAll('*').length;
    setMetalFocus(svg, 'cu111');
    expect(svg.querySelector('[data-point="alpha"] path[data-metal="cu111"]')!.hasAttribute('opacity')).toBe(false);
    expect(svg.querySelector('[data-point="alpha"] path[data-metal="ag111"]')!.getAttribute('opacity')).toBe('0.3');
    expect(svg.querySelector('[data-legend-metal="al111"]')!.getAttribute('opacity')).toBe('0.3');
    setMetalFocus(svg, null);
    expect(svg.querySelectorAll('[opacity="0.3"]').length).toBe(0);
    expect(svg.querySelectorAll('*').length).toBe(elements);
  });

  it('metal colours differ pairwise by more than 15 in CIELAB L* (greyscale and every colour-vision type keep them apart; common practice)', () => {
    for (let i = 0; i < METAL_COLOURS.length; i++) {
      for (let j = i + 1; j < METAL_COLOURS.length; j++) expect(Math.abs(lab(METAL_COLOURS[i]).l - lab(METAL_COLOURS[j]).l)).toBeGreaterThan(15);
    }
  });
});
