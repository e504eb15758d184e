/**
 * The energy–η figure of a cluster expansion: hole density η across, energy per lattice site up (relative to the
 * line through the end points of the hull of the calculations, meV). The user's calculations are dark discs (a
 * tick beside each at the fit's value), their hull a solid line; the fit's predictions for the patterns not
 * computed are small grey dots and the fit's hull (its ground states: fitted energies of the computed structures,
 * predicted ones of the others) a dashed line; the patterns suggested
 * for computing next are ringed and numbered, with their standard error as a bar. Every point carries
 * data-kind ("computed" | "predicted"), data-index, data-eta and data-energy (eV per site, relative), so the
 * view links a click to its pattern (energyHullPick) and marks the chosen one (setEnergyHullSelected).
 */
import { axisBottom, axisLeft, line, scaleLinear, type Selection } from 'd3';
import { drawCaption, figureFrame, readLinear, storeLinear, type Group } from './frame.ts';
import { formatNumber } from './format.ts';
import type { Look } from './look.ts';
import { GRID, INK, MUTED } from './palette.ts';
import type { EnergyHullData, EnergyHullPoint, FigureOptions } from './types.ts';

export type EnergyHullOptions = FigureOptions;

/** Predictions: a light blue-grey, below the user's points in weight and colour. */
const PREDICTED_COLOUR = '#8fa3b8';
/** The fit's hull (its claim of the ground states): a deep blue, dashed. */
const FIT_HULL_COLOUR = '#2a5d9f';
/** Suggestions: a brick red ring. */
const SUGGESTED_COLOUR = '#b03a2e';

const fixed = (v: number) => Math.round(v * 100) / 100;
const meV = (eV: number) => 1000 * eV;

function legend(group: Group, lk: Look): void {
  let y = 0;
  const row = (draw: (item: Group) => void, text: string, tag: string) => {
    const item = group.append('g').attr('transform', `translate(0,${y})`).attr('data-legend', tag);
    draw(item);
    item.append('text').attr('x', 12).attr('y', 4).attr('fill', INK).text(text);
    y += lk.tick + 7;
  };
  row((g) => g.append('circle').attr('r', 4).attr('fill', INK), 'your calculations', 'computed');
  row((g) => g.append('line').attr('x1', -7).attr('x2', 7).attr('stroke', INK).attr('stroke-width', lk.line), 'their hull', 'hull');
  row((g) => g.append('circle').attr('r', 2.2).attr('fill', PREDICTED_COLOUR), 'predicted by the fit', 'predicted');
  row((g) => g.append('line').attr('x1', -7).attr('x2', 7).attr('stroke', FIT_HULL_COLOUR).attr('stroke-width', lk.line).attr('stroke-dasharray', '4 3'),
    "the fit's hull", 'fit-hull');
  row((g) => g.append('circle').attr('r', 6).attr('fill', 'none').attr('stroke', SUGGESTED_COLOUR).attr('stroke-width', 1.6), 'compute next', 'suggested');
}

function pointTitle(p: EnergyHullPoint): string {
  const energy = `${formatNumber(meV(p.relative), 1)} meV/site`;
  if (p.kind === 'computed') return `${p.label}: η = ${formatNumber(p.eta, 4)}, ${energy} (your calculation; fit ${formatNumber(meV(p.fitted ?? NaN), 1)})`;
  const rank = p.suggested !== undefined ? ` — suggestion ${p.suggested}` : '';
  return `${p.label}: η = ${formatNumber(p.eta, 4)}, ${energy} ± ${formatNumber(meV(p.uncertainty ?? NaN), 1)} (predicted by the fit)${rank}`;
}

