import { describe, expect, it } from 'vitest';
import * as lacuna from '../src/index.ts';

describe('the library entry (package "exports")', () => {
  it('exposes sheets, enumeration and the solver, usable without the CLI', () => {
    const alpha = lacuna.findSheetPreset('alpha')!;
    const sheet = lacuna.patternToSheet(alpha.pattern);
    // α sheet: 8 atoms per 3×3 cell (Tang & Ismail-Beigi, PRL 99, 115501 (2007)).
    expect(sheet.atoms).toHaveLength(8);
    const found = [...lacuna.enumerateStructures({ sites: [9, 9], holes: [1, 1], isolated: true })];
    expect(found.some((s) => s.phase === 'alpha')).toBe(true);
    const result = lacuna.fill(new lacuna.TightBindingModel(sheet, lacuna.findParameterPreset('harrison1980')!), { mesh: 6 });
    expect(result.electronsPerAtom).toBeCloseTo(3, 9); // neutral boron: 3 valence electrons (common practice)
    expect(typeof lacuna.parseSheetText).toBe('function');
    expect(typeof lacuna.sheetToCif).toBe('function');
  });
});
