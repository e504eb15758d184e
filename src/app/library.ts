/**
 * The user's own patterns and parameter sets, kept in the browser's storage and moved between browsers as one
 * JSON file. Our own file form:
 *
 *   { "lacuna_library": 1, "sheets": [{ "label": "…", "sheet": <sheet file, either form> }],
 *     "parameter_sets": [<parameter file>] }
 *
 * Every entry is validated with the same parsers as the CLI's files, with the entry's path in the error
 * (`invalid sheets[2].sheet.vacancies[0]: …`). An import is all or nothing: a bad file changes nothing.
 */
import { fieldPath, invalid, ValidationError } from '../validate/invalid.ts';
import { requireArray, requireRecord } from '../validate/fields.ts';
import { validateParameterObject } from '../tb/paramsCheck.ts';
import { parseSheetObject } from '../io/sheetFile.ts';
import { hnfRows } from '../lattice/pattern.ts';
import type { Pattern, Sheet } from '../lattice/sheet.ts';
import type { ParameterSet } from '../tb/params.ts';

export interface SavedSheet {
  label: string;
  /** The pattern form when the sheet is on the triangular lattice, else the explicit form. */
  pattern?: Pattern;
  sheet?: Sheet;
}

export interface Library {
  sheets: SavedSheet[];
  parameterSets: ParameterSet[];
}

/** The storage key; the version is in the value. */
export const STORAGE_KEY = 'lacuna.library';
const MAX_LIBRARY_TEXT = 5_000_000;

export function emptyLibrary(): Library {
  return { sheets: [], parameterSets: [] };
}

function sheetEntry(saved: SavedSheet): Record<string, unknown> {
  const sheet = saved.pattern
    ? { bond: saved.pattern.bond, supercell: hnfRows(saved.pattern.supercell), vacancies: saved.pattern.vacancies }
    : { cell: saved.sheet!.cell, atoms: saved.sheet!.atoms };
  return { label: saved.label, sheet };
}

export function libraryToJson(library: Library): string {
  return `${JSON.stringify({
    lacuna_library: 1,
    sheets: library.sheets.map(sheetEntry),
    parameter_sets: library.parameterSets,
  }, null, 1)}\n`;
}

/** Re-throws a field error of an entry with the entry's path in front. */
function within<T>(path: string, read: () => T): T {
  try {
    return read();
  } catch (error) {
    if (error instanceof ValidationError) throw new ValidationError(`${path}.${error.field}`, error.value, error.why);
    throw error;
  }
}

/** Parses a library file; `origin` names the file in whole-file errors. */
export function parseLibrary(text: string, origin = 'library'): Library {
  if (text.length > MAX_LIBRARY_TEXT) invalid(origin, `${text.length} characters`, `longer than the limit of ${MAX_LIBRARY_TEXT}`);
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    invalid(origin, text, `not JSON: ${error instanceof Error ? error.message.slice(0, 120) : 'unreadable'}`);
  }
  const record = requireRecord(value, origin);
  if (record.lacuna_library !== 1) invalid('lacuna_library', record.lacuna_library, 'not a lacuna library file (expected 1)');
  for (const key of Object.keys(record)) {
    if (!['lacuna_library', 'sheets', 'parameter_sets'].includes(key)) invalid(fieldPath('', key), record[key], 'unknown field; expected lacuna_library, sheets, parameter_sets');
  }
  const sheets = requireArray(record.sheets ?? [], 'sheets').map((entry, index) => {
    const path = `sheets[${index}]`;
    const item = requireRecord(entry, path);
    if (typeof item.label !== 'string' || item.label.trim() === '' || item.label.length > 100) invalid(`${path}.label`, item.label, 'a name of 1–100 characters');
    const parsed = within(`${path}.sheet`, () => parseSheetObject(item.sheet));
    return parsed.form === 'pattern' ? { label: item.label, pattern: parsed.pattern } : { label: item.label, sheet: parsed.sheet };
  });
  const parameterSets = requireArray(record.parameter_sets ?? [], 'parameter_sets').map((entry, index) => validateParameterObject(entry, `parameter_sets[${index}]`));
  return { sheets, parameterSets };
}

/** Adds entries, replacing those of equal label / name (the incoming one wins). */
export function mergeLibraries(base: Library, incoming: Library): Library {
  const sheets = base.sheets.filter((s) => !incoming.sheets.some((t) => t.label === s.label)).concat(incoming.sheets);
  const parameterSets = base.parameterSets.filter((p) => !incoming.parameterSets.some((q) => q.name === p.name)).concat(incoming.parameterSets);
  return { sheets, parameterSets };
}

/**
 * The library in storage. A stored value that no longer parses is kept under a backup key (never deleted), and
 * the error is returned so the page can say so.
 */
export function loadLibrary(storage: Storage): { library: Library; error?: ValidationError } {
  const text = storage.getItem(STORAGE_KEY);
  if (text === null) return { library: emptyLibrary() };
  try {
    return { library: parseLibrary(text, 'stored library') };
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    storage.setItem(`${STORAGE_KEY}.unreadable.${Date.now()}`, text);
    return { library: emptyLibrary(), error };
  }
}

export function saveLibrary(storage: Storage, library: Library): void {
  storage.setItem(STORAGE_KEY, libraryToJson(library));
}
