import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ValidationError } from '../../src/validate/invalid.ts';
import { parseReferenceBandsText } from '../../src/io/referenceBandsFile.ts';
import { refusal } from './refusal.ts';

const VALID = { kpoints: [[0, 0], [0.5, 0], [1, 0]], energies: [[-5, -1, 2], [-4.5, -0.5, 1.5], [-4, 0, 1]] };
const text = (value: unknown) => JSON.stringify(value);
const withChange = (change: Record<string, unknown>) => text({ ...VALID, ...change });

describe('parseReferenceBandsText(text, origin)', () => {
  it('reads the bands --json form, with fermi, path labels and the other keys bands --json writes', () => {
    const reference = parseReferenceBandsText(withChange({ fermi: -0.2, path: { labels: [{ label: 'Γ', index: 0 }, { label: 'X', index: 2 }], distance: [0, 0.5, 1] }, sigma_weight: [[1, 1, 0]], parameters: 'x', sheet: 'alpha', title: 'my DFT' }));
    expect(reference.count).toBe(3);
    expect(reference.bands).toBe(3);
    expect(Array.from(reference.energies)).toEqual([-5, -1, 2, -4.5, -0.5, 1.5, -4, 0, 1]);
    expect(reference.fermi).toBe(-0.2);
    expect(reference.labels).toEqual([{ label: 'Γ', index: 0 }, { label: 'X', index: 2 }]);
    expect(reference.sheet).toBe('alpha');
    expect(reference.title).toBe('my DFT');
  });

  it('refuses bad files naming the field and the reason', () => {
    expect(refusal(() => parseReferenceBandsText('', 'b.json'))).toMatch(/^invalid b\.json: "" \(empty file/);
    expect(refusal(() => parseReferenceBandsText('{"kpoints": [', 'b.json'))).toMatch(/^invalid b\.json: .* \(not JSON/);
    expect(refusal(() => parseReferenceBandsText('[]', 'b.json'))).toBe('invalid b.json: [] (not a JSON object)');
    expect(refusal(() => parseReferenceBandsText(text({ energies: VALID.energies })))).toMatch(/^invalid kpoints: missing \(required field/);
    expect(refusal(() => parseReferenceBandsText(text({ kpoints: VALID.kpoints })))).toMatch(/^invalid energies: missing \(required field/);
    expect(refusal(() => parseReferenceBandsText(withChange({ kpoints: [] })))).toBe('invalid kpoints: [] (empty)');
    expect(refusal(() => parseReferenceBandsText(withChange({ energies: VALID.energies.slice(0, 2) })))).toBe('invalid energies: "2 rows" (expected one row per k-point: 3)');
    expect(refusal(() => parseReferenceBandsText(withChange({ energies: [[-5, -1, 2], [-4.5, 1.5], [-4, 0, 1]] })))).toMatch(/^invalid energies\[1\]: "2 energies" \(energies\[0\] has 3/);
    expect(refusal(() => parseReferenceBandsText(withChange({ energies: [[-5, -1, 2], [-4.5, 1.5, -0.5], [-4, 0, 1]] })))).toMatch(/^invalid energies\[1\]\[2\]: -0\.5 \(below energies\[1\]\[1\] = 1\.5: the energies at each k-point must be ascending\)/);
    expect(refusal(() => parseReferenceBandsText(withChange({ energies: [[-5, 'NaN', 2], [-4.5, -0.5, 1.5], [-4, 0, 1]] })))).toMatch(/^invalid energies\[0\]\[1\]: "NaN" \(expected a number/);
    expect(refusal(() => parseReferenceBandsText(withChange({ energies: [[-5, -1, 2e4], [-4.5, -0.5, 1.5], [-4, 0, 1]] })))).toMatch(/^invalid energies\[0\]\[2\]: 20000 \(\|E\| above 1000 eV/);
    expect(refusal(() => parseReferenceBandsText(withChange({ energies: [[], [], []] })))).toMatch(/^invalid energies\[0\]: \[\] \(empty/);
    expect(refusal(() => parseReferenceBandsText(withChange({ kpoints: [[0, 0], [0.5], [1, 0]] })))).toMatch(/^invalid kpoints\[1\]: \[0\.5\] \(must be \[kx, ky\]\)/);
    expect(refusal(() => parseReferenceBandsText(withChange({ fermi_level: 0 })))).toMatch(/^invalid fermi_level: 0 \(unknown field/);
    expect(refusal(() => parseReferenceBandsText(withChange({ fermi: 'zero' })))).toMatch(/^invalid fermi: "zero" \(expected a number/);
    expect(refusal(() => parseReferenceBandsText(withChange({ path: { labels: [{ label: 'Γ', index: 7 }] } })))).toMatch(/^invalid path\.labels\[0\]\.index: 7 \(expected a k-point index from 0 to 2\)/);
  });
});

// Fuzzing: 10,000 malformed reference bands files, each read or refused by a ValidationError naming a field —
// never another exception; anything read has ascending finite energies, one row per k-point.
describe('reference bands files fuzzing', () => {
  const VALID_TEXT = text(VALID);
  const malformed = fc.oneof(
    fc.integer({ min: 0, max: VALID_TEXT.length - 1 }).map((n) => VALID_TEXT.slice(0, n)),
    fc.tuple(fc.integer({ min: 0, max: VALID_TEXT.length - 1 }), fc.constantFrom('{', '}', '"', ',', ':', 'x', '-', '[', ']', '9', '0', 'e'))
      .map(([n, c]) => VALID_TEXT.slice(0, n) + c + VALID_TEXT.slice(n + 1)),
    fc.string({ maxLength: 200 }),
    fc.jsonValue().map((v) => JSON.stringify(v) ?? 'null'),
    fc.record({ kpoints: fc.array(fc.array(fc.oneof(fc.double(), fc.jsonValue()), { maxLength: 3 }), { maxLength: 4 }), energies: fc.array(fc.array(fc.oneof(fc.double(), fc.jsonValue()), { maxLength: 4 }), { maxLength: 4 }), fermi: fc.oneof(fc.double(), fc.jsonValue()) }, { requiredKeys: [] })
      .map((v) => JSON.stringify(v)),
  );
  it('10,000 generated files are read or refused with a named field', () => {
    fc.assert(
      fc.property(malformed, (input) => {
        try {
          const reference = parseReferenceBandsText(input, 'fuzz.json');
          expect(reference.energies.length).toBe(reference.count * reference.bands);
          for (let k = 0; k < reference.count; k++) {
            for (let b = 0; b < reference.bands; b++) {
              const e = reference.energies[k * reference.bands + b];
              expect(Number.isFinite(e)).toBe(true);
              if (b > 0) expect(e).toBeGreaterThanOrEqual(reference.energies[k * reference.bands + b - 1]);
            }
          }
        } catch (error) {
          if (!(error instanceof ValidationError)) throw error;
          expect(error.message).toMatch(/^invalid .+: .* \(.+\)$/);
          expect(error.field.length).toBeGreaterThan(0);
        }
      }),
      { numRuns: 10_000 },
    );
  });
});
