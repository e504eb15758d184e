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

const deep = (depth: number) => JSON.parse('['.repeat(depth) + ']'.repeat(depth)) as unknown;
const extremeNumber = fc.constantFrom(
  0, -0, 1, -1, 0.5, 1e-320, 5e-324, -5e-324, 1e-12, 1e12, 1e300, -1e300, Number.MAX_VALUE, -Number.MAX_VALUE,
  Number.MAX_SAFE_INTEGER, -Number.MAX_SAFE_INTEGER, 2 ** 53 + 2, 2 ** 31, -(2 ** 31), NaN, Infinity, -Infinity, 1e6, 1e6 + 1, -1e6,
);
const weird: fc.Arbitrary<unknown> = fc.oneof(
  extremeNumber,
  fc.double(),
  fc.integer({ min: -1e9, max: 1e9 }),
  fc.string({ maxLength: 20 }),
  fc.constantFrom(null, true, false, undefined, '', 'NaN', '1.69', [], {}, [[]], [[0, 0]], [0], { a: 1 }),
  fc.integer({ min: 1, max: 20_000 }).map(deep),
  fc.integer({ min: 1000, max: 200_000 }).map((n) => 'x'.repeat(n)),
  fc.array(fc.array(extremeNumber, { maxLength: 4 }), { maxLength: 5 }),
  fc.jsonValue({ maxDepth: 4 }),
);

/** Every path (list of keys) into a JSON value, at most 4 levels deep (deep values are left whole). */
function paths(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  const out = [prefix];
  if (prefix.length >= 4) return out;
  if (Array.isArray(value)) value.slice(0, 50).forEach((entry, k) => out.push(...paths(entry, [...prefix, k])));
  else if (value !== null && typeof value === 'object') for (const [key, entry] of Object.entries(value)) out.push(...paths(entry, [...prefix, key]));
  return out;
}

type Mutation = { kind: 'replace' | 'delete' | 'duplicate'; value: unknown } | { kind: 'addKey'; key: string; value: unknown };

/** Shallow copy of a container (arrays stay arrays; own keys only, so "__proto__" stays a plain key). */
function shallow(value: unknown): Record<string | number, unknown> {
  if (Array.isArray(value)) return [...value] as unknown as Record<number, unknown>;
  const out: Record<string, unknown> = {};
  for (const [key, entry] of Object.entries(value as object)) Object.defineProperty(out, key, { value: entry, enumerable: true, writable: true, configurable: true });
  return out;
}

/** The value with one mutation at one path; containers on the path are copied, the rest shared. */
function mutate(base: unknown, pathPick: number, mutation: Mutation): unknown {
  const all = paths(base);
  const path = all[pathPick % all.length];
  const edit = (node: unknown): unknown => {
    if (mutation.kind === 'replace') return mutation.value;
    if (mutation.kind === 'addKey') {
      if (node === null || typeof node !== 'object' || Array.isArray(node)) return node;
      const copy = shallow(node);
      Object.defineProperty(copy, mutation.key, { value: mutation.value, enumerable: true, writable: true, configurable: true });
      return copy;
    }
    return node;
  };
  const walk = (node: unknown, depth: number): unknown => {
    if (depth === path.length) return edit(node);
    const copy = shallow(node);
    const key = path[depth];
    if (depth === path.length - 1 && mutation.kind === 'delete') {
      if (Array.isArray(copy)) (copy as unknown[]).splice(key as number, 1);
      else delete copy[key];
      return copy;
    }
    if (depth === path.length - 1 && mutation.kind === 'duplicate' && Array.isArray(copy)) {
      (copy as unknown[]).push(copy[key as number]);
      return copy;
    }
    copy[key] = walk(copy[key], depth + 1);
    return copy;
  };
  return walk(base, 0);
}

const mutationArb: fc.Arbitrary<Mutation> = fc.oneof(
  { weight: 5, arbitrary: weird.map((value): Mutation => ({ kind: 'replace', value })) },
  { weight: 1, arbitrary: fc.constant<Mutation>({ kind: 'delete', value: undefined }) },
  { weight: 1, arbitrary: fc.constant<Mutation>({ kind: 'duplicate', value: undefined }) },
  { weight: 1, arbitrary: fc.record({ key: fc.oneof(fc.constantFrom('cell', 'bond', 'atoms', 'vacancies', 'name', '__proto__', 'constructor', ''), fc.string()), value: weird }).map((r): Mutation => ({ kind: 'addKey', ...r })) },
);

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
