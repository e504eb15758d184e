/**
 * The zone figure: the Brillouin zone (Wigner–Seitz cell of the reciprocal lattice), b1 and b2 from Γ, the
 * automatic k-path with its special points, and a marker for the k of the selected state (setZoneMarker).
 * Equal scales on kx and ky, ky up.
 */
import { axisBottom, axisLeft, scaleLinear } from 'd3';
import type { Vec2 } from '../lattice/sheet.ts';
import { drawCaption, figureFrame, readLinear, storeLinear } from './frame.ts';
import { formatNumber } from './format.ts';
import { FERMI_COLOUR, INK, MUTED, SIGMA_COLOUR } from './palette.ts';
import type { FigureOptions, SpectraData } from './types.ts';

export interface ZoneOptions extends FigureOptions {
  /** Cartesian k (Å⁻¹) marked on the zone. */
  selectedK?: Vec2;
}

export function zoneFigure(data: SpectraData, options: ZoneOptions): SVGSVGElement {
  const { corners, reciprocal } = data.zone;
  const path = data.path;
  const title = `${data.sheetLabel}: Brillouin zone and k-path (${path.cellType} cell)`;
  const frame = figureFrame('zone', options, { screen: [200, 200], publication: [420, 420] }, {
    title,
    description: `Wigner–Seitz cell of the reciprocal lattice (Å⁻¹), reciprocal vectors b1, b2, and the path ${path.labels.map((l) => l.label).join('–')}.`,
  });
  const lk = frame.look;
  const margins = lk.publication ? { top: 30, right: 16, bottom: 52, left: 64 } : { top: 20, right: 8, bottom: 8, left: 8 };
  const width = frame.width - margins.left - margins.right;
  const height = frame.height - margins.top - margins.bottom;
  let reach = 0;
  for (const p of [...corners, ...reciprocal]) reach = Math.max(reach, Math.abs(p[0]), Math.abs(p[1]));
  reach *= 1.12;
  const side = Math.min(width, height);
  const cx = margins.left + width / 2;
  const cy = margins.top + height / 2;
  const s = side / (2 * reach);
  // svg x = cx + s·kx, y = cy − s·ky (stored for setZoneMarker and the view's pointer).
  storeLinear(frame.svg, 'kx-scale', [0, 1], [cx, cx + s]);
  storeLinear(frame.svg, 'ky-scale', [0, 1], [cy, cy - s]);
  const X = (k: Vec2) => Math.round((cx + s * k[0]) * 100) / 100;
  const Y = (k: Vec2) => Math.round((cy - s * k[1]) * 100) / 100;

  const content = frame.svg.append('g').attr('data-layer', 'content');
  if (lk.publication) {
    const kx = scaleLinear().domain([-reach * (width / side), reach * (width / side)]).range([margins.left, margins.left + width]);
    const ky = scaleLinear().domain([-reach * (height / side), reach * (height / side)]).range([margins.top + height, margins.top]);
    frame.svg.append('g').attr('transform', `translate(0,${margins.top + height})`).call(axisBottom(kx).ticks(5).tickFormat((v) => formatNumber(Number(v), 1)))
      .attr('font-size', lk.tick).attr('font-family', null);
    frame.svg.append('g').attr('transform', `translate(${margins.left},0)`).call(axisLeft(ky).ticks(5).tickFormat((v) => formatNumber(Number(v), 1)))
      .attr('font-size', lk.tick).attr('font-family', null);
    frame.svg.append('text').attr('data-role', 'axis-title').attr('x', margins.left + width / 2).attr('y', frame.height - 10)
      .attr('text-anchor', 'middle').text('kx (Å⁻¹)');
    frame.svg.append('text').attr('data-role', 'axis-title').attr('transform', `translate(16,${margins.top + height / 2}) rotate(-90)`)
      .attr('text-anchor', 'middle').text('ky (Å⁻¹)');
  }
  content.append('polygon').attr('data-layer', 'zone').attr('points', corners.map((c) => `${X(c)},${Y(c)}`).join(' '))
    .attr('fill', '#eef1f5').attr('stroke', INK).attr('stroke-width', 1.2);
  const arrow = frame.id('arrow');
  frame.svg.append('defs').append('marker').attr('id', arrow).attr('viewBox', '0 0 10 10').attr('refX', 9).attr('refY', 5)
    .attr('markerWidth', 7).attr('markerHeight', 7).attr('orient', 'auto')
    .append('path').attr('d', 'M0,0L10,5L0,10z').attr('fill', MUTED);
  const origin: Vec2 = [0, 0];
  reciprocal.forEach((b, i) => {
    content.append('line').attr('data-vector', `b${i + 1}`).attr('x1', X(origin)).attr('y1', Y(origin)).attr('x2', X(b)).attr('y2', Y(b))
      .attr('stroke', MUTED).attr('stroke-width', 1.2).attr('marker-end', `url(#${arrow})`);
    const end = Math.hypot(b[0], b[1]);
    const push = 10 / s;
    content.append('text').attr('x', X([b[0] + (push * b[0]) / end, 0])).attr('y', Y([0, b[1] + (push * b[1]) / end]) + 4)
      .attr('text-anchor', 'middle').attr('fill', MUTED).attr('font-size', lk.tick).text(`b${i + 1}`);
  });
  const points = path.labels.map((l) => [path.kpoints[2 * l.index], path.kpoints[2 * l.index + 1]] as Vec2);
  content.append('polyline').attr('data-layer', 'k-path').attr('points', points.map((p) => `${X(p)},${Y(p)}`).join(' '))
    .attr('fill', 'none').attr('stroke', SIGMA_COLOUR).attr('stroke-width', 2).attr('stroke-linejoin', 'round');
  const seen = new Set<string>();
  path.labels.forEach((label, i) => {
    const p = points[i];
    const key = `${label.label}@${X(p)},${Y(p)}`;
    if (seen.has(key)) return;
    seen.add(key);
    content.append('circle').attr('data-k-label', label.label).attr('cx', X(p)).attr('cy', Y(p)).attr('r', 2.5).attr('fill', SIGMA_COLOUR);
    // Labels pushed outward from Γ (Γ itself below-left).
    const r = Math.hypot(p[0], p[1]);
    const dx = r > 0 ? (p[0] / r) * 11 : -9;
    const dy = r > 0 ? (-p[1] / r) * 11 : 12;
    content.append('text').attr('x', X(p) + dx).attr('y', Y(p) + dy + 4).attr('text-anchor', 'middle').attr('font-size', lk.font).text(label.label);
  });
  content.append('circle').attr('data-selected-k', '').attr('r', 5).attr('fill', 'none').attr('stroke', FERMI_COLOUR).attr('stroke-width', 2)
    .attr('visibility', 'hidden');
  drawCaption(frame, lk.publication ? title : 'Brillouin zone', 6);
  const svg = frame.svg.node()!;
  if (options.selectedK) setZoneMarker(svg, options.selectedK);
  return svg;
}

/** Moves the selected-k marker of a zone figure to k (Å⁻¹), or hides it (null). */
export function setZoneMarker(svg: Element, k: Vec2 | null): void {
  const mark = svg.querySelector('circle[data-selected-k]');
  const x = readLinear(svg, 'kx-scale');
  const y = readLinear(svg, 'ky-scale');
  if (!mark || !x || !y) throw new TypeError('invalid svg: not a zone figure (no selected-k marker)');
  if (!k) {
    mark.setAttribute('visibility', 'hidden');
    return;
  }
  mark.setAttribute('cx', String(x(k[0])));
  mark.setAttribute('cy', String(y(k[1])));
  mark.setAttribute('data-selected-k', `${k[0]} ${k[1]}`);
  mark.setAttribute('visibility', 'visible');
}
