/**
 * Unfolded bands (src/tb/unfold.ts) against outside checks: the bands of the one-site lattice (the model's own
 * one-atom cell, an independent route, and the analytic s band), completeness (the sum rule), symmetries the
 * weights must obey, and the Dirac crossing of the honeycomb (analytic, Wallace 1947).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { patternCoordination } from '../../src/lattice/geometry.ts';
import { makePattern, patternToSheet } from '../../src/lattice/pattern.ts';
import { SHEET_PRESETS, findSheetPreset } from '../../src/lattice/presets.ts';
import type { Pattern, Sheet } from '../../src/lattice/sheet.ts';
import { computeBands } from '../../src/tb/bands.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import type { ParameterSet } from '../../src/tb/params.ts';
import { unfoldBands, type UnfoldResult } from '../../src/tb/unfold.ts';
import { patternUnfolding, sheetUnfolding, type UnfoldingSheet } from '../../src/tb/unfoldSheet.ts';
import { primitivePath, primitiveZone } from '../../src/tb/unfoldZone.ts';
import { spectralEnergies, spectralFunction } from '../../src/tb/spectral.ts';
import { moveSheet, patternArb } from '../lattice/arbitraries.ts';
import { HARRISON_1980, withParameters } from './fixtures.ts';

const D = 1.69;

function unfold(unfolding: UnfoldingSheet, kpoints: Float64Array, params: ParameterSet = HARRISON_1980): UnfoldResult {
  return unfoldBands(new TightBindingModel(unfolding.sheet, params), unfolding.sites, kpoints);
}

/** A reproducible list of k-points spread over a few zones (Å⁻¹). */
function randomK(count: number, seed: number): Float64Array {
  let state = seed >>> 0;
  const next = () => ((state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 2 ** 32);
  return Float64Array.from({ length: 2 * count }, () => 8 * next() - 4);
}

/**
 * An explicit sheet is recognised on the lattice of its shortest atom–atom vector (src/lattice/recognise.ts): with
 * no two atoms nearest neighbours that is a coarser lattice, so the tests that go through recognition need a pair.
 */
const hasNearestPair = (pattern: Pattern) => patternCoordination(pattern).some((k) => k > 0);

const kArb = fc.tuple(fc.double({ min: -5, max: 5, noNaN: true }), fc.double({ min: -5, max: 5, noNaN: true }));

/** The sum of W over the states at each k. */
function weightSums(result: UnfoldResult, of: 'weights' | 'sigmaWeights' = 'weights'): number[] {
  return Array.from({ length: result.count }, (_, k) => {
    let sum = 0;
    for (let n = 0; n < result.bands; n++) sum += result[of][k * result.bands + n];
    return sum;
  });
}

/** A(k, E) on a fine grid with a narrow width: compares unfoldings without caring how degenerate states split. */
function spectrum(result: UnfoldResult): Float64Array {
  return spectralFunction(result, spectralEnergies(-40, 25, 3251), 0.05).total;
}

function maxDifference(a: Float64Array, b: Float64Array): number {
  let worst = 0;
  for (let i = 0; i < a.length; i++) worst = Math.max(worst, Math.abs(a[i] - b[i]));
  return worst;
}

/** Defect-free supercells of several shapes (HNF rows), 1…12 sites. */
const DEFECT_FREE: [[number, number], [number, number]][] = [[[2, 0], [0, 2]], [[3, 0], [1, 2]], [[1, 0], [0, 5]], [[1, 1], [-1, 2]], [[4, 0], [2, 3]]];

describe('unfoldBands(model, sites, kpoints)', () => {
  it('unfolds defect-free supercells of several shapes exactly onto the one-atom bands (weight 1 there, 0 on the folded copies)', () => {
    // Independent route: the one-atom cell of the same lattice, diagonalised by computeBands (src/tb/bands.ts).
    const k = randomK(40, 7);
    const primitive = computeBands(new TightBindingModel(patternToSheet(makePattern({ bond: D, supercell: [[1, 0], [0, 1]], vacancies: [] })), HARRISON_1980), k);
    for (const rows of DEFECT_FREE) {
      const result = unfold(patternUnfolding(makePattern({ bond: D, supercell: rows, vacancies: [] })), k);
      let worst = 0;
      for (let q = 0; q < k.length / 2; q++) {
        const bands = Array.from(primitive.energies.subarray(4 * q, 4 * q + 4));
        // Every primitive band carries weight 1 (summed over supercell states at its energy, for degeneracies) …
        for (const e of bands) {
          const multiplicity = bands.filter((x) => Math.abs(x - e) < 1e-7).length;
          let carried = 0;
          for (let n = 0; n < result.bands; n++) if (Math.abs(result.energies[q * result.bands + n] - e) < 1e-7) carried += result.weights[q * result.bands + n];
          worst = Math.max(worst, Math.abs(carried - multiplicity));
        }
        // … and every other state (a folded copy) carries none.
        for (let n = 0; n < result.bands; n++) {
          const e = result.energies[q * result.bands + n];
          if (!bands.some((x) => Math.abs(x - e) < 1e-7)) worst = Math.max(worst, result.weights[q * result.bands + n]);
        }
      }
      expect(worst, JSON.stringify(rows)).toBeLessThan(1e-9);
    }
  });

  it('gives the analytic s band of the triangular lattice, E = εs + 2Vssσ·Σ_j cos(k·a_j), for an s-only parameter set', () => {
    // Analytic nearest-neighbour s band (e.g. Ashcroft & Mermin, Solid State Physics (1976), ch. 10), a_j = a1, a2,
    // a2 − a1; spσ = ppσ = ppπ = 0 leaves the p states flat at εp with weight 3 (invented values, analytic check only).
    const sOnly = withParameters(HARRISON_1980, { hopping: { sp_sigma: 0, pp_sigma: 0, pp_pi: 0 } });
    const { s: es, p: ep } = sOnly.onsite;
    const v = sOnly.hopping.ss_sigma;
    const k = randomK(30, 11);
    const a = [[D, 0], [D / 2, (D * Math.sqrt(3)) / 2], [-D / 2, (D * Math.sqrt(3)) / 2]];
    for (const rows of DEFECT_FREE) {
      const result = unfold(patternUnfolding(makePattern({ bond: D, supercell: rows, vacancies: [] })), k, sOnly);
      for (let q = 0; q < result.count; q++) {
        const [kx, ky] = [k[2 * q], k[2 * q + 1]];
        const analytic = es + 2 * v * a.reduce((sum, [x, y]) => sum + Math.cos(kx * x + ky * y), 0);
        let sWeight = 0;
        let sEnergy = 0;
        let pWeight = 0;
        for (let n = 0; n < result.bands; n++) {
          const row = q * result.bands + n;
          if (Math.abs(result.energies[row] - ep) < 1e-9) pWeight += result.weights[row];
          else if (result.weights[row] > 1e-9) {
            sWeight += result.weights[row];
            sEnergy = result.energies[row];
          }
        }
        expect(sWeight).toBeCloseTo(1, 9);
        expect(sEnergy).toBeCloseTo(analytic, 9);
        expect(pWeight).toBeCloseTo(3, 9);
      }
    }
  });

  it('obeys the sum rule Σ_n W_n(k) = 4(1 − η), σ part 3(1 − η), to 1e-10 at random k for the presets, random patterns and a buckled sheet', () => {
    // Completeness of the supercell's eigenvectors at k (linear algebra): each orbital's Bloch sum keeps the share
    // atoms/sites of its norm on the atoms.
    const check = (unfolding: UnfoldingSheet, k: Float64Array) => {
      const result = unfold(unfolding, k);
      const share = result.atoms / result.sites;
      for (const sum of weightSums(result)) expect(Math.abs(sum - 4 * share)).toBeLessThan(1e-10);
      for (const sum of weightSums(result, 'sigmaWeights')) expect(Math.abs(sum - 3 * share)).toBeLessThan(1e-10);
    };
    for (const preset of SHEET_PRESETS) check(patternUnfolding(preset.pattern), randomK(20, 3));
    fc.assert(fc.property(patternArb(12), kArb, (pattern, [kx, ky]) => check(patternUnfolding(pattern), Float64Array.of(kx, ky))), { numRuns: 200 });
    check(sheetUnfolding(buckled(findSheetPreset('chi3')!.pattern))!, randomK(20, 5));
  });

  it('leaves the weights unchanged under a change of supercell basis, a larger supercell and a translation of the pattern', () => {
    // Symmetries the definition must obey: W depends on the structure and k only (common practice).
    const k = randomK(6, 17);
    fc.assert(fc.property(patternArb(8).filter(hasNearestPair), fc.constantFrom<[number, number, number, number]>([1, 1, 0, 1], [2, 1, 1, 1], [1, -2, 0, 1]), fc.tuple(fc.integer({ min: -3, max: 3 }), fc.integer({ min: -3, max: 3 })), (pattern, basis, [di, dj]) => {
      const reference = spectrum(unfold(patternUnfolding(pattern), k));
      const scale = Math.max(...reference);
      const rebased = sheetUnfolding(moveSheet(patternToSheet(pattern), { angle: 0, shift: [0, 0], basis }))!;
      expect(maxDifference(spectrum(unfold(rebased, k)), reference) / scale).toBeLessThan(1e-9);
      const { a, b, c } = pattern.supercell;
      const doubled = makePattern({ bond: pattern.bond, supercell: [[2 * a, 0], [b, c]], vacancies: pattern.vacancies.flatMap(([i, j]) => [[i, j], [i + a, j]] as [number, number][]) });
      expect(maxDifference(spectrum(unfold(patternUnfolding(doubled), k)), reference) / scale).toBeLessThan(1e-9);
      const moved = makePattern({ bond: pattern.bond, supercell: [[a, 0], [b, c]], vacancies: pattern.vacancies.map(([i, j]) => [i + di, j + dj]) });
      expect(maxDifference(spectrum(unfold(patternUnfolding(moved), k)), reference) / scale).toBeLessThan(1e-9);
    }), { numRuns: 60 });
  });

  it('leaves the weights unchanged when the sheet and k turn together (rotation about z; mirrors too)', () => {
    // Rotating the sheet rotates px, py among themselves; Σ over both of |Σ c|² is invariant (common practice).
    const k = randomK(6, 23);
    fc.assert(fc.property(patternArb(8).filter(hasNearestPair), fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), fc.boolean(), (pattern, angle, mirror) => {
      const reference = spectrum(unfold(patternUnfolding(pattern), k));
      const c = Math.cos(angle), s = Math.sin(angle);
      const turned = Float64Array.from({ length: k.length }, (_, i) => {
        const x = k[i & ~1];
        const y = mirror ? -k[i | 1] : k[i | 1];
        return i % 2 === 0 ? c * x - s * y : s * x + c * y;
      });
      const moved = sheetUnfolding(moveSheet(patternToSheet(pattern), { angle, shift: [0.3, -0.2], basis: [1, 0, 0, 1], mirror }))!;
      expect(moved.sites).toBe(pattern.supercell.a * pattern.supercell.c);
      expect(maxDifference(spectrum(unfold(moved, turned)), reference) / Math.max(...reference)).toBeLessThan(1e-9);
    }), { numRuns: 60 });
  });

  it('gives the members of a degenerate multiplet one weight, their mean: the multiplet\'s total is basis-free, its split is not (analytic: any unitary mix of degenerate eigenvectors is an eigenbasis)', () => {
    // α (6mm) at Γ and at the triangular K, where the hexagonal symmetry makes two-fold degenerate levels.
    const alpha = patternUnfolding(findSheetPreset('alpha')!.pattern);
    const result = unfold(alpha, Float64Array.of(0, 0, (4 * Math.PI) / (3 * D), 0));
    let multiplets = 0;
    for (let k = 0; k < result.count; k++) {
      for (let n = k * result.bands + 1; n < (k + 1) * result.bands; n++) {
        if (result.energies[n] - result.energies[n - 1] > 1e-9) continue;
        multiplets++;
        expect(result.weights[n]).toBe(result.weights[n - 1]);
        expect(result.sigmaWeights[n]).toBe(result.sigmaWeights[n - 1]);
      }
    }
    expect(multiplets).toBeGreaterThan(4);
  });

  it('has W(−k) = W(k) (time reversal: H(−k) is the complex conjugate of H(k))', () => {
    const unfolding = patternUnfolding(findSheetPreset('beta12')!.pattern);
    const k = randomK(10, 29);
    const minus = k.map((x) => -x);
    expect(maxDifference(spectrum(unfold(unfolding, minus)), spectrum(unfold(unfolding, k)))).toBeLessThan(1e-9);
  });

  it('is periodic in the primitive reciprocal lattice: W(k + b) = W(k) (the atoms sit on lattice sites)', () => {
    const unfolding = patternUnfolding(findSheetPreset('alpha')!.pattern);
    const [b1, b2] = primitiveZone(unfolding).reciprocal;
    const k = randomK(8, 31);
    const shifted = k.map((x, i) => x + (i % 2 === 0 ? b1[0] - 2 * b2[0] : b1[1] - 2 * b2[1]));
    expect(maxDifference(spectrum(unfold(unfolding, shifted)), spectrum(unfold(unfolding, k)))).toBeLessThan(1e-9);
  });
});

