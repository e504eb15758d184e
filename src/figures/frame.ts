/**
 * The outer `<svg data-figure="…">` of every figure: size, look, caption, unique ids, and the linear maps the
 * live updates (setFermi, setSelected, …) read back from data attributes, so they need no state but the svg.
 */
import { select, type Selection } from 'd3';
import { FONT_FAMILY, look, type Look } from './look.ts';
import { INK } from './palette.ts';
import type { FigureOptions } from './types.ts';

export const SVG_NS = 'http://www.w3.org/2000/svg';

export type Svg = Selection<SVGSVGElement, unknown, null, undefined>;
export type Group = Selection<SVGGElement, unknown, null, undefined>;

export interface Frame {
  svg: Svg;
  width: number;
  height: number;
  look: Look;
  /** A document-unique id for this figure's part `name`. */
  id(name: string): string;
}

/** Figures drawn so far in this module instance: makes the default id prefixes unique within a page. */
let drawn = 0;

export function figureFrame(
  kind: string,
  options: FigureOptions,
  sizes: { screen: [number, number]; publication: [number, number] },
  caption: { title: string; description: string },
): Frame {
  const lk = look(options.style);
  const [w0, h0] = lk.publication ? sizes.publication : sizes.screen;
  const width = options.width ?? w0;
  const height = options.height ?? h0;
  if (!(width > 0 && height > 0)) throw new TypeError(`invalid size: ${width}×${height} (must be positive)`);
  const prefix = options.idPrefix ?? `lacuna-${kind}-${++drawn}`;
  const svg = select(options.document.createElementNS(SVG_NS, 'svg') as SVGSVGElement)
    .attr('data-figure', kind)
    .attr('data-style', lk.style)
    .attr('width', width)
    .attr('height', height)
    .attr('viewBox', `0 0 ${width} ${height}`)
    .attr('font-family', FONT_FAMILY)
    .attr('font-size', lk.font)
    .attr('fill', INK)
    .attr('role', 'img')
    .attr('aria-label', caption.title);
  svg.append('title').text(caption.title);
  svg.append('desc').text(caption.description);
  if (lk.background) svg.append('rect').attr('data-layer', 'background').attr('width', width).attr('height', height).attr('fill', lk.background);
  return { svg, width, height, look: lk, id: (name) => `${prefix}-${name}` };
}

/** A linear map stored on an element as `data-<name>="d0 d1 r0 r1"` (domain → range). */
export function storeLinear(svg: Svg, name: string, domain: [number, number], range: [number, number]): void {
  svg.attr(`data-${name}`, `${domain[0]} ${domain[1]} ${range[0]} ${range[1]}`);
}

export interface StoredLinear {
  (value: number): number;
  invert(pixel: number): number;
  domain: [number, number];
  range: [number, number];
}

/** Reads back a map written by storeLinear; undefined when the svg has none. */
export function readLinear(svg: Element, name: string): StoredLinear | undefined {
  const text = svg.getAttribute(`data-${name}`);
  if (!text) return undefined;
  const [d0, d1, r0, r1] = text.split(' ').map(Number);
  const f = ((value: number) => r0 + ((value - d0) / (d1 - d0)) * (r1 - r0)) as StoredLinear;
  f.invert = (pixel: number) => d0 + ((pixel - r0) / (r1 - r0)) * (d1 - d0);
  f.domain = [d0, d1];
  f.range = [r0, r1];
  return f;
}

/** The caption line at the top left (the model named, so an estimate is not read as a prediction). */
export function drawCaption(frame: Frame, text: string, x: number): void {
  frame.svg.append('text').attr('data-role', 'caption').attr('x', x).attr('y', frame.look.caption + 4)
    .attr('font-size', frame.look.caption).text(text);
}
