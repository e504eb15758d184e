import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { erfc } from '../../src/tb/erfc.ts';

// Reference values: Python 3 math.erfc (the C library's erfc, correctly rounded to a few ulp), printed with repr.
const REFERENCE: [number, number][] = [
  [-3, 1.9999779095030015],
  [-1, 1.842700792949715],
  [-0.3, 1.3286267594591274],
  [0, 1.0],
  [1e-08, 0.9999999887162083],
  [0.1, 0.8875370839817152],
  [0.4999, 0.4795880048386134],
  [0.5, 0.4795001221869535],
  [0.75, 0.28884436634648486],
  [1, 0.15729920705028513],
  [1.5, 0.033894853524689274],
  [1.9999, 0.004679802092970608],
  [2, 0.004677734981047265],
  [2.5, 0.0004069520174449589],
  [3, 2.2090496998585438e-05],
  [4, 1.541725790028002e-08],
  [5, 1.5374597944280351e-12],
  [6, 2.1519736712498916e-17],
  [8, 1.1224297172982928e-29],
  [10, 2.088487583762545e-45],
  [15, 7.212994172451206e-100],
  [20, 5.3958656116079005e-176],
  [26, 5.663192408856143e-296],
];

describe('erfc(x)', () => {
  it('matches the reference library to 1e-15 absolute and 2e-13 relative', () => {
    for (const [x, expected] of REFERENCE) {
      const value = erfc(x);
      expect(Math.abs(value - expected)).toBeLessThan(1e-15);
      expect(Math.abs(value - expected)).toBeLessThanOrEqual(2e-13 * expected);
    }
  });

  it('obeys erfc(−x) = 2 − erfc(x) and lies in [0, 2] (Abramowitz & Stegun 7.1.9)', () => {
    fc.assert(fc.property(fc.double({ min: -30, max: 30, noNaN: true }), (x) => {
      const v = erfc(x);
      return v >= 0 && v <= 2 && Math.abs(erfc(-x) - (2 - v)) < 1e-15;
    }), { numRuns: 2000 });
  });

  it('is continuous across the switches between its three regimes', () => {
    for (const x of [0.5, 2]) {
      const below = erfc(x * (1 - 1e-12));
      const above = erfc(x);
      // Slope of erfc is −(2/√π)e^(−x²): the step over 1e-12·x is below 1e-12 (A&S 7.1.19).
      expect(Math.abs(below - above)).toBeLessThan(1e-12 * x * 1.2 + 1e-15);
    }
  });

  it('returns 0 far out, 2 far in, NaN for NaN', () => {
    expect(erfc(40)).toBe(0);
    expect(erfc(-40)).toBe(2);
    expect(erfc(Infinity)).toBe(0);
    expect(erfc(-Infinity)).toBe(2);
    expect(erfc(NaN)).toBeNaN();
  });
});