export function energyHullFigure(data: EnergyHullData, options: EnergyHullOptions): SVGSVGElement {
  const demo = data.demo ? 'DEMO — ' : '';
  const title = `${demo}Energy against hole density: your calculations, the cluster expansion fitted to them (${data.clusters}), its predictions and the hulls`;
  const frame = figureFrame('energy-hull', options, { screen: [600, 340], publication: [760, 460] }, {
    title,
    description: `Energy per lattice site (vacant sites counted) minus the line through the end points of the hull of the calculations, against η. Discs: the user's calculations${data.title ? ` (${data.title})` : ''}; solid line: their hull. Dots: the cluster expansion's predictions (fit rms ${formatNumber(meV(data.fitRms), 2)}, leave-one-out CV ${formatNumber(meV(data.cvRms), 2)} meV per site); dashed: the fit's hull, of its fitted energies of the calculations and its predictions. Rings: the patterns to compute next. The expansion interpolates the user's calculations and is only as good as they are; check it by computing the suggested patterns.`,
  });
  const lk = frame.look;
  const margin = lk.publication ? { top: 50, right: 200, bottom: 52, left: 70 } : { top: 34, right: 164, bottom: 40, left: 52 };
  const width = frame.width - margin.left - margin.right;
  const height = frame.height - margin.top - margin.bottom;

  const shown = [...data.computed, ...data.predicted];
  const etas = shown.map((p) => p.eta);
  const etaLow = Math.min(0, ...etas);
  const etaHigh = Math.max(0.05, ...etas);
  const x = scaleLinear().domain([etaLow - 0.04 * (etaHigh - etaLow), etaHigh + 0.04 * (etaHigh - etaLow)]).range([0, width]);
  // Energies: all of the user's points and the hulls; predictions far above them are left outside the frame.
  const anchor = [...data.computed.map((p) => meV(p.relative)), ...data.hull.map((v) => meV(v[1])), ...data.fitHull.map((v) => meV(v[1])), 0];
  const low = Math.min(...anchor, ...data.predicted.map((p) => meV(p.relative)));
  const high = Math.max(...anchor);
  const pad = 0.1 * (high - low || 1);
  const y = scaleLinear().domain([low - pad, high + pad]).range([height, 0]).nice();
  storeLinear(frame.svg, 'eta-scale', x.domain() as [number, number], [margin.left, margin.left + width]);
  storeLinear(frame.svg, 'energy-scale', (y.domain() as [number, number]).map((v) => v / 1000) as [number, number], [margin.top + height, margin.top]);

  const plot = frame.svg.append('g').attr('data-layer', 'plot').attr('transform', `translate(${margin.left},${margin.top})`);
  const xAxis = plot.append('g').attr('data-layer', 'eta-axis').attr('transform', `translate(0,${height})`)
    .call(axisBottom(x).ticks(lk.publication ? 8 : 6).tickSizeOuter(0).tickFormat((v) => formatNumber(Number(v), 2)));
  xAxis.attr('font-size', lk.tick).attr('font-family', null);
  const yAxis = plot.append('g').attr('data-layer', 'energy-axis').call(axisLeft(y).ticks(lk.publication ? 8 : 6).tickSizeOuter(0).tickFormat((v) => formatNumber(Number(v), 1)));
  yAxis.attr('font-size', lk.tick).attr('font-family', null);
  plot.append('text').attr('data-role', 'axis-title').attr('x', width / 2).attr('y', height + (lk.publication ? 40 : 31))
    .attr('text-anchor', 'middle').attr('font-size', lk.font).text('hole density η');
  plot.append('text').attr('data-role', 'axis-title').attr('transform', `translate(${lk.publication ? -52 : -40},${height / 2}) rotate(-90)`)
    .attr('text-anchor', 'middle').attr('font-size', lk.font).text(lk.publication ? 'energy per site − reference line (meV)' : 'energy/site − line (meV)');
  plot.append('line').attr('data-layer', 'zero').attr('x2', width).attr('y1', fixed(y(0))).attr('y2', fixed(y(0))).attr('stroke', GRID).attr('stroke-width', 1);
  plot.append('rect').attr('data-layer', 'frame').attr('width', width).attr('height', height).attr('fill', 'none').attr('stroke', INK).attr('stroke-width', 0.8);

  const body = plot.append('g').attr('clip-path', `url(#${frame.id('window')})`);
  plot.append('defs').append('clipPath').attr('id', frame.id('window')).append('rect').attr('width', width).attr('height', height);
  const at = (p: { eta: number; relative: number }): [number, number] => [fixed(x(p.eta)), fixed(y(meV(p.relative)))];
  const tag = (element: Selection<SVGCircleElement, unknown, null, undefined>, p: EnergyHullPoint) =>
    element.attr('data-kind', p.kind).attr('data-index', p.index).attr('data-eta', String(p.eta)).attr('data-energy', String(p.relative));

  const predicted = body.append('g').attr('data-layer', 'predicted');
  for (const p of data.predicted) {
    const [cx, cy] = at(p);
    tag(predicted.append('circle').attr('cx', cx).attr('cy', cy).attr('r', 2).attr('fill', PREDICTED_COLOUR), p).append('title').text(pointTitle(p));
  }
  const hullLine = line<[number, number]>().x((v) => fixed(x(v[0]))).y((v) => fixed(y(meV(v[1]))));
  body.append('path').attr('data-curve', 'fit-hull').attr('d', hullLine(data.fitHull) ?? '')
    .attr('fill', 'none').attr('stroke', FIT_HULL_COLOUR).attr('stroke-width', lk.line).attr('stroke-dasharray', '4 3');
  body.append('path').attr('data-curve', 'hull').attr('d', hullLine(data.hull) ?? '').attr('fill', 'none').attr('stroke', INK).attr('stroke-width', lk.line);

  const computed = body.append('g').attr('data-layer', 'computed');
  for (const p of data.computed) {
    const [cx, cy] = at(p);
    const group = computed.append('g');
    if (p.fitted !== undefined) {
      const fy = fixed(y(meV(p.fitted)));
      group.append('line').attr('data-role', 'fitted').attr('x1', cx + 5).attr('x2', cx + 11).attr('y1', fy).attr('y2', fy).attr('stroke', FIT_HULL_COLOUR).attr('stroke-width', 1.6);
    }
    tag(group.append('circle').attr('cx', cx).attr('cy', cy).attr('r', 4).attr('fill', INK).attr('stroke', '#ffffff').attr('stroke-width', 0.8), p)
      .append('title').text(pointTitle(p));
  }

  const suggested = body.append('g').attr('data-layer', 'suggested');
  for (const p of data.predicted.filter((q) => q.suggested !== undefined).sort((a, b) => a.suggested! - b.suggested!)) {
    const [cx, cy] = at(p);
    const group = suggested.append('g').attr('data-suggested', p.suggested!);
    const spread = meV(p.uncertainty ?? 0);
    if (spread > 0) {
      group.append('line').attr('x1', cx).attr('x2', cx).attr('y1', fixed(y(meV(p.relative) - spread))).attr('y2', fixed(y(meV(p.relative) + spread)))
        .attr('stroke', SUGGESTED_COLOUR).attr('stroke-width', 1.2);
    }
    tag(group.append('circle').attr('cx', cx).attr('cy', cy).attr('r', 6).attr('fill', 'none').attr('stroke', SUGGESTED_COLOUR).attr('stroke-width', 1.6), p)
      .append('title').text(pointTitle(p));
    group.append('text').attr('x', cx + 7).attr('y', cy - 6).attr('font-size', lk.tick).attr('fill', SUGGESTED_COLOUR).text(String(p.suggested));
  }
  body.append('circle').attr('data-role', 'selected').attr('r', 9).attr('fill', 'none').attr('stroke', INK).attr('stroke-width', 1.4)
    .attr('stroke-dasharray', '2 2').attr('visibility', 'hidden');

  legend(frame.svg.append('g').attr('data-layer', 'legend').attr('font-size', lk.tick)
    .attr('transform', `translate(${margin.left + width + 22},${margin.top + lk.tick})`), lk);
  frame.svg.append('text').attr('data-role', 'fit-errors').attr('x', margin.left + width + 10).attr('y', margin.top + height - lk.tick * 2.2)
    .attr('font-size', lk.tick).attr('fill', MUTED)
    .call((text) => {
      text.append('tspan').attr('x', margin.left + width + 10).text(`fit rms ${formatNumber(meV(data.fitRms), 2)} meV/site`);
      text.append('tspan').attr('x', margin.left + width + 10).attr('dy', lk.tick + 3).text(`CV ${Number.isFinite(data.cvRms) ? `${formatNumber(meV(data.cvRms), 2)} meV/site` : 'none'}`);
    });
  drawCaption(frame, lk.publication
    ? `${demo}Energy against η: your calculations and a cluster expansion fitted to them (${data.clusters})`
    : `${demo}energy against η: your calculations (discs), the fit's predictions (dots), compute next (rings)`, 6);
  return frame.svg.node()!;
}

