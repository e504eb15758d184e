import { describe, expect, it } from 'vitest';
import { patternToSheet, makePattern } from '../../src/lattice/pattern.ts';
import { chooseMesh, DEFAULT_KSPACING, meshForSpacing, meshSpacing } from '../../src/tb/meshDensity.ts';
import { DEFAULT_MESH } from '../../src/tb/meshSpectrum.ts';

const D = 1.69;
/** Triangular lattice of bond d: |b| = 4π/(√3·d) for both reciprocal vectors (analytic; b_i·a_j = 2π·δ_ij). */
const B = (4 * Math.PI) / (Math.sqrt(3) * D);
const primitive: [[number, number], [number, number]] = [[D, 0], [D / 2, (D * Math.sqrt(3)) / 2]];

describe('meshForSpacing(cell, spacing)', () => {
  it('is the smallest M with |b|/M ≤ spacing (analytic |b| of the triangular lattice)', () => {
    const m = meshForSpacing(primitive, 0.1);
    expect(m).toBe(Math.ceil(B / 0.1));
    expect(B / m).toBeLessThanOrEqual(0.1);
    expect(B / (m - 1)).toBeGreaterThan(0.1);
  });

  it('takes an exact ratio as it is (no extra row for rounding noise)', () => {
    expect(meshForSpacing(primitive, B / 36)).toBe(36);
  });

  it('uses the longer reciprocal vector: an n×1 strip cell needs the mesh of its short side', () => {
    // Cell n·a1, a2: |b2| = |b| of the primitive cell (b2·a2 = 2π, b2 ⟂ a1), |b1| = |b|/n (analytic).
    const strip: [[number, number], [number, number]] = [[5 * D, 0], primitive[1]];
    expect(meshForSpacing(strip, 0.1)).toBe(Math.ceil(B / 0.1));
  });

  it('scales with the cell: a √N×√N supercell needs M/√N (analytic, folding)', () => {
    const cell3: [[number, number], [number, number]] = [[3 * D, 0], [(3 * D) / 2, (3 * D * Math.sqrt(3)) / 2]];
    expect(meshForSpacing(cell3, B / 36)).toBe(12);
    expect(meshSpacing(cell3, 12)).toBeCloseTo(B / 36, 12);
  });

  it('is at least 1 and at most the cap', () => {
    expect(meshForSpacing(primitive, 100)).toBe(1);
    expect(meshForSpacing(primitive, 1e-6, 400)).toBe(400);
  });
});

describe('chooseMesh(sheet, options)', () => {
  const small = patternToSheet(makePattern({ bond: D, supercell: [[3, 0], [0, 3]], vacancies: [[0, 0]] }));
  const large = patternToSheet(makePattern({ bond: D, supercell: [[5, 0], [0, 5]], vacancies: [[0, 0]] }));

  it('keeps the documented mesh 36 on cells up to 12 atoms (the fill contract default)', () => {
    expect(chooseMesh(small)).toMatchObject({ mesh: DEFAULT_MESH, rule: 'default_mesh' });
  });

  it('gives larger cells the default spacing', () => {
    const choice = chooseMesh(large);
    expect(choice.rule).toBe('default_kspacing');
    expect(choice.mesh).toBe(meshForSpacing(large.cell, DEFAULT_KSPACING));
    expect(choice.mesh).toBeLessThan(DEFAULT_MESH);
  });

  it('gives small cells the spacing too when cells are compared', () => {
    expect(chooseMesh(small, { equalDensity: true })).toMatchObject({ rule: 'default_kspacing', mesh: meshForSpacing(small.cell, DEFAULT_KSPACING) });
  });

  it('obeys a given mesh or spacing and says so', () => {
    expect(chooseMesh(large, { mesh: 7 })).toMatchObject({ mesh: 7, rule: 'mesh' });
    expect(chooseMesh(small, { kspacing: 0.2 })).toMatchObject({ rule: 'kspacing', kspacing: 0.2, mesh: meshForSpacing(small.cell, 0.2) });
    expect(chooseMesh(small, { kspacing: 0.2 }).why).toMatch(/k-spacing 0\.2/);
  });
});
