import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cartesian } from '../../src/lattice/sheet.ts';
import { computeBands } from '../../src/tb/bands.ts';
import { kMesh, reciprocal } from '../../src/tb/kspace.ts';
import { specialPoints } from '../../src/tb/kspacePath.ts';
import { TightBindingModel } from '../../src/tb/model.ts';
import {
  HARRISON_1980, blockEigenvalues, maxDifference, patternSheet, presetSheet, rotateSheet, withParameters,
} from './fixtures.ts';

const kArbitrary = fc.tuple(fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true }));

function point(sheetCell: Parameters<typeof specialPoints>[0], label: string): [number, number] {
  const found = specialPoints(sheetCell).points.find((p) => p.label === label);
  if (!found) throw new Error(label);
  return found.k;
}

describe('TightBindingModel π band of the honeycomb', () => {
  // Wallace, Phys. Rev. 71, 622 (1947); Castro Neto et al., Rev. Mod. Phys. 81, 109 (2009), Eq. (6) with t' = 0:
  // E±(k) = εp ± |t|·|Σ_δ exp(i k·δ)| over the three nearest-neighbour vectors δ; 3|t| at Γ, |t| at M, 0 at K.
  const sheet = presetSheet('honeycomb');
  const model = new TightBindingModel(sheet, HARRISON_1980);
  const a = cartesian(sheet, 0);
  const b = cartesian(sheet, 1);
  const d = Math.hypot(b[0] - a[0], b[1] - a[1]);
  const t = HARRISON_1980.hopping.pp_pi * (HARRISON_1980.d0 / d) ** 2;
  // Nearest-neighbour vectors from A to B, found independently of the neighbour list: B + lattice vectors within 1.01 d.
  const deltas: [number, number][] = [];
  for (let n1 = -2; n1 <= 2; n1++) {
    for (let n2 = -2; n2 <= 2; n2++) {
      const x = b[0] - a[0] + n1 * sheet.cell[0][0] + n2 * sheet.cell[1][0];
      const y = b[1] - a[1] + n1 * sheet.cell[0][1] + n2 * sheet.cell[1][1];
      if (Math.hypot(x, y) < 1.01 * d) deltas.push([x, y]);
    }
  }

  it('has three nearest neighbours per atom and matches εp ± |t|·|Σ exp(i k·δ)| at any k', () => {
    expect(deltas.length).toBe(3);
    fc.assert(fc.property(kArbitrary, ([kx, ky]) => {
      let re = 0, im = 0;
      for (const [x, y] of deltas) {
        re += Math.cos(kx * x + ky * y);
        im += Math.sin(kx * x + ky * y);
      }
      const f = Math.hypot(re, im);
      const expected = [HARRISON_1980.onsite.p - Math.abs(t) * f, HARRISON_1980.onsite.p + Math.abs(t) * f];
      return maxDifference(blockEigenvalues(model, kx, ky, 'pi'), expected) < 1e-12;
    }), { numRuns: 200 });
  });

  it('is split by 3|t| at Γ, |t| at M and degenerate at K', () => {
    const split = (k: [number, number]) => {
      const [low, high] = blockEigenvalues(model, k[0], k[1], 'pi');
      return (high - low) / 2;
    };
    expect(split([0, 0])).toBeCloseTo(3 * Math.abs(t), 12);
    expect(split(point(sheet.cell, 'M'))).toBeCloseTo(Math.abs(t), 12);
    expect(split(point(sheet.cell, 'K'))).toBeCloseTo(0, 12);
  });
});

