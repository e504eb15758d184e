/**
 * energyHullFigure, energyHullPick, setEnergyHullSelected: what the web view relies on — one marker per point
 * with data-kind, data-index, data-eta and data-energy; positions that follow the stored scales; the suggestions
 * ringed in their order; DEMO and the fit's nature said in the title; a click resolved to its point; the
 * selection ring moved by attributes only. Regression guards of our own drawing, beside the golden files.
 */
import { describe, expect, it } from 'vitest';
import { energyHullFigure, energyHullPick, setEnergyHullSelected } from '../../src/figures/energyHull.ts';
import { readLinear } from '../../src/figures/frame.ts';
import { demoEnergyHull, document } from './helpers.ts';

const data = demoEnergyHull();
const svg = energyHullFigure(data, { document });

describe('energyHullFigure', () => {
  it('draws every computed and predicted point once, tagged with its index, η and relative energy', () => {
    expect(svg.querySelectorAll('[data-layer="computed"] [data-kind="computed"]').length).toBe(data.computed.length);
    expect(svg.querySelectorAll('[data-layer="predicted"] [data-kind="predicted"]').length).toBe(data.predicted.length);
    const eta = readLinear(svg, 'eta-scale')!;
    const energy = readLinear(svg, 'energy-scale')!;
    for (const element of svg.querySelectorAll('[data-layer="computed"] circle[data-kind]')) {
      const point = data.computed[Number(element.getAttribute('data-index'))];
      expect(Number(element.getAttribute('data-eta'))).toBe(point.eta);
      // The plot group is translated by the left/top margins, which the stored ranges include.
      expect(Number(element.getAttribute('cx')) + eta.range[0]).toBeCloseTo(eta(point.eta), 1);
      expect(Number(element.getAttribute('cy')) + energy.range[1]).toBeCloseTo(energy(point.relative), 1);
    }
  });

  it('rings the suggestions, numbered in order, and draws both hulls', () => {
    const rings = [...svg.querySelectorAll('[data-layer="suggested"] [data-suggested]')].map((g) => Number(g.getAttribute('data-suggested')));
    expect(rings).toEqual(data.predicted.filter((p) => p.suggested).map((p) => p.suggested).sort((a, b) => a! - b!));
    expect(rings.length).toBeGreaterThan(0);
    expect(svg.querySelector('[data-curve="hull"]')!.getAttribute('d')).toMatch(/^M/);
    expect(svg.querySelector('[data-curve="fit-hull"]')!.getAttribute('d')).toMatch(/^M/);
  });

  it('says DEMO and what the fit is in its title and description', () => {
    expect(svg.querySelector('title')!.textContent).toMatch(/^DEMO — /);
    expect(svg.querySelector('desc')!.textContent).toMatch(/interpolates the user's calculations and is only as good as they are/);
  });

  it('energyHullPick resolves a click to the nearest point within the radius, the user\'s own first', () => {
    const eta = readLinear(svg, 'eta-scale')!;
    const energy = readLinear(svg, 'energy-scale')!;
    const target = data.computed[3];
    expect(energyHullPick(svg, eta(target.eta) + 2, energy(target.relative) - 1)).toEqual({ kind: 'computed', index: target.index });
    const predicted = data.predicted[0];
    expect(energyHullPick(svg, eta(predicted.eta), energy(predicted.relative), 0.5)).toEqual({ kind: 'predicted', index: predicted.index });
    expect(energyHullPick(svg, -100, -100)).toBeUndefined();
  });

  it('a click on a computed disc picks it even when a prediction lies nearer to the pointer (drawn beneath it)', () => {
    const eta = readLinear(svg, 'eta-scale')!;
    const energy = readLinear(svg, 'energy-scale')!;
    const target = data.computed[3];
    const beneath = svg.querySelector('[data-layer="predicted"] [data-kind]')!;
    // Move one prediction 3 px right of the disc's centre and click 2.5 px right: the prediction is nearer.
    const x = eta(target.eta);
    const y = energy(target.relative);
    beneath.setAttribute('data-eta', String(eta.invert(x + 3)));
    beneath.setAttribute('data-energy', String(energy.invert(y)));
    expect(energyHullPick(svg, x + 2.5, y)).toEqual({ kind: 'computed', index: target.index });
  });

  it('setEnergyHullSelected moves the ring onto the point and hides it again', () => {
    const ring = svg.querySelector('[data-role="selected"]')!;
    const target = data.computed[2];
    setEnergyHullSelected(svg, { kind: 'computed', index: target.index });
    const point = svg.querySelector(`[data-layer="computed"] [data-index="${target.index}"]`)!;
    expect([ring.getAttribute('cx'), ring.getAttribute('cy'), ring.getAttribute('visibility')]).toEqual([point.getAttribute('cx'), point.getAttribute('cy'), 'visible']);
    expect(svg.getAttribute('data-selected')).toBe(`computed:${target.index}`);
    setEnergyHullSelected(svg, null);
    expect(ring.getAttribute('visibility')).toBe('hidden');
  });
});
