/**
 * The colour bar of the density figures (unfolded bands, constant-energy cuts): the viridis scale from no weight to
 * the figure's largest A(k, E), with its unit.
 */
import type { Frame, Group, Svg } from './frame.ts';
import { formatNumber } from './format.ts';
import { densityColour, INK, MUTED } from './palette.ts';
import type { SpectralPart } from './types.ts';

/** What the density shows, in words: all orbitals, or one part. */
export const PART_WORDS: Record<SpectralPart, string> = { total: 'all orbitals', sigma: 'σ part (s, px, py)', pi: 'π part (pz)' };

/** A horizontal bar `length` wide at (x, y) (its top left), labelled 0 and `scaleMax` in states per eV per site. */
export function drawDensityBar(frame: Frame, parent: Svg | Group, x: number, y: number, length: number, scaleMax: number): void {
  const id = frame.id('density');
  const gradient = parent.append('defs').append('linearGradient').attr('id', id);
  for (let i = 0; i <= 10; i++) gradient.append('stop').attr('offset', `${10 * i}%`).attr('stop-color', densityColour(i / 10));
  const bar = parent.append('g').attr('data-layer', 'density-bar').attr('transform', `translate(${x},${y})`).attr('font-size', frame.look.tick);
  bar.append('rect').attr('width', length).attr('height', 8).attr('fill', `url(#${id})`).attr('stroke', MUTED).attr('stroke-width', 0.5);
  bar.append('text').attr('x', 0).attr('y', 19).attr('fill', INK).text('0');
  bar.append('text').attr('x', length).attr('y', 19).attr('text-anchor', 'end').attr('fill', INK)
    .attr('data-scale-max', String(scaleMax)).text(`${formatNumber(scaleMax, 2)} /eV/site`);
}