describe('TightBindingModel s band of the one-atom triangular sheet', () => {
  // Nearest-neighbour s band of the triangular lattice, E = εs + 2t[cos k·a1 + cos k·a2 + cos k·(a1 − a2)]
  // (analytic; e.g. Ashcroft & Mermin, Solid State Physics (1976), ch. 10 tight-binding s band): εs + 6t at Γ,
  // εs − 2t at M, εs − 3t at K, width 9|t|. V_spσ = 0 decouples s from p (invented values, analytic check only).
  const sheet = presetSheet('delta6');
  const params = withParameters(HARRISON_1980, { hopping: { sp_sigma: 0 }, onsite: { p: 60 } });
  const model = new TightBindingModel(sheet, params);
  const eps = params.onsite.s;
  const t = params.hopping.ss_sigma;
  const [a1, a2] = sheet.cell;
  const sBand = (kx: number, ky: number) =>
    eps + 2 * t * (Math.cos(kx * a1[0] + ky * a1[1]) + Math.cos(kx * a2[0] + ky * a2[1])
      + Math.cos(kx * (a1[0] - a2[0]) + ky * (a1[1] - a2[1])));

  it('matches the analytic band at any k', () => {
    fc.assert(fc.property(kArbitrary, ([kx, ky]) => Math.abs(blockEigenvalues(model, kx, ky, 'sigma')[0] - sBand(kx, ky)) < 1e-12),
      { numRuns: 200 });
  });

  it('gives εs + 6t at Γ, εs − 2t at M, εs − 3t at K', () => {
    expect(blockEigenvalues(model, 0, 0, 'sigma')[0]).toBeCloseTo(eps + 6 * t, 12);
    const m = point(sheet.cell, 'M');
    const k = point(sheet.cell, 'K');
    expect(blockEigenvalues(model, m[0], m[1], 'sigma')[0]).toBeCloseTo(eps - 2 * t, 12);
    expect(blockEigenvalues(model, k[0], k[1], 'sigma')[0]).toBeCloseTo(eps - 3 * t, 12);
  });

  it('has the width 9|t| over the whole zone', () => {
    // Analytic band width of the nearest-neighbour triangular s band (same source as above), measured on the
    // model's own bands over a 60×60 mesh, which holds Γ and K (3 divides 60).
    const mesh = kMesh(sheet.cell, 60);
    let low = Infinity;
    let high = -Infinity;
    for (let p = 0; p < mesh.length; p += 2) {
      const e = blockEigenvalues(model, mesh[p], mesh[p + 1], 'sigma')[0];
      low = Math.min(low, e);
      high = Math.max(high, e);
    }
    expect(high - low).toBeCloseTo(9 * Math.abs(t), 10);
  });
});

describe('TightBindingModel symmetries', () => {
  it('a 6-site supercell of δ6 reproduces the one-atom bands folded', () => {
    // Band folding (Bloch's theorem, common practice): E_super(k) = ∪_G E_prim(k + G) over the supercell's
    // reciprocal vectors G modulo the primitive ones.
    const primitive = new TightBindingModel(presetSheet('delta6'), HARRISON_1980);
    const superSheet = patternSheet(1.69, [[2, 0], [1, 3]], []);
    const supercell = new TightBindingModel(superSheet, HARRISON_1980);
    const [B1, B2] = reciprocal(superSheet.cell);
    const [a1, a2] = primitive.sheet.cell;
    const shifts = new Map<string, [number, number]>();
    for (let m1 = 0; m1 < 6; m1++) {
      for (let m2 = 0; m2 < 6; m2++) {
        const g: [number, number] = [m1 * B1[0] + m2 * B2[0], m1 * B1[1] + m2 * B2[1]];
        const f = [g[0] * a1[0] + g[1] * a1[1], g[0] * a2[0] + g[1] * a2[1]].map((x) => {
          const r = (x / (2 * Math.PI)) % 1;
          return Math.round(((r + 1) % 1) * 1e6) % 1e6;
        });
        shifts.set(f.join(','), g);
      }
    }
    expect(shifts.size).toBe(6);
    fc.assert(fc.property(kArbitrary, ([kx, ky]) => {
      const folded: number[] = [];
      for (const [gx, gy] of shifts.values()) folded.push(...blockEigenvalues(primitive, kx + gx, ky + gy, 'full'));
      folded.sort((x, y) => x - y);
      return maxDifference(blockEigenvalues(supercell, kx, ky, 'full'), folded) < 1e-10;
    }), { numRuns: 50 });
  });

  it('E(k + G) = E(k) for reciprocal vectors G of the α sheet', () => {
    // Bloch's theorem (common practice).
    const sheet = presetSheet('alpha');
    const model = new TightBindingModel(sheet, HARRISON_1980);
    const [b1, b2] = reciprocal(sheet.cell);
    fc.assert(fc.property(kArbitrary, fc.integer({ min: -2, max: 2 }), fc.integer({ min: -2, max: 2 }), ([kx, ky], m1, m2) => {
      const gx = m1 * b1[0] + m2 * b2[0];
      const gy = m1 * b1[1] + m2 * b2[1];
      return maxDifference(blockEigenvalues(model, kx, ky, 'full'), blockEigenvalues(model, kx + gx, ky + gy, 'full')) < 1e-10;
    }), { numRuns: 50 });
  });

  it('rotating sheet and k together changes neither energies nor σ weights', () => {
    // Slater–Koster integrals depend only on the bond geometry (Slater & Koster 1954): a rigid rotation about z
    // of sheet and k leaves the spectrum and the σ/π shares unchanged. Checked on a buckled sheet, where
    // weights come from eigenvectors.
    const base = presetSheet('beta12');
    const buckled = { ...base, atoms: base.atoms.map((a, i) => [a[0], a[1], i % 2 === 0 ? 0.25 : -0.15] as [number, number, number]) };
    fc.assert(fc.property(kArbitrary, fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), ([kx, ky], angle) => {
      const one = computeBands(new TightBindingModel(buckled, HARRISON_1980), Float64Array.of(kx, ky));
      const c = Math.cos(angle), s = Math.sin(angle);
      const turned = computeBands(new TightBindingModel(rotateSheet(buckled, angle), HARRISON_1980), Float64Array.of(c * kx - s * ky, s * kx + c * ky));
      return maxDifference(one.energies, turned.energies) < 1e-9 && sumsMatch(one.sigmaWeight, turned.sigmaWeight, one.energies);
    }), { numRuns: 40 });
  });
});

