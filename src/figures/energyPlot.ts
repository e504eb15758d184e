/**
 * What the bands and DOS figures share: the same plot margins (so the two sit side by side on one energy axis),
 * the energy axis, and the E_F marker with its occupied/empty clip rectangles, moved by setFermi.
 */
import { axisLeft, scaleLinear, type ScaleLinear } from 'd3';
import { type Frame, type Group, type Svg, readLinear, storeLinear } from './frame.ts';
import type { Look } from './look.ts';
import { FERMI_COLOUR, INK, MUTED } from './palette.ts';
import { formatNumber } from './format.ts';

export interface Margins {
  top: number;
  right: number;
  bottom: number;
  left: number;
}

/** Margins of an energy plot; top and bottom depend only on the look, so bands and DOS line up. */
export function energyMargins(lk: Look, axis: boolean): Margins {
  return lk.publication
    ? { top: 46, right: 16, bottom: 48, left: axis ? 64 : 14 }
    : { top: 36, right: 10, bottom: 26, left: axis ? 44 : 8 };
}

/** The plot group, translated by the margins, and the energy scale (stored on the svg for setFermi). */
export function energyPlot(frame: Frame, margins: Margins, range: [number, number]): {
  plot: Group; width: number; height: number; y: ScaleLinear<number, number>;
} {
  const width = Math.max(10, frame.width - margins.left - margins.right);
  const height = Math.max(10, frame.height - margins.top - margins.bottom);
  const y = scaleLinear().domain(range).range([height, 0]);
  storeLinear(frame.svg, 'energy-scale', range, [height, 0]);
  frame.svg.attr('data-plot', `${margins.left} ${margins.top} ${width} ${height}`);
  const plot = frame.svg.append('g').attr('data-layer', 'plot').attr('transform', `translate(${margins.left},${margins.top})`);
  return { plot, width, height, y };
}

/** The energy axis on the left of the plot, with its title in the publication look. */
export function drawEnergyAxis(plot: Group, y: ScaleLinear<number, number>, lk: Look, height: number, labels = true): void {
  const axis = plot.append('g').attr('data-layer', 'energy-axis')
    .call(axisLeft(y).ticks(lk.publication ? 7 : 6).tickSizeOuter(0).tickFormat((v) => (labels ? formatNumber(Number(v), 1) : '')));
  axis.attr('font-size', lk.tick).attr('font-family', null);
  if (lk.publication && labels) {
    plot.append('text').attr('data-role', 'axis-title').attr('transform', `translate(${-48},${height / 2}) rotate(-90)`)
      .attr('text-anchor', 'middle').attr('font-size', lk.font).text('E (eV)');
  }
}

/** Clip rectangles of the occupied (below E_F) and empty parts of the plot, and the E_F line. */
export function drawFermi(frame: Frame, plot: Group, width: number, height: number, y: ScaleLinear<number, number>, fermi: number): {
  occupied: string; empty: string;
} {
  const occupied = frame.id('occupied');
  const empty = frame.id('empty');
  const defs = plot.append('defs');
  defs.append('clipPath').attr('id', occupied).append('rect').attr('data-clip', 'occupied').attr('x', 0).attr('width', width);
  defs.append('clipPath').attr('id', empty).append('rect').attr('data-clip', 'empty').attr('x', 0).attr('y', 0).attr('width', width);
  // Where the counting rule's electrons would put E_F: hidden until setRule gives it an energy.
  const rule = plot.append('g').attr('data-layer', 'rule').attr('visibility', 'hidden');
  rule.append('line').attr('data-rule', '').attr('x1', 0).attr('x2', width)
    .attr('stroke', MUTED).attr('stroke-width', 1.2).attr('stroke-dasharray', '2 3');
  rule.append('text').attr('data-rule-label', '').attr('x', 3).attr('font-size', frame.look.tick).attr('fill', MUTED).text('rule');
  const marker = plot.append('g').attr('data-layer', 'fermi');
  marker.append('line').attr('data-fermi', String(fermi)).attr('x1', 0).attr('x2', width)
    .attr('stroke', FERMI_COLOUR).attr('stroke-width', 1.4);
  const label = marker.append('text').attr('data-fermi-label', '').attr('x', width - 3).attr('text-anchor', 'end')
    .attr('font-size', frame.look.tick).attr('fill', FERMI_COLOUR).text('E');
  label.append('tspan').attr('dy', 3).attr('font-size', frame.look.tick * 0.75).text('F');
  placeFermi(frame.svg.node()!, fermi, y(fermi), height);
  return { occupied, empty };
}

