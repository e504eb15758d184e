import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ValidationError } from '../../src/validate/invalid.ts';
import { validateSubstrate } from '../../src/substrate/substrates.ts';

// Fuzzing (fast-check): 10,000 substrate objects with one field replaced by anything; each is either accepted with
// finite numbers in range or refused by a ValidationError in the project's form naming a field — never another
// exception. A further 10,000 arbitrary JSON values are refused the same way unless they happen to be valid.
const VALID = {
  name: 'x111', title: 'X(111)', lattice_constant: 4, lattice_source: 's', work_function: 5, work_function_source: 's',
  adsorption_height: { value: 2, source: 's' },
};
const FIELDS = [...Object.keys(VALID), 'adsorption_height_note'];

function check(value: unknown): void {
  try {
    const s = validateSubstrate(value, 'file');
    expect(Number.isFinite(s.nnDistance) && s.nnDistance > 0).toBe(true);
    expect(s.workFunction > 1 && s.workFunction < 8).toBe(true);
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    expect(error.message).toMatch(/^invalid file\S*: .* \(.+\)$/);
  }
}

describe('validateSubstrate(value) under fuzzing', () => {
  it('10,000 objects with one field replaced are accepted in range or refused with a named field', () => {
    fc.assert(fc.property(fc.constantFrom(...FIELDS), fc.jsonValue(), (field, replacement) => {
      check({ ...VALID, [field]: replacement });
    }), { numRuns: 10_000 });
  });
  it('10,000 arbitrary JSON values are refused with a named field (or accepted when valid)', () => {
    fc.assert(fc.property(fc.jsonValue(), check), { numRuns: 10_000 });
  });
});
