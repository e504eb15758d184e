/**
 * The two looks of every figure: 'screen' (compact, for the page, with handles and hover hints) and
 * 'publication' (white background, journal font sizes, axis titles with units, no UI chrome).
 */
import type { FigureStyle } from './types.ts';

export interface Look {
  style: FigureStyle;
  publication: boolean;
  /** Font sizes (px): labels and legends, tick labels, the caption line. */
  font: number;
  tick: number;
  caption: number;
  /** Stroke width of curves (px). */
  line: number;
  /** Fill of the background rectangle, or none. */
  background: string | null;
}

/** Fonts in order; the CLI's rasteriser ships the first (Noto Sans, with Greek and Å). */
export const FONT_FAMILY = "'Noto Sans', 'DejaVu Sans', 'Helvetica Neue', Arial, sans-serif";

export function look(style: FigureStyle | undefined): Look {
  if (style === undefined || style === 'screen') {
    return { style: 'screen', publication: false, font: 11, tick: 10, caption: 11, line: 1.4, background: null };
  }
  if (style === 'publication') return { style, publication: true, font: 14, tick: 12, caption: 13, line: 1.6, background: '#ffffff' };
  throw new TypeError(`invalid style: ${String(style)} (must be 'screen' or 'publication')`);
}