/** σ weights compared through sums over degenerate groups (individual vectors of a degenerate level are arbitrary). */
function sumsMatch(a: Float64Array, b: Float64Array, energies: Float64Array): boolean {
  let start = 0;
  for (let i = 1; i <= energies.length; i++) {
    if (i === energies.length || energies[i] - energies[i - 1] > 1e-6) {
      let sa = 0, sb = 0;
      for (let j = start; j < i; j++) {
        sa += a[j];
        sb += b[j];
      }
      if (Math.abs(sa - sb) > 1e-7) return false;
      start = i;
    }
  }
  return true;
}

describe('TightBindingModel σ/π decoupling', () => {
  it('is exact for a planar sheet: zero σ–π elements, and the full spectrum is the union of the blocks', () => {
    // z = 0 gives direction cosine n = 0 for every bond, so E_s,z = n·V_spσ and E_x,z = l·n(V_ppσ − V_ppπ)
    // vanish (Slater & Koster 1954, Table I).
    const model = new TightBindingModel(presetSheet('alpha'), HARRISON_1980);
    expect(model.planar).toBe(true);
    const n = model.size('full');
    const re = new Float64Array(n * n);
    const im = new Float64Array(n * n);
    fc.assert(fc.property(kArbitrary, ([kx, ky]) => {
      model.hamiltonian(kx, ky, 'full', re, im);
      for (let r = 0; r < n; r++) {
        for (let c = 0; c < n; c++) {
          if (((r & 3) === 3) !== ((c & 3) === 3) && (re[r * n + c] !== 0 || im[r * n + c] !== 0)) return false;
        }
      }
      const union = [...blockEigenvalues(model, kx, ky, 'sigma'), ...blockEigenvalues(model, kx, ky, 'pi')].sort((x, y) => x - y);
      const bands = computeBands(model, Float64Array.of(kx, ky));
      return maxDifference(blockEigenvalues(model, kx, ky, 'full'), union) < 1e-10
        && maxDifference(bands.energies, union) < 1e-10
        && bands.sigmaWeight.every((w) => w === 0 || w === 1);
    }), { numRuns: 30 });
  });

  it('is broken by buckling: σ–π elements appear and states of mixed character exist', () => {
    const base = presetSheet('honeycomb');
    const buckled = { ...base, atoms: [[base.atoms[0][0], base.atoms[0][1], 0.3], [base.atoms[1][0], base.atoms[1][1], -0.3]] as [number, number, number][] };
    const model = new TightBindingModel(buckled, HARRISON_1980);
    expect(model.planar).toBe(false);
    const bands = computeBands(model, Float64Array.of(0.3, 0.2));
    const mixed = Array.from(bands.sigmaWeight).filter((w) => w > 0.01 && w < 0.99);
    expect(mixed.length).toBeGreaterThan(0);
    // Weights are shares of normalised vectors: each in [0, 1], summing to 3 per atom over all states (common practice).
    expect(bands.sigmaWeight.every((w) => w >= -1e-12 && w <= 1 + 1e-12)).toBe(true);
    expect(bands.sigmaWeight.reduce((s, w) => s + w, 0)).toBeCloseTo(3 * model.atoms, 10);
  });
});

describe('TightBindingModel tiny entries', () => {
  it('gives the same bands and weights at k = 1e-160 as at Γ (entries whose squares underflow are dropped)', () => {
    // Continuity of E(k) (common practice); found by the rotation property above with k ≈ 1e-160.
    const base = presetSheet('beta12');
    const buckled = { ...base, atoms: base.atoms.map((a, i) => [a[0], a[1], i % 2 === 0 ? 0.25 : -0.15] as [number, number, number]) };
    const model = new TightBindingModel(buckled, HARRISON_1980);
    const gamma = computeBands(model, Float64Array.of(0, 0));
    const tiny = computeBands(model, Float64Array.of(1e-160, -1e-160));
    expect(maxDifference(gamma.energies, tiny.energies)).toBeLessThan(1e-12);
    expect(maxDifference(gamma.sigmaWeight, tiny.sigmaWeight)).toBeLessThan(1e-10);
  });
});
