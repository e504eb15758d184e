/**
 * Fuzzing the energies-file parser (fast-check): malformed and extreme inputs must each be answered by a
 * ValidationError whose message starts with `invalid ` and names a field, or be accepted with only finite
 * energies and distinct patterns — never another exception, a stack trace or a NaN. 10,000+ inputs in all.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { canonicalForm } from '../../src/enumerate/canonical.ts';
import { parseEnergiesObject, parseEnergiesText, type EnergiesFile } from '../../src/io/energiesFile.ts';
import { ValidationError } from '../../src/validate/invalid.ts';
import { mutate, mutationArbitrary, weird } from './fuzzValues.ts';

let inputs = 0;
let accepted = 0;
const DEMO_TEXT = readFileSync('presets/demo/hsl-energies.json', 'utf8');
const DEMO = JSON.parse(DEMO_TEXT) as Record<string, unknown>;

function answer(run: () => EnergiesFile): void {
  inputs++;
  let parsed: EnergiesFile;
  try {
    parsed = run();
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    expect(error.message.startsWith('invalid ')).toBe(true);
    expect(error.message).not.toMatch(/[\n\r]/);
    expect(error.field.length).toBeGreaterThan(0);
    expect(error.message.length).toBeLessThan(700);
    return;
  }
  expect(parsed.structures.length).toBeGreaterThan(0);
  for (const s of parsed.structures) expect(Number.isFinite(s.energy)).toBe(true);
  expect(new Set(parsed.structures.map((s) => canonicalForm(s.pattern))).size).toBe(parsed.structures.length);
  accepted++;
}

const mutationArb = mutationArbitrary(['structures', 'energy', 'supercell', 'vacancies', 'bond', 'name', 'title', 'demo']);

describe('energies-file parser fuzz', () => {
  it('random JSON values, as text and as objects (3,000)', () => {
    fc.assert(fc.property(fc.jsonValue(), (value) => {
      answer(() => parseEnergiesText(JSON.stringify(value) ?? 'null'));
      answer(() => parseEnergiesObject(value));
    }), { numRuns: 1500 });
  });

  it('structures with the right keys holding random values (2,000)', () => {
    const record = fc.record({ name: weird, bond: weird, supercell: weird, vacancies: weird, energy: weird }, { requiredKeys: [] });
    fc.assert(fc.property(fc.array(record, { maxLength: 3 }), (structures) => answer(() => parseEnergiesObject({ structures }))), { numRuns: 2000 });
  });

  it('the DEMO file with one or two mutations at any path (2,100)', () => {
    fc.assert(fc.property(fc.nat(), mutationArb, fc.nat(), mutationArb, (pick1, m1, pick2, m2) => {
      const once = mutate(DEMO, pick1, m1);
      answer(() => parseEnergiesObject(once));
      const twice = mutate(once, pick2, m2);
      let text: string | undefined;
      try {
        text = JSON.stringify(twice);
      } catch {
        text = undefined;
      }
      answer(() => parseEnergiesText(text ?? '{'));
      answer(() => parseEnergiesObject(twice));
    }), { numRuns: 700 });
  });

  it('text damage, and bare NaN / Infinity written where numbers stand (3,000)', () => {
    fc.assert(fc.property(fc.nat(), fc.nat({ max: 5 }), fc.oneof(fc.string({ maxLength: 6 }), fc.constantFrom('NaN', 'Infinity', '-Infinity', '"NaN"', 'nan')), (at, cut, insert) => {
      const k = at % (DEMO_TEXT.length + 1);
      answer(() => parseEnergiesText(DEMO_TEXT.slice(0, k) + insert + DEMO_TEXT.slice(k + cut), 'damaged.json'));
    }), { numRuns: 3000 });
  });

  afterAll(() => {
    expect(inputs).toBeGreaterThanOrEqual(10_000);
    console.log(`energies-file fuzz: ${inputs} inputs, ${accepted} accepted as valid`);
  });
});
