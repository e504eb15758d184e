/**
 * The unfolded-bands figure: the spectral function A(k, E) of a sheet's states unfolded onto the primitive
 * triangular lattice, along its path Γ–M–K–Γ, as a density image (viridis, no weight dark); the energy axis, E_F
 * (moved by setFermi, as on the bands figure) and a colour bar. Where the image is bright the supercell's states
 * look like Bloch states of the plain triangular lattice at that k: what photoemission on the lattice's zone sees.
 */
import { scaleLinear } from 'd3';
import { drawDensityBar, PART_WORDS } from './densityBar.ts';
import { drawEnergyAxis, drawFermi, energyMargins, energyPlot } from './energyPlot.ts';
import { drawCaption, figureFrame, storeLinear } from './frame.ts';
import { INK, MUTED } from './palette.ts';
import type { FigureOptions, UnfoldedData } from './types.ts';

const fixed = (v: number) => Math.round(v * 100) / 100;

export function unfoldedFigure(data: UnfoldedData, options: FigureOptions): SVGSVGElement {
  const path = data.path;
  const title = `${data.sheetLabel}: bands unfolded onto the triangular lattice (Slater–Koster, ${data.parameters})`;
  const frame = figureFrame('unfolded', options, { screen: [520, 400], publication: [640, 500] }, {
    title,
    description: `Spectral function A(k, E) of the ${data.atoms} atoms on ${data.sites} sites unfolded onto the triangular lattice of spacing ${data.bond} Å, along ${path.labels.map((l) => l.label).join('–')} of its zone, ${PART_WORDS[data.part]}, Gaussian width ${data.smearing} eV; per k it integrates to 4(1 − η) = ${(4 * data.atoms) / data.sites}. E_F = ${data.fermi} eV. A model estimate, not a prediction.`,
  });
  const lk = frame.look;
  const margins = energyMargins(lk, true);
  if (lk.publication) margins.top += 14;
  const [low, high] = data.energyRange;
  const { plot, width, height, y } = energyPlot(frame, margins, data.energyRange);
  const total = path.count > 1 ? path.distance[path.count - 1] : 1;
  const x = scaleLinear().domain([0, total]).range([0, width]);
  storeLinear(frame.svg, 'k-scale', [0, total], [0, width]);

  // Rows are equal energy bins over the window; columns are path points, so the image reaches half a column past
  // each end (the plot clips it).
  const halfColumn = path.count > 1 ? width / (path.count - 1) / 2 : 0;
  const clip = frame.id('window');
  plot.append('defs').append('clipPath').attr('id', clip).append('rect').attr('width', width).attr('height', height);
  plot.append('g').attr('clip-path', `url(#${clip})`).append('image').attr('data-layer', 'density')
    .attr('x', fixed(-halfColumn)).attr('y', fixed(y(high))).attr('width', fixed(width + 2 * halfColumn)).attr('height', fixed(y(low) - y(high)))
    .attr('preserveAspectRatio', 'none').attr('href', data.png);

  const special = plot.append('g').attr('data-layer', 'special-points').attr('stroke', '#ffffff').attr('stroke-opacity', 0.45);
  for (const label of path.labels.slice(1, -1)) {
    const at = fixed(x(path.distance[label.index]));
    special.append('line').attr('x1', at).attr('x2', at).attr('y2', height);
  }
  plot.append('rect').attr('data-layer', 'frame').attr('width', width).attr('height', height).attr('fill', 'none').attr('stroke', INK).attr('stroke-width', 0.8);
  drawFermi(frame, plot, width, height, y, data.fermi);
  drawEnergyAxis(plot, y, lk, height);
  const ticks = plot.append('g').attr('data-layer', 'k-labels').attr('font-size', lk.font).attr('text-anchor', 'middle');
  for (const label of path.labels) ticks.append('text').attr('x', x(path.distance[label.index])).attr('y', height + lk.font + 4).text(label.label);
  if (lk.publication) {
    plot.append('text').attr('data-role', 'axis-title').attr('x', width / 2).attr('y', height + 2 * lk.font + 10)
      .attr('text-anchor', 'middle').attr('fill', MUTED).attr('font-size', lk.tick).text('wave vector along the triangular lattice\'s zone path');
  }
  drawCaption(frame, lk.publication ? title : `unfolded onto the triangular lattice — ${PART_WORDS[data.part]}`, 6);
  const barLength = lk.publication ? 150 : 110;
  drawDensityBar(frame, frame.svg, frame.width - margins.right - barLength - 40, margins.top - (lk.publication ? 30 : 24), barLength, data.scaleMax);
  frame.svg.attr('data-part', data.part);
  return frame.svg.node()!;
}
