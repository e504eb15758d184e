/**
 * Fuzzing the sheet-file parser (fast-check): malformed and extreme inputs must each be answered by a
 * ValidationError whose message starts with `invalid ` and names a field, or be accepted as a valid sheet
 * with only finite numbers — never another exception, a stack trace or a NaN. 10,000+ inputs in all.
 */
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { ValidationError } from '../../src/validate/invalid.ts';
import { parseSheetObject, parseSheetText, type ParsedSheet } from '../../src/io/sheetFile.ts';
import { patternToJson, sheetToJson } from '../../src/io/sheetJson.ts';
import { hnfRows, patternToSheet } from '../../src/lattice/pattern.ts';
import { SHEET_PRESETS } from '../../src/lattice/presets.ts';
import { mutate, mutationArbitrary, weird } from './fuzzValues.ts';

let inputs = 0;
let accepted = 0;

function expectSane(parsed: ParsedSheet): void {
  const numbers = [...parsed.sheet.cell.flat(), ...parsed.sheet.atoms.flat()];
  expect(numbers.every(Number.isFinite)).toBe(true);
  expect(parsed.sheet.atoms.length).toBeGreaterThan(0);
  for (const [f1, f2] of parsed.sheet.atoms) expect(f1 >= 0 && f1 < 1 && f2 >= 0 && f2 < 1).toBe(true);
  if (parsed.pattern) {
    const { bond, supercell, vacancies } = parsed.pattern;
    expect(bond > 0 && Number.isFinite(bond)).toBe(true);
    expect([supercell.a, supercell.b, supercell.c, ...vacancies.flat()].every(Number.isInteger)).toBe(true);
    expect(vacancies.length).toBeLessThan(supercell.a * supercell.c);
  }
}

/** Runs one input: accepted and sane, or refused with a field-level ValidationError. */
function answer(run: () => ParsedSheet): void {
  inputs++;
  let parsed: ParsedSheet;
  try {
    parsed = run();
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    expect(error.message.startsWith('invalid ')).toBe(true);
    expect(error.message).not.toMatch(/[\n\r]/); // one stderr line
    expect(error.field.length).toBeGreaterThan(0);
    expect(error.message).not.toMatch(/\n\s+at /);
    expect(error.message.length).toBeLessThan(600);
    return;
  }
  expectSane(parsed);
  accepted++;
}

// Valid starting points: every preset in both forms.
const VALID: Record<string, unknown>[] = SHEET_PRESETS.flatMap((preset) => [
  { name: preset.name, bond: preset.pattern.bond, supercell: hnfRows(preset.pattern.supercell), vacancies: preset.pattern.vacancies },
  JSON.parse(sheetToJson(patternToSheet(preset.pattern))) as Record<string, unknown>,
]);

const mutationArb = mutationArbitrary(['cell', 'bond', 'atoms', 'vacancies', 'name']);

describe('sheet-file parser fuzz', () => {
  it('random JSON values, as text and as objects (3,000)', () => {
    fc.assert(fc.property(fc.jsonValue(), (value) => {
      answer(() => parseSheetText(JSON.stringify(value) ?? 'null'));
      answer(() => parseSheetObject(value));
    }), { numRuns: 1500 });
  });

  it('objects with the right keys holding random values (3,000)', () => {
    const explicitArb = fc.record({ name: weird, cell: weird, atoms: weird }, { requiredKeys: [] });
    const patternArb = fc.record({ name: weird, bond: weird, supercell: weird, vacancies: weird }, { requiredKeys: [] });
    fc.assert(fc.property(explicitArb, patternArb, (e, p) => {
      answer(() => parseSheetObject(e));
      answer(() => parseSheetObject(p));
    }), { numRuns: 1500 });
  });

  it('valid files with one or two mutations at any path (3,000)', () => {
    fc.assert(fc.property(
      fc.integer({ min: 0, max: VALID.length - 1 }), fc.nat(), mutationArb, fc.nat(), mutationArb,
      (which, pick1, m1, pick2, m2) => {
        const once = mutate(VALID[which], pick1, m1);
        answer(() => parseSheetObject(once));
        let text: string | undefined;
        try {
          text = JSON.stringify(mutate(once, pick2, m2));
        } catch {
          text = undefined; // BigInt-free by construction; a too-deep value may not stringify
        }
        answer(() => parseSheetText(text ?? '{'));
        answer(() => parseSheetObject(mutate(once, pick2, m2)));
      },
    ), { numRuns: 1000 });
  });

  it('text damage: truncation, insertion, deletion of characters in valid files (1,500)', () => {
    const texts = SHEET_PRESETS.flatMap((preset) => [patternToJson(preset.pattern), sheetToJson(patternToSheet(preset.pattern))]);
    fc.assert(fc.property(
      fc.integer({ min: 0, max: texts.length - 1 }), fc.nat(), fc.nat({ max: 5 }), fc.string({ maxLength: 6 }),
      (which, at, cut, insert) => {
        const text = texts[which];
        const k = at % (text.length + 1);
        answer(() => parseSheetText(text.slice(0, k) + insert + text.slice(k + cut), 'damaged.json'));
      },
    ), { numRuns: 1500 });
  });

  it('extreme integers in the supercell and vacancies (1,000)', () => {
    const big = fc.oneof(fc.integer({ min: -2e6, max: 2e6 }), fc.constantFrom(1e6, -1e6, 999_999, 2 ** 31, 2 ** 53, -(2 ** 53), 1e15, 0.5, -0));
    fc.assert(fc.property(fc.tuple(big, big, big, big), fc.array(fc.tuple(big, big), { maxLength: 6 }), ([p, q, r, s], vacancies) => {
      answer(() => parseSheetObject({ bond: 1.69, supercell: [[p, q], [r, s]], vacancies }));
    }), { numRuns: 700 });
    // Unimodular rows with entries near the limit: 1e6·999998 − 999999² = −1, one site.
    fc.assert(fc.property(fc.integer({ min: 1, max: 1e6 }), (m) => {
      answer(() => parseSheetObject({ bond: 1.69, supercell: [[m, m - 1], [m + 1, m]], vacancies: [] }));
    }), { numRuns: 300 });
  });

  it('deep nesting and long strings at every field (600)', () => {
    fc.assert(fc.property(
      fc.constantFrom('name', 'cell', 'atoms', 'bond', 'supercell', 'vacancies', 'other'),
      fc.oneof(fc.integer({ min: 1, max: 100_000 }).map((n) => ({ deepText: '['.repeat(n) + ']'.repeat(n) })), fc.integer({ min: 1, max: 300_000 }).map((n) => ({ deepText: JSON.stringify('y'.repeat(n)) }))),
      fc.boolean(),
      (field, { deepText }, explicitForm) => {
        const base = explicitForm ? '"cell": [[1.69, 0], [0.845, 1.4636]], "atoms": [[0, 0]]' : '"bond": 1.69, "supercell": [[1, 0], [0, 1]], "vacancies": []';
        answer(() => parseSheetText(`{ ${base.replace(new RegExp(`"${field}": [^,}]+(\\]\\])?`), `"${field}": ${deepText}`)}${base.includes(`"${field}"`) ? '' : `, "${field}": ${deepText}`} }`));
        answer(() => parseSheetText(deepText));
      },
    ), { numRuns: 300 });
  });

  afterAll(() => {
    // Every property above ran fully; count what was fed in.
    expect(inputs).toBeGreaterThanOrEqual(10_000);
    console.log(`sheet-file fuzz: ${inputs} inputs, ${accepted} accepted as valid`);
  });
});
