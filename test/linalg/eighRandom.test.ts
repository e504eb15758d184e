import { describe, expect, it } from 'vitest';
import { fillRandomHermitian, fillRandomSymmetric, xorshift32 } from '../../src/linalg/eighRandom.ts';

describe('xorshift32(seed)', () => {
  it('is deterministic per seed and stays in [0, 1)', () => {
    const a = xorshift32(42);
    const b = xorshift32(42);
    const c = xorshift32(43);
    let differs = false;
    for (let i = 0; i < 10_000; i++) {
      const x = a();
      expect(x).toBe(b());
      expect(x).toBeGreaterThanOrEqual(0);
      expect(x).toBeLessThan(1);
      if (x !== c()) differs = true;
    }
    expect(differs).toBe(true);
  });

  it('has a mean near 1/2 (uniform: standard error 1/√(12N); common practice)', () => {
    const next = xorshift32(7);
    const count = 100_000;
    let sum = 0;
    for (let i = 0; i < count; i++) sum += next();
    expect(Math.abs(sum / count - 0.5)).toBeLessThan(5 / Math.sqrt(12 * count));
  });

  it('seed 0 still produces numbers (xorshift needs a non-zero state)', () => {
    const next = xorshift32(0);
    expect(next()).not.toBe(next());
  });
});

describe('fillRandomHermitian(n, uniform, re, im)', () => {
  it('fills an exactly Hermitian matrix with a real diagonal', () => {
    const n = 9;
    const re = new Float64Array(n * n);
    const im = new Float64Array(n * n);
    fillRandomHermitian(n, xorshift32(5), re, im);
    for (let r = 0; r < n; r++) {
      expect(im[r * n + r]).toBe(0);
      for (let c = 0; c < n; c++) {
        expect(re[r * n + c]).toBe(re[c * n + r]);
        expect(im[r * n + c] + im[c * n + r]).toBe(0);
        expect(Math.abs(re[r * n + c])).toBeLessThanOrEqual(1);
      }
    }
  });
});

describe('fillRandomSymmetric(n, uniform, a)', () => {
  it('fills an exactly symmetric matrix with entries in [−1, 1), not all equal', () => {
    const n = 9;
    const a = new Float64Array(n * n);
    fillRandomSymmetric(n, xorshift32(5), a);
    for (let r = 0; r < n; r++) {
      for (let c = 0; c < n; c++) {
        expect(a[r * n + c]).toBe(a[c * n + r]);
        expect(a[r * n + c]).toBeGreaterThanOrEqual(-1);
        expect(a[r * n + c]).toBeLessThan(1);
      }
    }
    expect(new Set(a).size).toBe((n * (n + 1)) / 2);
  });
});
