import { describe, expect, it } from 'vitest';
import { ValidationError } from '../../src/validate/invalid.ts';
import { parseSheetObject, parseSheetText } from '../../src/io/sheetFile.ts';
import { MAX_ATOMS, MAX_NAME_LENGTH, MAX_SHEET_TEXT_LENGTH } from '../../src/io/sheetLimits.ts';
import { SQRT3 } from '../../src/lattice/triangular.ts';
import { refusal } from './refusal.ts';

const d = 1.69;
const HEX_CELL = [[d, 0], [d / 2, (SQRT3 / 2) * d]];
const explicit = (patch: Record<string, unknown>) => ({ cell: HEX_CELL, atoms: [[0, 0]], ...patch });
const pattern = (patch: Record<string, unknown>) => ({ bond: 1.69, supercell: [[3, 0], [0, 3]], vacancies: [[0, 0]], ...patch });

describe('parseSheetText(text, origin)', () => {
  it('reads the pattern form (α: Tang & Ismail-Beigi 2007, 8 atoms) and brings rows to HNF', () => {
    const parsed = parseSheetText('{"name": "a", "bond": 1.69, "supercell": [[0, 3], [3, 0]], "vacancies": [[3, 3]]}');
    expect(parsed.form).toBe('pattern');
    expect(parsed.pattern!.supercell).toEqual({ a: 3, b: 0, c: 3 });
    expect(parsed.pattern!.vacancies).toEqual([[0, 0]]);
    expect(parsed.sheet.atoms).toHaveLength(8);
    expect(parsed.sheet.name).toBe('a');
  });

  it('reads the explicit form, wraps fractions, defaults z to 0, and recognises the pattern', () => {
    const parsed = parseSheetText(JSON.stringify({ cell: HEX_CELL, atoms: [[1.25, -0.5]] }));
    expect(parsed.form).toBe('explicit');
    expect(parsed.sheet.atoms).toEqual([[0.25, 0.5, 0]]);
    expect(parsed.pattern!.supercell).toEqual({ a: 1, b: 0, c: 1 });
    expect(parsed.pattern!.bond).toBeCloseTo(d, 12);
  });

  it('explicit form off the triangular lattice: no pattern', () => {
    const parsed = parseSheetObject({ cell: [[3, 0], [0, 3]], atoms: [[0, 0, 0.2], [0.5, 0.5, -0.2]] });
    expect(parsed.pattern).toBeUndefined();
    expect(parsed.sheet.atoms[1]).toEqual([0.5, 0.5, -0.2]);
  });

  it('strips a byte-order mark', () => {
    expect(parseSheetText(`\uFEFF${JSON.stringify(pattern({}))}`).form).toBe('pattern');
  });

  it('names the file when the text is not JSON or too long', () => {
    expect(refusal(() => parseSheetText('{"bond": ', 'my.json'))).toMatch(/^invalid my\.json: "\{\\"bond\\": " \(not JSON: /);
    expect(refusal(() => parseSheetText('nope'))).toMatch(/^invalid sheet: "nope" \(not JSON/);
    expect(refusal(() => parseSheetText(' '.repeat(MAX_SHEET_TEXT_LENGTH + 1), 'big.json')))
      .toBe(`invalid big.json: ${MAX_SHEET_TEXT_LENGTH + 1} characters (longer than the limit of ${MAX_SHEET_TEXT_LENGTH})`);
  });
});

describe('parseSheetObject(value): the shape of the file', () => {
  const cases: [string, unknown, string][] = [
    ['not an object', [1, 2], 'invalid sheet: [1,2] (not a JSON object)'],
    ['null', null, 'invalid sheet: null (not a JSON object)'],
    ['unknown field', explicit({ colour: 'red' }), 'invalid colour: "red" (unknown field; a sheet is { name?, cell, atoms } or { name?, bond, supercell, vacancies })'],
    ['odd unknown key', explicit({ 'a b': 1 }), 'invalid ["a b"]: 1 (unknown field; a sheet is { name?, cell, atoms } or { name?, bond, supercell, vacancies })'],
    ['mixed forms', explicit({ bond: 1.7 }), "invalid bond: 1.7 (a pattern-form field beside the explicit form's cell; a sheet is { name?, cell, atoms } or { name?, bond, supercell, vacancies })"],
    ['neither form', { name: 'x' }, 'invalid sheet: {"name":"x"} (neither form; a sheet is { name?, cell, atoms } or { name?, bond, supercell, vacancies })'],
    ['missing atoms', { cell: HEX_CELL }, 'invalid atoms: missing (required by the explicit form; a sheet is { name?, cell, atoms } or { name?, bond, supercell, vacancies })'],
    ['missing vacancies', { bond: 1.7, supercell: [[1, 0], [0, 1]] }, 'invalid vacancies: missing (required by the pattern form; a sheet is { name?, cell, atoms } or { name?, bond, supercell, vacancies })'],
    ['name not a string', explicit({ name: 3 }), 'invalid name: 3 (not a string)'],
    ['name too long', explicit({ name: 'x'.repeat(MAX_NAME_LENGTH + 1) }), `invalid name: ${MAX_NAME_LENGTH + 1} characters (longer than the limit of ${MAX_NAME_LENGTH})`],
  ];
  for (const [what, value, message] of cases) it(what, () => expect(refusal(() => parseSheetObject(value))).toBe(message));
});

describe('parseSheetObject(value): explicit form fields', () => {
  const cases: [string, unknown, string][] = [
    ['cell not an array', explicit({ cell: 'hex' }), 'invalid cell: "hex" (not an array)'],
    ['cell with three rows', explicit({ cell: [[1, 0], [0, 1], [1, 1]] }), 'invalid cell: [[1,0],[0,1],[1,1]] (3 entries, expected 2)'],
    ['cell entry a string', explicit({ cell: [[1.69, 0], ['0.845', 1.46]] }), 'invalid cell[1][0]: "0.845" (not a number)'],
    ['cell entry NaN (from code)', explicit({ cell: [[NaN, 0], [0, 2]] }), 'invalid cell[0][0]: NaN (not a finite number)'],
    ['cell entry Infinity (from code)', explicit({ cell: [[2, 0], [0, Infinity]] }), 'invalid cell[1][1]: Infinity (not a finite number)'],
    ['cell entry huge', explicit({ cell: [[2, 0], [0, 1e300]] }), 'invalid cell[1][1]: 1e+300 (|value| above the limit 1000)'],
    ['zero vector', explicit({ cell: [[0, 0], [0, 2]] }), 'invalid cell[0]: [0,0] (zero vector)'],
    ['collinear cell', explicit({ cell: [[2, 0], [4, 0]] }), 'invalid cell: [[2,0],[4,0]] (zero area: the two vectors are collinear)'],
    ['lattice vector too short', explicit({ cell: [[100, 0], [100.3, 0.001]] }), 'invalid cell: [[100,0],[100.3,0.001]] (a lattice vector of 0.300 Å is shorter than the minimum atom separation 0.5 Å)'],
    ['no atoms', explicit({ atoms: [] }), 'invalid atoms: [] (no atoms)'],
    ['too many atoms', explicit({ atoms: Array.from({ length: MAX_ATOMS + 1 }, () => [0, 0]) }), `invalid atoms: ${MAX_ATOMS + 1} atoms (more than the limit of ${MAX_ATOMS})`],
    ['atom not an array', explicit({ atoms: [[0, 0], { f1: 0 }] }), 'invalid atoms[1]: {"f1":0} (not an array)'],
    ['atom with four entries', explicit({ atoms: [[0, 0, 0, 0]] }), 'invalid atoms[0]: [0,0,0,0] (4 entries, expected [f1, f2] or [f1, f2, z])'],
    ['atom z not a number', explicit({ atoms: [[0, 0, null]] }), 'invalid atoms[0][2]: null (not a number)'],
    ['fraction far out', explicit({ atoms: [[0, 12]] }), 'invalid atoms[0][1]: 12 (|value| above the limit 10)'],
    ['height far out', explicit({ atoms: [[0, 0, -11]] }), 'invalid atoms[0][2]: -11 (|value| above the limit 10)'],
    ['overlapping atoms', explicit({ cell: [[5, 0], [0, 5]], atoms: [[0, 0], [0.5, 0.5], [0.98, 0.99]] }), 'invalid atoms[2]: [0.98,0.99] (0.112 Å from atoms[0] (periodic images included), closer than the minimum separation 0.5 Å)'],
    ['overlap through the z range only', explicit({ cell: [[5, 0], [0, 5]], atoms: [[0.5, 0.5, 0], [0.5, 0.5, 0.3]] }), 'invalid atoms[1]: [0.5,0.5,0.3] (0.300 Å from atoms[0] (periodic images included), closer than the minimum separation 0.5 Å)'],
  ];
  for (const [what, value, message] of cases) it(what, () => expect(refusal(() => parseSheetObject(value))).toBe(message));

  it('a bilayer: two atoms above each other 2 Å apart are not overlapping', () => {
    expect(parseSheetObject(explicit({ cell: [[5, 0], [0, 5]], atoms: [[0.5, 0.5, -1], [0.5, 0.5, 1]] })).sheet.atoms).toHaveLength(2);
  });
});

describe('parseSheetObject(value): pattern form fields', () => {
  const cases: [string, unknown, string][] = [
    ['bond zero', pattern({ bond: 0 }), 'invalid bond: 0 (must be positive)'],
    ['bond negative', pattern({ bond: -1.69 }), 'invalid bond: -1.69 (must be positive)'],
    ['bond a string', pattern({ bond: '1.69' }), 'invalid bond: "1.69" (not a number)'],
    ['bond tiny', pattern({ bond: 0.1 }), 'invalid bond: 0.1 (below the minimum atom separation 0.5 Å)'],
    ['bond huge', pattern({ bond: 1e9 }), 'invalid bond: 1000000000 (above the limit 10 Å)'],
    ['supercell not 2×2', pattern({ supercell: [[3, 0]] }), 'invalid supercell: [[3,0]] (1 entries, expected 2)'],
    ['supercell row short', pattern({ supercell: [[3, 0], [0]] }), 'invalid supercell[1]: [0] (1 entries, expected 2)'],
    ['supercell not integer', pattern({ supercell: [[3, 0], [0.5, 3]] }), 'invalid supercell[1][0]: 0.5 (not an integer)'],
    ['supercell entry huge', pattern({ supercell: [[3, 0], [0, 1e12]] }), 'invalid supercell[1][1]: 1000000000000 (|value| above the limit 1000000)'],
    ['singular supercell', pattern({ supercell: [[2, 1], [4, 2]] }), 'invalid supercell: [[2,1],[4,2]] (singular: determinant 0)'],
    ['too many sites', pattern({ supercell: [[100, 0], [0, 100]] }), 'invalid supercell: [[100,0],[0,100]] (10000 sites, more than the limit of 4096)'],
    ['vacancies not an array', pattern({ vacancies: 'none' }), 'invalid vacancies: "none" (not an array)'],
    ['vacancy not integer', pattern({ vacancies: [[0, 0.5]] }), 'invalid vacancies[0][1]: 0.5 (not an integer)'],
    ['vacancy not a pair', pattern({ vacancies: [[0, 0, 0]] }), 'invalid vacancies[0]: [0,0,0] (3 entries, expected 2)'],
    ['duplicate vacancy modulo the supercell', pattern({ vacancies: [[0, 0], [1, 1], [3, -3]] }), 'invalid vacancies[2]: [3,-3] (same site as vacancies[0] modulo the supercell)'],
    ['every site vacant', pattern({ supercell: [[2, 0], [0, 1]], vacancies: [[0, 0], [1, 0]] }), 'invalid vacancies: [[0,0],[1,0]] (every one of the 2 sites is vacant: no atoms)'],
    ['more vacancies than sites', pattern({ supercell: [[1, 0], [0, 1]], vacancies: [[0, 0], [1, 0]] }), 'invalid vacancies: 2 vacancies (more than the 1 sites of the supercell)'],
  ];
  for (const [what, value, message] of cases) it(what, () => expect(refusal(() => parseSheetObject(value))).toBe(message));

  it('accepts any integer rows of non-zero determinant, negative too, and any vacancy representative', () => {
    const parsed = parseSheetObject(pattern({ supercell: [[-1, -1], [1, -2]], vacancies: [[-7, 5]] }));
    // Honeycomb rows up to sign: HNF [[3, 0], [1, 1]] (worked by hand in test/lattice/hnf.test.ts).
    expect(parsed.pattern!.supercell).toEqual({ a: 3, b: 1, c: 1 });
    expect(parsed.sheet.atoms).toHaveLength(2);
  });
});

describe('the sheet presets', () => {
  it('pass the same validation as a user file (pattern form of the sheet contract)', async () => {
    const { readdirSync, readFileSync } = await import('node:fs');
    const { SHEET_PRESETS } = await import('../../src/lattice/presets.ts');
    const folder = new URL('../../presets/sheets/', import.meta.url);
    const files = readdirSync(folder).filter((f) => f.endsWith('.json'));
    expect(files.length).toBe(SHEET_PRESETS.length);
    for (const file of files) {
      const { name, bond, supercell, vacancies } = JSON.parse(readFileSync(new URL(file, folder), 'utf8'));
      const parsed = parseSheetObject({ name, bond, supercell, vacancies });
      const preset = SHEET_PRESETS.find((p) => p.name === name)!;
      expect(parsed.pattern).toEqual(preset.pattern);
    }
  });
});
