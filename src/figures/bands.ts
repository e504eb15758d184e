/**
 * The bands figure: every band on the automatic k-path as one curve (planar sheets: σ block then π block, each
 * ascending, so bands cross freely), coloured by its σ share; special points; the E_F line; occupied states full
 * and empty ones faded through two clip rectangles that setFermi moves.
 */
import { scaleLinear } from 'd3';
import { drawCaption, figureFrame, readLinear, storeLinear, type StoredLinear } from './frame.ts';
import { drawEnergyAxis, drawFermi, drawLegend, energyMargins, energyPlot } from './energyPlot.ts';
import { formatNumber } from './format.ts';
import { EMPTY_OPACITY, GRID, INK, MUTED, PI_COLOUR, SIGMA_COLOUR, shareColour } from './palette.ts';
import type { FigureOptions, SpectraData } from './types.ts';

export interface BandsOptions extends FigureOptions {
  /** Energy window [lo, hi] (eV); default: all path energies with a small margin. */
  energyRange?: [number, number];
  /** A state marked on the figure. */
  selected?: { kIndex: number; band: number };
}

/** The default energy window of the bands and DOS figures: every path energy, 4% margin each side. */
export function spectraEnergyRange(data: SpectraData): [number, number] {
  let low = Infinity;
  let high = -Infinity;
  for (const e of data.path.energies) {
    if (e < low) low = e;
    if (e > high) high = e;
  }
  if (!(high > low)) return [low - 1, high + 1];
  const pad = 0.04 * (high - low);
  return [low - pad, high + pad];
}

/** Checks a caller's energy window; a bad one is a programmer error. */
export function checkEnergyRange(range: [number, number]): [number, number] {
  if (!(Number.isFinite(range[0]) && Number.isFinite(range[1]) && range[1] > range[0])) {
    throw new TypeError(`invalid energyRange: [${range[0]}, ${range[1]}] (need finite lo < hi in eV)`);
  }
  return range;
}

/** Smallest change of σ share that gets its own gradient stop. */
const STOP_STEP = 0.02;

const fixed = (v: number) => Math.round(v * 100) / 100;

export function bandsFigure(data: SpectraData, options: BandsOptions): SVGSVGElement {
  const path = data.path;
  const range = checkEnergyRange(options.energyRange ?? spectraEnergyRange(data));
  const title = `${data.sheetLabel}: tight-binding bands (Slater–Koster, ${data.parameters}), δ = ${formatNumber(data.doping, 3)} e/atom`;
  const frame = figureFrame('bands', options, { screen: [520, 400], publication: [640, 480] }, {
    title,
    description: `Bands on the ${path.cellType} path ${path.labels.map((l) => l.label).join('–')}, coloured by σ share; E_F = ${data.fermi} eV from a ${data.mesh}×${data.mesh} mesh with Gaussian width ${data.smearing} eV. A model estimate, not a prediction.`,
  });
  const lk = frame.look;
  const margins = energyMargins(lk, true);
  const { plot, width, height, y } = energyPlot(frame, margins, range);
  const total = path.count > 1 ? path.distance[path.count - 1] : 1;
  const x = scaleLinear().domain([0, total]).range([0, width]);
  storeLinear(frame.svg, 'k-scale', [0, total], [0, width]);

  const special = plot.append('g').attr('data-layer', 'special-points').attr('stroke', GRID);
  for (const label of path.labels.slice(1, -1)) {
    const at = x(path.distance[label.index]);
    special.append('line').attr('x1', at).attr('x2', at).attr('y2', height);
  }

  // The clips are defined by drawFermi below (forward references are fine in SVG); they also bound the plot area.
  const occupied = frame.id('occupied');
  const empty = frame.id('empty');
  const curvesId = frame.id('curves');
  const faded = plot.append('g').attr('data-layer', 'empty-states').attr('clip-path', `url(#${empty})`).attr('opacity', EMPTY_OPACITY);
  const curves = faded.append('g').attr('id', curvesId).attr('data-layer', 'bands').attr('fill', 'none')
    .attr('stroke-width', lk.line).attr('stroke-linejoin', 'round');
  const gradients = data.planar ? null : plot.append('defs');
  const bands = path.bands;
  const xs = Array.from(path.distance, (d) => fixed(x(d)));
  for (let b = 0; b < bands; b++) {
    let d = '';
    for (let k = 0; k < path.count; k++) {
      d += `${k === 0 ? 'M' : 'L'}${xs[k]},${fixed(y(path.energies[k * bands + b]))}`;
    }
    const curve = curves.append('path').attr('data-band', b).attr('d', d);
    if (gradients) {
      const id = frame.id(`share-${b}`);
      const gradient = gradients.append('linearGradient').attr('id', id).attr('gradientUnits', 'userSpaceOnUse')
        .attr('x1', 0).attr('x2', width).attr('y1', 0).attr('y2', 0);
      let last = -1;
      for (let k = 0; k < path.count; k++) {
        const w = path.sigmaWeight[k * bands + b];
        if (k > 0 && k < path.count - 1 && Math.abs(w - last) < STOP_STEP) continue;
        last = w;
        gradient.append('stop').attr('offset', fixed((100 * xs[k]) / width) + '%').attr('stop-color', shareColour(w));
      }
      curve.attr('stroke', `url(#${id})`);
    } else {
      curve.attr('stroke', shareColour(path.sigmaWeight[b]));
    }
  }
  plot.append('use').attr('href', `#${curvesId}`).attr('data-layer', 'occupied-states').attr('clip-path', `url(#${occupied})`);

  plot.append('rect').attr('data-layer', 'frame').attr('width', width).attr('height', height).attr('fill', 'none').attr('stroke', INK).attr('stroke-width', 0.8);
  drawFermi(frame, plot, width, height, y, data.fermi);
  drawEnergyAxis(plot, y, lk, height);
  const ticks = plot.append('g').attr('data-layer', 'k-labels').attr('font-size', lk.font).attr('text-anchor', 'middle');
  for (const label of path.labels) {
    ticks.append('text').attr('x', x(path.distance[label.index])).attr('y', height + lk.font + 4).text(label.label);
  }
  if (lk.publication) {
    plot.append('text').attr('data-role', 'axis-title').attr('x', width / 2).attr('y', height + 2 * lk.font + 10)
      .attr('text-anchor', 'middle').attr('fill', MUTED).attr('font-size', lk.tick).text(`wave vector along the ${path.cellType} zone path`);
  }

  drawCaption(frame, title, 6);
  const legend = data.planar
    ? [{ label: 'σ (s, px, py)', colour: SIGMA_COLOUR }, { label: 'π (pz)', colour: PI_COLOUR }]
    : [{ label: 'σ', colour: SIGMA_COLOUR }, { label: 'half σ, half π', colour: shareColour(0.5) }, { label: 'π', colour: PI_COLOUR }];
  const legendEntries: { label: string; colour: string; opacity?: number }[] = legend;
  legendEntries.push({ label: 'empty states', colour: SIGMA_COLOUR, opacity: EMPTY_OPACITY });
  drawLegend(frame.svg, margins.left, margins.top - 10, lk, legendEntries);

  plot.append('circle').attr('data-selected', '').attr('r', 4.5).attr('fill', 'none').attr('stroke', INK).attr('stroke-width', 2)
    .attr('visibility', 'hidden');
  const svg = frame.svg.node()!;
  if (options.selected) setSelected(svg, data, options.selected);
  return svg;
}

