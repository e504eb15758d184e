/**
 * The energies file of `expand` (DESIGN.md, command-line contract):
 *   { "title"?, "source"?, "note"?, "demo"?, "structures": [{ "name"?, "bond"?, "supercell", "vacancies", "energy" }] }
 * Each structure is a pattern in the sheet file's pattern form (read by patternForm.ts; `bond` may be left out)
 * with its total energy per supercell in eV from the user's own calculation. Refused, naming the field: a bad
 * pattern, a non-finite or absurd energy, energies per atom so far apart that they cannot come from one code and
 * one setting, and a structure given twice — the same pattern up to the 12 operations of 6mm and translations, in
 * any supercell (compared by canonicalForm, src/enumerate/canonical.ts).
 */
import { canonicalForm } from '../enumerate/canonical.ts';
import type { Pattern } from '../lattice/sheet.ts';
import { refuseRendered, requireArray, requireFinite, requireRecord } from '../validate/fields.ts';
import { fieldPath, invalid, ValidationError } from '../validate/invalid.ts';
import { readPatternForm } from './patternForm.ts';
import { MAX_NAME_LENGTH, MAX_SHEET_TEXT_LENGTH } from './sheetLimits.ts';

/** Limits of the energies file; past them an input is refused as a likely mistake. */
export const ENERGIES_LIMITS = {
  /** Most structures in one file. */
  structures: 5000,
  /** Largest |energy| of a cell, eV. */
  cellEnergy: 1e7,
  /**
   * Largest |energy per atom|, eV: a boron atom's total energy is a few eV in plane-wave pseudopotential codes and
   * about −670 eV all-electron (24.6 hartree; from memory) — 2000 eV per atom comes from no code.
   */
  perAtom: 2000,
  /**
   * Largest distance of a structure's energy per atom from the file's median, eV: boron sheets of different hole
   * density differ by tenths of an eV per atom; a wider spread means mixed units (Ry and eV) or mixed codes.
   */
  spreadPerAtom: 5,
  /** Longest text of a title, source or note. */
  text: 4000,
} as const;

/** Bond length (Å) of a structure that gives none: it only sets the drawing, never an energy. */
export const ENERGIES_DEFAULT_BOND = 1.69;

export interface EnergiesStructure {
  name?: string;
  pattern: Pattern;
  /** Total energy of the supercell as given, eV. */
  energy: number;
}

export interface EnergiesFile {
  title?: string;
  source?: string;
  note?: string;
  demo: boolean;
  structures: EnergiesStructure[];
}

const TOP_KEYS = ['title', 'source', 'note', 'demo', 'structures'];
const STRUCTURE_KEYS = ['name', 'bond', 'supercell', 'vacancies', 'energy'];
const FORM = 'an energies file is { "structures": [{ "supercell", "vacancies", "energy", "bond"?, "name"? }] }';

function optionalText(record: Record<string, unknown>, key: string, path: string, limit: number): string | undefined {
  const value = record[key];
  if (value === undefined) return undefined;
  const field = fieldPath(path, key);
  if (typeof value !== 'string') invalid(field, value, 'not a string');
  if (value.length > limit) refuseRendered(field, `${value.length} characters`, `longer than the limit of ${limit}`);
  return value;
}

/** Runs a parse of one structure's part, prefixing the field of any refusal with the structure's path. */
function within<T>(path: string, parse: () => T): T {
  try {
    return parse();
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    throw new ValidationError(`${path}.${error.field}`, error.value, error.why);
  }
}

function readStructure(value: unknown, path: string): EnergiesStructure {
  const record = requireRecord(value, path);
  for (const key of Object.keys(record)) if (!STRUCTURE_KEYS.includes(key)) invalid(fieldPath(path, key), record[key], `unknown field; ${FORM}`);
  for (const key of ['supercell', 'vacancies', 'energy']) if (record[key] === undefined) invalid(fieldPath(path, key), undefined, `required; ${FORM}`);
  const name = optionalText(record, 'name', path, MAX_NAME_LENGTH);
  const pattern = within(path, () => readPatternForm({ ...record, bond: record.bond ?? ENERGIES_DEFAULT_BOND }, name));
  const field = fieldPath(path, 'energy');
  const energy = requireFinite(record.energy, field, ENERGIES_LIMITS.cellEnergy);
  const atoms = pattern.supercell.a * pattern.supercell.c - pattern.vacancies.length;
  if (!(Math.abs(energy / atoms) <= ENERGIES_LIMITS.perAtom)) {
    invalid(field, energy, `${(energy / atoms).toPrecision(4)} eV per atom for ${atoms} atoms: no code gives more than ${ENERGIES_LIMITS.perAtom} eV per atom; the energy is the total of the cell in eV`);
  }
  return name !== undefined ? { name, pattern, energy } : { pattern, energy };
}

