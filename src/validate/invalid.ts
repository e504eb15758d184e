/**
 * The one error style of lacuna: `invalid <field path>: <value> (<why>)`.
 * Thrown at the boundary (files, CLI flags, UI fields, URL state); kernels trust their inputs.
 *
 * The one quoting rule: the value is shown as JSON renders what the user wrote. Everything typed on a command
 * line is text — a flag's value, an argument, a file name — so it is always in double quotes, as typed
 * ("36", "-m", "1-22"), even when it is a number; a value read from a JSON file keeps its JSON type (a number
 * bare, text quoted); a value not given at all is `missing`. Callers pass command-line values as strings.
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
    // One line, always: a reason quoting raw input (e.g. a JSON parser's message) may carry newlines or tabs.
    super(`invalid ${oneLine(field)}: ${oneLine(value)} (${oneLine(why)})`);
  }
}

const BRIEF_ENTRIES = 6;
const BRIEF_DEPTH = 3;
const BRIEF_STRING = 60;

/**
 * A bounded copy of any value: arrays and objects cut to their first few entries and a few levels deep, long
 * strings cut. JSON.stringify and String overflow the stack on deeply nested input; a brief copy never does.
 */
function briefCopy(value: unknown, depth: number): unknown {
  if (typeof value === 'string') return value.length > BRIEF_STRING ? `${value.slice(0, BRIEF_STRING)}…` : value;
  if (typeof value === 'bigint') return `${value}n`;
  if (typeof value === 'symbol' || typeof value === 'function') return `[${typeof value}]`;
  if (value === null || typeof value !== 'object') return value;
  if (Array.isArray(value)) {
    if (depth <= 0) return value.length === 0 ? [] : ['…'];
    const head = value.slice(0, BRIEF_ENTRIES).map((entry) => briefCopy(entry, depth - 1));
    if (value.length > BRIEF_ENTRIES) head.push('…');
    return head;
  }
  const keys = Object.keys(value);
  if (depth <= 0) return keys.length === 0 ? {} : { '…': '…' };
  const out: Record<string, unknown> = {};
  for (const key of keys.slice(0, BRIEF_ENTRIES)) out[briefCopy(key, 0) as string] = briefCopy((value as Record<string, unknown>)[key], depth - 1);
  if (keys.length > BRIEF_ENTRIES) out['…'] = '…';
  return out;
}

/** Control characters written as JSON escapes (\n, \t, \u0000 …), so a message stays on one line. */
function oneLine(text: string): string {
  // eslint-disable-next-line no-control-regex
  return text.replace(/[\u0000-\u001f\u007f\u2028\u2029]/g, (c) => JSON.stringify(c).slice(1, -1));
}

/** Renders any value compactly and safely for an error message (deep values cut, long text cut). */
export function show(value: unknown): string {
  if (typeof value === 'number') return Number.isNaN(value) ? 'NaN' : String(value);
  if (value === undefined) return 'missing';
  let text: string;
  try {
    const copy = briefCopy(value, BRIEF_DEPTH);
    text = JSON.stringify(copy) ?? String(copy);
  } catch {
    text = '[unreadable]';
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

/**
 * Runs a parse of one input and names the input in any field error it throws: `invalid onsite.p: "a" (expected a
 * number; in the parameter file "p.json")`. An error already about the whole input (its field is the input's
 * name) is left as it is.
 */
export function namingSource<T>(what: string, name: string, parse: () => T): T {
  try {
    return parse();
  } catch (error) {
    if (!(error instanceof ValidationError) || error.field === name) throw error;
    throw new ValidationError(error.field, error.value, `${error.why}; in ${what} ${show(name)}`);
  }
}
