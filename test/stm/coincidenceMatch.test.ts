import { describe, expect, it } from 'vitest';
import { canonicalForm } from '../../src/enumerate/canonical.ts';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import type { Vec2 } from '../../src/lattice/sheet.ts';
import { analysePicture } from '../../src/stm/analyse.ts';
import { coincidenceCellFits } from '../../src/stm/coincidenceMatch.ts';
import { CELL_TOLERANCE } from '../../src/stm/correspondence.ts';
import { matchPatterns } from '../../src/stm/match.ts';
import { moirePicture, PARAMS } from './helpers.ts';

// The geometry, worked by hand: α (Tang & Ismail-Beigi, PRL 99, 115501 (2007); here the preset, bond d = 1.69 Å) has a
// triangular lattice of side 3d. A triangular lattice of side a has the (√n×√n) sublattice spanned by (i, j) and its
// 60° turn (−j, i + j) in the 60° basis, n = i² + ij + j² (common practice): (2, 1) gives √7 of α, (4, 1) gives √21 of
// Ag(111), a_s = 4.0853/√2 Å (fcc a of Ag, CRC Handbook, from memory). Their directions are 19.107° and 10.893° from
// the first basis vector, so α turned by 8.21° lies on the metal with 7 cells in 21 metal atoms and an isotropic
// strain |√21·a_s / (√7·3d) − 1| = 0.0131.
const AG = 4.0853 / Math.SQRT2;
const alpha = findSheetPreset('alpha')!.pattern;
const sheet = patternToSheet(alpha);
const rows = (r: [number, number][], [p, q]: [Vec2, Vec2]) => r.map(([i, j]) => [i * p[0] + j * q[0], i * p[1] + j * q[1]] as Vec2) as [Vec2, Vec2];
const S = rows([[2, 1], [-1, 3]], sheet.cell);
const M = rows([[4, 1], [-1, 5]], [[AG, 0], [AG / 2, (AG * Math.sqrt(3)) / 2]]);
const STRAIN = Math.abs((Math.sqrt(21) * AG) / (Math.sqrt(7) * 3 * 1.69) - 1);
const area = ([u, v]: [Vec2, Vec2]) => Math.abs(u[0] * v[1] - u[1] * v[0]);
const turn = (deg: number, k: number, [u, v]: [Vec2, Vec2]): [Vec2, Vec2] => {
  const c = Math.cos((deg * Math.PI) / 180), s = Math.sin((deg * Math.PI) / 180);
  return [[k * (c * u[0] - s * u[1]), k * (s * u[0] + c * u[1])], [k * (c * v[0] - s * v[1]), k * (s * v[0] + c * v[1])]];
};

describe('coincidenceCellFits(sheet, targets, search, tolerance)', () => {
  it('finds α\'s (√21×√21)R10.9° cell on Ag(111) in a measured cell that is that cell turned and 2 % too large', () => {
    expect(sheet.cell[0][0]).toBeCloseTo(3 * 1.69, 9); // the frame S is built in (α's 3d cell along x)
    const fits = coincidenceCellFits(sheet, [{ vectors: turn(37, 1.02, M), index: 1 }], { nnDistance: AG }, CELL_TOLERANCE);
    expect(fits.length).toBeGreaterThan(0);
    for (const fit of fits) {
      expect(fit.coincidence?.sites).toBe(21); // hand-worked above
      expect(fit.coincidence?.sheetCells).toBe(7);
      expect(fit.coincidence?.strain).toBeCloseTo(STRAIN, 6);
      expect(fit.scale).toBeCloseTo(1.02, 9); // the scale put in: the metal's cell is exact
      expect(area(fit.vectors)).toBeCloseTo(area(S), 6); // the model is drawn on 7 α cells
    }
  });

  it('finds none when the strain allowed is below the fit\'s, the measured cell is no coincidence cell, or only a sublattice of it is', () => {
    expect(coincidenceCellFits(sheet, [{ vectors: M, index: 2 }], { nnDistance: AG }, CELL_TOLERANCE)).toHaveLength(0);
    expect(coincidenceCellFits(sheet, [{ vectors: M, index: 1 }], { nnDistance: AG, maxStrain: 0.01 }, CELL_TOLERANCE)).toHaveLength(0);
    expect(coincidenceCellFits(sheet, [{ vectors: [[11, 0], [0, 11]], index: 1 }], { nnDistance: AG }, CELL_TOLERANCE)).toHaveLength(0);
  });
});

describe('matchPatterns(analysis, { coincidence })', () => {
  // A synthetic picture of α strained onto its √21 coincidence cell with Ag(111), with a moiré modulation of that
  // cell's period (DEMO geometry, made here), turned, tilted, noisy, pixel size told 3 % off: its lattice is the
  // coincidence cell, 2.6× α's own.
  const truePixel = 0.2;
  const picture = moirePicture(sheet, S, M, { pixels: 512, pixelSize: truePixel, angleDeg: 23, tilt: 2, noise: 0.3, seed: 5, moire: 0.5 });
  const analysis = analysePicture({ ...picture, pixelSize: truePixel * 1.03 });

  it('measures the coincidence cell, and without a metal finds no α', () => {
    expect(analysis.ok).toBe(true);
    if (!analysis.ok) return;
    expect(analysis.lattice.a).toBeCloseTo(Math.sqrt(21) * AG * 1.03, 0); // hand-worked above
    const own = matchPatterns(analysis, { parameters: PARAMS, sites: [8, 10], top: 50 });
    expect(own.candidates.some((c) => c.structure.canonical === canonicalForm(alpha))).toBe(false);
  });

  it('names α through its coincidence cell with Ag(111): 21 metal atoms, 7 cells, the strain worked by hand', () => {
    if (!analysis.ok) throw new Error(analysis.why);
    const result = matchPatterns(analysis, { parameters: PARAMS, sites: [8, 10], top: 3, coincidence: { nnDistance: AG } });
    const best = result.candidates[0];
    expect(best.structure.canonical).toBe(canonicalForm(alpha));
    expect(best.coincidence?.sites).toBe(21);
    expect(best.coincidence?.sheetCells).toBe(7);
    expect(best.coincidence?.strain).toBeCloseTo(STRAIN, 6);
    expect(best.scale).toBeCloseTo(1.03, 1);
    expect(result.fittingByCoincidence).toBeGreaterThan(0);
    if (result.candidates.length > 1) expect(best.score - result.candidates[1].score).toBeGreaterThan(0.05);
  });
});
