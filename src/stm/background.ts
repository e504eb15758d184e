/**
 * Background removal of a measured picture (common practice in scanning-probe work):
 * - 'plane': subtract the least-squares plane a + b·x + c·y (tilt of sample or scanner);
 * - 'lines': subtract from every scan line (row) its own least-squares line (tilt plus line-to-line offsets);
 * - 'none'.
 * On a full regular grid the centred coordinates are orthogonal, so each fit is closed-form. Returns a new array.
 */
import type { Picture } from './stmImage.ts';

export type Background = 'plane' | 'lines' | 'none';

export function removeBackground(picture: Picture, mode: Background): Float64Array {
  const { width: w, height: h, values } = picture;
  const out = Float64Array.from(values);
  if (mode === 'none') return out;
  const cx = (w - 1) / 2, cy = (h - 1) / 2;
  let sxx = 0;
  for (let x = 0; x < w; x++) sxx += (x - cx) * (x - cx);
  if (mode === 'lines') {
    for (let row = 0; row < h; row++) {
      let mean = 0, sxz = 0;
      for (let x = 0; x < w; x++) {
        mean += out[row * w + x];
        sxz += (x - cx) * out[row * w + x];
      }
      mean /= w;
      const slope = sxx > 0 ? sxz / sxx : 0;
      for (let x = 0; x < w; x++) out[row * w + x] -= mean + slope * (x - cx);
    }
    return out;
  }
  let syy = 0;
  for (let y = 0; y < h; y++) syy += (y - cy) * (y - cy);
  let mean = 0, sxz = 0, syz = 0;
  for (let row = 0; row < h; row++) {
    for (let x = 0; x < w; x++) {
      const z = out[row * w + x];
      mean += z;
      sxz += (x - cx) * z;
      syz += (row - cy) * z;
    }
  }
  mean /= w * h;
  const b = sxx > 0 ? sxz / (sxx * h) : 0;
  const c = syy > 0 ? syz / (syy * w) : 0;
  for (let row = 0; row < h; row++) for (let x = 0; x < w; x++) out[row * w + x] -= mean + b * (x - cx) + c * (row - cy);
  return out;
}
