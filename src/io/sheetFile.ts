/**
 * Reading a sheet file (DESIGN.md, sheet contract), either form, with field-level errors
 * `invalid <field path>: <value> (<why>)`. Pure: the caller reads the file and passes its text.
 *
 * The form is decided by the keys present: cell/atoms mean explicit, bond/supercell/vacancies mean pattern;
 * keys of both forms, or an unknown key, are refused naming the key. Limits: src/io/sheetLimits.ts.
 */
import { patternToSheet } from '../lattice/pattern.ts';
import { RECOGNITION_TOLERANCE, sheetToPattern } from '../lattice/recognise.ts';
import type { Pattern, Sheet } from '../lattice/sheet.ts';
import { readExplicitForm } from './explicitForm.ts';
import { refuseRendered, requireRecord } from '../validate/fields.ts';
import { invalid } from '../validate/invalid.ts';
import { fieldPath } from '../validate/invalid.ts';
import { readPatternForm } from './patternForm.ts';
import { MAX_NAME_LENGTH, MAX_SHEET_TEXT_LENGTH, MAX_SUPERCELL_SITES } from './sheetLimits.ts';

/** A validated sheet file. */
export interface ParsedSheet {
  /** Which form the file used. */
  readonly form: 'explicit' | 'pattern';
  /** The explicit sheet (for the pattern form: `patternToSheet` of the pattern). */
  readonly sheet: Sheet;
  /**
   * The vacancy pattern: the file's own in the pattern form; in the explicit form the recognised one
   * (src/lattice/recognise.ts, equal up to a rigid motion), or absent when the atoms sit on no triangular lattice
   * (or on one whose supercell has more than MAX_SUPERCELL_SITES sites).
   */
  readonly pattern?: Pattern;
}

const EXPLICIT_KEYS = ['cell', 'atoms'] as const;
const PATTERN_KEYS = ['bond', 'supercell', 'vacancies'] as const;
const FORMS = 'a sheet is { name?, cell, atoms } or { name?, bond, supercell, vacancies }';

function readName(value: unknown): string | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'string') invalid('name', value, 'not a string');
  if (value.length > MAX_NAME_LENGTH) refuseRendered('name', `${value.length} characters`, `longer than the limit of ${MAX_NAME_LENGTH}`);
  return value;
}

/** Validates a sheet given as a value (parsed JSON, or an object built in code). */
export function parseSheetObject(value: unknown): ParsedSheet {
  const record = requireRecord(value, 'sheet');
  const keys = Object.keys(record);
  const known = new Set<string>(['name', ...EXPLICIT_KEYS, ...PATTERN_KEYS]);
  for (const key of keys) if (!known.has(key)) invalid(fieldPath('', key), record[key], `unknown field; ${FORMS}`);
  const explicitKey = keys.find((key) => (EXPLICIT_KEYS as readonly string[]).includes(key));
  const patternKey = keys.find((key) => (PATTERN_KEYS as readonly string[]).includes(key));
  if (explicitKey !== undefined && patternKey !== undefined) {
    invalid(patternKey, record[patternKey], `a pattern-form field beside the explicit form's ${explicitKey}; ${FORMS}`);
  }
  if (explicitKey === undefined && patternKey === undefined) invalid('sheet', value, `neither form; ${FORMS}`);
  const name = readName(record.name);
  const required = explicitKey !== undefined ? EXPLICIT_KEYS : PATTERN_KEYS;
  for (const key of required) if (record[key] === undefined) invalid(key, undefined, `required by the ${explicitKey !== undefined ? 'explicit' : 'pattern'} form; ${FORMS}`);

  if (explicitKey !== undefined) {
    const sheet = readExplicitForm(record, name);
    const pattern = sheetToPattern(sheet, RECOGNITION_TOLERANCE, MAX_SUPERCELL_SITES);
    return pattern ? { form: 'explicit', sheet, pattern } : { form: 'explicit', sheet };
  }
  const pattern = readPatternForm(record, name);
  return { form: 'pattern', sheet: patternToSheet(pattern), pattern };
}

/**
 * Validates a sheet file's text. `origin` (e.g. the file name) names the input in the error when the text
 * is too long or not JSON; by default it is `sheet`.
 */
export function parseSheetText(text: string, origin: string = 'sheet'): ParsedSheet {
  if (typeof text !== 'string') invalid(origin, text, 'not a text');
  if (text.length > MAX_SHEET_TEXT_LENGTH) refuseRendered(origin, `${text.length} characters`, `longer than the limit of ${MAX_SHEET_TEXT_LENGTH}`);
  let value: unknown;
  try {
    value = JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  } catch (error) {
    invalid(origin, text, `not JSON: ${error instanceof Error ? error.message.slice(0, 120) : 'unreadable'}`);
  }
  return parseSheetObject(value);
}
