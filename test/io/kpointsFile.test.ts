import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ValidationError } from '../../src/validate/invalid.ts';
import { parseKpointsObject, parseKpointsText } from '../../src/io/kpointsFile.ts';

describe('parseKpointsText(text)', () => {
  it('returns kx, ky interleaved (DESIGN.md k-points contract)', () => {
    expect(Array.from(parseKpointsText('{"kpoints": [[0, 0], [1.5, -0.25]]}'))).toEqual([0, 0, 1.5, -0.25]);
  });

  it('names the field of every refusal', () => {
    expect(() => parseKpointsText('[', 'k.json')).toThrow(/^invalid k.json: "\[" \(not JSON/);
    expect(() => parseKpointsText('{"kpoints": []}')).toThrow('invalid kpoints: [] (empty)');
    expect(() => parseKpointsText('{"kpoints": [[0]]}')).toThrow('invalid kpoints[0]: [0] (must be [kx, ky])');
    expect(() => parseKpointsText('{"kpoints": [[0, 1e5]]}')).toThrow(/^invalid kpoints\[0\]\[1\]: 100000/);
    expect(() => parseKpointsText('{"kpoints": [[0, 0]], "weights": [1]}')).toThrow(/^invalid weights: \[1\] \(unknown field/);
    expect(() => parseKpointsObject({ kpoints: [[0, Number.NaN]] })).toThrow('invalid kpoints[0][1]: NaN (not a finite number)');
  });
});

// Fuzzing: 10,000 generated documents, each parsed into finite numbers or refused with a named field.
describe('k-points file fuzzing', () => {
  it('never throws anything but a ValidationError, never returns NaN', () => {
    const number = fc.oneof(fc.double(), fc.integer(), fc.constantFrom(1e300, -0, 1e4, 1e4 + 1));
    const point = fc.oneof(fc.tuple(number, number), fc.array(fc.anything(), { maxLength: 3 }), fc.anything());
    const document = fc.oneof(
      fc.record({ kpoints: fc.array(point, { maxLength: 6 }) }),
      fc.dictionary(fc.string({ maxLength: 8 }), fc.anything(), { maxKeys: 3 }),
      fc.anything(),
    );
    fc.assert(
      fc.property(document, fc.boolean(), (value, asText) => {
        try {
          let text: string | undefined;
          try {
            text = JSON.stringify(value);
          } catch {
            text = undefined;
          }
          const out = asText && text !== undefined ? parseKpointsText(text) : parseKpointsObject(value);
          for (const k of out) expect(Number.isFinite(k)).toBe(true);
        } catch (error) {
          if (!(error instanceof ValidationError)) throw error;
          expect(error.message).toMatch(/^invalid \S/);
          expect(error.message).not.toMatch(/[\n\r]/);
        }
      }),
      { numRuns: 10_000 },
    );
  });
});
