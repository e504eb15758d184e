import { describe, expect, it } from 'vitest';
import { ValidationError } from '../../src/validate/invalid.ts';
import { parseParameterFile } from '../../src/io/paramsFile.ts';

// The contract's example file (DESIGN.md, parameter file), with values of the harrison1980 preset.
const VALID = {
  name: 'mine',
  source: 'my fit',
  onsite: { s: -12.54, p: -6.64 },
  hopping: { ss_sigma: -3.7, sp_sigma: 4.9, pp_sigma: 8.6, pp_pi: -2.2 },
  d0: 1.69,
  exponent: 2,
  cutoff: 2.1,
};

function errorOf(text: string): ValidationError {
  try {
    parseParameterFile(text);
  } catch (error) {
    if (error instanceof ValidationError) return error;
    throw error;
  }
  throw new Error('accepted');
}

const VALID_TEXT_WITH = (member: string) => JSON.stringify(VALID).replace('{', `{${member}`);
const change = (patch: Record<string, unknown>) => JSON.stringify({ ...VALID, ...patch });

describe('parseParameterFile(text)', () => {
  it('reads the contract form, with an optional provenance', () => {
    expect(parseParameterFile(JSON.stringify(VALID))).toEqual(VALID);
    expect(parseParameterFile(change({ provenance: 'notes' })).provenance).toBe('notes');
  });

  it('names the field of every kind of mistake', () => {
    const cases: [string, RegExp][] = [
      ['{', /^invalid parameters: "\{" \(not valid JSON: /],
      ['[1]', /^invalid parameters: \[1\] \(not a JSON object\)$/],
      [change({ d0: 0 }), /^invalid d0: 0 \(must lie in \(0, 10\] Å\)$/],
      [change({ d0: -1 }), /^invalid d0: -1/],
      [change({ cutoff: 0 }), /^invalid cutoff: 0/],
      [change({ cutoff: 1000 }), /^invalid cutoff: 1000/],
      [change({ exponent: -1 }), /^invalid exponent: -1/],
      [change({ exponent: '2' }), /^invalid exponent: "2" \(expected a number\)$/],
      [change({ name: '' }), /^invalid name: "" \(must not be empty\)$/],
      [change({ name: 7 }), /^invalid name: 7 \(expected a string\)$/],
      [change({ colour: 'red' }), /^invalid colour: "red" \(unknown field/],
      [VALID_TEXT_WITH('"__proto__":{"d0":1},'), /^invalid __proto__: \{"d0":1\} \(unknown field/],
      [VALID_TEXT_WITH('"":1,'), /^invalid \[""\]: 1 \(unknown field/],
      [change({ onsite: { s: 1 } }), /^invalid onsite\.p: missing \(required field\)$/],
      [change({ onsite: { s: 1, p: 2, d: 3 } }), /^invalid onsite\.d: 3 \(unknown field/],
      [change({ hopping: { ...VALID.hopping, pp_pi: null } }), /^invalid hopping\.pp_pi: null \(expected a number\)$/],
      [change({ hopping: { ...VALID.hopping, sp_sigma: 1000 } }), /^invalid hopping\.sp_sigma: 1000 \(\|value\| must be at most 100 eV\)$/],
      [change({ hopping: 3 }), /^invalid hopping: 3 \(not a JSON object\)$/],
      [JSON.stringify({ ...VALID, d0: undefined }), /^invalid d0: missing \(required field\)$/],
      [change({}).replace('"d0":1.69', '"d0":1e400'), /^invalid d0: Infinity \(must be finite\)$/],
    ];
    for (const [text, pattern] of cases) expect(errorOf(text).message).toMatch(pattern);
  });
});
