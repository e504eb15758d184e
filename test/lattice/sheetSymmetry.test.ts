import { describe, expect, it } from 'vitest';
import { makePattern, patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { sheetSymmetry } from '../../src/lattice/sheetSymmetry.ts';

describe('sheetSymmetry(sheet)', () => {
  it('the honeycomb has 6mm: rotations by 60°…300°, six mirror lines 30° apart (analytic)', () => {
    const s = sheetSymmetry(patternToSheet(findSheetPreset('honeycomb')!.pattern));
    expect(s.rotations).toEqual([60, 120, 180, 240, 300]);
    expect(s.mirrors).toHaveLength(6);
  });
  it('β12 has 2mm: a 2-fold axis and mirror lines along both axes of its rectangular 3d × √3d cell with one hole (analytic)', () => {
    const s = sheetSymmetry(patternToSheet(findSheetPreset('beta12')!.pattern));
    expect(s.rotations).toEqual([180]);
    expect(s.mirrors).toEqual([0, 90]);
  });
  it('one hole per (√7×√7)R19.1° cell is chiral: point group 6, no mirror line (analytic: the superlattice mirrors lie at 19.1° + k·30°, the lattice mirrors at k·30°)', () => {
    const pattern = makePattern({ bond: 1.69, supercell: [[7, 0], [2, 1]], vacancies: [[0, 0]] });
    const s = sheetSymmetry(patternToSheet(pattern));
    expect(s.rotations).toEqual([60, 120, 180, 240, 300]);
    expect(s.mirrors).toEqual([]);
  });
});
