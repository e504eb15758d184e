import { describe, expect, it } from 'vitest';
import { canonicalForm } from '../../src/enumerate/canonical.ts';
import { presetPhase } from '../../src/enumerate/phase.ts';
import { makePattern } from '../../src/lattice/pattern.ts';
import { SHEET_PRESETS } from '../../src/lattice/presets.ts';

describe('presetPhase(canonical)', () => {
  it('names every preset by its own canonical form, and the forms are distinct', () => {
    for (const preset of SHEET_PRESETS) expect(presetPhase(canonicalForm(preset.pattern))).toBe(preset.name);
    expect(new Set(SHEET_PRESETS.map((p) => canonicalForm(p.pattern))).size).toBe(SHEET_PRESETS.length);
  });

  it('recognises β12 drawn rotated by 60° in a doubled cell (rows (3, 0), (−1, 2) → a2, a2 − a1 images)', () => {
    // R60 maps (3, 0) → (0, 3) and (−1, 2) → (−2, 1); doubling the first row repeats the hole at R60·(3, 0).
    const pattern = makePattern({ bond: 1.69, supercell: [[0, 6], [-2, 1]], vacancies: [[0, 0], [0, 3]] });
    expect(presetPhase(canonicalForm(pattern))).toBe('beta12');
  });

  it('names nothing else', () => {
    expect(presetPhase('2,0,1:0')).toBeUndefined();
    expect(presetPhase('not a form')).toBeUndefined();
  });
});
