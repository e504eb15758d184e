/**
 * The power spectrum of a picture: mean removed, a separable Hann window (Harris, Proc. IEEE 66, 51 (1978)) against
 * leakage from the picture's edges, zero padding to powers of two, |FFT|².
 * Frame: x = column, y = (height − 1 − row) in pixels (y up). Bin (fx, fy) of the padded nx × ny array is the
 * wave vector k = 2π·(fx'/nx, fy'/ny) rad/pixel, fx' = fx or fx − nx (the signed frequency).
 * Layout: power[fy·nx + fx].
 */
import { fft2d, nextPowerOfTwo } from './fft.ts';

export interface PowerSpectrum {
  nx: number;
  ny: number;
  power: Float64Array;
}

export function powerSpectrum(values: Float64Array, width: number, height: number): PowerSpectrum {
  const nx = nextPowerOfTwo(width), ny = nextPowerOfTwo(height);
  let mean = 0;
  for (let i = 0; i < values.length; i++) mean += values[i];
  mean /= values.length;
  const re = new Float64Array(nx * ny), im = new Float64Array(nx * ny);
  const wx = new Float64Array(width), wy = new Float64Array(height);
  for (let x = 0; x < width; x++) wx[x] = 0.5 - 0.5 * Math.cos((2 * Math.PI * (x + 0.5)) / width);
  for (let y = 0; y < height; y++) wy[y] = 0.5 - 0.5 * Math.cos((2 * Math.PI * (y + 0.5)) / height);
  for (let y = 0; y < height; y++) {
    const row = height - 1 - y;
    for (let x = 0; x < width; x++) re[y * nx + x] = (values[row * width + x] - mean) * wx[x] * wy[y];
  }
  fft2d(re, im, nx, ny);
  const power = new Float64Array(nx * ny);
  for (let i = 0; i < power.length; i++) power[i] = re[i] * re[i] + im[i] * im[i];
  return { nx, ny, power };
}
