/**
 * A picture's values as 8-bit grey levels, the form a picture file and an overlay image take: linear from the
 * minimum (0) to the maximum (255); a flat picture is mid-grey (128).
 */
export function toGrey8(values: Float64Array): Uint8Array {
  let lo = Infinity, hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (values[i] < lo) lo = values[i];
    if (values[i] > hi) hi = values[i];
  }
  const out = new Uint8Array(values.length);
  if (!(hi > lo)) return out.fill(128);
  const scale = 255 / (hi - lo);
  for (let i = 0; i < values.length; i++) out[i] = Math.round((values[i] - lo) * scale);
  return out;
}
