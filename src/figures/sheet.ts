/**
 * The sheet figure: atoms, bonds, vacant sites (open), hexagonal holes marked, the edited cell outlined among
 * its repeats, the reduced cell dashed when it differs, handles at the cell vectors' tips (screen look), and a
 * selected Bloch state as discs of area ∝ weight coloured by phase. Everything drawn sits in one
 * `g[data-layer="content"]` the view may zoom and pan; `data-frame="ox oy s"` maps Å to svg units
 * (x = ox + s·X, y = oy − s·Y).
 */
import { axisBottom, axisLeft, scaleLinear } from 'd3';
import type { Vec2 } from '../lattice/sheet.ts';
import { drawCaption, figureFrame } from './frame.ts';
import { formatFraction, formatNumber } from './format.ts';
import { ATOM_FILL, BOND_COLOUR, GRID, HOLE_FILL, INK, MUTED, SIGMA_COLOUR, phaseColour } from './palette.ts';
import { copyBasis, editedCell, placeSites, placedBonds } from './sheetLayout.ts';
import type { FigureOptions, SheetData } from './types.ts';

export type SheetOptions = FigureOptions;

const fixed = (v: number) => Math.round(v * 100) / 100;

/**
 * True when cell q is as reduced as p: same area and the same two lengths (a reduced basis holds the two shortest
 * independent lattice vectors, so equal lengths and area mean q is a reduced basis too, e.g. 60° vs 120°).
 */
function sameCell(p: [Vec2, Vec2], q: [Vec2, Vec2]): boolean {
  const lengths = (c: [Vec2, Vec2]) => [Math.hypot(...c[0]), Math.hypot(...c[1])].sort((x, y) => x - y);
  const area = (c: [Vec2, Vec2]) => Math.abs(c[0][0] * c[1][1] - c[0][1] * c[1][0]);
  const [lp, lq] = [lengths(p), lengths(q)];
  const close = (x: number, y: number) => Math.abs(x - y) <= 1e-6 * Math.max(1, Math.abs(x));
  return close(area(p), area(q)) && close(lp[0], lq[0]) && close(lp[1], lq[1]);
}