/** Refuses the structure whose energy per atom lies farthest from the median, when beyond the spread limit. */
function checkSpread(structures: readonly EnergiesStructure[], records: readonly unknown[]): void {
  const perAtom = structures.map((s) => s.energy / (s.pattern.supercell.a * s.pattern.supercell.c - s.pattern.vacancies.length));
  const sorted = [...perAtom].sort((x, y) => x - y);
  const middle = sorted.length >> 1;
  const median = sorted.length % 2 === 1 ? sorted[middle] : 0.5 * (sorted[middle - 1] + sorted[middle]);
  let worst = 0;
  perAtom.forEach((e, k) => {
    if (Math.abs(e - median) > Math.abs(perAtom[worst] - median)) worst = k;
  });
  const distance = Math.abs(perAtom[worst] - median);
  if (distance > ENERGIES_LIMITS.spreadPerAtom) {
    const energy = (records[worst] as { energy: number }).energy;
    invalid(`structures[${worst}].energy`, energy,
      `${perAtom[worst].toPrecision(5)} eV per atom, ${distance.toPrecision(3)} eV from the median ${median.toPrecision(5)} eV per atom of the file: energies of one code and setting differ by far less (mixed units or codes?); every energy is the cell's total in eV`);
  }
}

/** Validates an energies file given as a value (parsed JSON, or an object built in code). */
export function parseEnergiesObject(value: unknown): EnergiesFile {
  const root = requireRecord(value, 'energies');
  for (const key of Object.keys(root)) if (!TOP_KEYS.includes(key)) invalid(fieldPath('', key), root[key], `unknown field; ${FORM}`);
  if (root.structures === undefined) invalid('structures', undefined, `required; ${FORM}`);
  if (root.demo !== undefined && typeof root.demo !== 'boolean') invalid('demo', root.demo, 'not true or false');
  const records = requireArray(root.structures, 'structures');
  if (records.length === 0) invalid('structures', records, 'empty: give the structures you computed');
  if (records.length > ENERGIES_LIMITS.structures) refuseRendered('structures', `${records.length} structures`, `more than the limit of ${ENERGIES_LIMITS.structures}`);
  const structures = records.map((record, k) => readStructure(record, `structures[${k}]`));
  const seen = new Map<string, number>();
  structures.forEach((s, k) => {
    const canonical = canonicalForm(s.pattern);
    const earlier = seen.get(canonical);
    if (earlier !== undefined) {
      const names = structures[earlier].name !== undefined ? ` ("${structures[earlier].name}")` : '';
      invalid(`structures[${k}]`, records[k], `the same pattern as structures[${earlier}]${names} up to rotations, mirrors and translations of the lattice (in any supercell); give each structure once`);
    }
    seen.set(canonical, k);
  });
  checkSpread(structures, records);
  const file: EnergiesFile = { demo: root.demo === true, structures };
  for (const key of ['title', 'source', 'note'] as const) {
    const text = optionalText(root, key, '', ENERGIES_LIMITS.text);
    if (text !== undefined) file[key] = text;
  }
  return file;
}

const NON_FINITE: Readonly<Record<string, number>> = { NaN: NaN, Infinity: Infinity, '-Infinity': -Infinity };
const MARK = '\u0000non-finite:';
/** MARK as written inside a JSON string (a raw control character is not allowed there). */
const MARK_JSON = '\\u0000non-finite:';

/**
 * The text with every bare NaN, Infinity and -Infinity outside strings (which JSON lacks but some programs
 * write for a failed calculation) turned into a marked string, so that the parse succeeds and the field holding
 * it can be named; undefined when there is none.
 */
function markNonFinite(text: string): string | undefined {
  let out = '';
  let from = 0;
  for (let at = 0; at < text.length; at++) {
    const c = text[at];
    if (c === '"') {
      for (at++; at < text.length && text[at] !== '"'; at++) if (text[at] === '\\') at++;
      continue;
    }
    const word = ['-Infinity', 'Infinity', 'NaN'].find((w) => text.startsWith(w, at));
    if (word === undefined) continue;
    out += `${text.slice(from, at)}"${MARK_JSON}${word}"`;
    at += word.length - 1;
    from = at + 1;
  }
  return from === 0 ? undefined : out + text.slice(from);
}

/** Validates an energies file's text; `origin` (the file name) names the input when the text is not JSON. */
export function parseEnergiesText(text: string, origin = 'energies'): EnergiesFile {
  if (typeof text !== 'string') invalid(origin, text, 'not a text');
  if (text.length > MAX_SHEET_TEXT_LENGTH) refuseRendered(origin, `${text.length} characters`, `longer than the limit of ${MAX_SHEET_TEXT_LENGTH}`);
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  let value: unknown;
  try {
    value = JSON.parse(body);
  } catch (error) {
    const marked = markNonFinite(body);
    try {
      if (marked === undefined) throw error;
      value = JSON.parse(marked, (_key, v: unknown) => (typeof v === 'string' && v.startsWith(MARK) ? NON_FINITE[v.slice(MARK.length)] : v));
    } catch {
      invalid(origin, text, `not JSON: ${error instanceof Error ? error.message.slice(0, 120) : 'unreadable'}`);
    }
  }
  return parseEnergiesObject(value);
}
