/**
 * Command-line flags: one declarative spec per command, one parser, one error style.
 * Every refusal is a ValidationError `invalid --flag: <value> (<why>)`, so the shell prints one line and exits 2.
 */
import { ValidationError, invalid } from '../validate/invalid.ts';

/** What a flag accepts. Ranges are inclusive; `a-b` or a single value `a`. */
export type FlagKind =
  | { kind: 'switch' }
  | { kind: 'integer'; min: number; max: number }
  | { kind: 'number'; min: number; max: number; exclusiveMin?: boolean; exclusiveMax?: boolean }
  | { kind: 'integerRange'; min: number; max: number }
  | { kind: 'numberRange'; min: number; max: number }
  | { kind: 'integerList'; min: number; max: number; maxLength: number }
  | { kind: 'numberList'; min: number; max: number; length: number; exclusiveMin?: boolean }
  | { kind: 'choice'; values: readonly string[] }
  | { kind: 'text' }
  | { kind: 'shard' };

/** `repeatable`: may be given more than once; every value is kept in order in ParsedArgs.repeated. */
export type FlagSpec = FlagKind & { help: string; placeholder?: string; repeatable?: boolean };

export interface CommandSpec {
  name: string;
  summary: string;
  /** Positional arguments in order; the last one may be `repeatable` (one or more, at most MAX_REPEATS). */
  positionals: readonly { name: string; help: string; optional?: boolean; repeatable?: boolean }[];
  flags: Readonly<Record<string, FlagSpec>>;
}

export type FlagValue = boolean | number | string | [number, number] | number[] | { index: number; count: number };

export interface ParsedArgs {
  /** The (first) value of each positional. */
  positionals: Record<string, string>;
  /** The (first) value of each flag given. */
  flags: Record<string, FlagValue>;
  /** Every value, in order, of each repeatable flag or positional given. */
  repeated: Record<string, FlagValue[]>;
}

/** Most values a repeatable flag or positional takes. */
export const MAX_REPEATS = 16;

/** Longest flag value we look at; anything longer is refused before parsing. */
const MAX_VALUE_LENGTH = 4096;

const INTEGER = /^[+-]?\d+$/;
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

function parseInteger(flag: string, text: string, min: number, max: number): number {
  if (!INTEGER.test(text)) invalid(flag, text, 'not an integer');
  const value = Number(text);
  if (!(value >= min && value <= max)) invalid(flag, text, `must be from ${min} to ${max}`);
  return value;
}

function parseNumber(flag: string, text: string, min: number, max: number, exclusiveMin = false, exclusiveMax = false): number {
  if (!NUMBER.test(text)) invalid(flag, text, 'not a number');
  const value = Number(text);
  if (!Number.isFinite(value)) invalid(flag, text, 'not a finite number');
  const low = exclusiveMin ? value > min : value >= min;
  const high = exclusiveMax ? value < max : value <= max;
  if (!(low && high)) {
    const range = exclusiveMin || exclusiveMax
      ? `${exclusiveMin ? 'above' : 'at least'} ${min} and ${exclusiveMax ? 'below' : 'at most'} ${max}`
      : `from ${min} to ${max}`;
    invalid(flag, text, `must be ${range}`);
  }
  return value;
}

/** `a-b` or `a`; negative numbers need no special form because the separator is the first `-` after a digit. */
function splitRange(flag: string, text: string): [string, string] {
  const match = /^([+-]?[^-]+)(?:-([+-]?[^-]+))?$/.exec(text);
  if (!match) invalid(flag, text, 'not a range such as 4-12 or 6');
  return [match[1], match[2] ?? match[1]];
}

/** Runs a parse of one part of a value; a refusal then shows the whole value, with the part in the reason. */
function withWhole<T>(flag: string, whole: string, parse: () => T): T {
  try {
    return parse();
  } catch (error) {
    if (!(error instanceof ValidationError) || error.value === JSON.stringify(whole)) throw error;
    throw new ValidationError(flag, JSON.stringify(whole), `${error.value}: ${error.why}`);
  }
}

function parseValue(flag: string, spec: FlagSpec, text: string): FlagValue {
  if (text.length > MAX_VALUE_LENGTH) invalid(flag, text, `longer than ${MAX_VALUE_LENGTH} characters`);
  switch (spec.kind) {
    case 'switch':
      return true;
    case 'integer':
      return parseInteger(flag, text, spec.min, spec.max);
    case 'number':
      return parseNumber(flag, text, spec.min, spec.max, spec.exclusiveMin, spec.exclusiveMax);
    case 'integerRange':
    case 'numberRange': {
      const [lowText, highText] = splitRange(flag, text);
      const parse = spec.kind === 'integerRange' ? parseInteger : parseNumber;
      const low = withWhole(flag, text, () => parse(flag, lowText, spec.min, spec.max));
      const high = withWhole(flag, text, () => parse(flag, highText, spec.min, spec.max));
      if (low > high) invalid(flag, text, 'the range is empty (low end above high end)');
      return [low, high];
    }
    case 'integerList': {
      const parts = text.split(',');
      if (parts.length > spec.maxLength) invalid(flag, text, `at most ${spec.maxLength} values`);
      return parts.map((part) => withWhole(flag, text, () => parseInteger(flag, part.trim(), spec.min, spec.max)));
    }
    case 'numberList': {
      const parts = text.split(',');
      if (parts.length !== spec.length) invalid(flag, text, `needs ${spec.length} comma-separated numbers`);
      return parts.map((part) => withWhole(flag, text, () => parseNumber(flag, part.trim(), spec.min, spec.max, spec.exclusiveMin)));
    }
    case 'choice':
      if (!spec.values.includes(text)) invalid(flag, text, `must be one of ${spec.values.join(', ')}`);
      return text;
    case 'text':
      if (text.length === 0) invalid(flag, text, 'empty');
      return text;
    case 'shard': {
      const match = /^(\d+)\/(\d+)$/.exec(text);
      if (!match) invalid(flag, text, 'not of the form i/n, e.g. 3/8');
      const index = Number(match[1]);
      const count = Number(match[2]);
      if (!(count >= 1 && count <= 100_000)) invalid(flag, text, 'n must be from 1 to 100000');
      if (!(index >= 1 && index <= count)) invalid(flag, text, 'i must be from 1 to n');
      return { index, count };
    }
  }
}