export function sheetFigure(data: SheetData, options: SheetOptions): SVGSVGElement {
  const sites = placeSites(data);
  const atoms = data.sheet.atoms.length;
  const eta = data.pattern ? formatFraction(data.pattern.vacancies.length, data.pattern.supercell.a * data.pattern.supercell.c) : undefined;
  const state = data.state;
  const title = `${data.label}: ${eta !== undefined ? `η = ${eta}, ` : ''}${atoms} atoms per cell`;
  const stateLine = state
    ? `state: band ${state.band + 1}, k = (${formatNumber(state.k[0], 3)}, ${formatNumber(state.k[1], 3)}) Å⁻¹, E = ${formatNumber(state.energy, 2)} eV, σ ${formatNumber(state.sigma, 2)}${state.parameters ? ` (${state.parameters})` : ''}`
    : '';
  const frame = figureFrame('sheet', options, { screen: [420, 420], publication: [560, 560] }, {
    title: state ? `${title}; ${stateLine}` : title,
    description: `Atoms (filled), vacant sites (open), bonds shorter than ${data.bondCutoff} Å, hexagonal holes shaded; the edited cell outlined, repeated ${data.repeats[0]}×${data.repeats[1]}.${state ? ' Disc area ∝ the state’s weight on each atom, colour its phase (a tight-binding estimate).' : ''}`,
  });
  const lk = frame.look;
  const line2 = state ? lk.caption + 6 : 0;
  const margins = lk.publication
    ? { top: 34 + line2, right: 16, bottom: 56 + (state ? 24 : 0), left: 64 }
    : { top: 22 + line2, right: 8, bottom: state ? 30 : 8, left: 8 };
  const [A1, A2] = editedCell(data);
  const corners: Vec2[] = [[0, 0], A1, A2, [A1[0] + A2[0], A1[1] + A2[1]]];
  let [minX, minY, maxX, maxY] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const p of [...sites.map((s) => [s.x, s.y] as Vec2), ...corners]) {
    minX = Math.min(minX, p[0]);
    minY = Math.min(minY, p[1]);
    maxX = Math.max(maxX, p[0]);
    maxY = Math.max(maxY, p[1]);
  }
  const pad = data.pattern?.bond ?? 1.7;
  [minX, minY, maxX, maxY] = [minX - pad, minY - pad, maxX + pad, maxY + pad];
  const width = frame.width - margins.left - margins.right;
  const height = frame.height - margins.top - margins.bottom;
  const s = Math.min(width / (maxX - minX), height / (maxY - minY));
  const ox = margins.left + (width - s * (maxX - minX)) / 2 - s * minX;
  const oy = margins.top + (height - s * (maxY - minY)) / 2 + s * maxY;
  frame.svg.attr('data-frame', `${ox} ${oy} ${s}`);
  const X = (x: number) => fixed(ox + s * x);
  const Y = (y: number) => fixed(oy - s * y);
  const bondLength = data.pattern?.bond ?? 1.7;

  if (lk.publication) {
    const sx = scaleLinear().domain([(margins.left - ox) / s, (margins.left + width - ox) / s]).range([margins.left, margins.left + width]);
    const sy = scaleLinear().domain([(oy - margins.top - height) / s, (oy - margins.top) / s]).range([margins.top + height, margins.top]);
    frame.svg.append('g').attr('transform', `translate(0,${margins.top + height})`).call(axisBottom(sx).ticks(6).tickFormat((v) => formatNumber(Number(v), 1)))
      .attr('font-size', lk.tick).attr('font-family', null);
    frame.svg.append('g').attr('transform', `translate(${margins.left},0)`).call(axisLeft(sy).ticks(6).tickFormat((v) => formatNumber(Number(v), 1)))
      .attr('font-size', lk.tick).attr('font-family', null);
    frame.svg.append('text').attr('data-role', 'axis-title').attr('x', margins.left + width / 2).attr('y', frame.height - 12).attr('text-anchor', 'middle').text('x (Å)');
    frame.svg.append('text').attr('data-role', 'axis-title').attr('transform', `translate(16,${margins.top + height / 2}) rotate(-90)`)
      .attr('text-anchor', 'middle').text('y (Å)');
  }

  const content = frame.svg.append('g').attr('data-layer', 'content');
  const cellPath = (origin: Vec2, u: Vec2, v: Vec2) => {
    const p = [origin, [origin[0] + u[0], origin[1] + u[1]], [origin[0] + u[0] + v[0], origin[1] + u[1] + v[1]], [origin[0] + v[0], origin[1] + v[1]]];
    return p.map((q) => `${X(q[0])},${Y(q[1])}`).join(' ');
  };
  const cells = content.append('g').attr('data-layer', 'cells').attr('fill', 'none');
  // Copies are laid along the reduced vectors of the edited cell's lattice (compact for any HNF); for an explicit
  // sheet along its own cell vectors, and then the first copy is the edited cell itself.
  const [C1, C2] = data.pattern ? copyBasis(data).cartesian : [A1, A2];
  for (let n2 = 0; n2 < data.repeats[1]; n2++) {
    for (let n1 = 0; n1 < data.repeats[0]; n1++) {
      if (!data.pattern && n1 === 0 && n2 === 0) continue;
      const o: Vec2 = [n1 * C1[0] + n2 * C2[0], n1 * C1[1] + n2 * C2[1]];
      cells.append('polygon').attr('data-cell', `${n1},${n2}`).attr('points', cellPath(o, C1, C2)).attr('stroke', GRID).attr('stroke-width', 1);
    }
  }

  const holes = content.append('g').attr('data-layer', 'holes').attr('fill', HOLE_FILL).attr('stroke', 'none');
  const hexagon = (x: number, y: number) => Array.from({ length: 6 }, (_, n) => {
    // Corners on the six neighbouring atoms: the ring around the hole.
    const t = (Math.PI / 3) * n;
    const r = bondLength;
    return `${X(x + r * Math.cos(t))},${Y(y + r * Math.sin(t))}`;
  }).join(' ');
  for (const site of sites) if (site.hexagonal) holes.append('polygon').attr('data-hole', site.site!.join(',')).attr('points', hexagon(site.x, site.y));

  const bonds = content.append('g').attr('data-layer', 'bonds').attr('stroke', BOND_COLOUR).attr('stroke-width', Math.max(1, 0.09 * bondLength * s)).attr('stroke-linecap', 'round');
  for (const [n, m] of placedBonds(sites, data.bondCutoff)) {
    bonds.append('line').attr('x1', X(sites[n].x)).attr('y1', Y(sites[n].y)).attr('x2', X(sites[m].x)).attr('y2', Y(sites[m].y));
  }

  content.append('polygon').attr('data-cell', 'edited').attr('points', cellPath([0, 0], A1, A2)).attr('fill', 'none')
    .attr('stroke', INK).attr('stroke-width', 1.6);
  if (!sameCell(data.reducedCell, [A1, A2])) {
    content.append('polygon').attr('data-cell', 'reduced').attr('points', cellPath([0, 0], data.reducedCell[0], data.reducedCell[1]))
      .attr('fill', 'none').attr('stroke', SIGMA_COLOUR).attr('stroke-width', 1.4).attr('stroke-dasharray', '5 4');
  }

  const radius = Math.max(1.5, 0.2 * bondLength * s);
  const layer = content.append('g').attr('data-layer', 'sites');
  for (const site of sites) {
    const mark = layer.append('circle').attr('cx', X(site.x)).attr('cy', Y(site.y)).attr('r', fixed(radius));
    if (site.site) mark.attr('data-site', site.site.join(','));
    if (site.atom < 0) {
      mark.attr('data-vacant', '').attr('fill', lk.publication ? 'none' : '#ffffff').attr('fill-opacity', lk.publication ? null : 0)
        .attr('stroke', MUTED).attr('stroke-width', 1).attr('stroke-dasharray', '2 2');
      if (!lk.publication) mark.append('title').text(`vacant site ${site.site!.join(', ')}`);
    } else {
      const coordination = data.coordination[site.atom];
      mark.attr('data-atom', site.atom).attr('data-coordination', coordination).attr('fill', ATOM_FILL);
      if (!lk.publication) mark.append('title').text(`atom ${site.atom + 1}: ${coordination} neighbours${site.site ? `, site ${site.site.join(', ')}` : ''}`);
    }
  }

  if (state) {
    let largest = 0;
    for (const w of state.weight) largest = Math.max(largest, w);
    const discs = content.append('g').attr('data-layer', 'state').attr('stroke', INK).attr('stroke-width', 0.6);
    const rmax = 0.48 * bondLength * s;
    for (const site of sites) {
      if (site.atom < 0) continue;
      const w = state.weight[site.atom];
      if (!(largest > 0) || w <= 1e-6 * largest) continue;
      const phase = state.phase[site.atom] + state.k[0] * site.rx + state.k[1] * site.ry;
      discs.append('circle').attr('data-state-atom', site.atom).attr('cx', X(site.x)).attr('cy', Y(site.y))
        .attr('r', fixed(rmax * Math.sqrt(w / largest))).attr('fill', phaseColour(phase)).attr('fill-opacity', 0.9);
    }
    drawPhaseLegend(frame, lk.publication ? margins.left : 10, frame.height - 8);
  }

  if (!lk.publication) {
    const handles = content.append('g').attr('data-layer', 'handles');
    for (const [name, v] of [['A1', A1], ['A2', A2]] as [string, Vec2][]) {
      handles.append('circle').attr('data-handle', name).attr('cx', X(v[0])).attr('cy', Y(v[1])).attr('r', 6)
        .attr('fill', '#ffffff').attr('stroke', INK).attr('stroke-width', 1.5).attr('cursor', 'move')
        .append('title').text(`drag to change the cell vector ${name}`);
    }
  }
  drawCaption(frame, title, 6);
  if (state) {
    frame.svg.append('text').attr('data-role', 'state-caption').attr('x', 6).attr('y', 2 * lk.caption + 9).attr('font-size', lk.tick).text(stateLine);
  }
  return frame.svg.node()!;
}

