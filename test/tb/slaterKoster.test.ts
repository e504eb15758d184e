import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { slaterKosterBlock } from '../../src/tb/slaterKoster.ts';

const V = { ss: -3.7, sp: 4.9, pps: 8.6, ppp: -2.2 };

function block(l: number, m: number, n: number): Float64Array {
  const out = new Float64Array(16);
  slaterKosterBlock(l, m, n, V.ss, V.sp, V.pps, V.ppp, out, 0);
  return out;
}

const direction = fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }))
  .filter(([x, y, z]) => Math.hypot(x, y, z) > 0.1)
  .map(([x, y, z]) => {
    const r = Math.hypot(x, y, z);
    return [x / r, y / r, z / r] as [number, number, number];
  });

describe('slaterKosterBlock(l, m, n, …)', () => {
  it('gives the table entries along x: E_ss = V_ssσ, E_s,x = V_spσ, E_x,x = V_ppσ, E_y,y = E_z,z = V_ppπ', () => {
    // Slater & Koster, Phys. Rev. 94, 1498 (1954), Table I at (l, m, n) = (1, 0, 0).
    const b = block(1, 0, 0);
    expect(b[0]).toBe(V.ss);
    expect(b[1]).toBe(V.sp);
    expect(b[4]).toBe(-V.sp);
    expect(b[5]).toBeCloseTo(V.pps, 14);
    expect(b[10]).toBe(V.ppp);
    expect(b[15]).toBe(V.ppp);
    expect([b[2], b[3], b[6], b[7], b[9], b[11], b[13], b[14]].every((x) => x === 0)).toBe(true);
  });

  it('is the transpose of the block of the reversed bond, E_αβ(−d) = E_βα(d) (Hermiticity of H)', () => {
    fc.assert(fc.property(direction, ([l, m, n]) => {
      const forward = block(l, m, n);
      const back = block(-l, -m, -n);
      for (let a = 0; a < 4; a++) for (let b = 0; b < 4; b++) if (Math.abs(forward[4 * a + b] - back[4 * b + a]) > 1e-15) return false;
      return true;
    }));
  });

  it('rotates as s ⊕ vector: the p–p part is V_ppπ·I + (V_ppσ − V_ppπ)·d̂d̂ᵀ with trace V_ppσ + 2V_ppπ', () => {
    // Invariant of the p–p block under rotations (Slater & Koster 1954: p orbitals transform as a vector).
    fc.assert(fc.property(direction, ([l, m, n]) => {
      const b = block(l, m, n);
      return Math.abs(b[5] + b[10] + b[15] - (V.pps + 2 * V.ppp)) < 1e-12
        && Math.abs(Math.hypot(b[1], b[2], b[3]) - Math.abs(V.sp)) < 1e-12;
    }));
  });

  it('writes at the given offset only', () => {
    const out = new Float64Array(48).fill(7);
    slaterKosterBlock(0, 1, 0, V.ss, V.sp, V.pps, V.ppp, out, 16);
    expect(out.slice(0, 16).every((x) => x === 7) && out.slice(32).every((x) => x === 7)).toBe(true);
    expect(out[16 + 2]).toBe(V.sp);
  });
});
