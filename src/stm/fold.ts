/**
 * Folding a periodic picture onto one cell of its lattice: every pixel goes to the bin of its fractional coordinates
 * (f1, f2) = (r·g1, r·g2)/2π mod 1 in the lattice basis, and each bin keeps the mean. Averaging over all the cells
 * of the picture removes noise (by √cells) and gives a motif in the lattice's own frame, so rotation and the pixel
 * grid drop out. Bins no pixel reached (a lattice commensurate with the pixels) take the mean of their filled
 * neighbours, repeatedly.
 * Layout: motif[i1·bins + i2], bin (i1, i2) centred at fractional ((i1 + ½)/bins, (i2 + ½)/bins).
 */
import type { Vec2 } from '../lattice/sheet.ts';

/** Frame of the values as in src/stm/spectrum.ts: x = column, y = height − 1 − row (pixels). */
export function foldPicture(values: Float64Array, width: number, height: number, reciprocal: [Vec2, Vec2], bins: number): Float64Array {
  const sum = new Float64Array(bins * bins), count = new Float64Array(bins * bins);
  const [g1, g2] = reciprocal;
  const twoPi = 2 * Math.PI;
  for (let row = 0; row < height; row++) {
    const y = height - 1 - row;
    for (let x = 0; x < width; x++) {
      let f1 = (g1[0] * x + g1[1] * y) / twoPi, f2 = (g2[0] * x + g2[1] * y) / twoPi;
      f1 -= Math.floor(f1);
      f2 -= Math.floor(f2);
      const b = Math.min(bins - 1, Math.floor(f1 * bins)) * bins + Math.min(bins - 1, Math.floor(f2 * bins));
      sum[b] += values[row * width + x];
      count[b]++;
    }
  }
  const motif = new Float64Array(bins * bins);
  let empty = 0;
  for (let b = 0; b < motif.length; b++) {
    if (count[b] > 0) motif[b] = sum[b] / count[b];
    else empty++;
  }
  for (let guard = 0; empty > 0 && guard < bins; guard++) {
    const filled = Float64Array.from(count, (c) => (c > 0 ? 1 : 0));
    for (let i = 0; i < bins; i++) {
      for (let j = 0; j < bins; j++) {
        if (filled[i * bins + j]) continue;
        let s = 0, n = 0;
        for (const [di, dj] of [[1, 0], [-1, 0], [0, 1], [0, -1]]) {
          const at = ((i + di + bins) % bins) * bins + ((j + dj + bins) % bins);
          if (filled[at]) {
            s += motif[at];
            n++;
          }
        }
        if (n > 0) {
          motif[i * bins + j] = s / n;
          count[i * bins + j] = 1;
          empty--;
        }
      }
    }
  }
  return motif;
}
