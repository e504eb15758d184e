import { describe, expect, it } from 'vitest';
import { alignFermiLevel, E2_OVER_EPS0, linearDosFermiShift } from '../../src/substrate/alignment.ts';
import { HALF_FILLING, linearDosSpectrum } from './linearDos.ts';

// Graphene numbers of Giovannetti et al., PRL 101, 026803 (2008) (from memory): cell area 5.18 Å², so
// α = e²/(ε0·A) = 34.93 eV/Å; D0 = 0.09 states/(eV²·cell); d0 = 2.4 Å; Δc = 0.9 eV at d = 3.3 Å; W_G = 4.5 eV.
const AREA = 5.18;
const D0 = 0.09;
const spectrum = linearDosSpectrum(D0, 200_000);
const graphene = (metal: number, distance = 3.3) => alignFermiLevel(spectrum, {
  cellArea: AREA, metalWorkFunction: metal, sheetWorkFunction: 4.5, dipole: 0.9, distance, d0: 2.4,
  smearing: 0.005, neutralElectrons: HALF_FILLING(2),
});

describe('alignFermiLevel(spectrum, options)', () => {
  it('α = e²/(ε0·A) is 34.93 eV/Å for graphene (Giovannetti et al. 2008, from memory)', () => {
    expect(graphene(5).alpha).toBeCloseTo(34.93, 2);
    expect(E2_OVER_EPS0 / AREA).toBeCloseTo(34.93, 2);
  });

  it('no transfer at W_M = 5.4 eV = W_G + Δc, the crossover of Giovannetti et al. (2008)', () => {
    const r = graphene(5.4);
    expect(Math.abs(r.fermiShift)).toBeLessThan(1e-9);
    expect(Math.abs(r.electronsPerAtom)).toBeLessThan(1e-9);
  });

  it('matches the closed form for a linear DOS (Giovannetti et al. 2008, eq. for ΔE_F) on both sides of the crossover', () => {
    for (const metal of [4.22, 4.74, 5.0, 5.54, 5.84, 6.2]) {
      const r = graphene(metal);
      const closed = linearDosFermiShift(4.5 + 0.9 - metal, 34.93 * (5.18 / AREA), D0, 0.9);
      // tolerance: the level spacing of the synthetic spectrum and the Gaussian width of 5 meV
      expect(r.fermiShift).toBeCloseTo(closed, 2);
      // the electrons it holds: ±D0·ΔE_F²/2 per cell (linear DOS, analytic)
      expect(r.electronsPerCell).toBeCloseTo(Math.sign(closed) * D0 * closed * closed / 2, 3);
    }
  });

  it('low work-function metals give electrons (n-type), high ones take them (Giovannetti et al. 2008: Al, Ag, Cu n-type; Au, Pt p-type)', () => {
    expect(graphene(4.22).electronsPerAtom).toBeGreaterThan(0);
    expect(graphene(5.54).electronsPerAtom).toBeLessThan(0);
  });

  it('satisfies its balance W_S + Δc − W_M = ΔE_F + α·q·(d − d0) (DESIGN.md contract)', () => {
    const r = graphene(4.5, 3.0);
    expect(r.fermiShift + r.capacitorStep).toBeCloseTo(4.5 + 0.9 - 4.5, 10);
  });

  it('d = d0 leaves only the Fermi-level shift: ΔE_F = L (analytic)', () => {
    const r = graphene(5.0, 2.4);
    expect(r.fermiShift).toBeCloseTo(0.4, 9);
    expect(linearDosFermiShift(0.4, 34.93, D0, 0)).toBe(0.4);
  });
});
