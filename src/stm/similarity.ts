/**
 * Similarity of two motifs on the same cell (bins × bins, periodic, bins a power of two): the Pearson correlation
 * coefficient (zero-normalised cross-correlation, common practice in image registration) maximised over the cyclic
 * translations of the second by whole bins. In [−1, 1]; 1 means equal up to brightness, contrast and a shift.
 * All shifts at once by the correlation theorem: c(s) = Σ_r a(r)·b(r + s) = IFFT(conj(A)·B)(s), and the inverse
 * transform is the forward one of the conjugate, conjugated and divided by bins².
 */
import { fft2d } from './fft.ts';

export interface Alignment {
  score: number;
  /** Shift (bins along the two cell vectors) applied to the second motif. */
  shift: [number, number];
}

function standardise(values: Float64Array): Float64Array {
  let mean = 0;
  for (const v of values) mean += v;
  mean /= values.length;
  let norm = 0;
  for (const v of values) norm += (v - mean) ** 2;
  norm = Math.sqrt(norm);
  return Float64Array.from(values, (v) => (norm > 0 ? (v - mean) / norm : 0));
}

/** Layout of both motifs: [i1·bins + i2]. */
export function bestCorrelation(measured: Float64Array, model: Float64Array, bins: number): Alignment {
  const n = bins * bins;
  const aRe = standardise(measured), aIm = new Float64Array(n);
  const bRe = standardise(model), bIm = new Float64Array(n);
  fft2d(aRe, aIm, bins, bins);
  fft2d(bRe, bIm, bins, bins);
  // conj(conj(A)·B) = A·conj(B), transformed forward, then conjugated (real part only is needed).
  const cRe = new Float64Array(n), cIm = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    cRe[i] = aRe[i] * bRe[i] + aIm[i] * bIm[i];
    cIm[i] = aIm[i] * bRe[i] - aRe[i] * bIm[i];
  }
  fft2d(cRe, cIm, bins, bins);
  let best = 0;
  for (let i = 1; i < n; i++) if (cRe[i] > cRe[best]) best = i;
  // Layout of fft2d is [row·nx + col] with row = first index i1.
  return { score: cRe[best] / n, shift: [Math.floor(best / bins), best % bins] };
}