/**
 * The honeycomb of the √3×√3 pattern (η = 1/3) in the triangular zone. Its cell √3·d turned by 30° has the
 * reciprocal lattice of spacing 4π/(3d) along 0°, 60°, … (the directions of the triangular K: K_tri is a
 * reciprocal vector of the honeycomb, so the honeycomb's Γ folds onto K_tri). Its zone corners, the Dirac points,
 * lie at 4π/(3√3·d) along 30°, 90°, …: the directions of the triangular M, at |K_hc|/|M| = (4π/(3√3d))/(2π/(√3d))
 * = 2/3. So the Dirac crossing sits two thirds of the way from Γ to M of the triangular zone (all six Γ–M lines),
 * not at the triangular K.
 */
describe('the honeycomb (η = 1/3) unfolded in the triangular zone', () => {
  const honeycomb = patternUnfolding(findSheetPreset('honeycomb')!.pattern);
  const zone = primitiveZone(honeycomb);
  const M = zone.points.find((p) => p.label === 'M')!.k;
  const K = zone.points.find((p) => p.label === 'K')!.k;
  // ppπ at the honeycomb's bond (d⁻² law of the parameter set).
  const t = HARRISON_1980.hopping.pp_pi * (HARRISON_1980.d0 / findSheetPreset('honeycomb')!.pattern.bond) ** 2;
  const bond = findSheetPreset('honeycomb')!.pattern.bond;
  const piStates = (result: UnfoldResult, q: number) => {
    const out: { e: number; w: number }[] = [];
    for (let n = 0; n < result.bands; n++) {
      const row = q * result.bands + n;
      if (result.sigmaWeights[row] === 0) out.push({ e: result.energies[row], w: result.weights[row] });
    }
    return out;
  };

  it('shows the Dirac crossing of the π bands at 2/3 of Γ–M, at εp, with the whole π weight 1 − η there', () => {
    // Wallace, Phys. Rev. 71, 622 (1947): nearest-neighbour π bands of the honeycomb, E = εp ± |t|·|f(k)|, f = 0 at
    // the zone corners; the π part of the sum rule is 1 − η = 2/3.
    const result = unfold(honeycomb, Float64Array.of((2 / 3) * M[0], (2 / 3) * M[1]));
    const pi = piStates(result, 0);
    expect(pi).toHaveLength(2);
    expect(Math.abs(pi[1].e - pi[0].e)).toBeLessThan(1e-9);
    expect(pi[0].e).toBeCloseTo(HARRISON_1980.onsite.p, 9);
    expect(pi[0].w + pi[1].w).toBeCloseTo(2 / 3, 10);
  });

  it('shows the cone as the ARPES-like picture of two sublattices: one bright branch along Γ–M, both across it', () => {
    // Two-site interference (analytic): a π state with sublattice amplitudes of equal size and relative phase φ has
    // W = (1 ± cos φ)/3 at the primitive k. On the Γ–M line (a mirror line of the honeycomb) the two π states are even
    // and odd: the even one takes all of 1 − η = 2/3, so the bright band runs straight through the crossing, the
    // lower branch before it, the upper after (the other halves of the cone are dark: the "dark corridor" of
    // graphite photoemission, Shirley et al., PRB 51, 13614 (1995), from memory). Across Γ–M, φ ≈ ±π/2: both
    // branches carry about 1/3 and the crossing shows as an X.
    const unit = Math.hypot(M[0], M[1]);
    const along: [number, number] = [M[0] / unit, M[1] / unit];
    const across: [number, number] = [-along[1], along[0]];
    const at = (q: number, dir: [number, number]) => piStates(unfold(honeycomb, Float64Array.of((2 / 3) * M[0] + q * dir[0], (2 / 3) * M[1] + q * dir[1])), 0);
    for (const q of [0.01, 0.05]) {
      const before = at(-q, along);
      const after = at(q, along);
      expect(before[0].w).toBeCloseTo(2 / 3, 9);
      expect(before[1].w).toBeCloseTo(0, 9);
      expect(after[0].w).toBeCloseTo(0, 9);
      expect(after[1].w).toBeCloseTo(2 / 3, 9);
      for (const side of [at(-q, across), at(q, across)]) for (const state of side) expect(state.w).toBeGreaterThan(0.3);
    }
  });

  it('opens linearly away from it, gap 3|t|·d·|q| (the Dirac cone, ħv = 3|t|d/2), and is gapped at the triangular K', () => {
    const along = (f: number): [number, number] => [f * M[0], f * M[1]];
    const q = 1e-4;
    const unit = Math.hypot(M[0], M[1]);
    for (const f of [2 / 3 - q / unit, 2 / 3 + q / unit]) {
      const pi = piStates(unfold(honeycomb, Float64Array.from(along(f))), 0);
      expect((pi[1].e - pi[0].e) / (3 * Math.abs(t) * bond * q)).toBeCloseTo(1, 3);
    }
    // At K_tri the honeycomb's Γ: π states at εp ± 3|t| (Wallace 1947), a gap of 6|t|.
    const atK = piStates(unfold(honeycomb, Float64Array.from(K)), 0);
    expect(atK[1].e - atK[0].e).toBeCloseTo(6 * Math.abs(t), 9);
  });

  it('on the automatic primitive path, the π gap is smallest two thirds of the way along Γ–M', () => {
    const path = primitivePath(honeycomb, 301);
    const result = unfold(honeycomb, path.kpoints);
    const mIndex = path.labels[1].index;
    let best = 0;
    let smallest = Infinity;
    for (let p = 0; p < path.count; p++) {
      const pi = piStates(result, p);
      const gap = Math.abs(pi[1].e - pi[0].e);
      if (gap < smallest) {
        smallest = gap;
        best = p;
      }
    }
    expect(path.labels.map((l) => l.label)).toEqual(['Γ', 'M', 'K', 'Γ']);
    expect(Math.abs(best - (2 / 3) * mIndex)).toBeLessThanOrEqual(1);
  });
});