/** Marks state (kIndex, band) on a bands figure, or hides the mark (null). */
export function setSelected(svg: Element, data: SpectraData, selected: { kIndex: number; band: number } | null): void {
  const mark = svg.querySelector('circle[data-selected]');
  if (!mark) throw new TypeError('invalid svg: not a bands figure (no selected-state mark)');
  const path = data.path;
  if (!selected || !(selected.kIndex >= 0 && selected.kIndex < path.count && selected.band >= 0 && selected.band < path.bands)) {
    mark.setAttribute('visibility', 'hidden');
    mark.removeAttribute('data-selected-state');
    return;
  }
  const scales = bandsScales(svg);
  mark.setAttribute('cx', String(scales.x(path.distance[selected.kIndex])));
  mark.setAttribute('cy', String(scales.y(path.energies[selected.kIndex * path.bands + selected.band])));
  mark.setAttribute('data-selected-state', `${selected.kIndex},${selected.band}`);
  mark.setAttribute('visibility', 'visible');
}

/** The maps of a bands figure: path distance → x and E → y, in plot coordinates, and the plot's offset and size. */
export function bandsScales(svg: Element): { x: StoredLinear; y: StoredLinear; left: number; top: number; width: number; height: number } {
  const x = readLinear(svg, 'k-scale');
  const y = readLinear(svg, 'energy-scale');
  const plot = svg.getAttribute('data-plot');
  if (!x || !y || !plot) throw new TypeError('invalid svg: not a bands figure (no data-k-scale)');
  const [left, top, width, height] = plot.split(' ').map(Number);
  return { x, y, left, top, width, height };
}

/**
 * The state nearest to a pointer at (x, y) in the svg's own units (viewBox = CSS pixels at the default size):
 * the path point nearest in x, then the band nearest in energy there. Undefined outside the plot.
 */
export function bandsPick(svg: Element, data: SpectraData, x: number, y: number): { kIndex: number; band: number; energy: number } | undefined {
  const s = bandsScales(svg);
  const px = x - s.left;
  const py = y - s.top;
  if (!(px >= 0 && px <= s.width && py >= 0 && py <= s.height)) return undefined;
  const path = data.path;
  if (path.count === 0 || path.bands === 0) return undefined;
  const d = s.x.invert(px);
  let lo = 0;
  let hi = path.count - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (path.distance[mid] <= d) lo = mid;
    else hi = mid;
  }
  const kIndex = Math.abs(path.distance[hi] - d) < Math.abs(path.distance[lo] - d) ? hi : lo;
  const energy = s.y.invert(py);
  let band = 0;
  let best = Infinity;
  for (let b = 0; b < path.bands; b++) {
    const gap = Math.abs(path.energies[kIndex * path.bands + b] - energy);
    if (gap < best) {
      best = gap;
      band = b;
    }
  }
  return { kIndex, band, energy: path.energies[kIndex * path.bands + band] };
}
