import { describe, expect, it } from 'vitest';
import { patternCell } from '../../src/lattice/pattern.ts';
import { periodicityMismatch, periodicityOf, reducedPeriodicity } from '../../src/lattice/periodicity.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';

const SQRT3 = Math.sqrt(3);

describe('reducedPeriodicity(cell)', () => {
  it('reads the presets as an image would show them (cells worked by hand from the lattice basis)', () => {
    const d = 1.69;
    // α: hexagonal 3d × 3d, γ = 120° (Tang & Ismail-Beigi, PRL 99, 115501 (2007)).
    const alpha = reducedPeriodicity(patternCell(findSheetPreset('alpha')!.pattern));
    expect([alpha.a, alpha.b, alpha.gammaDeg].map((x) => +x.toFixed(9))).toEqual([+(3 * d).toFixed(9), +(3 * d).toFixed(9), 120]);
    // β12: rectangular √3d × 3d (Feng et al., Nat. Chem. 8, 563 (2016)).
    const beta = reducedPeriodicity(patternCell(findSheetPreset('beta12')!.pattern));
    expect(beta.a).toBeCloseTo(SQRT3 * d, 12);
    expect(beta.b).toBeCloseTo(3 * d, 12);
    expect(beta.gammaDeg).toBeCloseTo(90, 10);
    // χ3 (Feng et al. 2016): worked by hand from its cell rows (2, 1), (−1, 2): u = (0, √3d), v = −(5d/2, √3d/2),
    // so a = √3d, b = √7d and cos γ = u·v/(ab) = −(3d²/2)/(√21·d²).
    const chi = reducedPeriodicity(patternCell(findSheetPreset('chi3')!.pattern));
    expect(chi.a).toBeCloseTo(SQRT3 * d, 12);
    expect(chi.b).toBeCloseTo(Math.sqrt(7) * d, 12);
    expect(Math.cos((chi.gammaDeg * Math.PI) / 180)).toBeCloseTo(-(1.5 * d * d) / (SQRT3 * d * Math.sqrt(7) * d), 12);
  });

  it('does not depend on the choice of cell vectors', () => {
    const p = periodicityOf(5.1, 2.95, 90);
    const q = reducedPeriodicity([[2.95, 0], [3 * 2.95, 5.1]]);
    expect(periodicityMismatch(p, q).length).toBeLessThan(1e-12);
    expect(periodicityMismatch(p, q).angleDeg).toBeLessThan(1e-9);
  });
});
