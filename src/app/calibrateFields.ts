/**
 * The calibrate panel's fields as typed text → values, each read on its own with its label in the error
 * (`invalid <label>: <text> (<why>)`), so a bad field is named and the others are still used.
 */
import { invalid } from '../validate/invalid.ts';
import { PARAMETER_PRESETS } from '../tb/params.ts';
import type { BandBlock } from '../learn/calibrate/parametricBands.ts';

/** The labels the panel shows (and its errors use). */
export const CALIBRATE_FIELD_NAMES = {
  modelBands: 'model bands',
  referenceBands: 'reference bands',
  block: 'bands matched',
  weightWidth: 'weight half-width',
  free: 'also fit',
  name: 'name of the fitted set',
  file: 'reference bands file',
} as const;

/** Largest band index the fields take (the reference file's own limit). */
const MAX_BAND = 4000;
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A run of bands "a-b" or "a" (1-based), or undefined for an empty field (the lowest bands). */
export function readBandRange(label: string, text: string): [number, number] | undefined {
  const trimmed = text.trim();
  if (trimmed === '') return undefined;
  const match = /^(\d+)\s*(?:[-–]\s*(\d+))?$/.exec(trimmed);
  if (!match) invalid(label, trimmed, 'not a run of bands such as 1-16 or 5');
  const low = Number(match[1]);
  const high = Number(match[2] ?? match[1]);
  if (!(low >= 1 && high <= MAX_BAND)) invalid(label, trimmed, `bands are numbered from 1 to ${MAX_BAND}`);
  if (low > high) invalid(label, trimmed, 'the run is empty (first band above the last)');
  return [low, high];
}

/** The weights' half-width W (eV), or null for equal weights; empty means the default. */
export function readWeightWidth(text: string, equal: boolean, fallback: number): number | null {
  if (equal) return null;
  const trimmed = text.trim();
  if (trimmed === '') return fallback;
  if (!NUMBER.test(trimmed)) invalid(CALIBRATE_FIELD_NAMES.weightWidth, trimmed, 'not a number');
  const x = Number(trimmed);
  if (!(x > 0 && x <= 100)) invalid(CALIBRATE_FIELD_NAMES.weightWidth, trimmed, 'must lie in (0, 100] eV');
  return x;
}

export function readBlock(text: string): BandBlock {
  if (text !== 'full' && text !== 'sigma' && text !== 'pi') invalid(CALIBRATE_FIELD_NAMES.block, text, 'must be full, sigma or pi');
  return text;
}

/**
 * The name a fitted set is kept under: 1–100 characters, not a preset's, and made unique among `taken` by a
 * suffix " (2)", " (3)" … so that keeping a new fit never replaces a set the user kept before.
 */
export function keptName(text: string, taken: readonly string[]): string {
  const name = text.trim();
  if (name === '' || name.length > 96) invalid(CALIBRATE_FIELD_NAMES.name, text, 'expected 1 to 96 characters');
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f]/.test(name)) invalid(CALIBRATE_FIELD_NAMES.name, text, 'contains control characters');
  if (PARAMETER_PRESETS.some((p) => p.name === name)) invalid(CALIBRATE_FIELD_NAMES.name, name, 'a preset has this name; choose another');
  if (!taken.includes(name)) return name;
  for (let n = 2; ; n++) if (!taken.includes(`${name} (${n})`)) return `${name} (${n})`;
}
