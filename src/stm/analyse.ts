/**
 * A measured picture's periodicity: background removal, the power spectrum, its peaks and the lattice. The kernel does not throw on bad data: an unusable picture comes back as a
 * reason, which the caller turns into an error naming the file.
 */
import { removeBackground, type Background } from './background.ts';
import { fitLattice, type MeasuredLattice } from './lattice.ts';
import { PEAK_DEFAULTS, findPeaks } from './peaks.ts';
import { powerSpectrum } from './spectrum.ts';
import type { Picture } from './stmImage.ts';

export interface AnalyseOptions {
  /** Default 'plane'. */
  background?: Background;
  /** Motif bins per side (a power of two; default 32). */
  bins?: number;
}

export type Analysis =
  | {
    ok: true;
    lattice: MeasuredLattice;
    /** The picture with its background removed (row 0 at the top), its size and pixel size: folded again by match. */
    values: Float64Array;
    width: number;
    height: number;
    pixelSize: number;
    /** Motif bins per side. */
    bins: number;
    /** Cells of the lattice in the picture. */
    cells: number;
  }
  | { ok: false; why: string };

export function analysePicture(picture: Picture, options: AnalyseOptions = {}): Analysis {
  const { width, height, pixelSize } = picture;
  const bins = options.bins ?? 32;
  const background = options.background ?? 'plane';
  const values = removeBackground(picture, background);
  let lo = Infinity, hi = -Infinity, scale = 0;
  for (let i = 0; i < picture.values.length; i++) scale = Math.max(scale, Math.abs(picture.values[i]));
  for (const v of values) {
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  if (!(hi - lo > 1e-12 * Math.max(scale, 1e-300))) return { ok: false, why: 'flat: no contrast left after background removal' };
  const spectrum = powerSpectrum(values, width, height);
  const peaks = findPeaks(spectrum, { ...PEAK_DEFAULTS, side: Math.min(width, height), skipScanAxis: background === 'lines' });
  const lattice = fitLattice(peaks, pixelSize, (2 * Math.PI) / Math.max(spectrum.nx, spectrum.ny), (2 * Math.PI * PEAK_DEFAULTS.minCycles) / Math.min(width, height));
  if (!lattice) {
    return { ok: false, why: `no periodicity: ${peaks.length < 2 ? 'fewer than two' : 'no two independent'} Fourier peaks stand out of the noise with at least ${PEAK_DEFAULTS.minCycles} periods across the picture` };
  }
  const cellPixels = Math.abs(lattice.vectors[0][0] * lattice.vectors[1][1] - lattice.vectors[0][1] * lattice.vectors[1][0]) / (pixelSize * pixelSize);
  return { ok: true, lattice, values, width, height, pixelSize, bins, cells: (width * height) / cellPixels };
}
