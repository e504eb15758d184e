import { describe, expect, it } from 'vitest';
import { ValidationError } from '../../src/validate/invalid.ts';
import { SUBSTRATES, findSubstrate, requireSubstrate, validateSubstrate } from '../../src/substrate/substrates.ts';

describe('substrate presets', () => {
  it('are the four metals of the contract (DESIGN.md: ag111, cu111, au111, al111)', () => {
    expect(SUBSTRATES.map((s) => s.name).sort()).toEqual(['ag111', 'al111', 'au111', 'cu111']);
  });

  // fcc lattice constants, CRC Handbook of Chemistry and Physics (room temperature; values as given in issue 7,
  // from memory); nearest-neighbour distance a/√2 (fcc geometry, analytic).
  it.each([
    ['ag111', 4.0853, 2.88874],
    ['cu111', 3.6149, 2.55612],
    ['au111', 4.0782, 2.88372],
    ['al111', 4.0495, 2.86343],
  ])('%s: a = %f Å, nearest neighbours %f Å (CRC Handbook, from memory)', (name, a, nn) => {
    const s = findSubstrate(name)!;
    expect(s.latticeConstant).toBe(a);
    expect(s.nnDistance).toBeCloseTo(nn, 4);
  });

  // Work functions of the (111) faces, CRC Handbook "Electron work function of the elements" (from memory).
  it.each([
    ['al111', 4.24], ['ag111', 4.74], ['cu111', 4.94], ['au111', 5.31],
  ])('%s: W = %f eV (CRC Handbook, from memory)', (name, w) => {
    expect(findSubstrate(name)!.workFunction).toBe(w);
  });

  it('every number carries its source', () => {
    for (const s of SUBSTRATES) {
      expect(s.latticeSource).toMatch(/CRC/);
      expect(s.workFunctionSource).toMatch(/CRC/);
      if (s.adsorptionHeight) expect(s.adsorptionHeight.source).toMatch(/estimate/);
      else expect(s.adsorptionHeightNote).toBeTruthy();
    }
  });

  it('requireSubstrate lists the substrates that exist when a name is unknown', () => {
    expect(() => requireSubstrate('pt111', '--substrate')).toThrow('invalid --substrate: "pt111" (unknown substrate; substrates: al111, ag111, cu111, au111)');
  });

  it('validateSubstrate names the field that is wrong', () => {
    const good = { name: 'x111', title: 'X(111)', lattice_constant: 4, lattice_source: 's', work_function: 5, work_function_source: 's' };
    expect(validateSubstrate(good).nnDistance).toBeCloseTo(4 / Math.SQRT2, 12);
    expect(() => validateSubstrate({ ...good, lattice_constant: -1 })).toThrow('invalid lattice_constant: -1 (must lie between 2 and 8 Å)');
    expect(() => validateSubstrate({ ...good, work_function: 'high' })).toThrow('invalid work_function: "high" (not a number)');
    expect(() => validateSubstrate({ ...good, adsorption_height: { value: 2 } })).toThrow('invalid adsorption_height.source: missing (not a non-empty string)');
    expect(() => validateSubstrate({ ...good, name: 'Bad Name' })).toThrow(ValidationError);
    expect(() => validateSubstrate([], 'file.json')).toThrow('invalid file.json: [] (not a JSON object)');
  });
});
