/**
 * The parameter set's fields (DESIGN.md, parameter-file contract): validation of every field, with errors
 * `invalid <field path>: <value> (<why>)`. Documented limits (beyond them a file is refused as a likely mistake):
 * |on-site| and |hopping| ≤ 100 eV; 0 < d0 ≤ 10 Å; 0 ≤ exponent ≤ 20; 0 < cutoff ≤ 8 Å (larger cutoffs make the
 * neighbour lists explode and are far outside any two-centre fit); name ≤ 100 characters, source and
 * provenance ≤ 4000; the file itself ≤ 1 MB.
 */
import { requireRecord } from '../validate/fields.ts';
import { fieldPath, invalid } from '../validate/invalid.ts';
import type { ParameterSet } from './parameterSet.ts';

export const PARAMETER_LIMITS = {
  energy: 100,
  d0: 10,
  exponent: 20,
  cutoff: 8,
  name: 100,
  text: 4000,
  fileBytes: 1_000_000,
} as const;

const TOP_FIELDS = ['name', 'source', 'provenance', 'onsite', 'hopping', 'd0', 'exponent', 'cutoff'];
const REQUIRED_FIELDS = ['name', 'source', 'onsite', 'hopping', 'd0', 'exponent', 'cutoff'];
const ONSITE_FIELDS = ['s', 'p'] as const;
const HOPPING_FIELDS = ['ss_sigma', 'sp_sigma', 'pp_sigma', 'pp_pi'] as const;

function checkKeys(record: Record<string, unknown>, path: string, allowed: readonly string[], required: readonly string[]): void {
  for (const key of Object.keys(record)) {
    if (!allowed.includes(key)) invalid(fieldPath(path, key), record[key], `unknown field; expected ${allowed.join(', ')}`);
  }
  for (const key of required) {
    if (!Object.hasOwn(record, key)) invalid(fieldPath(path, key), undefined, 'required field');
  }
}

function text(value: unknown, field: string, max: number, allowEmpty: boolean): string {
  if (typeof value !== 'string') invalid(field, value, 'expected a string');
  if (!allowEmpty && value.trim() === '') invalid(field, value, 'must not be empty');
  if (value.length > max) invalid(field, value, `longer than ${max} characters`);
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u0008\u000b-\u001f\u007f]/.test(value)) invalid(field, value, 'contains control characters');
  return value;
}

function number(value: unknown, field: string): number {
  if (typeof value !== 'number') invalid(field, value, 'expected a number');
  if (!Number.isFinite(value)) invalid(field, value, 'must be finite');
  return value;
}

function bounded(value: unknown, field: string, low: number, high: number, lowOpen: boolean, unit: string): number {
  const x = number(value, field);
  const aboveLow = lowOpen ? x > low : x >= low;
  if (!aboveLow || !(x <= high)) {
    invalid(field, x, `must lie in ${lowOpen ? '(' : '['}${low}, ${high}] ${unit}`.trimEnd());
  }
  return x;
}

function energy(value: unknown, field: string): number {
  const x = number(value, field);
  if (!(Math.abs(x) <= PARAMETER_LIMITS.energy)) invalid(field, x, `|value| must be at most ${PARAMETER_LIMITS.energy} eV`);
  return x;
}

/**
 * Validates an already parsed parameter object (e.g. imported JSON); `path` prefixes field names in errors.
 * Returns a fresh ParameterSet; throws ValidationError on the first bad field.
 */
export function validateParameterObject(value: unknown, path = ''): ParameterSet {
  const root = requireRecord(value, path === '' ? 'parameters' : path);
  checkKeys(root, path, TOP_FIELDS, REQUIRED_FIELDS);
  const name = text(root.name, fieldPath(path, 'name'), PARAMETER_LIMITS.name, false);
  const source = text(root.source, fieldPath(path, 'source'), PARAMETER_LIMITS.text, false);
  const onsitePath = fieldPath(path, 'onsite');
  const onsiteRecord = requireRecord(root.onsite, onsitePath);
  checkKeys(onsiteRecord, onsitePath, ONSITE_FIELDS, ONSITE_FIELDS);
  const hoppingPath = fieldPath(path, 'hopping');
  const hoppingRecord = requireRecord(root.hopping, hoppingPath);
  checkKeys(hoppingRecord, hoppingPath, HOPPING_FIELDS, HOPPING_FIELDS);
  const set: ParameterSet = {
    name: name.trim(),
    source,
    onsite: {
      s: energy(onsiteRecord.s, fieldPath(onsitePath, 's')),
      p: energy(onsiteRecord.p, fieldPath(onsitePath, 'p')),
    },
    hopping: {
      ss_sigma: energy(hoppingRecord.ss_sigma, fieldPath(hoppingPath, 'ss_sigma')),
      sp_sigma: energy(hoppingRecord.sp_sigma, fieldPath(hoppingPath, 'sp_sigma')),
      pp_sigma: energy(hoppingRecord.pp_sigma, fieldPath(hoppingPath, 'pp_sigma')),
      pp_pi: energy(hoppingRecord.pp_pi, fieldPath(hoppingPath, 'pp_pi')),
    },
    d0: bounded(root.d0, fieldPath(path, 'd0'), 0, PARAMETER_LIMITS.d0, true, 'Å'),
    exponent: bounded(root.exponent, fieldPath(path, 'exponent'), 0, PARAMETER_LIMITS.exponent, false, ''),
    cutoff: bounded(root.cutoff, fieldPath(path, 'cutoff'), 0, PARAMETER_LIMITS.cutoff, true, 'Å'),
  };
  if (root.provenance !== undefined) {
    set.provenance = text(root.provenance, fieldPath(path, 'provenance'), PARAMETER_LIMITS.text, true);
  }
  return set;
}
