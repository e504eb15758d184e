import { describe, expect, it } from 'vitest';
import { changeSupercell, resolveSheetChoice, toggleSite } from '../../src/app/sheetChoice.ts';
import { canonicalForm } from '../../src/enumerate/index.ts';
import { makePattern } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';

const full3x3 = makePattern({ bond: 1.69, supercell: [[3, 0], [0, 3]], vacancies: [] });

describe('toggleSite(pattern, i, j)', () => {
  it('one hole in the 3×3 cell is the α sheet, η = 1/9 (Tang & Ismail-Beigi, PRL 99, 115501 (2007))', () => {
    const alpha = findSheetPreset('alpha')!.pattern;
    const toggled = toggleSite(full3x3, 4, -2); // any representative of a site
    expect(toggled.vacancies).toEqual([[1, 1]]);
    const resolved = resolveSheetChoice({ kind: 'pattern', label: 't', pattern: toggled });
    expect(resolved.eta).toBeCloseTo(1 / 9, 15);
    expect(canonicalForm(resolved.cellPattern!)).toBe(canonicalForm(alpha));
    expect(toggleSite(toggled, 1, 1).vacancies).toEqual([]);
  });

  it('refuses to remove the last atom', () => {
    const one = makePattern({ bond: 1.69, supercell: [[1, 0], [0, 1]], vacancies: [] });
    expect(() => toggleSite(one, 0, 0)).toThrow(/invalid site: "0,0" \(the last atom/);
  });
});

describe('changeSupercell(pattern, rows)', () => {
  it('keeps a pattern in a cell made of its periods (the honeycomb in a 6-site cell)', () => {
    const honeycomb = findSheetPreset('honeycomb')!.pattern;
    const { pattern, kept } = changeSupercell(honeycomb, [[3, 0], [2, 2]]);
    expect(kept).toBe(true);
    expect(pattern.vacancies).toHaveLength(2);
    expect(canonicalForm(resolveSheetChoice({ kind: 'pattern', label: 'h', pattern }).cellPattern!)).toBe(canonicalForm(honeycomb));
  });

  it('says when the pattern cannot repeat in the new cell', () => {
    const alpha = findSheetPreset('alpha')!.pattern;
    expect(changeSupercell(alpha, [[2, 0], [0, 2]]).kept).toBe(false);
    expect(() => changeSupercell(alpha, [[1, 2], [2, 4]])).toThrow(/invalid supercell: .*zero area/);
  });

  it('the smallest cell of a preset is the preset itself, so its figures match `fill NAME`', () => {
    for (const name of ['delta6', 'alpha', 'beta12', 'chi3', 'honeycomb']) {
      const preset = findSheetPreset(name)!.pattern;
      expect(resolveSheetChoice({ kind: 'preset', name }).cellPattern!.supercell).toEqual(preset.supercell);
      expect(resolveSheetChoice({ kind: 'preset', name }).cellPattern!.vacancies).toEqual(preset.vacancies);
    }
  });
});
