import { describe, expect, it } from 'vitest';
import { fill } from '../../src/tb/fill.ts';
import { checkGap } from '../../src/tb/gapCheck.ts';
import { meshSpectrum } from '../../src/tb/meshSpectrum.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import { HARRISON_1980, presetSheet } from './fixtures.ts';

const honeycomb = new TightBindingModel(presetSheet('honeycomb'), HARRISON_1980);
// Nearest-neighbour ppπ at the honeycomb bond d = 1.782 Å, scaled by the parameter set's d⁻² law.
const vppPi = HARRISON_1980.hopping.pp_pi * (HARRISON_1980.d0 / 1.782) ** 2;
const ep = HARRISON_1980.onsite.p;

describe('checkGap(model, spectrum, interval, options)', () => {
  it('calls the empty interval around E_F of the δ = 1 honeycomb on a 35×35 mesh a mesh gap: the π bands touch at K', () => {
    // The honeycomb π bands E = εp ± |t·f(k)| meet at K, where f(K) = 0 (Wallace, Phys. Rev. 71, 622 (1947)); K is
    // on the Γ-centred M×M mesh only when 3 divides M, so at M = 35 the mesh leaves an empty interval around εp.
    const spectrum = meshSpectrum(honeycomb, { mesh: 35 });
    const result = fill(honeycomb, { mesh: 35, doping: 1 });
    expect(result.inGap).toBeUndefined();
    const empty = result.meshGap as { lower: number; upper: number; checked: boolean };
    expect(empty.checked).toBe(true);
    expect(empty.upper - empty.lower).toBeGreaterThan(0.3);
    const verdict = checkGap(honeycomb, spectrum, empty);
    expect(verdict.kind).toBe('mesh-gap');
    expect(verdict.gap).toBeUndefined();
    expect(verdict.crossing?.label).toBe('K');
    expect(verdict.crossing?.energy).toBeCloseTo(ep, 9);
  });

  it('confirms the real gap of the neutral honeycomb between the σ bonding bands and the bottom of the π band', () => {
    // π band bottom at Γ: εp + 3·Vppπ, |f(Γ)| = 3 (Wallace 1947). Three electrons per atom fill the three σ bonding
    // bands of two atoms, which lie below it (the σ/π picture of the MgB2 boron layer; common practice).
    const result = fill(honeycomb, { mesh: 35 });
    const gap = result.inGap as { lower: number; upper: number };
    expect(result.meshGap).toBeUndefined();
    expect(gap.upper).toBeCloseTo(ep + 3 * vppPi, 9);
    expect(gap.upper - gap.lower).toBeGreaterThan(2);
    expect(result.gapVerdict).toMatchObject({ kind: 'gap', bandsBelow: 3, edges: { upper: { label: 'Γ' } } });
    // The mesh spectrum is checked with the same σ block alone: the σ gap runs from the same top to the σ antibonding bottom.
    const sigma = checkGap(honeycomb, meshSpectrum(honeycomb, { mesh: 35 }), gap, { bands: 'sigma' });
    expect(sigma.kind).toBe('gap');
    expect((sigma.gap as { upper: number }).upper).toBeGreaterThan(gap.upper);
  });

  it('finds no gap where bands touch on the mesh itself (3 | M puts K on it), and the fill says nothing of a gap', () => {
    // Wallace 1947 again: at M = 36 the K point is a mesh point, both π states sit at εp.
    const result = fill(honeycomb, { mesh: 36, doping: 1 });
    expect(result.inGap).toBeUndefined();
    expect(result.meshGap).toBeUndefined();
    expect(result.fermi).toBeCloseTo(ep, 6);
  });

  it('refutes an interval when the band count below its middle differs between mesh points (bands are continuous)', () => {
    // Invented interval inside the π band of the honeycomb (δ = 1 region): the band count changes across the zone.
    const spectrum = meshSpectrum(honeycomb, { mesh: 12 });
    const verdict = checkGap(honeycomb, spectrum, { lower: -9, upper: -8.9 });
    expect(verdict.kind).toBe('mesh-gap');
    expect(verdict.checked.mesh).toBe(144);
  });
});