/** The point (kind, index) nearest to (x, y) in svg coordinates within `radius` pixels, if any. */
export function energyHullPick(svg: Element, x: number, y: number, radius = 8): { kind: 'computed' | 'predicted'; index: number } | undefined {
  const eta = readLinear(svg, 'eta-scale');
  const energy = readLinear(svg, 'energy-scale');
  if (!eta || !energy) return undefined;
  let best: { kind: 'computed' | 'predicted'; index: number } | undefined;
  // The user's points first, and a prediction only where none of them is within reach: their discs are drawn on
  // top, so a click on a disc means that calculation even when a prediction sits a pixel nearer beneath it.
  for (const layer of ['computed', 'predicted']) {
    let nearest = radius * radius;
    for (const element of svg.querySelectorAll(`[data-layer="${layer}"] [data-kind]`)) {
      const dx = eta(Number(element.getAttribute('data-eta'))) - x;
      const dy = energy(Number(element.getAttribute('data-energy'))) - y;
      const d = dx * dx + dy * dy;
      if (d < nearest) {
        nearest = d;
        best = { kind: element.getAttribute('data-kind') as 'computed' | 'predicted', index: Number(element.getAttribute('data-index')) };
      }
    }
    if (best) break;
  }
  return best;
}

/** Rings the point (kind, index), or hides the ring with null: attributes only, no redraw. */
export function setEnergyHullSelected(svg: Element, chosen: { kind: 'computed' | 'predicted'; index: number } | null): void {
  const ring = svg.querySelector('[data-role="selected"]');
  if (!ring) return;
  const point = chosen && svg.querySelector(`[data-layer="${chosen.kind}"] [data-kind="${chosen.kind}"][data-index="${chosen.index}"]`);
  if (!point) {
    ring.setAttribute('visibility', 'hidden');
    svg.removeAttribute('data-selected');
    return;
  }
  ring.setAttribute('cx', point.getAttribute('cx') ?? '0');
  ring.setAttribute('cy', point.getAttribute('cy') ?? '0');
  ring.setAttribute('visibility', 'visible');
  svg.setAttribute('data-selected', `${chosen!.kind}:${chosen!.index}`);
}
