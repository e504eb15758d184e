import { describe, expect, it } from 'vitest';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import type { Sheet } from '../../src/lattice/sheet.ts';
import { SQRT3 } from '../../src/lattice/triangular.ts';
import { coincidenceFits } from '../../src/substrate/coincidence.ts';
import { principalStretch } from '../../src/substrate/stretch.ts';
import { findSubstrate } from '../../src/substrate/substrates.ts';

const triangular = (d: number): Sheet => ({ cell: [[d, 0], [d / 2, (d * SQRT3) / 2]], atoms: [[0, 0, 0]] });
const preset = (name: string) => patternToSheet(findSheetPreset(name)!.pattern);
const AG = findSubstrate('ag111')!.nnDistance;
const ROOT7_ANGLE = (Math.atan(SQRT3 / 5) * 180) / Math.PI; // 19.1066°, angle of 2b1 + b2 (analytic)

describe('principalStretch(a, b, c, d)', () => {
  it('a rotation by θ has stretches 1, 1 and rotation θ (analytic)', () => {
    const t = 0.3;
    const s = principalStretch(Math.cos(t), -Math.sin(t), Math.sin(t), Math.cos(t));
    expect(s.major).toBeCloseTo(1, 14);
    expect(s.minor).toBeCloseTo(1, 14);
    expect(s.rotation).toBeCloseTo(t, 14);
  });
  it('diag(1.02, 0.97) turned by 0.5 rad: stretches 1.02 and 0.97, strain 0.03, rotation 0.5 (analytic)', () => {
    const c = Math.cos(0.5), s = Math.sin(0.5);
    const f = principalStretch(c * 1.02, -s * 0.97, s * 1.02, c * 0.97);
    expect(f.major).toBeCloseTo(1.02, 14);
    expect(f.minor).toBeCloseTo(0.97, 14);
    expect(f.strain).toBeCloseTo(0.03, 14);
    expect(f.rotation).toBeCloseTo(0.5, 14);
  });
});

describe('coincidenceFits(sheet, spacing, options)', () => {
  it('finds the exact (√7×√7)R19.1° coincidence of a 2×2 triangular sheet with 2d = √7·a_s (analytic)', () => {
    const fits = coincidenceFits(triangular((Math.sqrt(7) * 2.5) / 2), 2.5, { maxStrain: 0.001, maxSites: 7 });
    expect(fits).toHaveLength(1);
    const [fit] = fits;
    expect(fit.strain).toBeLessThan(1e-12);
    expect(fit.sites).toBe(7);
    expect(fit.sheetCells).toBe(4);
    expect(fit.angleDeg).toBeCloseTo(ROOT7_ANGLE, 9);
    expect(fit.wood).toBe('(√7×√7)R19.1°');
    expect(fit.moire.a).toBeCloseTo(Math.sqrt(7) * 2.5, 12);
  });

  it('maps the sheet supercell onto the substrate supercell as reported (contract: rotate by angle_deg, then strain)', () => {
    const sheet = triangular((Math.sqrt(7) * 2.5) / 2 * 1.01);
    const [fit] = coincidenceFits(sheet, 2.5, { maxStrain: 0.02, maxSites: 7 });
    const t = (fit.angleDeg * Math.PI) / 180;
    const vec = (cell: Sheet['cell'], [i, j]: [number, number]) => [i * cell[0][0] + j * cell[1][0], i * cell[0][1] + j * cell[1][1]];
    const substrateCell: Sheet['cell'] = [[2.5, 0], [1.25, 2.5 * SQRT3 / 2]];
    for (const r of [0, 1] as const) {
      const [x, y] = vec(sheet.cell, fit.sheetSupercell[r]);
      const turned = [Math.cos(t) * x - Math.sin(t) * y, Math.sin(t) * x + Math.cos(t) * y];
      const target = vec(substrateCell, fit.substrateSupercell[r]);
      expect(Math.hypot(turned[0] - target[0], turned[1] - target[1]) / Math.hypot(turned[0], turned[1])).toBeLessThanOrEqual(fit.strain + 1e-12);
    }
    expect(fit.stretches[0]).toBeCloseTo(1 / 1.01, 12);
  });

  it('lists each fit once: the identical lattice at 1 site and the √7 twist, nothing else (analytic)', () => {
    // Up to 12 sites a triangular lattice coincides with itself turned by 0° and by the commensurate twist angle
    // cos θ = 13/14 (θ = 21.787°, the (√7×√7) twist; analytic); all other zero-strain maps are supercells of these
    // or their images under 6mm, and must not be listed.
    const fits = coincidenceFits(triangular(2.5), 2.5, { maxStrain: 0.001, maxSites: 12 });
    expect(fits.map((f) => f.sites)).toEqual([1, 7]);
    expect(fits[0].angleDeg).toBe(0);
    expect(Math.cos((fits[1].angleDeg * Math.PI) / 180)).toBeCloseTo(13 / 14, 12);
    expect(fits[1].wood).toBe('(√7×√7)R19.1°');
  });

  it('an exactly commensurate β12 (√3·d = a_s) fits 2 substrate sites with zero strain, its 3d axis along b1 + b2 (analytic)', () => {
    const pattern = findSheetPreset('beta12')!.pattern;
    const sheet = patternToSheet({ ...pattern, bond: 2.5 / SQRT3 });
    const [fit] = coincidenceFits(sheet, 2.5, { maxStrain: 0.001, maxSites: 6 });
    expect(fit.sites).toBe(2);
    expect(fit.strain).toBeLessThan(1e-12);
    expect(fit.angleDeg).toBeCloseTo(30, 9);
  });

  // From memory: borophene on Ag(111) (Feng et al., Nat. Chem. 8, 563 (2016) and later STM work) is nearly
  // commensurate — B rows along the close-packed Ag directions, the B–B distance close to a_Ag/√3 = 1.668 Å,
  // the β12 and χ3 cells within 1–2 % of a small Ag cell. With the preset bond 1.69 Å the mismatch is analytic:
  // 1 − a_Ag/(√3·1.69) = 1.313 %.
  it('β12 on Ag(111): 2 Ag atoms per β12 cell, strain 1.31 %, hole rows along a close-packed Ag row (from memory; strain analytic)', () => {
    const [best] = coincidenceFits(preset('beta12'), AG, { maxStrain: 0.02, maxSites: 12 });
    expect(best.sites).toBe(2);
    expect(best.sheetCells).toBe(1);
    expect(best.strain).toBeCloseTo(1 - AG / (SQRT3 * 1.69), 10);
    expect(best.angleDeg).toBeCloseTo(30, 9);
    expect(best.moire.gammaDeg).toBeCloseTo(90, 9);
  });

  it('χ3 on Ag(111): 3 χ3 cells on 5 Ag atoms at the same 1.31 % (the √3 relation, analytic)', () => {
    const [best] = coincidenceFits(preset('chi3'), AG, { maxStrain: 0.02, maxSites: 12 });
    expect(best.sites).toBe(5);
    expect(best.sheetCells).toBe(3);
    expect(best.strain).toBeCloseTo(1 - AG / (SQRT3 * 1.69), 10);
  });

  it('ranks by area, then strain (DESIGN.md contract)', () => {
    const fits = coincidenceFits(preset('honeycomb'), AG, { maxStrain: 0.03, maxSites: 25 });
    for (let i = 1; i < fits.length; i++) {
      const [p, q] = [fits[i - 1], fits[i]];
      expect(p.sites < q.sites || (p.sites === q.sites && p.strain <= q.strain + 1e-12)).toBe(true);
    }
    expect(fits.every((f) => f.strain <= 0.03)).toBe(true);
  });
});
