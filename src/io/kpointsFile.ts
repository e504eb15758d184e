/**
 * k-points file (DESIGN.md, `bands --kpoints`): `{ "kpoints": [[kx, ky], …] }` in Cartesian Å⁻¹.
 */
import { fieldPath, invalid } from '../validate/invalid.ts';

/** Most k-points one file may hold. */
export const MAX_KPOINTS = 1_000_000;
/** Largest |k| component accepted (Å⁻¹); a B–B bond of 1.7 Å has its zone edge near 2.5 Å⁻¹. */
export const MAX_K = 1e4;

/** Parses and validates; returns kx, ky interleaved. `origin` names the file in errors. */
export function parseKpointsText(text: string, origin = 'kpoints'): Float64Array {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    invalid(origin, text.slice(0, 40), `not JSON: ${(error as Error).message}`);
  }
  return parseKpointsObject(value);
}

export function parseKpointsObject(value: unknown): Float64Array {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) invalid('kpoints file', value, 'must be an object {"kpoints": [[kx, ky]]}');
  for (const key of Object.keys(value)) if (key !== 'kpoints') invalid(fieldPath('', key), (value as Record<string, unknown>)[key], 'unknown field; a k-points file has only "kpoints"');
  return readKpointList((value as { kpoints?: unknown }).kpoints, 'kpoints');
}

/** A list of [kx, ky] (Å⁻¹) under `field`, checked point by point; returns kx, ky interleaved. */
export function readKpointList(list: unknown, field: string): Float64Array {
  if (!Array.isArray(list)) invalid(field, list, 'must be a list of [kx, ky]');
  if (list.length === 0) invalid(field, list, 'empty');
  if (list.length > MAX_KPOINTS) invalid(field, `${list.length} points`, `at most ${MAX_KPOINTS}`);
  const out = new Float64Array(2 * list.length);
  list.forEach((point: unknown, index: number) => {
    if (!Array.isArray(point) || point.length !== 2) invalid(`${field}[${index}]`, point, 'must be [kx, ky]');
    for (let c = 0; c < 2; c++) {
      const k = point[c];
      if (typeof k !== 'number' || !Number.isFinite(k)) invalid(`${field}[${index}][${c}]`, k, 'not a finite number');
      if (Math.abs(k) > MAX_K) invalid(`${field}[${index}][${c}]`, k, `|k| above ${MAX_K} Å⁻¹`);
      out[2 * index + c] = k;
    }
  });
  return out;
}
