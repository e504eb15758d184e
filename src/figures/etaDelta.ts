/**
 * The η–δ figure: hole density η across, electrons per B atom δ up. The counting-rule curve δ(η) is what a sheet
 * of each η asks; each candidate sits at its η once per metal, at the doping that metal gives it (Fermi-level
 * alignment), one marker shape and colour per metal; a short grey dash marks the doping the model's σ bonding
 * states ask. Observations are drawn apart — hollow stars and their labels — and named as observations.
 * Markers of one candidate are spread a few pixels sideways so that all metals stay visible; their data-eta and
 * data-doping attributes carry the exact values.
 */
import { axisBottom, axisLeft, line, scaleLinear, symbol, symbolCircle, symbolDiamond, symbolSquare, symbolStar, symbolTriangle, type SymbolType } from 'd3';
import { drawCaption, figureFrame, storeLinear, type Group } from './frame.ts';
import { formatNumber } from './format.ts';
import type { Look } from './look.ts';
import { GRID, INK, METAL_COLOURS, MUTED, OBSERVED_COLOUR } from './palette.ts';
import type { EtaDeltaData, FigureOptions } from './types.ts';

export type EtaDeltaOptions = FigureOptions;

/** Marker shapes, in the order of the metals (after METAL_COLOURS). */
const METAL_SHAPES: readonly SymbolType[] = [symbolCircle, symbolSquare, symbolTriangle, symbolDiamond];

/** The marker of the i-th metal: colour and shape (cycling past four). */
export function metalMarker(i: number): { colour: string; shape: SymbolType } {
  return { colour: METAL_COLOURS[i % METAL_COLOURS.length], shape: METAL_SHAPES[i % METAL_SHAPES.length] };
}

const fixed = (v: number) => Math.round(v * 100) / 100;

/** A symbol path of `shape` with area `size` (px²). */
const marker = (shape: SymbolType, size: number) => symbol(shape, size)() ?? '';

function legend(group: Group, lk: Look, data: EtaDeltaData): void {
  const size = lk.publication ? 64 : 44;
  let y = 0;
  const row = (draw: (item: Group) => void, text: string, tag: Record<string, string>) => {
    const item = group.append('g').attr('transform', `translate(0,${y})`);
    for (const [k, v] of Object.entries(tag)) item.attr(k, v);
    draw(item);
    item.append('text').attr('x', 12).attr('y', 4).attr('fill', INK).text(text);
    y += lk.tick + 7;
  };
  group.append('text').attr('y', -lk.tick - 2).attr('fill', MUTED).text('metal gives (model)');
  data.metals.forEach((m, i) => {
    const { colour, shape } = metalMarker(i);
    row((item) => item.append('path').attr('d', marker(shape, size)).attr('fill', colour).attr('stroke', '#ffffff').attr('stroke-width', 0.6),
      `${m.title} (W ${formatNumber(m.workFunction, 2)} eV)`, { 'data-legend-metal': m.name });
  });
  y += 4;
  row((item) => item.append('line').attr('x1', -7).attr('x2', 7).attr('stroke', INK).attr('stroke-width', lk.line), 'counting rule asks', { 'data-legend': 'rule' });
  row((item) => item.append('line').attr('x1', -5).attr('x2', 5).attr('stroke', MUTED).attr('stroke-width', 2.5), 'σ filling asks (model)', { 'data-legend': 'sigma' });
  row((item) => item.append('path').attr('d', marker(symbolStar, size * 1.6)).attr('fill', 'none').attr('stroke', OBSERVED_COLOUR).attr('stroke-width', 1.2),
    'observed (experiment)', { 'data-legend': 'observed' });
}

