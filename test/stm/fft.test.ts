import { describe, expect, it } from 'vitest';
import { Fft, fft2d, nextPowerOfTwo } from '../../src/stm/fft.ts';

/** The DFT by its definition X[k] = Σ x[n] e^{−2πi kn/N} (analytic reference). */
function dft(re: number[], im: number[]) {
  const n = re.length;
  return re.map((_, k) => {
    let sr = 0, si = 0;
    for (let t = 0; t < n; t++) {
      const a = (-2 * Math.PI * k * t) / n;
      sr += re[t] * Math.cos(a) - im[t] * Math.sin(a);
      si += re[t] * Math.sin(a) + im[t] * Math.cos(a);
    }
    return [sr, si];
  });
}

describe('Fft(n).transform(re, im)', () => {
  it('equals the DFT definition for n = 1 … 64 (Cooley & Tukey 1965)', () => {
    for (const n of [1, 2, 4, 8, 64]) {
      const re = Array.from({ length: n }, (_, i) => Math.sin(1.3 * i) + 0.1 * i);
      const im = Array.from({ length: n }, (_, i) => Math.cos(0.7 * i * i));
      const expected = dft(re, im);
      const r = Float64Array.from(re), m = Float64Array.from(im);
      new Fft(n).transform(r, m);
      expected.forEach(([er, ei], k) => {
        expect(r[k]).toBeCloseTo(er, 10);
        expect(m[k]).toBeCloseTo(ei, 10);
      });
    }
  });

  it('2D: a plane wave e^{2πi(3x/16 + 5y/8)} has all its weight in bin (5, 3) (analytic)', () => {
    const nx = 16, ny = 8;
    const re = new Float64Array(nx * ny), im = new Float64Array(nx * ny);
    for (let y = 0; y < ny; y++) for (let x = 0; x < nx; x++) {
      const a = 2 * Math.PI * ((3 * x) / nx + (5 * y) / ny);
      re[y * nx + x] = Math.cos(a);
      im[y * nx + x] = Math.sin(a);
    }
    fft2d(re, im, nx, ny);
    for (let i = 0; i < nx * ny; i++) expect(Math.hypot(re[i], im[i])).toBeCloseTo(i === 5 * nx + 3 ? nx * ny : 0, 9);
  });

  it('refuses sizes that are not powers of two; nextPowerOfTwo rounds up', () => {
    expect(() => new Fft(12)).toThrow();
    expect([1, 2, 3, 500, 512, 513].map(nextPowerOfTwo)).toEqual([1, 2, 4, 512, 512, 1024]);
  });
});
