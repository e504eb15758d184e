import { describe, expect, it } from 'vitest';
import { matchBands } from '../../../src/learn/calibrate/bandMatch.ts';
import { checkBlock, checkKpointsFitSheet } from '../../../src/learn/calibrate/referenceChecks.ts';
import { autoPath } from '../../../src/tb/kspacePath.ts';
import { presetSheet } from '../../tb/fixtures.ts';
import { refusal } from '../../io/refusal.ts';
import { BUCKLED } from './helpers.ts';

const FIELDS = { model: '--model-bands', reference: '--reference-bands', file: 'b.json' };

describe('checkKpointsFitSheet(sheet, reference)', () => {
  it('accepts the sheet\'s own path and refuses the path of a cell with a larger zone (δ6 on α: the primitive triangular zone is 8 times the α zone; common practice)', () => {
    const alpha = presetSheet('alpha');
    const own = autoPath(alpha.cell, 30).kpoints;
    expect(() => checkKpointsFitSheet(alpha, { count: 30, bands: 1, kpoints: own, energies: new Float64Array(30) })).not.toThrow();
    const primitive = autoPath(presetSheet('delta6').cell, 30).kpoints;
    expect(refusal(() => checkKpointsFitSheet(alpha, { count: 30, bands: 1, kpoints: primitive, energies: new Float64Array(30) })))
      .toMatch(/^invalid kpoints\[\d+\]: \[.*\] \(outside 1\.5× the first Brillouin zone of this sheet/);
  });
});

describe('checkBlock(sheet, block, field)', () => {
  it('refuses a σ or π block on a buckled sheet, accepts it on a planar one', () => {
    expect(refusal(() => checkBlock(BUCKLED, 'pi', '--block'))).toBe('invalid --block: "pi" (the sheet is buckled, so its σ and π states mix: only "full" matches its bands)');
    expect(() => checkBlock(presetSheet('alpha'), 'pi', '--block')).not.toThrow();
  });
});

describe('matchBands(modelBands, referenceBands, request, fields)', () => {
  it('matches the lowest bands by default, or the runs asked for (1-based, inclusive)', () => {
    expect(matchBands(20, 16, {}, FIELDS)).toEqual({ modelFirst: 0, referenceFirst: 0, count: 16 });
    expect(matchBands(20, 30, {}, FIELDS)).toEqual({ modelFirst: 0, referenceFirst: 0, count: 20 });
    expect(matchBands(20, 30, { model: [3, 20], reference: [1, 18] }, FIELDS)).toEqual({ modelFirst: 2, referenceFirst: 0, count: 18 });
    expect(matchBands(20, 30, { reference: [5, 8] }, FIELDS)).toEqual({ modelFirst: 0, referenceFirst: 4, count: 4 });
  });

  it('refuses runs the sheet or the file do not have, or of unequal lengths, naming the field', () => {
    expect(refusal(() => matchBands(20, 16, { model: [1, 24] }, FIELDS, '20 bands (4 per atom)'))).toBe('invalid --model-bands: "1-24" (the sheet\'s model has 20 bands (4 per atom))');
    expect(refusal(() => matchBands(20, 16, { reference: [1, 17] }, FIELDS))).toBe('invalid --reference-bands: "1-17" (the reference file has 16 bands per k-point)');
    expect(refusal(() => matchBands(20, 16, { model: [1, 10], reference: [1, 9] }, FIELDS))).toMatch(/^invalid --reference-bands: "1-9" \(9 bands, but --model-bands 1-10 has 10/);
    expect(refusal(() => matchBands(20, 16, { model: [1, 20] }, FIELDS))).toMatch(/^invalid --model-bands: "1-20" \(20 bands, but the reference file has 16/);
  });
});
