/**
 * The calibration figure: the fitted model's bands (lines) against the reference bands they were fitted to (dots),
 * along the reference's own k-points, on the reference's energy scale. Matched pairs are drawn full (a dot's
 * opacity is its weight in the fit), the rest faded; the reference's E_F dashed when known. The caption says what a
 * fit is: an interpolation of the user's own calculation, not a prediction.
 */
import { scaleLinear } from 'd3';
import { drawCaption, figureFrame, storeLinear } from './frame.ts';
import { drawEnergyAxis, drawLegend, energyPlot } from './energyPlot.ts';
import { formatNumber } from './format.ts';
import { FERMI_COLOUR, GRID, INK, MUTED, REFERENCE_COLOUR } from './palette.ts';
import type { CalibrationFigureData, FigureOptions } from './types.ts';

/** Most reference dots drawn; beyond, every s-th k-point is drawn (said in the description). */
const MAX_DOTS = 12_000;
/** Steps of a dot's opacity (its weight in the fit, 0 … 1). */
const WEIGHT_LEVELS = 8;

const fixed = (v: number) => Math.round(v * 100) / 100;

/** Every reference energy and every matched model energy, 4% margin each side. */
function energyRange(data: CalibrationFigureData): [number, number] {
  let low = Infinity;
  let high = -Infinity;
  for (const e of data.referenceEnergies) {
    low = Math.min(low, e);
    high = Math.max(high, e);
  }
  for (let k = 0; k < data.count; k++) {
    for (let j = 0; j < data.match.count; j++) {
      const e = data.modelEnergies[k * data.modelBands + data.match.modelFirst + j];
      low = Math.min(low, e);
      high = Math.max(high, e);
    }
  }
  if (!(high > low)) return [low - 1, high + 1];
  const pad = 0.04 * (high - low);
  return [low - pad, high + pad];
}

