/**
 * The STM panel's fields as typed text → values, each read on its own with its label in the error
 * (`invalid <label>: <text> (<why>)`), so a bad field is named and the others are still used.
 */
import { invalid } from '../validate/invalid.ts';
import type { Background } from '../stm/background.ts';
import type { StmMode } from '../stm/simulate.ts';
import { LIMITS } from './state.ts';

/** The labels the panel shows (and its errors use). */
export const STM_FIELD_NAMES = {
  bias: 'bias V',
  height: 'tip height',
  mode: 'tip mode',
  cells: 'cells per side',
  pixels: 'pixels per side',
  pixelSize: 'pixel size',
  background: 'background',
  sites: 'sites per cell',
  top: 'candidates listed',
} as const;

/** Bounds of the picture (the CLI's `stm --cells`, and a pixel count the page draws quickly). */
export const PICTURE_LIMITS = { cells: [1, 20] as const, pixels: [32, 512] as const, pixelSize: [0, 100] as const };

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

function number(label: string, text: string): number {
  const trimmed = text.trim();
  if (trimmed === '') invalid(label, text, 'required');
  if (!NUMBER.test(trimmed)) invalid(label, trimmed, 'not a number');
  return Number(trimmed);
}

function integer(label: string, text: string, [low, high]: readonly [number, number]): number {
  const x = number(label, text);
  if (!Number.isInteger(x)) invalid(label, text.trim(), 'not a whole number');
  if (!(x >= low && x <= high)) invalid(label, text.trim(), `must be from ${low} to ${high}`);
  return x;
}

export function readBias(text: string): number {
  const x = number(STM_FIELD_NAMES.bias, text);
  const [low, high] = LIMITS.bias;
  if (!(Math.abs(x) >= low)) invalid(STM_FIELD_NAMES.bias, text.trim(), `|V| must be at least ${low} V: the window E_F … E_F + eV is empty at zero bias`);
  if (!(Math.abs(x) <= high)) invalid(STM_FIELD_NAMES.bias, text.trim(), `|V| must be at most ${high} V`);
  return x;
}

export function readHeight(text: string): number {
  const x = number(STM_FIELD_NAMES.height, text);
  const [low, high] = LIMITS.height;
  if (!(x >= low && x <= high)) invalid(STM_FIELD_NAMES.height, text.trim(), `must lie in [${low}, ${high}] Å`);
  return x;
}

export function readMode(text: string): StmMode {
  if (text !== 'constant-current' && text !== 'constant-height') invalid(STM_FIELD_NAMES.mode, text, 'must be constant-current or constant-height');
  return text;
}

export const readCells = (text: string) => integer(STM_FIELD_NAMES.cells, text, PICTURE_LIMITS.cells);
export const readPixels = (text: string) => integer(STM_FIELD_NAMES.pixels, text, PICTURE_LIMITS.pixels);
export const readTop = (text: string) => integer(STM_FIELD_NAMES.top, text, LIMITS.top);

/** Å per pixel of the measured picture: required, positive, at most 100 Å. */
export function readPixelSize(text: string): number {
  if (text.trim() === '') invalid(STM_FIELD_NAMES.pixelSize, text, 'required: Å per pixel of the picture (scan size divided by pixels)');
  const x = number(STM_FIELD_NAMES.pixelSize, text);
  if (!(x > PICTURE_LIMITS.pixelSize[0] && x <= PICTURE_LIMITS.pixelSize[1])) invalid(STM_FIELD_NAMES.pixelSize, text.trim(), `must lie in (0, ${PICTURE_LIMITS.pixelSize[1]}] Å`);
  return x;
}

export function readBackground(text: string): Background {
  if (text !== 'plane' && text !== 'lines' && text !== 'none') invalid(STM_FIELD_NAMES.background, text, 'must be plane, lines or none');
  return text;
}

/** A range such as 1-12 (or one number). */
export function readSites(text: string): [number, number] {
  const label = STM_FIELD_NAMES.sites;
  const match = /^\s*([^-\s]+)\s*(?:-\s*([^-\s]+)\s*)?$/.exec(text);
  if (!match) invalid(label, text, 'not a range such as 1-12 or 6');
  const pair: [number, number] = [integer(label, match[1], LIMITS.matchSites), integer(label, match[2] ?? match[1], LIMITS.matchSites)];
  if (pair[0] > pair[1]) invalid(label, text.trim(), 'the range is empty (low end above high end)');
  return pair;
}
