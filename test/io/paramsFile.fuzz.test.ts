import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ValidationError } from '../../src/validate/invalid.ts';
import { parseParameterFile } from '../../src/io/paramsFile.ts';

// Fuzzing (property-based testing with fast-check): 10,000+ malformed or extreme parameter files, each of which
// must be refused by a ValidationError naming a field — never another exception, a hang or a NaN.
const VALID = {
  name: 'fuzz',
  source: 'generated',
  onsite: { s: -12.54, p: -6.64 },
  hopping: { ss_sigma: -3.7, sp_sigma: 4.9, pp_sigma: 8.6, pp_pi: -2.2 },
  d0: 1.69,
  exponent: 2,
  cutoff: 2.1,
};
const VALID_TEXT = JSON.stringify(VALID);
const NUMERIC_PATHS = [['onsite', 's'], ['onsite', 'p'], ['hopping', 'ss_sigma'], ['hopping', 'sp_sigma'], ['hopping', 'pp_sigma'], ['hopping', 'pp_pi'], ['d0'], ['exponent'], ['cutoff']];
// Character positions inside the string values "fuzz" and "generated", where a changed character stays valid.
const FREE_TEXT = [VALID_TEXT.indexOf('"fuzz"'), VALID_TEXT.indexOf('"fuzz"') + 6, VALID_TEXT.indexOf('"generated"'), VALID_TEXT.indexOf('"generated"') + 11];
const inFreeText = (n: number) => (n > FREE_TEXT[0] && n < FREE_TEXT[1] - 1) || (n > FREE_TEXT[2] && n < FREE_TEXT[3] - 1);
const ALL_PATHS = [...NUMERIC_PATHS, ['name'], ['source'], ['onsite'], ['hopping']];

function clone(): Record<string, unknown> {
  return JSON.parse(VALID_TEXT) as Record<string, unknown>;
}

function setAt(root: Record<string, unknown>, path: string[], value: unknown, remove = false): void {
  let node = root as Record<string, unknown>;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string, unknown>;
  if (remove) delete node[path[path.length - 1]];
  // An own property even for "__proto__", as JSON.parse would make it.
  else Object.defineProperty(node, path[path.length - 1], { value, enumerable: true, writable: true, configurable: true });
}

/** Numbers out of every documented range for the numeric field at `path`. */
function outOfRange(path: string[]): fc.Arbitrary<number> {
  const field = path[path.length - 1];
  if (field === 'd0') return fc.oneof(fc.double({ max: 0, noNaN: true }), fc.double({ min: 10.000001, noNaN: true, noDefaultInfinity: true }));
  if (field === 'cutoff') return fc.oneof(fc.double({ max: 0, noNaN: true }), fc.double({ min: 8.000001, noNaN: true, noDefaultInfinity: true }));
  if (field === 'exponent') return fc.oneof(fc.double({ max: -1e-9, noNaN: true }), fc.double({ min: 20.000001, noNaN: true, noDefaultInfinity: true }));
  return fc.oneof(fc.double({ min: 100.000001, noNaN: true }), fc.double({ max: -100.000001, noNaN: true }));
}

const notNumber = fc.jsonValue().filter((v) => typeof v !== 'number');
const notString = fc.jsonValue().filter((v) => typeof v !== 'string');

