/**
 * Reference bands files (DESIGN.md, calibrate contract): the `bands --json` form
 * `{ "kpoints": [[kx, ky]], "energies": [[e1 ≤ e2 ≤ …]] }`, Cartesian Å⁻¹ and eV, with an optional `"fermi"` (eV,
 * on the file's own zero) and the other keys `bands --json` writes (`sigma_weight`, `path`, `parameters`, `sheet`)
 * or a script may add to say what the file is (`title`, `source`, `note`, `demo`). Any other key is refused, so a
 * misspelt `fermi` is not silently ignored. Errors: `invalid <field path>: <value> (<why>)`.
 *
 * Limits (beyond them a file is refused as a likely mistake): at most 20,000 k-points, 4,000 bands and 4,000,000
 * energies; |E| ≤ 1000 eV; the text ≤ 64 MB.
 */
import type { ReferenceBands } from '../learn/calibrate/referenceBands.ts';
import { requireArray, requireRecord } from '../validate/fields.ts';
import { fieldPath, invalid } from '../validate/invalid.ts';
import { readKpointList } from './kpointsFile.ts';

export const REFERENCE_LIMITS = {
  kpoints: 20_000,
  bands: 4_000,
  energies: 4_000_000,
  energy: 1000,
  textBytes: 64_000_000,
  label: 20,
  text: 4000,
} as const;

const KNOWN_FIELDS = ['kpoints', 'energies', 'fermi', 'sigma_weight', 'path', 'parameters', 'sheet', 'title', 'source', 'note', 'demo'];

function energyValue(value: unknown, field: string): number {
  if (typeof value !== 'number') invalid(field, value, 'expected a number (eV)');
  if (!Number.isFinite(value)) invalid(field, value, 'not a finite number');
  if (!(Math.abs(value) <= REFERENCE_LIMITS.energy)) invalid(field, value, `|E| above ${REFERENCE_LIMITS.energy} eV`);
  return value + 0;
}

function optionalText(value: unknown, field: string): string | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'string') invalid(field, value, 'expected a string');
  if (value.length > REFERENCE_LIMITS.text) invalid(field, value, `longer than ${REFERENCE_LIMITS.text} characters`);
  return value;
}

/** The `path.labels` of `bands --json`, kept for the figure; other `path` keys are not used. */
function readLabels(path: unknown, count: number): { label: string; index: number }[] | undefined {
  if (path === undefined) return undefined;
  const record = requireRecord(path, 'path');
  if (record.labels === undefined) return undefined;
  return requireArray(record.labels, 'path.labels').map((entry, at) => {
    const field = `path.labels[${at}]`;
    const item = requireRecord(entry, field);
    if (typeof item.label !== 'string' || item.label.length === 0 || item.label.length > REFERENCE_LIMITS.label) {
      invalid(`${field}.label`, item.label, `expected a label of 1 to ${REFERENCE_LIMITS.label} characters`);
    }
    const index = item.index;
    if (typeof index !== 'number' || !Number.isInteger(index) || index < 0 || index >= count) {
      invalid(`${field}.index`, index, `expected a k-point index from 0 to ${count - 1}`);
    }
    return { label: item.label, index };
  });
}

/** Validates a parsed reference bands object; throws ValidationError naming the first bad field (`origin`: the whole). */
export function validateReferenceBands(value: unknown, origin = 'reference-bands'): ReferenceBands {
  const root = requireRecord(value, origin);
  for (const key of Object.keys(root)) {
    if (!KNOWN_FIELDS.includes(key)) invalid(fieldPath('', key), root[key], `unknown field; a reference bands file has kpoints, energies and optionally fermi (also read: ${KNOWN_FIELDS.slice(3).join(', ')})`);
  }
  if (root.kpoints === undefined) invalid('kpoints', undefined, 'required field: [[kx, ky]] in Cartesian Å⁻¹');
  if (root.energies === undefined) invalid('energies', undefined, 'required field: one ascending row of band energies (eV) per k-point');
  if (Array.isArray(root.kpoints) && root.kpoints.length > REFERENCE_LIMITS.kpoints) {
    invalid('kpoints', `${root.kpoints.length} points`, `at most ${REFERENCE_LIMITS.kpoints}`);
  }
  const kpoints = readKpointList(root.kpoints, 'kpoints');
  const count = kpoints.length / 2;
  const rows = requireArray(root.energies, 'energies');
  if (rows.length !== count) invalid('energies', `${rows.length} rows`, `expected one row per k-point: ${count}`);
  const first = requireArray(rows[0], 'energies[0]');
  const bands = first.length;
  if (bands === 0) invalid('energies[0]', first, 'empty: every k-point needs at least one band');
  if (bands > REFERENCE_LIMITS.bands) invalid('energies[0]', `${bands} bands`, `at most ${REFERENCE_LIMITS.bands}`);
  if (bands * count > REFERENCE_LIMITS.energies) invalid('energies', `${bands * count} energies`, `at most ${REFERENCE_LIMITS.energies}`);
  const energies = new Float64Array(count * bands);
  for (let k = 0; k < count; k++) {
    const row = requireArray(rows[k], `energies[${k}]`);
    if (row.length !== bands) invalid(`energies[${k}]`, `${row.length} energies`, `energies[0] has ${bands}: every k-point needs the same number of bands`);
    for (let b = 0; b < bands; b++) {
      const e = energyValue(row[b], `energies[${k}][${b}]`);
      if (b > 0 && !(e >= energies[k * bands + b - 1])) {
        invalid(`energies[${k}][${b}]`, e, `below energies[${k}][${b - 1}] = ${energies[k * bands + b - 1]}: the energies at each k-point must be ascending`);
      }
      energies[k * bands + b] = e;
    }
  }
  const reference: ReferenceBands = { count, bands, kpoints, energies };
  if (root.fermi !== undefined) reference.fermi = energyValue(root.fermi, 'fermi');
  const labels = readLabels(root.path, count);
  if (labels) reference.labels = labels;
  const title = optionalText(root.title, 'title');
  const source = optionalText(root.source, 'source');
  if (title !== undefined || source !== undefined) reference.title = title ?? source;
  optionalText(root.note, 'note');
  const sheet = optionalText(root.sheet, 'sheet');
  if (sheet !== undefined) reference.sheet = sheet;
  return reference;
}

/** Parses and validates the text of a reference bands file; `origin` names it in whole-file errors. */
export function parseReferenceBandsText(text: string, origin = 'reference-bands'): ReferenceBands {
  if (text.length > REFERENCE_LIMITS.textBytes) invalid(origin, `${text.length} characters`, `larger than ${REFERENCE_LIMITS.textBytes} characters`);
  if (text.trim() === '') invalid(origin, text, 'empty file: expected {"kpoints": [[kx, ky]], "energies": [[e1, e2, …]]}');
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    invalid(origin, text.slice(0, 40), `not JSON: ${(error as Error).message}`);
  }
  return validateReferenceBands(value, origin);
}