describe('sheetUnfolding(sheet) and patternUnfolding(pattern)', () => {
  it('recognises an explicit sheet in its own frame: sites, spacing, a1 nearest +x, heights kept', () => {
    const pattern = findSheetPreset('beta12')!.pattern;
    const sheet = buckled(pattern);
    const found = sheetUnfolding(moveSheet(sheet, { angle: 0.4, shift: [0.1, 0.2], basis: [1, 1, 0, 1] }))!;
    expect(found.sites).toBe(pattern.supercell.a * pattern.supercell.c);
    expect(found.bond).toBeCloseTo(pattern.bond, 12);
    // 0.4 rad = 22.9°: within (−30°, 30°], so it is the angle itself.
    expect(found.angle).toBeCloseTo(0.4, 12);
    expect(found.sheet.atoms.map((a) => a[2]).sort()).toEqual(sheet.atoms.map((a) => a[2]).sort());
    const pathHere = primitivePath(found, 10);
    const pathThere = primitivePath(patternUnfolding(pattern), 10);
    const c = Math.cos(0.4), s = Math.sin(0.4);
    for (let p = 0; p < 10; p++) {
      const [x, y] = [pathThere.kpoints[2 * p], pathThere.kpoints[2 * p + 1]];
      expect(pathHere.kpoints[2 * p]).toBeCloseTo(c * x - s * y, 12);
      expect(pathHere.kpoints[2 * p + 1]).toBeCloseTo(s * x + c * y, 12);
    }
  });

  it('refuses a sheet whose atoms sit on no triangular lattice (a square lattice; atoms off the sites)', () => {
    expect(sheetUnfolding({ cell: [[2, 0], [0, 2]], atoms: [[0, 0, 0]] })).toBeUndefined();
    const sheet = patternToSheet(findSheetPreset('alpha')!.pattern);
    expect(sheetUnfolding({ ...sheet, atoms: sheet.atoms.map((a, i) => (i === 2 ? [a[0] + 0.01, a[1], a[2]] : a)) })).toBeUndefined();
  });

  it('patternUnfolding keeps the pattern frame: a1 = d·(1, 0), the path of the one-atom cell', () => {
    const unfolding = patternUnfolding(findSheetPreset('delta6')!.pattern);
    expect(unfolding.angle).toBe(0);
    const beta12 = findSheetPreset('beta12')!.pattern;
    expect(patternUnfolding(beta12).sites).toBe(beta12.supercell.a * beta12.supercell.c);
    expect(unfolding.sites).toBe(1);
  });
});

/** A pattern's sheet buckled: every other atom raised by 0.35 Å (invented). */
function buckled(pattern: Pattern): Sheet {
  const sheet = patternToSheet(pattern);
  return { ...sheet, atoms: sheet.atoms.map(([f1, f2], i) => [f1, f2, i % 2 === 0 ? 0.35 : 0]) };
}