/** A phase bar from −π to π (cyclic colours) with a note on disc areas. */
function drawPhaseLegend(frame: ReturnType<typeof figureFrame>, x: number, baseline: number): void {
  const lk = frame.look;
  const legend = frame.svg.append('g').attr('data-layer', 'legend').attr('transform', `translate(${x},${baseline})`).attr('font-size', lk.tick);
  legend.append('text').attr('y', 0).text('phase');
  const bar = legend.append('g').attr('transform', `translate(${lk.tick * 3.2},-9)`);
  const steps = 24;
  const w = 6;
  for (let n = 0; n < steps; n++) {
    bar.append('rect').attr('x', n * w).attr('width', w + 0.3).attr('height', 10).attr('fill', phaseColour(-Math.PI + ((n + 0.5) * 2 * Math.PI) / steps));
  }
  bar.append('text').attr('x', 0).attr('y', -2).attr('text-anchor', 'middle').attr('font-size', lk.tick * 0.85).text('−π');
  bar.append('text').attr('x', (steps * w) / 2).attr('y', -2).attr('text-anchor', 'middle').attr('font-size', lk.tick * 0.85).text('0');
  bar.append('text').attr('x', steps * w).attr('y', -2).attr('text-anchor', 'middle').attr('font-size', lk.tick * 0.85).text('π');
  legend.append('text').attr('x', lk.tick * 3.2 + steps * w + 10).attr('y', 0).text('disc area: weight on the atom');
}
