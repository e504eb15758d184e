/**
 * Property tests: the sheet forms round-trip through their text (src/io/sheetJson.ts → src/io/sheetFile.ts).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseSheetText } from '../../src/io/sheetFile.ts';
import { patternToJson, sheetToJson } from '../../src/io/sheetJson.ts';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import type { Sheet } from '../../src/lattice/sheet.ts';
import { motionArb, moveSheet, patternArb } from '../lattice/arbitraries.ts';
import { patternsEquivalent, ROTATIONS } from '../lattice/equivalent.ts';

/** Plain data with −0 folded to 0 (JSON text cannot tell them apart). */
const plain = (value: unknown) => JSON.parse(JSON.stringify(value)) as unknown;
const named = fc.option(fc.string({ maxLength: 30 }), { nil: undefined });

describe('sheet forms round-trip', () => {
  it('pattern → explicit → JSON text → parse: the same sheet, number for number', () => {
    fc.assert(fc.property(patternArb(24), named, (pattern, name) => {
      const sheet = patternToSheet(name === undefined ? pattern : { ...pattern, name });
      const parsed = parseSheetText(sheetToJson(sheet));
      expect(parsed.form).toBe('explicit');
      expect(parsed.sheet).toEqual(sheet);
    }), { numRuns: 500 });
  });

  it('pattern → pattern text → parse: the same pattern', () => {
    fc.assert(fc.property(patternArb(24), named, (pattern, name) => {
      const given = name === undefined ? pattern : { ...pattern, name };
      const parsed = parseSheetText(patternToJson(given));
      expect(parsed.form).toBe('pattern');
      expect(plain(parsed.pattern)).toEqual(plain(given));
      expect(parsed.sheet).toEqual(patternToSheet(given));
    }), { numRuns: 500 });
  });

  it('explicit sheets in any cell and orientation: JSON text → parse gives the same sheet and an equivalent pattern', () => {
    fc.assert(fc.property(patternArb(16), motionArb, (pattern, motion) => {
      const sheet: Sheet = moveSheet(patternToSheet(pattern), { ...motion, lift: 0 });
      const parsed = parseSheetText(sheetToJson(sheet));
      expect(parsed.sheet).toEqual(sheet);
      // With two atoms lattice neighbours the recognised bond is the pattern's and the patterns are equivalent;
      // otherwise a coarser lattice may describe it (src/lattice/recognise.ts).
      if (parsed.pattern && parsed.pattern.bond < pattern.bond * 1.0001) {
        expect(patternsEquivalent(parsed.pattern, pattern, ROTATIONS, 1e-9)).toBe(true);
      }
    }), { numRuns: 300 });
  });
});
