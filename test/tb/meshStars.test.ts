/**
 * One diagonalisation per star of the mesh (src/tb/meshStars.ts) against solving every point: the bands of a
 * sheet are invariant under its symmetry operations and under k → −k (analytic: a symmetry {O|t} is a unitary
 * change of basis of H(k) that takes k to O·k; H(−k) = H(k)* for real Slater–Koster blocks). So the spectra must
 * agree to rounding, and the star sizes must follow the point group (analytic counts on the mesh).
 */
import { describe, expect, it } from 'vitest';
import { sheetOperations } from '../../src/lattice/sheetSymmetry.ts';
import type { Sheet } from '../../src/lattice/sheet.ts';
import { meshSpectrum } from '../../src/tb/meshSpectrum.ts';
import { meshStars } from '../../src/tb/meshStars.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { HARRISON_1980, maxDifference, patternSheet, presetSheet } from './fixtures.ts';

function buckle(sheet: Sheet, heights: (atom: number) => number): Sheet {
  return { ...sheet, atoms: sheet.atoms.map((a, i) => [a[0], a[1], heights(i)] as [number, number, number]) };
}

const SHEETS: [string, Sheet][] = [
  ['alpha (6mm)', presetSheet('alpha')],
  ['beta12 (2mm)', presetSheet('beta12')],
  ['chi3', presetSheet('chi3')],
  ['honeycomb (6mm)', presetSheet('honeycomb')],
  ['one hole in √7×√7 (chiral, 6)', patternSheet(1.7, [[7, 0], [2, 1]], [[0, 0]])],
  ['two holes, oblique cell', patternSheet(1.7, [[5, 0], [2, 2]], [[0, 0], [2, 1]])],
  ['beta12 buckled alternately', buckle(presetSheet('beta12'), (i) => (i % 2 === 0 ? 0.2 : -0.2))],
  ['alpha with one atom raised', buckle(presetSheet('alpha'), (i) => (i === 0 ? 0.3 : 0))],
];

describe('meshSpectrum by stars', () => {
  it.each(SHEETS)('%s: the same energies and σ shares as with time reversal alone (to 1e-10)', (_, sheet) => {
    const model = new TightBindingModel(sheet, HARRISON_1980);
    for (const mesh of [6, 7]) {
      const stars = meshSpectrum(model, { mesh });
      const pairs = meshSpectrum(model, { mesh, symmetry: false });
      expect(maxDifference(stars.energies, pairs.energies)).toBeLessThan(1e-10);
      expect(maxDifference(stars.sigmaWeight, pairs.sigmaWeight)).toBeLessThan(1e-10);
    }
  });

  it('stars of a 6mm sheet on a 6×6 mesh: Γ alone, the three M together, K with K′, every other point in a star of 6 or 12 (analytic, group 6mm of order 12)', () => {
    const sheet = presetSheet('alpha');
    expect(sheetOperations(sheet)).toHaveLength(12);
    const stars = meshStars(sheet, 6);
    expect(stars.order).toBe(12);
    const sizes = new Map<number, number>();
    for (let p = 0; p < 36; p++) sizes.set(stars.starOf[p], (sizes.get(stars.starOf[p]) ?? 0) + 1);
    const bySize = [...sizes.values()].sort((a, b) => a - b);
    expect(bySize.slice(0, 3)).toEqual([1, 2, 3]);
    expect(bySize.slice(3).every((size) => size === 6 || size === 12)).toBe(true);
    expect(bySize.reduce((a, b) => a + b, 0)).toBe(36);
    expect(sizes.get(stars.starOf[0])).toBe(1); // Γ
    expect(sizes.get(stars.starOf[3 * 6])).toBe(3); // b1/2, an M point
  });

  it('time reversal alone pairs k with −k: (M² + 4)/2 stars on an even mesh, (M² + 1)/2 on an odd one (analytic)', () => {
    const identity = [{ matrix: [1, 0, 0, 1] as [number, number, number, number], kind: 'rotation' as const, degrees: 0, atomMap: new Int32Array(0) }];
    expect(meshStars(presetSheet('beta12'), 6, identity).representatives.length).toBe((36 + 4) / 2);
    expect(meshStars(presetSheet('beta12'), 7, identity).representatives.length).toBe((49 + 1) / 2);
  });
});
