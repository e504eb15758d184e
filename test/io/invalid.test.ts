import { describe, expect, it } from 'vitest';
import { fieldPath, invalid, show, ValidationError } from '../../src/validate/invalid.ts';

describe('show(value)', () => {
  it('renders numbers, strings, missing values and NaN for humans', () => {
    expect(show(1.5)).toBe('1.5');
    expect(show(Number.NaN)).toBe('NaN');
    expect(show(undefined)).toBe('missing');
    expect(show('abc')).toBe('"abc"');
    expect(show([1, [2, 3]])).toBe('[1,[2,3]]');
  });

  it('cuts deep, wide and long values instead of overflowing the stack', () => {
    let deep: unknown = [];
    for (let i = 0; i < 100_000; i++) deep = [deep];
    expect(show(deep)).toBe('[[[["…"]]]]');
    expect(show([1, 2, 3, 4, 5, 6, 7, 8])).toBe('[1,2,3,4,5,6,"…"]');
    expect(show('x'.repeat(500)).length).toBeLessThanOrEqual(80);
    const cyclic: Record<string, unknown> = {};
    cyclic.self = cyclic;
    expect(show(cyclic)).toBe('{"self":{"self":{"self":{"…":"…"}}}}');
    const trap = { get x() { throw new Error('no'); } };
    expect(show(trap)).toBe('[unreadable]');
  });
});

describe('invalid(field, value, why)', () => {
  it('throws the one error style, keeping the parts', () => {
    // The form is the project's own rule (STYLE.md: "invalid <field>: <value> (<why>)").
    expect.assertions(4);
    expect(() => invalid('atoms[2][0]', 'x', 'not a number')).toThrow(ValidationError);
    try {
      invalid('atoms[2][0]', 'x', 'not a number');
    } catch (error) {
      expect(error).toBeInstanceOf(ValidationError);
      expect((error as ValidationError).message).toBe('invalid atoms[2][0]: "x" (not a number)');
      expect((error as ValidationError).field).toBe('atoms[2][0]');
    }
  });

  it('keeps every message on one line, whatever the reason quotes', () => {
    const error = new ValidationError('sheet', '"x"', 'not JSON: Unexpected token in\nline 2\tcol 3');
    expect(error.message).toBe('invalid sheet: "x" (not JSON: Unexpected token in\\nline 2\\tcol 3)');
    expect(error.message).not.toMatch(/[\n\r\t]/);
  });

  it('fieldPath quotes keys that are not plain names', () => {
    expect(fieldPath('', 'cell')).toBe('cell');
    expect(fieldPath('hopping', 'ss_sigma')).toBe('hopping.ss_sigma');
    expect(fieldPath('', ' ')).toBe('[" "]');
    expect(fieldPath('onsite', '')).toBe('onsite[""]');
  });
});
