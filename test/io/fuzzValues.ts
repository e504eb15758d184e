/**
 * What the parser fuzz tests feed in: odd values of every kind, and valid inputs mutated at any path (a value
 * replaced, deleted, duplicated, or a key added). Shared by the sheet-file and energies-file fuzz tests.
 */
import fc from 'fast-check';

export const deep = (depth: number) => JSON.parse('['.repeat(depth) + ']'.repeat(depth)) as unknown;
export const extremeNumber = fc.constantFrom(
  0, -0, 1, -1, 0.5, 1e-320, 5e-324, -5e-324, 1e-12, 1e12, 1e300, -1e300, Number.MAX_VALUE, -Number.MAX_VALUE,
  Number.MAX_SAFE_INTEGER, -Number.MAX_SAFE_INTEGER, 2 ** 53 + 2, 2 ** 31, -(2 ** 31), NaN, Infinity, -Infinity, 1e6, 1e6 + 1, -1e6,
);
export const weird: fc.Arbitrary<unknown> = fc.oneof(
  extremeNumber,
  fc.double(),
  fc.integer({ min: -1e9, max: 1e9 }),
  fc.string({ maxLength: 20 }),
  fc.constantFrom(null, true, false, undefined, '', 'NaN', '1.69', [], {}, [[]], [[0, 0]], [0], { a: 1 }),
  fc.integer({ min: 1, max: 20_000 }).map(deep),
  fc.integer({ min: 1000, max: 200_000 }).map((n) => 'x'.repeat(n)),
  fc.array(fc.array(extremeNumber, { maxLength: 4 }), { maxLength: 5 }),
  fc.jsonValue({ maxDepth: 4 }),
);

/** Every path (list of keys) into a JSON value, at most 4 levels deep (deep values are left whole). */
export function paths(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  const out = [prefix];
  if (prefix.length >= 4) return out;
  if (Array.isArray(value)) value.slice(0, 50).forEach((entry, k) => out.push(...paths(entry, [...prefix, k])));
  else if (value !== null && typeof value === 'object') for (const [key, entry] of Object.entries(value)) out.push(...paths(entry, [...prefix, key]));
  return out;
}

export type Mutation = { kind: 'replace' | 'delete' | 'duplicate'; value: unknown } | { kind: 'addKey'; key: string; value: unknown };

/** Shallow copy of a container (arrays stay arrays; own keys only, so "__proto__" stays a plain key). */
function shallow(value: unknown): Record<string | number, unknown> {
  if (Array.isArray(value)) return [...value] as unknown as Record<number, unknown>;
  const out: Record<string, unknown> = {};
  for (const [key, entry] of Object.entries(value as object)) Object.defineProperty(out, key, { value: entry, enumerable: true, writable: true, configurable: true });
  return out;
}

/** The value with one mutation at one path; containers on the path are copied, the rest shared. */
export function mutate(base: unknown, pathPick: number, mutation: Mutation): unknown {
  const all = paths(base);
  const path = all[pathPick % all.length];
  const edit = (node: unknown): unknown => {
    if (mutation.kind === 'replace') return mutation.value;
    if (mutation.kind === 'addKey') {
      if (node === null || typeof node !== 'object' || Array.isArray(node)) return node;
      const copy = shallow(node);
      Object.defineProperty(copy, mutation.key, { value: mutation.value, enumerable: true, writable: true, configurable: true });
      return copy;
    }
    return node;
  };
  const walk = (node: unknown, depth: number): unknown => {
    if (depth === path.length) return edit(node);
    const copy = shallow(node);
    const key = path[depth];
    if (depth === path.length - 1 && mutation.kind === 'delete') {
      if (Array.isArray(copy)) (copy as unknown[]).splice(key as number, 1);
      else delete copy[key];
      return copy;
    }
    if (depth === path.length - 1 && mutation.kind === 'duplicate' && Array.isArray(copy)) {
      (copy as unknown[]).push(copy[key as number]);
      return copy;
    }
    copy[key] = walk(copy[key], depth + 1);
    return copy;
  };
  return walk(base, 0);
}

/** One mutation; `keys` are the names tried first when a key is added. */
export const mutationArbitrary = (keys: readonly string[]): fc.Arbitrary<Mutation> => fc.oneof(
  { weight: 5, arbitrary: weird.map((value): Mutation => ({ kind: 'replace', value })) },
  { weight: 1, arbitrary: fc.constant<Mutation>({ kind: 'delete', value: undefined }) },
  { weight: 1, arbitrary: fc.constant<Mutation>({ kind: 'duplicate', value: undefined }) },
  { weight: 1, arbitrary: fc.record({ key: fc.oneof(fc.constantFrom(...keys, '__proto__', 'constructor', ''), fc.string()), value: weird }).map((r): Mutation => ({ kind: 'addKey', ...r })) },
);
