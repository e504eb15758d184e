/**
 * A bounded copy of any value for an error message: arrays and objects cut to their first few entries and a
 * few levels deep, long strings cut. `show` in invalid.ts renders values with JSON.stringify/String, which
 * overflow the stack on deeply nested input; a brief copy is always safe to render.
 */
const MAX_ENTRIES = 6;
const MAX_DEPTH = 3;
const MAX_STRING = 60;

function copy(value: unknown, depth: number): unknown {
  if (typeof value === 'string') return value.length > MAX_STRING ? `${value.slice(0, MAX_STRING)}…` : value;
  if (typeof value === 'bigint') return `${value}n`;
  if (typeof value === 'symbol' || typeof value === 'function') return `[${typeof value}]`;
  if (value === null || typeof value !== 'object') return value;
  if (Array.isArray(value)) {
    if (depth <= 0) return value.length === 0 ? [] : ['…'];
    const head = value.slice(0, MAX_ENTRIES).map((entry) => copy(entry, depth - 1));
    if (value.length > MAX_ENTRIES) head.push('…');
    return head;
  }
  const keys = Object.keys(value);
  if (depth <= 0) return keys.length === 0 ? {} : { '…': '…' };
  const out: Record<string, unknown> = {};
  for (const key of keys.slice(0, MAX_ENTRIES)) out[copy(key, 0) as string] = copy((value as Record<string, unknown>)[key], depth - 1);
  if (keys.length > MAX_ENTRIES) out['…'] = '…';
  return out;
}

/** A small, plain, JSON-safe stand-in for `value` (unreadable values become "[unreadable]"). */
export function brief(value: unknown): unknown {
  try {
    return copy(value, MAX_DEPTH);
  } catch {
    return '[unreadable]';
  }
}
