import { describe, expect, it } from 'vitest';
import { autoPath } from '../../src/tb/kspacePath.ts';
import { blochState } from '../../src/tb/blochState.ts';
import { diagonaliseRows } from '../../src/tb/bands.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import type { Sheet } from '../../src/lattice/sheet.ts';
import { HARRISON_1980, presetSheet } from './fixtures.ts';

/** max |H c − E c| for the state's own block (linear algebra: the eigenvalue equation). */
function residual(model: TightBindingModel, state: ReturnType<typeof blochState>): number {
  const n = state.vectorRe.length;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  model.hamiltonian(state.kx, state.ky, state.block, re, im);
  let worst = 0;
  for (let r = 0; r < n; r++) {
    let x = 0;
    let y = 0;
    for (let c = 0; c < n; c++) {
      x += re[r * n + c] * state.vectorRe[c] - im[r * n + c] * state.vectorIm[c];
      y += re[r * n + c] * state.vectorIm[c] + im[r * n + c] * state.vectorRe[c];
    }
    worst = Math.max(worst, Math.hypot(x - state.energy * state.vectorRe[r], y - state.energy * state.vectorIm[r]));
  }
  return worst;
}

const sum = (a: Float64Array) => a.reduce((s, x) => s + x, 0);

/** A buckled honeycomb: the second atom 0.4 Å up (invented geometry, for the full-block path only). */
function buckled(): Sheet {
  const flat = presetSheet('honeycomb');
  return { cell: flat.cell, atoms: flat.atoms.map((a, i) => [a[0], a[1], i === 1 ? 0.4 : 0]) };
}

describe('blochState(model, kx, ky, band, order)', () => {
  it('gives weights summing to 1, H c = E c, and the energy of the bands at that k (planar α, blocks order)', () => {
    const model = new TightBindingModel(presetSheet('alpha'), HARRISON_1980);
    const path = autoPath(model.sheet.cell, 30);
    const bands = model.size('full');
    const energies = new Float64Array(path.count * bands);
    const sigma = new Float64Array(path.count * bands);
    diagonaliseRows(model, path.kpoints, energies, sigma, 'blocks');
    for (const k of [0, 7, 19]) {
      for (const band of [0, 5, 23, 24, 31]) {
        const state = blochState(model, path.kpoints[2 * k], path.kpoints[2 * k + 1], band, 'blocks');
        expect(sum(state.weight)).toBeCloseTo(1, 12);
        expect(sum(state.orbitalWeight)).toBeCloseTo(1, 12);
        expect(residual(model, state)).toBeLessThan(1e-10);
        expect(state.energy).toBeCloseTo(energies[k * bands + band], 10);
        expect(state.sigma).toBe(sigma[k * bands + band]);
        for (const p of state.phase) expect(Math.abs(p)).toBeLessThanOrEqual(Math.PI);
      }
    }
  });

  it('finds the same state in the ascending order as the merged bands (planar and buckled)', () => {
    for (const sheet of [presetSheet('chi3'), buckled()]) {
      const model = new TightBindingModel(sheet, HARRISON_1980);
      const k: [number, number] = [0.31, -0.12];
      const bands = model.size('full');
      const energies = new Float64Array(bands);
      const sigma = new Float64Array(bands);
      diagonaliseRows(model, new Float64Array(k), energies, sigma, 'ascending');
      for (let band = 0; band < bands; band++) {
        const state = blochState(model, k[0], k[1], band, 'ascending');
        expect(state.energy).toBeCloseTo(energies[band], 10);
        expect(state.sigma).toBeCloseTo(sigma[band], 10);
        expect(sum(state.weight)).toBeCloseTo(1, 12);
        expect(residual(model, state)).toBeLessThan(1e-10);
      }
    }
  });

  it('puts the honeycomb π bonding state at Γ equally on both atoms with equal phase (Wallace, Phys. Rev. 71, 622 (1947))', () => {
    const model = new TightBindingModel(presetSheet('honeycomb'), HARRISON_1980);
    // π block follows the 6 σ bands; with V_ppπ < 0 the bonding combination is the lower one (Harrison 1980).
    const state = blochState(model, 0, 0, 6, 'blocks');
    expect(state.sigma).toBe(0);
    expect(state.weight[0]).toBeCloseTo(0.5, 12);
    expect(state.weight[1]).toBeCloseTo(0.5, 12);
    expect(state.phase[0]).toBeCloseTo(0, 12);
    expect(state.phase[1]).toBeCloseTo(0, 12);
    // E = εp + 3·V_ppπ (three nearest neighbours, Wallace's π band at Γ), with V scaled to d = 1.782 Å by d⁻².
    const v = HARRISON_1980.hopping.pp_pi * (HARRISON_1980.d0 / 1.782) ** 2;
    expect(state.energy).toBeCloseTo(HARRISON_1980.onsite.p + 3 * v, 10);
    // The antibonding partner: opposite phases.
    const anti = blochState(model, 0, 0, 7, 'blocks');
    expect(Math.abs(anti.phase[0] - anti.phase[1])).toBeCloseTo(Math.PI, 12);
  });

  it('carries the Bloch factor: at K the honeycomb π states sit on one atom each (Wallace 1947, Dirac point)', () => {
    const model = new TightBindingModel(presetSheet('honeycomb'), HARRISON_1980);
    const path = autoPath(model.sheet.cell, 31);
    const kIndex = path.labels.find((l) => l.label === 'K')!.index;
    const state = blochState(model, path.kpoints[2 * kIndex], path.kpoints[2 * kIndex + 1], 6, 'blocks');
    // At K the two π states are degenerate; any combination is allowed, but weights still sum to 1.
    expect(sum(state.weight)).toBeCloseTo(1, 12);
    expect(residual(model, state)).toBeLessThan(1e-10);
  });
});
