/**
 * The STM picture figure: a greyscale picture (simulated: `data-figure="stm"`; measured: `data-figure="stm-measured"`)
 * as an embedded PNG (a data URL made with the data, in the page's worker: no pixel work on the page's thread), one cell outlined, lattice points marked (measured pictures: the fitted lattice), a scale bar in
 * Å, and the lines that say what the picture is (the model, the bias, the fitted cell) under it.
 */
import type { Vec2 } from '../lattice/sheet.ts';
import { drawCaption, figureFrame } from './frame.ts';
import { FERMI_COLOUR, INK, MUTED, PI_COLOUR } from './palette.ts';
import type { FigureOptions, StmPictureData } from './types.ts';

/** Scale-bar lengths tried (Å), the longest that fits in a third of the picture's width is drawn. */
const BAR_LENGTHS = [0.5, 1, 2, 5, 10, 20, 50, 100, 200, 500];

/** Words of `text` in lines of at most `width` characters (a word longer than that gets a line of its own). */
export function wrapWords(text: string, width: number): string[] {
  const out: string[] = [];
  let line = '';
  for (const word of text.split(' ')) {
    if (line !== '' && line.length + 1 + word.length > width) {
      out.push(line);
      line = word;
    } else {
      line = line === '' ? word : `${line} ${word}`;
    }
  }
  if (line !== '') out.push(line);
  return out;
}

export function stmPictureFigure(data: StmPictureData, options: FigureOptions): SVGSVGElement {
  const kind = data.kind === 'simulated' ? 'stm' : 'stm-measured';
  // The title is one line over the picture: a long sheet or file name is cut (the description keeps it whole).
  const shortLabel = data.label.length > 26 ? `${data.label.slice(0, 25)}…` : data.label;
  const side = options.style === 'publication' ? 440 : 300;
  // About 0.55 em per character of the tick font: lines wrapped to the picture's width.
  const chars = Math.floor(side / (0.56 * (options.style === 'publication' ? 12 : 10)));
  const demo = data.demo ? wrapWords(data.demo, chars) : [];
  const lines = [...demo, ...data.lines.flatMap((line) => wrapWords(line, chars))];
  const lineHeight = options.style === 'publication' ? 17 : 13;
  const frame = figureFrame(kind, options, {
    screen: [side + 8, side + 28 + lineHeight * lines.length],
    publication: [side + 40, side + 48 + lineHeight * lines.length],
  }, {
    title: data.demo ? 'DEMO: synthetic picture to match' : `${shortLabel}: ${data.kind === 'simulated' ? 'simulated STM picture (model)' : 'measured STM picture'}`,
    description: `${data.label}: ${data.width}×${data.height} pixels of ${data.pixelSize.toPrecision(4)} Å; ${[data.demo, ...data.lines].filter((line) => line !== undefined).join('; ')}`,
  });
  const lk = frame.look;
  const left = lk.publication ? 20 : 4, top = lk.caption + 12;
  drawCaption(frame, frame.svg.attr('aria-label'), left);
  const scale = side / Math.max(data.width, data.height); // svg units per pixel
  const w = data.width * scale, h = data.height * scale;
  const perAngstrom = scale / data.pixelSize;
  const X = (x: number) => Math.round((left + x * perAngstrom) * 100) / 100;
  const Y = (y: number) => Math.round((top + h - y * perAngstrom) * 100) / 100;
  frame.svg.attr('data-pixel-size', data.pixelSize).attr('data-pixels', `${data.width} ${data.height}`);

  const clip = frame.id('clip');
  frame.svg.append('defs').append('clipPath').attr('id', clip).append('rect').attr('x', left).attr('y', top).attr('width', w).attr('height', h);
  frame.svg.append('image').attr('data-layer', 'picture').attr('x', left).attr('y', top).attr('width', w).attr('height', h)
    .attr('preserveAspectRatio', 'none').attr('image-rendering', 'optimizeSpeed') // pixels as measured, not smoothed (a style attribute would break the page's CSP)
    .attr('href', data.png);
  const over = frame.svg.append('g').attr('data-layer', 'lattice').attr('clip-path', `url(#${clip})`);
  if (data.points) {
    over.selectAll('circle').data(data.points).join('circle').attr('data-role', 'lattice-point')
      .attr('cx', (p) => X(p[0])).attr('cy', (p) => Y(p[1])).attr('r', 1.8)
      .attr('fill', PI_COLOUR).attr('stroke', INK).attr('stroke-width', 0.4);
  }
  if (data.cell) {
    const { origin: o, vectors: [a, b] } = data.cell;
    const corners: Vec2[] = [o, [o[0] + a[0], o[1] + a[1]], [o[0] + a[0] + b[0], o[1] + a[1] + b[1]], [o[0] + b[0], o[1] + b[1]]];
    over.append('polygon').attr('data-role', 'cell').attr('points', corners.map((p) => `${X(p[0])},${Y(p[1])}`).join(' '))
      .attr('fill', 'none').attr('stroke', PI_COLOUR).attr('stroke-width', lk.publication ? 2 : 1.6);
  }
  frame.svg.append('rect').attr('x', left).attr('y', top).attr('width', w).attr('height', h).attr('fill', 'none').attr('stroke', MUTED).attr('stroke-width', 0.8);

  // Scale bar: white on a dark band, bottom right of the picture.
  const fullWidth = data.width * data.pixelSize;
  const length = [...BAR_LENGTHS].reverse().find((l) => l <= fullWidth / 3) ?? BAR_LENGTHS[0];
  const barRight = left + w - 8, barY = top + h - 10, barLength = length * perAngstrom;
  const bar = frame.svg.append('g').attr('data-role', 'scale-bar').attr('data-length', length);
  bar.append('rect').attr('x', barRight - barLength - 4).attr('y', barY - lk.tick - 6).attr('width', barLength + 8).attr('height', lk.tick + 12)
    .attr('fill', INK).attr('fill-opacity', 0.7).attr('rx', 2);
  bar.append('line').attr('x1', barRight - barLength).attr('x2', barRight).attr('y1', barY).attr('y2', barY).attr('stroke', '#ffffff').attr('stroke-width', 3);
  bar.append('text').attr('x', barRight - barLength / 2).attr('y', barY - 4).attr('text-anchor', 'middle').attr('font-size', lk.tick)
    .attr('fill', '#ffffff').text(`${length} Å`);

  const text = frame.svg.append('g').attr('data-role', 'lines');
  lines.forEach((line, i) => {
    text.append('text').attr('x', left).attr('y', top + h + 6 + lineHeight * (i + 1) - 4).attr('font-size', lk.tick)
      .attr('fill', i < demo.length ? FERMI_COLOUR : INK).text(line);
  });
  return frame.svg.node()!;
}