export function calibrationFigure(data: CalibrationFigureData, options: FigureOptions): SVGSVGElement {
  const stride = Math.max(1, Math.ceil((data.count * data.referenceBands) / MAX_DOTS));
  const title = `${data.sheetLabel}: fitted model (${data.parameters}) against the reference bands`;
  const stats = `rms ${formatNumber(data.rms, 3)} eV, largest ${formatNumber(data.maxError, 3)} eV over ${data.points} energies${data.block === 'full' ? '' : ` (${data.block} block)`}`;
  const frame = figureFrame('calibration', options, { screen: [560, 420], publication: [680, 520] }, {
    title,
    description: `${data.referenceLabel}: reference bands ${data.match.referenceFirst + 1}–${data.match.referenceFirst + data.match.count} matched to model bands ${data.match.modelFirst + 1}–${data.match.modelFirst + data.match.count}; ${stats}${stride > 1 ? `; every ${stride}th k-point drawn` : ''}. ${data.demo ? `${data.demo}. ` : ''}A fit is an interpolation of the reference calculation, as good as that calculation; not a prediction.`,
  });
  const lk = frame.look;
  const lines = data.demo ? 3 : 2;
  const margins = lk.publication
    ? { top: 40 + lines * (lk.caption + 5), right: 16, bottom: 48, left: 64 }
    : { top: 30 + lines * (lk.caption + 4), right: 10, bottom: 26, left: 44 };
  const range = energyRange(data);
  const { plot, width, height, y } = energyPlot(frame, margins, range);
  const total = data.count > 1 ? data.distance[data.count - 1] : 1;
  const x = scaleLinear().domain([0, total > 0 ? total : 1]).range([0, width]);
  storeLinear(frame.svg, 'k-scale', [0, total > 0 ? total : 1], [0, width]);
  frame.svg.attr('data-rms', data.rms).attr('data-points', data.points);

  const clip = frame.id('clip');
  plot.append('defs').append('clipPath').attr('id', clip).append('rect').attr('width', width).attr('height', height);
  const special = plot.append('g').attr('data-layer', 'special-points').attr('stroke', GRID);
  const marks = new Set([...data.labels.map((l) => l.index), ...data.breaks]);
  for (const index of marks) {
    if (index <= 0 || index >= data.count - 1) continue;
    special.append('line').attr('x1', fixed(x(data.distance[index]))).attr('x2', fixed(x(data.distance[index]))).attr('y2', height)
      .attr('stroke', data.breaks.includes(index) ? MUTED : GRID);
  }
  const inside = plot.append('g').attr('clip-path', `url(#${clip})`);
  if (data.fermi !== null) {
    const at = fixed(y(data.fermi));
    inside.append('line').attr('data-layer', 'fermi').attr('data-fermi', String(data.fermi)).attr('x1', 0).attr('x2', width).attr('y1', at).attr('y2', at)
      .attr('stroke', FERMI_COLOUR).attr('stroke-width', 1).attr('stroke-dasharray', '5 3');
  }

  // Model bands: one path each, lifted at jumps of the path.
  const xs = Array.from(data.distance, (d) => fixed(x(d)));
  const breaks = new Set(data.breaks);
  const model = inside.append('g').attr('data-layer', 'model').attr('fill', 'none').attr('stroke-linejoin', 'round');
  for (let b = 0; b < data.modelBands; b++) {
    let d = '';
    for (let k = 0; k < data.count; k++) d += `${k === 0 || breaks.has(k) ? 'M' : 'L'}${xs[k]},${fixed(y(data.modelEnergies[k * data.modelBands + b]))}`;
    const matched = b >= data.match.modelFirst && b < data.match.modelFirst + data.match.count;
    const path = model.append('path').attr('data-band', b).attr('d', d).attr('stroke', matched ? INK : MUTED).attr('stroke-width', matched ? lk.line : 0.8);
    if (!matched) path.attr('stroke-dasharray', '3 2').attr('data-unmatched', '');
  }

  // Reference energies: dots, opacity by weight where matched (in WEIGHT_LEVELS steps, one path per step, so a
  // large file is a few elements, not thousands); hollow where not matched.
  const radius = lk.publication ? 2.2 : 1.8;
  const dot = (cx: number, cy: number) => `M${fixed(cx - radius)},${cy}a${radius},${radius} 0 1,0 ${2 * radius},0a${radius},${radius} 0 1,0 ${-2 * radius},0`;
  const levels: string[] = Array.from({ length: WEIGHT_LEVELS + 1 }, () => '');
  let unmatched = '';
  let dots = 0;
  for (let k = 0; k < data.count; k += stride) {
    for (let b = 0; b < data.referenceBands; b++) {
      const j = b - data.match.referenceFirst;
      const d = dot(xs[k], fixed(y(data.referenceEnergies[k * data.referenceBands + b])));
      if (j >= 0 && j < data.match.count) levels[Math.round(WEIGHT_LEVELS * data.weights[k * data.match.count + j])] += d;
      else unmatched += d;
      dots++;
    }
  }
  const reference = inside.append('g').attr('data-layer', 'reference').attr('fill', REFERENCE_COLOUR);
  levels.forEach((d, level) => {
    if (d !== '') reference.append('path').attr('data-weight', level / WEIGHT_LEVELS).attr('opacity', fixed(0.25 + (0.75 * level) / WEIGHT_LEVELS)).attr('d', d);
  });
  if (unmatched !== '') reference.append('path').attr('data-unmatched', '').attr('fill', 'none').attr('stroke', MUTED).attr('stroke-width', 0.7).attr('d', unmatched);
  frame.svg.attr('data-reference-dots', dots);

  plot.append('rect').attr('data-layer', 'frame').attr('width', width).attr('height', height).attr('fill', 'none').attr('stroke', INK).attr('stroke-width', 0.8);
  drawEnergyAxis(plot, y, lk, height);
  const ticks = plot.append('g').attr('data-layer', 'k-labels').attr('font-size', lk.font).attr('text-anchor', 'middle');
  for (const label of data.labels) ticks.append('text').attr('x', xs[label.index]).attr('y', height + lk.font + 4).text(label.label);
  if (lk.publication) {
    plot.append('text').attr('data-role', 'axis-title').attr('x', width / 2).attr('y', height + 2 * lk.font + 10)
      .attr('text-anchor', 'middle').attr('fill', MUTED).attr('font-size', lk.tick).text('wave vector along the reference k-points');
  }

  const left = lk.publication ? margins.left : 6;
  drawCaption(frame, title, left);
  const second = lk.caption + 4 + lk.caption + 4;
  frame.svg.append('text').attr('data-role', 'statistics').attr('x', left).attr('y', second).attr('font-size', lk.tick).attr('fill', MUTED)
    .text(`${stats}; an interpolation of the reference, not a prediction`);
  if (data.demo) {
    frame.svg.append('text').attr('data-role', 'demo').attr('x', left).attr('y', second + lk.caption + 4).attr('font-size', lk.tick)
      .attr('font-weight', 'bold').attr('fill', FERMI_COLOUR).text(data.demo);
  }
  const legend: { label: string; colour: string; opacity?: number }[] = [
    { label: 'model, fitted', colour: INK },
    { label: 'reference', colour: REFERENCE_COLOUR },
  ];
  if (data.modelBands > data.match.count) legend.push({ label: 'model, not matched', colour: MUTED, opacity: 0.6 });
  if (data.fermi !== null) legend.push({ label: 'reference E_F', colour: FERMI_COLOUR });
  drawLegend(frame.svg, margins.left, margins.top - 8, lk, legend);
  return frame.svg.node()!;
}
