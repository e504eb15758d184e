/**
 * The DOS figure: energy vertical on the bands' energy window (same plot margins, so the two sit side by side
 * on one axis), total, σ and π curves, the occupied part of the total filled below E_F by a clip that setFermi
 * moves, and a legend.
 */
import { area, axisBottom, line, scaleLinear } from 'd3';
import { checkEnergyRange, spectraEnergyRange } from './bands.ts';
import { drawEnergyAxis, drawFermi, drawLegend, energyMargins, energyPlot } from './energyPlot.ts';
import { drawCaption, figureFrame } from './frame.ts';
import { formatNumber } from './format.ts';
import { INK, OCCUPIED_FILL, PI_COLOUR, SIGMA_COLOUR, TOTAL_COLOUR } from './palette.ts';
import type { FigureOptions, SpectraData } from './types.ts';

export interface DosOptions extends FigureOptions {
  /** Energy window [lo, hi] (eV): give the bands figure's, so the axes match. Default as the bands figure. */
  energyRange?: [number, number];
  /** Draw the energy axis labels (default true); false when the DOS sits right of the bands and shares theirs. */
  energyLabels?: boolean;
}

export function dosFigure(data: SpectraData, options: DosOptions): SVGSVGElement {
  const range = checkEnergyRange(options.energyRange ?? spectraEnergyRange(data));
  const dos = data.dos;
  const title = `${data.sheetLabel}: DOS (Slater–Koster, ${data.parameters})`;
  const frame = figureFrame('dos', options, { screen: [180, 400], publication: [300, 480] }, {
    title,
    description: `Density of states, states per eV per atom (both spins), Gaussian width ${data.smearing} eV on a ${data.mesh}×${data.mesh} mesh; total, σ and π parts; filled up to E_F = ${data.fermi} eV at δ = ${data.doping}. A model estimate, not a prediction.`,
  });
  const lk = frame.look;
  const labels = options.energyLabels ?? true;
  const margins = energyMargins(lk, labels);
  const { plot, width, height, y } = energyPlot(frame, margins, range);

  // Grid points inside the window, plus one on each side so the curves reach its edges.
  let first = 0;
  while (first < dos.energy.length - 1 && dos.energy[first + 1] < range[0]) first++;
  let end = dos.energy.length;
  while (end > first + 1 && dos.energy[end - 2] > range[1]) end--;
  let top = 0;
  for (let i = first; i < end; i++) if (dos.total[i] > top) top = dos.total[i];
  const x = scaleLinear().domain([0, top > 0 ? top * 1.05 : 1]).range([0, width]);
  const index = Array.from({ length: end - first }, (_, i) => first + i);
  const fixed = (v: number) => Math.round(v * 100) / 100;
  const curve = (values: Float64Array) => line<number>().x((i) => fixed(x(values[i]))).y((i) => fixed(y(dos.energy[i])))(index) ?? '';

  const occupied = frame.id('occupied');
  const body = plot.append('g').attr('data-layer', 'dos').attr('clip-path', `url(#${frame.id('window')})`);
  plot.append('defs').append('clipPath').attr('id', frame.id('window')).append('rect').attr('width', width).attr('height', height);
  body.append('g').attr('clip-path', `url(#${occupied})`).append('path').attr('data-layer', 'occupied')
    .attr('fill', OCCUPIED_FILL)
    .attr('d', area<number>().x0(0).x1((i) => fixed(x(dos.total[i]))).y((i) => fixed(y(dos.energy[i])))(index) ?? '');
  body.append('path').attr('data-curve', 'sigma').attr('d', curve(dos.sigma)).attr('fill', 'none').attr('stroke', SIGMA_COLOUR).attr('stroke-width', lk.line);
  body.append('path').attr('data-curve', 'pi').attr('d', curve(dos.pi)).attr('fill', 'none').attr('stroke', PI_COLOUR).attr('stroke-width', lk.line);
  body.append('path').attr('data-curve', 'total').attr('d', curve(dos.total)).attr('fill', 'none').attr('stroke', TOTAL_COLOUR).attr('stroke-width', lk.line);

  plot.append('rect').attr('data-layer', 'frame').attr('width', width).attr('height', height).attr('fill', 'none').attr('stroke', INK).attr('stroke-width', 0.8);
  drawFermi(frame, plot, width, height, y, data.fermi);
  drawEnergyAxis(plot, y, lk, height, labels);
  const axis = plot.append('g').attr('data-layer', 'dos-axis').attr('transform', `translate(0,${height})`)
    .call(axisBottom(x).ticks(lk.publication ? 4 : 3).tickSizeOuter(0).tickFormat((v) => formatNumber(Number(v), 1)));
  axis.attr('font-size', lk.tick).attr('font-family', null);
  if (lk.publication) {
    plot.append('text').attr('data-role', 'axis-title').attr('x', width / 2).attr('y', height + 2 * lk.font + 10)
      .attr('text-anchor', 'middle').attr('font-size', lk.font).text('DOS (states/eV/atom)');
  }
  drawCaption(frame, lk.publication ? title : 'DOS', 6);
  // A column inside the plot's top right, where the DOS of a sheet's highest bands is low.
  drawLegend(plot, width - (lk.publication ? 66 : 52), lk.tick + 4, lk, [
    { label: 'total', colour: TOTAL_COLOUR },
    { label: 'σ', colour: SIGMA_COLOUR },
    { label: 'π', colour: PI_COLOUR },
    { label: 'filled', colour: OCCUPIED_FILL, kind: 'box' },
  ], true);
  return frame.svg.node()!;
}
