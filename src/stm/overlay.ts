/**
 * The fitted lattice drawn over a picture, for the eye: the background-removed picture in grey (minimum black,
 * maximum white) with a small cross at every lattice point. The points are placed at the brightest bin of the
 * picture averaged onto the fitted cell, so they sit on the bright feature the lattice repeats.
 * Layout: grey[row·width + col], row 0 at the top (PNG order).
 */
import { toGrey8 } from './grey.ts';
import type { Analysis } from './analyse.ts';
import { foldPicture } from './fold.ts';

/** A lattice point of the fitted lattice (pixels, x right, y up from the bottom-left corner): the brightest motif bin. */
export function latticeOrigin(analysis: Extract<Analysis, { ok: true }>): [number, number] {
  const { values, width, height, pixelSize, bins, lattice } = analysis;
  const motif = foldPicture(values, width, height, lattice.reciprocalPixels, bins);
  let brightest = 0;
  for (let b = 1; b < motif.length; b++) if (motif[b] > motif[brightest]) brightest = b;
  const f1 = (Math.floor(brightest / bins) + 0.5) / bins, f2 = ((brightest % bins) + 0.5) / bins;
  const [a, b] = lattice.vectors.map(([x, y]) => [x / pixelSize, y / pixelSize]);
  return [f1 * a[0] + f2 * b[0], f1 * a[1] + f2 * b[1]];
}

export function latticeOverlay(analysis: Extract<Analysis, { ok: true }>): Uint8Array {
  const { values, width, height, pixelSize, lattice } = analysis;
  const grey = toGrey8(values);
  const [a, b] = lattice.vectors.map(([x, y]) => [x / pixelSize, y / pixelSize]);
  const [ox, oy] = latticeOrigin(analysis);
  // Lattice indices covering the picture: solve the corners for (n1, n2) and take the bounding range.
  const det = a[0] * b[1] - a[1] * b[0];
  let lo1 = Infinity, hi1 = -Infinity, lo2 = Infinity, hi2 = -Infinity;
  for (const [x, y] of [[0, 0], [width, 0], [0, height], [width, height]]) {
    const n1 = ((x - ox) * b[1] - (y - oy) * b[0]) / det, n2 = (a[0] * (y - oy) - a[1] * (x - ox)) / det;
    lo1 = Math.min(lo1, n1); hi1 = Math.max(hi1, n1); lo2 = Math.min(lo2, n2); hi2 = Math.max(hi2, n2);
  }
  const put = (x: number, y: number, v: number) => {
    const col = Math.round(x), row = Math.round(height - 1 - y);
    if (col >= 0 && col < width && row >= 0 && row < height) grey[row * width + col] = v;
  };
  for (let n1 = Math.floor(lo1); n1 <= Math.ceil(hi1); n1++) {
    for (let n2 = Math.floor(lo2); n2 <= Math.ceil(hi2); n2++) {
      const x = ox + n1 * a[0] + n2 * b[0], y = oy + n1 * a[1] + n2 * b[1];
      for (let d = -3; d <= 3; d++) {
        put(x + d, y, 0);
        put(x, y + d, 0);
      }
      put(x, y, 255);
    }
  }
  return grey;
}