/** Parses argv (without the command name) against a command's spec. */
export function parseArgs(spec: CommandSpec, argv: readonly string[]): ParsedArgs {
  const flags: Record<string, FlagValue> = {};
  const repeated: Record<string, FlagValue[]> = {};
  const given: string[] = [];
  for (let at = 0; at < argv.length; at++) {
    const word = argv[at];
    if (word.startsWith('--')) {
      const equals = word.indexOf('=');
      const name = equals < 0 ? word.slice(2) : word.slice(2, equals);
      const flag = `--${name}`;
      const flagSpec = Object.hasOwn(spec.flags, name) ? spec.flags[name] : undefined;
      if (!flagSpec) {
        const known = Object.keys(spec.flags).map((f) => `--${f}`).join(', ');
        // Name the flag itself when it looks like one; otherwise the field is just "option".
        invalid(/^--[A-Za-z][\w-]*$/.test(flag) ? flag : 'option', word, `unknown option for ${spec.name}; known: ${known}`);
      }
      if (Object.hasOwn(flags, name) && !flagSpec.repeatable) invalid(flag, word, 'given twice');
      let text: string;
      if (flagSpec.kind === 'switch') {
        if (equals >= 0) invalid(flag, word, 'takes no value');
        text = '';
      } else if (equals >= 0) {
        text = word.slice(equals + 1);
      } else {
        if (at + 1 >= argv.length) invalid(flag, undefined, `needs a value${flagSpec.placeholder ? ` (${flagSpec.placeholder})` : ''}`);
        text = argv[++at];
      }
      const value = parseValue(flag, flagSpec, text);
      if (flagSpec.repeatable) {
        const list = (repeated[name] ??= []);
        if (list.length >= MAX_REPEATS) invalid(flag, text, `given more than ${MAX_REPEATS} times`);
        list.push(value);
      }
      if (!Object.hasOwn(flags, name)) flags[name] = value;
    } else if (/^-[A-Za-z]/.test(word)) {
      // A single-dash word is a mistyped option, not a positional argument (a file named so can be given as ./-m).
      const known = Object.keys(spec.flags).map((f) => `--${f}`).join(', ');
      invalid(/^-[A-Za-z][\w-]*$/.test(word) ? word : 'option', word, `unknown option for ${spec.name}; options are written --name; known: ${known}`);
    } else {
      given.push(word);
    }
  }
  const positionals: Record<string, string> = {};
  const slots = spec.positionals;
  const last = slots[slots.length - 1];
  if (last?.repeatable && given.length > slots.length) {
    const extra = given.slice(slots.length - 1);
    if (extra.length > MAX_REPEATS) invalid(last.name, extra[MAX_REPEATS], `at most ${MAX_REPEATS} values`);
    repeated[last.name] = extra;
    given.length = slots.length;
  } else if (last?.repeatable && given.length === slots.length) {
    repeated[last.name] = [given[slots.length - 1]];
  }
  if (given.length > slots.length) {
    invalid(slots.length ? 'arguments' : 'argument', given[slots.length], `${spec.name} takes ${slots.length ? slots.map((s) => s.name).join(' ') : 'no positional arguments'}`);
  }
  slots.forEach((slot, index) => {
    if (index < given.length) positionals[slot.name] = given[index];
    else if (!slot.optional) invalid(slot.name, undefined, `${spec.name} needs ${slot.name}: ${slot.help}`);
  });
  return { positionals, flags, repeated };
}

/** Help text for one command, generated from its spec. */
export function commandHelp(spec: CommandSpec): string {
  const shown = (p: CommandSpec['positionals'][number]) => `${p.name}${p.repeatable ? '...' : ''}`;
  const lines = [`lacuna ${spec.name} ${spec.positionals.map((p) => (p.optional ? `[${shown(p)}]` : shown(p))).join(' ')}`.trimEnd(), `  ${spec.summary}`];
  for (const p of spec.positionals) lines.push(`  ${shown(p).padEnd(22)} ${p.help}`);
  for (const [name, flag] of Object.entries(spec.flags)) {
    const left = `--${name}${flag.placeholder ? ` ${flag.placeholder}` : ''}`;
    lines.push(`  ${left.padEnd(22)} ${flag.help}${flag.repeatable ? ' (may be repeated)' : ''}`);
  }
  return lines.join('\n');
}

/** A parsed range written back as the user would type it: `4-12`, or `6` for a one-point range. */
export function rangeText(range: readonly number[]): string {
  return range[0] === range[1] ? `${range[0]}` : `${range[0]}-${range[1]}`;
}