function placeFermi(svg: Element, fermi: number, py: number, height: number): void {
  const inside = py >= 0 && py <= height;
  const at = Math.min(height, Math.max(0, py));
  const line = svg.querySelector('line[data-fermi]');
  if (line) {
    line.setAttribute('data-fermi', String(fermi));
    line.setAttribute('y1', String(at));
    line.setAttribute('y2', String(at));
    line.setAttribute('visibility', inside ? 'visible' : 'hidden');
  }
  const label = svg.querySelector('text[data-fermi-label]');
  if (label) {
    label.setAttribute('y', String(at - 3));
    label.setAttribute('visibility', inside ? 'visible' : 'hidden');
  }
  const filled = svg.querySelector('rect[data-clip="occupied"]');
  if (filled) {
    filled.setAttribute('y', String(at));
    filled.setAttribute('height', String(height - at));
  }
  const emptyRect = svg.querySelector('rect[data-clip="empty"]');
  if (emptyRect) emptyRect.setAttribute('height', String(at));
}

/**
 * Moves the E_F line, its `data-fermi` value (full precision) and the occupied/empty clips of a bands or DOS
 * figure to `fermi` (eV), without re-rendering: a few attribute writes, for the doping slider.
 */
export function setFermi(svg: SVGSVGElement | Element, fermi: number): void {
  const y = readLinear(svg, 'energy-scale');
  if (!y) throw new TypeError('invalid svg: not a bands or DOS figure (no data-energy-scale)');
  placeFermi(svg, fermi, y(fermi), y.range[0]);
}

/**
 * Shows a second, dotted line where E_F would sit with the counting rule's doping δ = 8/(3(1 − η)) − 3 (the
 * energy that just fills the σ bonding states by the rule), or hides it (null or outside the plot).
 */
export function setRule(svg: SVGSVGElement | Element, energy: number | null): void {
  const y = readLinear(svg, 'energy-scale');
  if (!y) throw new TypeError('invalid svg: not a bands or DOS figure (no data-energy-scale)');
  const group = svg.querySelector('g[data-layer="rule"]');
  const line = svg.querySelector('line[data-rule]');
  const label = svg.querySelector('text[data-rule-label]');
  if (!group || !line || !label) return;
  const py = energy === null ? NaN : y(energy);
  const inside = py >= 0 && py <= y.range[0];
  group.setAttribute('visibility', inside ? 'visible' : 'hidden');
  if (!inside) {
    line.setAttribute('data-rule', '');
    return;
  }
  line.setAttribute('data-rule', String(energy));
  line.setAttribute('y1', String(py));
  line.setAttribute('y2', String(py));
  label.setAttribute('y', String(py - 3));
}

/** A legend row of swatches at (x, y): each entry a short line (or box) and its label. */
export function drawLegend(
  parent: Svg | Group, x: number, y: number, lk: Look,
  entries: { label: string; colour: string; kind?: 'line' | 'box'; opacity?: number }[],
  /** Entries one under another instead of in a row. */
  column = false,
): void {
  const legend = parent.append('g').attr('data-layer', 'legend').attr('transform', `translate(${x},${y})`).attr('font-size', lk.tick);
  let at = 0;
  for (const entry of entries) {
    const item = legend.append('g').attr('transform', column ? `translate(0,${at})` : `translate(${at},0)`);
    const swatch = entry.kind === 'box'
      ? item.append('rect').attr('y', -5).attr('width', 14).attr('height', 8).attr('fill', entry.colour)
      : item.append('line').attr('x2', 16).attr('y1', -1).attr('y2', -1).attr('stroke', entry.colour).attr('stroke-width', 3);
    if (entry.opacity !== undefined) swatch.attr('opacity', entry.opacity);
    item.append('text').attr('x', 20).attr('y', 3).attr('fill', INK).text(entry.label);
    // Width estimate: no text metrics exist headless, so lengths are estimated from the character count.
    at += column ? lk.tick + 5 : 28 + entry.label.length * lk.tick * 0.55;
  }
}

export { MUTED };
