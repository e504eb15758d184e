import { describe, expect, it } from 'vitest';
import { reciprocal } from '../../src/tb/kspace.ts';
import { pzTail, pzTransform, sTail, sTransform } from '../../src/stm/tails.ts';
import { decayConstant } from '../../src/stm/barrier.ts';
import type { Sheet } from '../../src/lattice/sheet.ts';

const cell: Sheet['cell'] = [[2.4, 0], [1.2, 2.4 * Math.sqrt(3) / 2]];
const area = cell[0][0] * cell[1][1];

/** Σ_T e^{ik·T} φ(r − T) summed directly over lattice vectors (the tails decay like e^{−κd}: 60 Å is ample). */
function directSum(tail: (k: number, dx: number, dy: number, dz: number) => number, kappa: number, k: [number, number], r: [number, number, number]) {
  let re = 0, im = 0;
  for (let i = -40; i <= 40; i++) for (let j = -40; j <= 40; j++) {
    const tx = i * cell[0][0] + j * cell[1][0], ty = i * cell[0][1] + j * cell[1][1];
    const v = tail(kappa, r[0] - tx, r[1] - ty, r[2]);
    re += v * Math.cos(k[0] * tx + k[1] * ty);
    im += v * Math.sin(k[0] * tx + k[1] * ty);
  }
  return [re, im];
}

/** (1/A) Σ_G φ̃(k + G) e^{i(k+G)·r}: the Poisson-summed form used by src/stm/ldosSeries.ts. */
function fourierSum(kind: 's' | 'pz', kappa: number, k: [number, number], r: [number, number, number]) {
  const [b1, b2] = reciprocal(cell);
  let re = 0, im = 0;
  for (let i = -12; i <= 12; i++) for (let j = -12; j <= 12; j++) {
    const qx = k[0] + i * b1[0] + j * b2[0], qy = k[1] + i * b1[1] + j * b2[1];
    const gamma = Math.sqrt(kappa * kappa + qx * qx + qy * qy);
    const amplitude = (kind === 's' ? sTransform(kappa, gamma) : pzTransform(kappa)) * Math.exp(-gamma * r[2]) / area;
    re += amplitude * Math.cos(qx * r[0] + qy * r[1]);
    im += amplitude * Math.sin(qx * r[0] + qy * r[1]);
  }
  return [re, im];
}

describe('vacuum tails', () => {
  it('κ = 0.5123·√φ Å⁻¹ (ħ²/2m = 3.80998 eV·Å², CODATA)', () => {
    expect(decayConstant(4)).toBeCloseTo(1.0246, 4);
    expect(decayConstant(4.5)).toBeCloseTo(Math.sqrt(4.5 / 3.80998), 3);
  });

  it('solve (∇² − κ²)φ = 0 away from the atom (the vacuum Schrödinger equation; finite differences)', () => {
    const kappa = 1.1, h = 1e-3;
    for (const tail of [sTail, pzTail]) {
      const at = [0.7, -0.4, 3.1];
      const f = (dx: number, dy: number, dz: number) => tail(kappa, at[0] + dx, at[1] + dy, at[2] + dz);
      const laplacian = (f(h, 0, 0) + f(-h, 0, 0) + f(0, h, 0) + f(0, -h, 0) + f(0, 0, h) + f(0, 0, -h) - 6 * f(0, 0, 0)) / (h * h);
      expect(laplacian / (kappa * kappa * f(0, 0, 0))).toBeCloseTo(1, 5);
    }
  });

  it('Bloch sums equal their Fourier series (Poisson summation with the Weyl–Sommerfeld identity ∫e^{−κr}/r·e^{−iq·ρ}d²ρ = 2π·e^{−γz}/γ)', () => {
    const kappa = decayConstant(4.5);
    for (const k of [[0, 0], [0.4, -0.3]] as [number, number][]) {
      for (const r of [[0, 0, 2.5], [0.9, 0.6, 3.5]] as [number, number, number][]) {
        const s = directSum(sTail, kappa, k, r), sf = fourierSum('s', kappa, k, r);
        const z = directSum(pzTail, kappa, k, r), zf = fourierSum('pz', kappa, k, r);
        expect(Math.abs(s[0] - sf[0]) + Math.abs(s[1] - sf[1])).toBeLessThan(1e-7 * Math.hypot(s[0], s[1]));
        expect(Math.abs(z[0] - zf[0]) + Math.abs(z[1] - zf[1])).toBeLessThan(1e-7 * Math.hypot(z[0], z[1]));
      }
    }
  });
});
