/**
 * The real form of H(k) for sheets with a 2-fold axis (src/tb/realForm.ts): Vᴴ·H·V must be real and have the
 * eigenvalues of H (analytic: C₂ combined with time reversal is an antiunitary symmetry squaring to +1, so a real
 * basis exists — Wigner's theorem), checked at random k on sheets of several symmetries, planar and buckled;
 * V must be unitary; eigenvalues of the real matrices checked against ml-matrix (general-purpose reference library).
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import type { Sheet } from '../../src/lattice/sheet.ts';
import { HermitianEigensolver } from '../../src/linalg/eigh.ts';
import { SymmetricEigenvalues } from '../../src/linalg/symmetricEigenvalues.ts';
import { computeBands, diagonaliseRows } from '../../src/tb/bands.ts';
import { type HamiltonianBlock, TightBindingModel } from '../../src/tb/model.ts';
import { realForm } from '../../src/tb/realForm.ts';
import { HARRISON_1980, maxDifference, patternSheet, presetSheet } from './fixtures.ts';

function buckle(sheet: Sheet, heights: (atom: number) => number): Sheet {
  return { ...sheet, atoms: sheet.atoms.map((a, i) => [a[0], a[1], heights(i)] as [number, number, number]) };
}

const beta12 = presetSheet('beta12');
const CASES: [string, Sheet, HamiltonianBlock[]][] = [
  ['alpha', presetSheet('alpha'), ['sigma', 'pi']],
  ['beta12', beta12, ['sigma', 'pi']],
  ['chi3', presetSheet('chi3'), ['sigma', 'pi']],
  ['honeycomb', presetSheet('honeycomb'), ['sigma', 'pi']],
  ['one hole in √7×√7 (chiral)', patternSheet(1.7, [[7, 0], [2, 1]], [[0, 0]]), ['sigma', 'pi']],
  ['two holes, oblique cell', patternSheet(1.7, [[5, 0], [2, 2]], [[0, 0], [2, 1]]), ['sigma', 'pi', 'full']],
];

/** Deterministic k-points (a small linear congruential sequence), Å⁻¹. */
function kpoints(count: number): [number, number][] {
  let seed = 12345;
  const next = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) * 4 - 2;
  return Array.from({ length: count }, () => [next(), next()]);
}

describe('realForm', () => {
  it.each(CASES)('%s: Vᴴ·H(k)·V is real with the eigenvalues of H(k) (to 1e-10)', (_, sheet, blocks) => {
    const model = new TightBindingModel(sheet, HARRISON_1980);
    for (const block of blocks) {
      const form = realForm(model, block);
      expect(form).toBeDefined();
      const n = model.size(block);
      const re = new Float64Array(n * n);
      const im = new Float64Array(n * n);
      const out = new Float64Array(n * n);
      const outIm = new Float64Array(n * n);
      const complex = new Float64Array(n);
      const real = new Float64Array(n);
      for (const [kx, ky] of kpoints(4)) {
        model.hamiltonian(kx, ky, block, re, im);
        form!.transform(re, im, out, outIm);
        expect(Math.max(...outIm.map(Math.abs))).toBeLessThan(1e-12);
        new HermitianEigensolver(n).eigenvalues(re, im, complex);
        new SymmetricEigenvalues(n).eigenvalues(out, real);
        expect(maxDifference(real, complex)).toBeLessThan(1e-10);
      }
    }
  });

  it('buckled β12 with heights kept by its 2-fold axis: the full 4n block has a real form', () => {
    const twofold = new TightBindingModel(beta12, HARRISON_1980).operations.find((o) => o.kind === 'rotation' && o.degrees === 180)!;
    // Each pair {a, C₂(a)} at one height, pairs alternating up and down.
    const buckled = buckle(beta12, (i) => (Math.min(i, twofold.atomMap[i]) % 2 === 0 ? 0.2 : -0.2));
    const model = new TightBindingModel(buckled, HARRISON_1980);
    expect(model.planar).toBe(false);
    const form = realForm(model, 'full');
    expect(form).toBeDefined();
    const n = model.size('full');
    const re = new Float64Array(n * n);
    const im = new Float64Array(n * n);
    const out = new Float64Array(n * n);
    const outIm = new Float64Array(n * n);
    model.hamiltonian(0.7, -0.3, 'full', re, im);
    form!.transform(re, im, out, outIm);
    expect(Math.max(...outIm.map(Math.abs))).toBeLessThan(1e-12);
    const complex = new HermitianEigensolver(n).eigenvalues(re, im, new Float64Array(n));
    expect(maxDifference(new SymmetricEigenvalues(n).eigenvalues(out, new Float64Array(n)), complex)).toBeLessThan(1e-10);
  });

  it('α with one atom raised has no 2-fold axis (no atom of α sits on one: they lie on the hole and between sites), so no real form', () => {
    const sheet = buckle(presetSheet('alpha'), (i) => (i === 0 ? 0.3 : 0));
    const model = new TightBindingModel(sheet, HARRISON_1980);
    expect(model.operations.some((o) => o.kind === 'rotation' && o.degrees === 180)).toBe(false);
    expect(realForm(model, 'full')).toBeUndefined();
  });

  it('the real solver agrees with ml-matrix on the real form of β12 (general-purpose reference library)', () => {
    const model = new TightBindingModel(beta12, HARRISON_1980);
    const n = model.size('sigma');
    const re = new Float64Array(n * n);
    const im = new Float64Array(n * n);
    const out = new Float64Array(n * n);
    model.hamiltonian(0.4, 0.9, 'sigma', re, im);
    realForm(model, 'sigma')!.transform(re, im, out);
    const ours = new SymmetricEigenvalues(n).eigenvalues(out, new Float64Array(n));
    const rows = Array.from({ length: n }, (_, r) => Array.from(out.subarray(r * n, r * n + n)));
    const reference = new EigenvalueDecomposition(new Matrix(rows)).realEigenvalues.sort((a, b) => a - b);
    expect(maxDifference(ours, reference)).toBeLessThan(1e-10);
  });

  it('bands with and without the real form agree along a path (to 1e-10)', () => {
    const model = new TightBindingModel(presetSheet('chi3'), HARRISON_1980);
    const ks = Float64Array.from(kpoints(20).flat());
    const bands = model.size('full');
    const a = new Float64Array(20 * bands);
    const b = new Float64Array(20 * bands);
    const w = new Float64Array(20 * bands);
    diagonaliseRows(model, ks, a, w, 'ascending', undefined, true);
    diagonaliseRows(model, ks, b, w, 'ascending', undefined, false);
    expect(maxDifference(a, b)).toBeLessThan(1e-10);
    expect(maxDifference(computeBands(model, ks).energies, a)).toBe(0);
  });
});
