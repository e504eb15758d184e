import { describe, expect, it } from 'vitest';
import { canonicalForm } from '../../src/enumerate/canonical.ts';
import { presetPhase } from '../../src/enumerate/phase.ts';
import { makePattern } from '../../src/lattice/pattern.ts';
import { SHEET_PRESETS } from '../../src/lattice/presets.ts';

describe('presetPhase(canonical)', () => {
  it('names each published structure written here in a cell, origin and orientation of its own', () => {
    // Written from the published descriptions, not from the preset files, so a wrong preset or a canonical form
    // that depends on how a pattern is written fails here:
    // α: one hole in a 3×3 cell (Tang & Ismail-Beigi, PRL 99, 115501 (2007)) — rows 3·a2 and 3·a2 − 3·a1;
    // β12: one hole per rectangular 3d × √3d cell (Feng et al., Nat. Chem. 8, 563 (2016)) — doubled along 3d, shifted;
    // χ3: one hole per 5 sites with no two holes adjacent (Feng et al. 2016, from memory). Worked by hand: of the
    //     5-site cells (5,0),(b,1) and (1,0),(0,5), b = 0 and 4 and the last put a nearest-neighbour vector (a2,
    //     a2 − a1, a1) among the hole images; b = 1, 2, 3 keep holes apart and are one pattern (b = 3 is the
    //     mirror image of b = 1 across a1, b = 2 its 60° rotation) — here b = 1;
    // honeycomb: one hole per √3×√3 cell (the boron layer of MgB2, common practice) — rows 2a1 − a2, a1 + a2;
    // δ6: no hole — in a 2×2 cell, which the canonical form must reduce to the one-site cell.
    const written: [string, Parameters<typeof makePattern>[0]][] = [
      ['alpha', { bond: 1.69, supercell: [[0, 3], [-3, 3]], vacancies: [[1, 1]] }],
      ['beta12', { bond: 1.69, supercell: [[6, 0], [-1, 2]], vacancies: [[2, 1], [5, 1]] }],
      ['chi3', { bond: 1.69, supercell: [[5, 0], [1, 1]], vacancies: [[2, 3]] }],
      ['honeycomb', { bond: 1.69, supercell: [[2, -1], [1, 1]], vacancies: [[5, 7]] }],
      ['delta6', { bond: 1.69, supercell: [[2, 0], [0, 2]], vacancies: [] }],
    ];
    for (const [name, parts] of written) expect(presetPhase(canonicalForm(makePattern(parts))), name).toBe(name);
    expect(written.map(([name]) => name).sort()).toEqual(SHEET_PRESETS.map((p) => p.name).sort());
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
