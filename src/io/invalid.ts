/**
 * The one error style of lacuna: `invalid <field path>: <value> (<why>)`.
 * Thrown at the boundary (files, CLI flags, UI fields, URL state); kernels trust their inputs.
 */
export class ValidationError extends Error {
  override readonly name = 'ValidationError';
  constructor(
    /** Dotted/indexed path of the offending field, e.g. `atoms[3][1]` or `--mesh`. */
    readonly field: string,
    /** The offending value, already rendered for humans. */
    readonly value: string,
    /** Why it is refused. */
    readonly why: string,
  ) {
    super(`invalid ${field}: ${value} (${why})`);
  }
}

/** Renders any value compactly for an error message (long values are cut). */
export function show(value: unknown): string {
  let text: string;
  if (typeof value === 'string') text = JSON.stringify(value);
  else if (typeof value === 'number') text = Number.isNaN(value) ? 'NaN' : String(value);
  else if (value === undefined) text = 'missing';
  else {
    try {
      text = JSON.stringify(value) ?? String(value);
    } catch {
      text = String(value);
    }
  }
  return text.length > 80 ? `${text.slice(0, 77)}...` : text;
}

/** Throws a ValidationError for `field`. */
export function invalid(field: string, value: unknown, why: string): never {
  throw new ValidationError(field, show(value), why);
}

/**
 * The field path of `key` inside `parent` (empty for the top level): `parent.key` for plain names,
 * `parent["odd key"]` for anything else, so that a path never contains blanks or is empty.
 */
export function fieldPath(parent: string, key: string): string {
  if (/^[A-Za-z_][\w-]*$/.test(key)) return parent ? `${parent}.${key}` : key;
  return `${parent}[${JSON.stringify(key.length > 40 ? `${key.slice(0, 37)}...` : key)}]`;
}
