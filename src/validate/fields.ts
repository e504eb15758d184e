/**
 * Field checks shared by the input files: each returns the checked value or throws
 * `invalid <field>: <value> (<why>)` through invalid.ts.
 */
import { invalid, ValidationError } from './invalid.ts';

/** Throws the one error style with a value already rendered for humans (e.g. `5000 atoms`). */
export function refuseRendered(field: string, rendered: string, why: string): never {
  throw new ValidationError(field, rendered, why);
}

/** A plain object (not an array, not null) or an error. */
export function requireRecord(value: unknown, field: string): Record<string, unknown> {
  if (value === null || typeof value !== 'object' || Array.isArray(value)) invalid(field, value, 'not a JSON object');
  return value as Record<string, unknown>;
}

/** An array, of exactly `length` entries when given, or an error. */
export function requireArray(value: unknown, field: string, length?: number): unknown[] {
  if (!Array.isArray(value)) invalid(field, value, 'not an array');
  if (length !== undefined && value.length !== length) invalid(field, value, `${value.length} entries, expected ${length}`);
  return value;
}

/** A finite number with |x| ≤ `limit`, or an error; −0 comes back as 0. */
export function requireFinite(value: unknown, field: string, limit: number): number {
  if (typeof value !== 'number') invalid(field, value, 'not a number');
  if (!Number.isFinite(value)) invalid(field, value, 'not a finite number');
  if (!(Math.abs(value) <= limit)) invalid(field, value, `|value| above the limit ${limit}`);
  return value + 0;
}

/** An integer with |x| ≤ `limit`, or an error; −0 comes back as 0. */
export function requireInteger(value: unknown, field: string, limit: number): number {
  const x = requireFinite(value, field, limit);
  if (!Number.isInteger(x)) invalid(field, value, 'not an integer');
  return x;
}
