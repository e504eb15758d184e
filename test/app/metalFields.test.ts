import { describe, expect, it } from 'vitest';
import { readMetalField, readMetalFields } from '../../src/app/metalFields.ts';

const texts = (over: Partial<Record<'sheetWorkFunction' | 'dipole' | 'distance' | 'd0', string>> = {}) => ({ sheetWorkFunction: '', dipole: '', distance: '', d0: '', ...over });

describe('readMetalField(field, text)', () => {
  it('reads numbers, empty as the default (undefined), and names the field when refusing', () => {
    expect(readMetalField('dipole', ' -0.3 ')).toBe(-0.3);
    expect(readMetalField('distance', '')).toBeUndefined();
    expect(() => readMetalField('sheetWorkFunction', 'abc')).toThrow('invalid sheet work function W_S: "abc" (not a number)');
    expect(() => readMetalField('distance', '12')).toThrow('invalid distance d: "12" (must lie in [0.5, 10] Å)');
  });
});

describe('readMetalFields(texts, current, edited)', () => {
  it('takes the good fields and reports the bad ones, leaving those at their current value', () => {
    const { model, errors } = readMetalFields(texts({ sheetWorkFunction: '5.1', dipole: 'lots', distance: '3' }), { dipole: 0.4 });
    expect(model).toEqual({ sheetWorkFunction: 5.1, dipole: 0.4, distance: 3 });
    expect(errors.map((e) => e.message)).toEqual(['invalid interface dipole Δc: "lots" (not a number)']);
  });

  it('refuses the edited field of a pair with d < d0 (d − d0 is a thickness; Giovannetti et al., PRL 101, 026803 (2008))', () => {
    const byD0 = readMetalFields(texts({ distance: '3', d0: '3.2' }), { distance: 3 }, 'd0');
    expect(byD0.model).toEqual({ distance: 3 });
    expect(byD0.errors[0].message).toMatch(/^invalid d0: "3.2" \(the distance d = 3 Å must be at least d0 = 3.2 Å/);
    const byDistance = readMetalFields(texts({ distance: '1' }), {}, 'distance');
    expect(byDistance.model).toEqual({});
    expect(byDistance.errors[0].field).toBe('distance d');
  });
});