const malformed: fc.Arbitrary<string> = fc.oneof(
  // Truncated or corrupted text.
  fc.integer({ min: 0, max: VALID_TEXT.length - 1 }).map((n) => VALID_TEXT.slice(0, n)),
  fc.tuple(fc.integer({ min: 0, max: VALID_TEXT.length - 1 }), fc.constantFrom('{', '}', '"', ',', ':', 'x', 'NaN', '-', '['))
    .filter(([n, c]) => !inFreeText(n) && VALID_TEXT[n] !== c)
    .map(([n, c]) => VALID_TEXT.slice(0, n) + c + VALID_TEXT.slice(n + 1)),
  // Arbitrary text and arbitrary JSON that is not a parameter object.
  fc.string({ maxLength: 200 }),
  fc.jsonValue().filter((v) => typeof v !== 'object' || v === null || Array.isArray(v) || Object.keys(v).length < 7).map((v) => JSON.stringify(v) ?? 'null'),
  // A missing field.
  fc.constantFrom(...ALL_PATHS).map((path) => {
    const root = clone();
    setAt(root, path, undefined, true);
    return JSON.stringify(root);
  }),
  // An unknown field at the top or inside onsite/hopping.
  fc.tuple(fc.constantFrom<string[]>([], ['onsite'], ['hopping']), fc.string({ minLength: 1, maxLength: 12 }), fc.jsonValue()).filter(
    ([path, key]) => !['name', 'source', 'provenance', 'onsite', 'hopping', 'd0', 'exponent', 'cutoff', 's', 'p', 'ss_sigma', 'sp_sigma', 'pp_sigma', 'pp_pi'].includes(key),
  ).map(([path, key, value]) => {
    const root = clone();
    setAt(root, [...path, key], value);
    return JSON.stringify(root);
  }),
  // A wrong type.
  fc.tuple(fc.constantFrom(...NUMERIC_PATHS), notNumber).map(([path, value]) => {
    const root = clone();
    setAt(root, path, value);
    return JSON.stringify(root);
  }),
  fc.tuple(fc.constantFrom<string[]>(['name'], ['source'], ['provenance']), notString).map(([path, value]) => {
    const root = clone();
    setAt(root, path, value);
    return JSON.stringify(root);
  }),
  // Out-of-range or non-finite numbers (1e999 parses to Infinity).
  fc.constantFrom(...NUMERIC_PATHS).chain((path) => outOfRange(path).map((value) => {
    const root = clone();
    setAt(root, path, 123456.789);
    return JSON.stringify(root).replace('123456.789', Number.isFinite(value) ? JSON.stringify(value) : value > 0 ? '1e999' : '-1e999');
  })),
  fc.constantFrom(...NUMERIC_PATHS).map((path) => {
    const root = clone();
    setAt(root, path, 123456.789);
    return JSON.stringify(root).replace('123456.789', '-1e999');
  }),
  // Empty or over-long texts.
  fc.constantFrom('', '   ', 'null', '{}'),
  fc.integer({ min: 101, max: 300 }).map((n) => JSON.stringify({ ...VALID, name: 'n'.repeat(n) })),
);

describe('parseParameterFile fuzzing', () => {
  it('answers 10,000 malformed or extreme files with a ValidationError naming the field', () => {
    let refused = 0;
    fc.assert(fc.property(malformed, (text) => {
      try {
        parseParameterFile(text);
      } catch (error) {
        if (!(error instanceof ValidationError)) return false;
        refused++;
        return error.field.length > 0 && error.message.startsWith(`invalid ${error.field}: `) && !/[\n\r]/.test(error.message);
      }
      return false;
    }), { numRuns: 10_000 });
    expect(refused).toBe(10_000);
  });

  it('answers deeply nested values (which overflow printing) with a ValidationError too', () => {
    const nested = fc.oneof(
      fc.integer({ min: 1, max: 50_000 }).map((n) => '['.repeat(n) + ']'.repeat(n)),
      fc.tuple(fc.constantFrom(...ALL_PATHS), fc.integer({ min: 1000, max: 50_000 })).map(([path, n]) => {
        const root = clone();
        setAt(root, path, 123456.789);
        return JSON.stringify(root).replace('123456.789', '['.repeat(n) + ']'.repeat(n));
      }),
    );
    fc.assert(fc.property(nested, (text) => {
      try {
        parseParameterFile(text);
      } catch (error) {
        return error instanceof ValidationError && error.field.length > 0;
      }
      return false;
    }), { numRuns: 100 });
  });

  it('accepts extreme but valid numbers and never returns NaN', () => {
    const inRange = fc.record({
      s: fc.double({ min: -100, max: 100, noNaN: true }),
      v: fc.double({ min: -100, max: 100, noNaN: true }),
      d0: fc.double({ min: Number.MIN_VALUE, max: 10, noNaN: true }),
      exponent: fc.double({ min: 0, max: 20, noNaN: true }),
      cutoff: fc.double({ min: Number.MIN_VALUE, max: 8, noNaN: true }),
    });
    fc.assert(fc.property(inRange, ({ s, v, d0, exponent, cutoff }) => {
      const text = JSON.stringify({ ...VALID, onsite: { s, p: v }, hopping: { ss_sigma: v, sp_sigma: s, pp_sigma: -v, pp_pi: -s }, d0, exponent, cutoff });
      const set = parseParameterFile(text);
      const numbers = [set.onsite.s, set.onsite.p, ...Object.values(set.hopping), set.d0, set.exponent, set.cutoff];
      return numbers.every(Number.isFinite);
    }), { numRuns: 2000 });
  });
});