export function etaDeltaFigure(data: EtaDeltaData, options: EtaDeltaOptions): SVGSVGElement {
  const m = data.model;
  const title = `η–δ map: counting rule and Fermi-level alignment (capacitor model; ${data.parameters}, ${data.mesh}×${data.mesh} mesh)`;
  const frame = figureFrame('eta-delta', options, { screen: [560, 330], publication: [720, 440] }, {
    title,
    description: `Electrons per B atom δ against hole density η. Curve: the counting rule δ(η) = 8/(3(1 − η)) − 3. Markers: the doping each metal gives each candidate in the Fermi-level alignment model (W_S = ${m.sheetWorkFunction} eV, Δc = ${m.dipole} eV, d = ${m.distance} Å, d0 = ${m.d0} Å; weak coupling assumed). Dashes: the doping that fills the tight-binding σ bonding states. Stars: observations from experiment, not model output. Model estimates, not predictions of stability.`,
  });
  const lk = frame.look;
  const margin = lk.publication ? { top: 46, right: 220, bottom: 52, left: 64 } : { top: 30, right: 176, bottom: 40, left: 44 };
  const width = frame.width - margin.left - margin.right;
  const height = frame.height - margin.top - margin.bottom;

  const etas = [...data.curve.map((c) => c.eta), ...data.points.map((p) => p.eta), ...data.observed.flatMap((o) => o.holeDensities)];
  const dopings = [
    ...data.curve.map((c) => c.doping),
    ...data.points.flatMap((p) => [p.sigmaFilling, ...Object.values(p.dopings)]),
    ...data.observed.flatMap((o) => (o.doping !== undefined ? [o.doping] : [])),
    0,
  ].filter(Number.isFinite);
  const top = Math.max(0.05, ...etas) * 1.04;
  // A little room left of η = 0, so the markers of a sheet without holes are not cut by the frame.
  const x = scaleLinear().domain([-0.04 * top, top]).range([0, width]);
  const [lo, hi] = [Math.min(...dopings), Math.max(...dopings)];
  const pad = 0.08 * (hi - lo || 1);
  const y = scaleLinear().domain([lo - pad, hi + pad]).range([height, 0]).nice();
  storeLinear(frame.svg, 'eta-scale', x.domain() as [number, number], [margin.left, margin.left + width]);
  storeLinear(frame.svg, 'doping-scale', y.domain() as [number, number], [margin.top + height, margin.top]);

  const plot = frame.svg.append('g').attr('data-layer', 'plot').attr('transform', `translate(${margin.left},${margin.top})`);
  const xAxis = plot.append('g').attr('data-layer', 'eta-axis').attr('transform', `translate(0,${height})`)
    .call(axisBottom(x).ticks(lk.publication ? 8 : 6).tickSizeOuter(0).tickFormat((v) => formatNumber(Number(v), 2)));
  xAxis.attr('font-size', lk.tick).attr('font-family', null);
  const yAxis = plot.append('g').attr('data-layer', 'doping-axis').call(axisLeft(y).ticks(lk.publication ? 8 : 6).tickSizeOuter(0).tickFormat((v) => formatNumber(Number(v), 1)));
  yAxis.attr('font-size', lk.tick).attr('font-family', null);
  plot.append('text').attr('data-role', 'axis-title').attr('x', width / 2).attr('y', height + (lk.publication ? 40 : 31))
    .attr('text-anchor', 'middle').attr('font-size', lk.font).text('hole density η');
  plot.append('text').attr('data-role', 'axis-title').attr('transform', `translate(${lk.publication ? -46 : -32},${height / 2}) rotate(-90)`)
    .attr('text-anchor', 'middle').attr('font-size', lk.font).text('δ (e/atom)');
  plot.append('line').attr('data-layer', 'neutral').attr('x2', width).attr('y1', fixed(y(0))).attr('y2', fixed(y(0)))
    .attr('stroke', GRID).attr('stroke-width', 1);
  plot.append('rect').attr('data-layer', 'frame').attr('width', width).attr('height', height).attr('fill', 'none').attr('stroke', INK).attr('stroke-width', 0.8);

  const body = plot.append('g').attr('clip-path', `url(#${frame.id('window')})`);
  plot.append('defs').append('clipPath').attr('id', frame.id('window')).append('rect').attr('width', width).attr('height', height);

  if (data.current) {
    const at = fixed(x(data.current.eta));
    const current = body.append('g').attr('data-layer', 'current').attr('data-eta', String(data.current.eta));
    current.append('line').attr('x1', at).attr('x2', at).attr('y2', height).attr('stroke', MUTED).attr('stroke-dasharray', '2 3');
    current.append('text').attr('x', at + 3).attr('y', height - 4).attr('font-size', lk.tick).attr('fill', MUTED).text(`this sheet: ${data.current.label}`);
  }

  body.append('path').attr('data-curve', 'counting-rule')
    .attr('d', line<{ eta: number; doping: number }>().x((c) => fixed(x(c.eta))).y((c) => fixed(y(c.doping)))(data.curve) ?? '')
    .attr('fill', 'none').attr('stroke', INK).attr('stroke-width', lk.line);

  const size = lk.publication ? 64 : 44;
  const spread = lk.publication ? 7 : 5;
  const points = body.append('g').attr('data-layer', 'points');
  for (const p of data.points) {
    const group = points.append('g').attr('data-point', p.label);
    const px = fixed(x(p.eta));
    group.append('line').attr('data-sigma-filling', String(p.sigmaFilling))
      .attr('x1', px - 7).attr('x2', px + 7).attr('y1', fixed(y(p.sigmaFilling))).attr('y2', fixed(y(p.sigmaFilling)))
      .attr('stroke', MUTED).attr('stroke-width', 2.5);
    data.metals.forEach((metal, i) => {
      const doping = p.dopings[metal.name];
      if (!Number.isFinite(doping)) return;
      const { colour, shape } = metalMarker(i);
      const dx = (i - (data.metals.length - 1) / 2) * spread;
      group.append('path').attr('data-metal', metal.name).attr('data-eta', String(p.eta)).attr('data-doping', String(doping))
        .attr('transform', `translate(${fixed(px + dx)},${fixed(y(doping))})`).attr('d', marker(shape, size))
        .attr('fill', colour).attr('stroke', '#ffffff').attr('stroke-width', 0.6)
        .append('title').text(`${p.label} on ${metal.title}: η = ${formatNumber(p.eta, 3)}, δ = ${formatNumber(doping, 3)} e/atom (model)`);
    });
  }

  // Observations: a star at (η, δ) when the doping is reported, else at the top edge (η only), each labelled.
  const observed = plot.append('g').attr('data-layer', 'observed');
  for (const o of data.observed) {
    const group = observed.append('g').attr('data-observed', o.metal);
    let labelAt: [number, number] | undefined;
    for (const eta of o.holeDensities) {
      const ox = fixed(x(eta));
      const oy = o.doping !== undefined ? fixed(y(o.doping)) : 12;
      group.append('path').attr('data-eta', String(eta)).attr('data-doping', o.doping !== undefined ? String(o.doping) : null)
        .attr('transform', `translate(${ox},${oy})`).attr('d', marker(symbolStar, size * 1.6))
        .attr('fill', 'none').attr('stroke', OBSERVED_COLOUR).attr('stroke-width', 1.2)
        .append('title').text(`observed: ${o.label} — ${o.source}`);
      if (o.doping === undefined) {
        group.append('line').attr('x1', ox).attr('x2', ox).attr('y1', 22).attr('y2', height).attr('stroke', OBSERVED_COLOUR).attr('stroke-opacity', 0.25).attr('stroke-dasharray', '1 3');
      }
      // The label goes beside the rightmost star (left of it near the right edge), clear of the other stars.
      labelAt = labelAt && labelAt[0] > ox ? labelAt : [ox, oy];
    }
    if (labelAt) {
      const left = labelAt[0] > width * 0.6;
      const first = fixed(x(Math.min(...o.holeDensities)));
      // Two lines (what was seen; who saw it), so the label stays inside the plot.
      const cut = o.label.lastIndexOf(' (');
      const lines = cut > 0 ? [o.label.slice(0, cut), o.label.slice(cut + 1)] : [o.label];
      const text = group.append('text').attr('data-role', 'observed-label').attr('y', labelAt[1] + 4 - ((lines.length - 1) * lk.tick) / 2)
        .attr('text-anchor', left ? 'end' : 'start').attr('font-size', lk.tick).attr('fill', OBSERVED_COLOUR);
      lines.forEach((part, i) => text.append('tspan').attr('x', left ? first - 12 : labelAt![0] + 12).attr('dy', i === 0 ? 0 : lk.tick + 1).text(part));
    }
  }

  legend(frame.svg.append('g').attr('data-layer', 'legend').attr('font-size', lk.tick)
    .attr('transform', `translate(${margin.left + width + 22},${margin.top + lk.tick + 8})`), lk, data);
  drawCaption(frame, lk.publication ? title : 'η–δ map: electrons wanted (curve, dashes) and given (markers); stars observed', 6);
  return frame.svg.node()!;
}

/** Brings one metal's markers forward (the others faded), or all back with null: attributes only, no redraw. */
export function setMetalFocus(svg: Element, metal: string | null): void {
  svg.setAttribute('data-focus', metal ?? '');
  for (const element of svg.querySelectorAll('[data-layer="points"] path[data-metal], [data-legend-metal]')) {
    const name = element.getAttribute('data-metal') ?? element.getAttribute('data-legend-metal');
    if (metal === null || name === metal) element.removeAttribute('opacity');
    else element.setAttribute('opacity', '0.3');
  }
}
