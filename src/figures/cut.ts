/**
 * The constant-energy cut figure: A(k, E0) of the unfolded states over the primitive triangular zone as a density
 * image (what a photoemission map at one binding energy shows), with the zone outlined, the sheet's own smaller zone
 * (dashed: where its bands fold to), Γ, M, K, and a colour bar. Equal scales on kx and ky, ky up.
 */
import { axisBottom, axisLeft, scaleLinear } from 'd3';
import type { Vec2 } from '../lattice/sheet.ts';
import { drawDensityBar, PART_WORDS } from './densityBar.ts';
import { drawCaption, figureFrame, storeLinear } from './frame.ts';
import { formatNumber } from './format.ts';
import { INK } from './palette.ts';
import type { CutData, FigureOptions } from './types.ts';

export function cutFigure(data: CutData, options: FigureOptions): SVGSVGElement {
  const relative = data.energy - data.fermi;
  const shift = formatNumber(Math.abs(relative), 3);
  const at = shift === '0' ? 'E_F' : `E_F ${relative > 0 ? '+' : '−'} ${shift} eV`;
  const title = `${data.sheetLabel}: cut at ${at} (Slater–Koster, ${data.parameters})`;
  const frame = figureFrame('cut', options, { screen: [280, 300], publication: [460, 500] }, {
    title,
    description: `A(k, E0) at E0 = ${data.energy} eV (E_F = ${data.fermi} eV) over the triangular lattice's zone, ${PART_WORDS[data.part]}, Gaussian width ${data.smearing} eV; the dashed hexagon is the sheet's own zone. A model estimate, not a prediction.`,
  });
  const lk = frame.look;
  const margins = lk.publication ? { top: 34, right: 16, bottom: 80, left: 64 } : { top: 22, right: 8, bottom: 40, left: 8 };
  const width = frame.width - margins.left - margins.right;
  const height = frame.height - margins.top - margins.bottom;
  const side = Math.min(width, height);
  const cx = margins.left + width / 2;
  const cy = margins.top + height / 2;
  const s = side / (2 * data.reach);
  storeLinear(frame.svg, 'kx-scale', [0, 1], [cx, cx + s]);
  storeLinear(frame.svg, 'ky-scale', [0, 1], [cy, cy - s]);
  const X = (k: Vec2) => Math.round((cx + s * k[0]) * 100) / 100;
  const Y = (k: Vec2) => Math.round((cy - s * k[1]) * 100) / 100;

  if (lk.publication) {
    const kx = scaleLinear().domain([-data.reach, data.reach]).range([cx - side / 2, cx + side / 2]);
    const ky = scaleLinear().domain([-data.reach, data.reach]).range([cy + side / 2, cy - side / 2]);
    frame.svg.append('g').attr('transform', `translate(0,${cy + side / 2})`).call(axisBottom(kx).ticks(5).tickFormat((v) => formatNumber(Number(v), 1)))
      .attr('font-size', lk.tick).attr('font-family', null);
    frame.svg.append('g').attr('transform', `translate(${cx - side / 2},0)`).call(axisLeft(ky).ticks(5).tickFormat((v) => formatNumber(Number(v), 1)))
      .attr('font-size', lk.tick).attr('font-family', null);
    frame.svg.append('text').attr('data-role', 'axis-title').attr('x', cx).attr('y', cy + side / 2 + 36).attr('text-anchor', 'middle').text('kx (Å⁻¹)');
    frame.svg.append('text').attr('data-role', 'axis-title').attr('transform', `translate(16,${cy}) rotate(-90)`).attr('text-anchor', 'middle').text('ky (Å⁻¹)');
  }
  const content = frame.svg.append('g').attr('data-layer', 'content');
  const outline = (corners: Vec2[]) => corners.map((c) => `${X(c)},${Y(c)}`).join(' ');
  // The image clipped to the zone: its pixels outside are empty, and the edge stays sharp.
  const clip = frame.id('zone-clip');
  content.append('defs').append('clipPath').attr('id', clip).append('polygon').attr('points', outline(data.zone.corners));
  content.append('image').attr('clip-path', `url(#${clip})`).attr('data-layer', 'density').attr('x', X([-data.reach, 0])).attr('y', Y([0, data.reach]))
    .attr('width', 2 * data.reach * s).attr('height', 2 * data.reach * s).attr('preserveAspectRatio', 'none').attr('href', data.png);
  content.append('polygon').attr('data-layer', 'cell-zone').attr('points', outline(data.cellZone))
    .attr('fill', 'none').attr('stroke', '#ffffff').attr('stroke-opacity', 0.7).attr('stroke-width', 1).attr('stroke-dasharray', '3 3');
  content.append('polygon').attr('data-layer', 'zone').attr('points', outline(data.zone.corners))
    .attr('fill', 'none').attr('stroke', INK).attr('stroke-width', 1.2);
  for (const point of data.zone.points) {
    content.append('circle').attr('data-k-label', point.label).attr('cx', X(point.k)).attr('cy', Y(point.k)).attr('r', 2.2)
      .attr('fill', '#ffffff').attr('stroke', INK).attr('stroke-width', 0.6);
    const r = Math.hypot(point.k[0], point.k[1]);
    const dx = r > 0 ? (point.k[0] / r) * 10 : -8;
    const dy = r > 0 ? (-point.k[1] / r) * 10 : 10;
    // Light text with a dark rim: readable on the dark density and on the page.
    content.append('text').attr('x', X(point.k) + dx).attr('y', Y(point.k) + dy + 4).attr('text-anchor', 'middle')
      .attr('font-size', lk.font).attr('fill', '#ffffff').attr('stroke', INK).attr('stroke-width', 2).attr('paint-order', 'stroke').text(point.label);
  }
  drawCaption(frame, lk.publication ? title : `constant-energy cut at ${at}`, 6);
  const barLength = Math.min(side, lk.publication ? 180 : 150);
  drawDensityBar(frame, frame.svg, cx - barLength / 2, frame.height - (lk.publication ? 30 : 26), barLength, data.scaleMax);
  frame.svg.attr('data-part', data.part).attr('data-cut-energy', String(data.energy)).attr('data-cut-fermi', String(data.fermi));
  return frame.svg.node()!;
}
