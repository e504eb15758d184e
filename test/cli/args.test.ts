import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseArgs, type CommandSpec, type FlagValue } from '../../src/cli/args.ts';
import { COMMANDS } from '../../src/cli/run.ts';
import { ValidationError } from '../../src/validate/invalid.ts';
import { refusal as message } from '../io/refusal.ts';

const demoSpec: CommandSpec = {
  name: 'demo',
  summary: 'a spec exercising every flag kind',
  positionals: [{ name: 'SHEET', help: 'a sheet' }, { name: 'EXTRA', help: 'optional', optional: true }],
  flags: {
    sites: { kind: 'integerRange', min: 1, max: 64, help: '' },
    eta: { kind: 'numberRange', min: 0, max: 1, help: '' },
    mesh: { kind: 'integer', min: 1, max: 400, help: '' },
    smearing: { kind: 'number', min: 0, max: 10, exclusiveMin: true, help: '' },
    sizes: { kind: 'integerList', min: 1, max: 512, maxLength: 4, help: '' },
    format: { kind: 'choice', values: ['cif', 'xyz'], help: '' },
    out: { kind: 'text', help: '' },
    shard: { kind: 'shard', help: '' },
    json: { kind: 'switch', help: '' },
  },
};

describe('parseArgs(spec, argv)', () => {
  it('reads every kind of flag, in both --flag value and --flag=value forms', () => {
    const parsed = parseArgs(demoSpec, ['alpha', '--sites', '4-12', '--eta=0.1-0.2', '--mesh', '60', '--smearing', '0.05', '--sizes', '24,64', '--format', 'cif', '--out', 'a.cif', '--shard', '2/8', '--json']);
    expect(parsed.positionals).toEqual({ SHEET: 'alpha' });
    expect(parsed.flags).toEqual({ sites: [4, 12], eta: [0.1, 0.2], mesh: 60, smearing: 0.05, sizes: [24, 64], format: 'cif', out: 'a.cif', shard: { index: 2, count: 8 }, json: true });
  });

  it('takes a single value as a one-point range', () => {
    expect(parseArgs(demoSpec, ['x', '--sites', '9']).flags.sites).toEqual([9, 9]);
  });

  it('names the flag and the reason in every refusal', () => {
    expect(message(() => parseArgs(demoSpec, ['x', '--mesh', 'abc']))).toBe('invalid --mesh: "abc" (not an integer)');
    expect(message(() => parseArgs(demoSpec, ['x', '--mesh', '0']))).toBe('invalid --mesh: "0" (must be from 1 to 400)');
    expect(message(() => parseArgs(demoSpec, ['x', '--smearing', '0']))).toMatch(/^invalid --smearing: "0" \(must be above 0/);
    expect(message(() => parseArgs(demoSpec, ['x', '--smearing', 'NaN']))).toBe('invalid --smearing: "NaN" (not a number)');
    expect(message(() => parseArgs(demoSpec, ['x', '--smearing', '1e400']))).toBe('invalid --smearing: "1e400" (not a finite number)');
    expect(message(() => parseArgs(demoSpec, ['x', '--sites', '12-4']))).toMatch(/^invalid --sites: "12-4" \(the range is empty/);
    expect(message(() => parseArgs(demoSpec, ['x', '--shard', '9/8']))).toBe('invalid --shard: "9/8" (i must be from 1 to n)');
    expect(message(() => parseArgs(demoSpec, ['x', '--bogus']))).toMatch(/^invalid --bogus: "--bogus" \(unknown option for demo; known: --sites/);
    expect(message(() => parseArgs(demoSpec, ['x', '--mesh']))).toBe('invalid --mesh: missing (needs a value)');
    expect(message(() => parseArgs(demoSpec, ['x', '--json=1']))).toBe('invalid --json: "--json=1" (takes no value)');
    expect(message(() => parseArgs(demoSpec, ['x', '--mesh', '3', '--mesh', '4']))).toBe('invalid --mesh: "--mesh" (given twice)');
    expect(message(() => parseArgs(demoSpec, []))).toBe('invalid SHEET: missing (demo needs SHEET: a sheet)');
    expect(message(() => parseArgs(demoSpec, ['a', 'b', 'c']))).toMatch(/^invalid arguments: "c"/);
    expect(message(() => parseArgs(demoSpec, ['x', '--toString']))).toMatch(/^invalid --toString: /);
  });
});

// Fuzzing of the CLI flags: ≥10,000 generated argument lists per command, each either parsed into finite,
// in-range values or refused with a ValidationError naming the field — never another exception.
const flagWord = (spec: CommandSpec) =>
  fc.oneof(
    fc.constantFrom(...Object.keys(spec.flags).map((f) => `--${f}`)),
    fc.constantFrom('--', '---', '--=', '--__proto__', '--constructor', '-x', '--JSON'),
    fc.string({ maxLength: 12 }).map((s) => `--${s}`),
  );
const valueWord = fc.oneof(
  fc.integer({ min: -1e6, max: 1e6 }).map(String),
  fc.double().map(String),
  fc.constantFrom('', ' ', '-', '--', '1-', '-1', '1--2', '3-1', '1e309', '-1e309', '0x10', '1_000', 'Infinity', 'NaN', '1/0', '0/0', '2/1', '5/4', '1,2,,3', '∞', '١٢', 'auto', 'cif', 'json', '{}', 'a'.repeat(5000)),
  fc.string({ maxLength: 20 }),
  fc.tuple(fc.integer({ min: -5, max: 80 }), fc.integer({ min: -5, max: 80 })).map(([a, b]) => `${a}-${b}`),
);

function checkValue(value: FlagValue): void {
  if (typeof value === 'number') expect(Number.isFinite(value)).toBe(true);
  if (Array.isArray(value)) for (const v of value) expect(Number.isFinite(v)).toBe(true);
}

describe('CLI flags fuzzing', () => {
  for (const command of COMMANDS) {
    it(`${command.spec.name}: 10,000 generated argument lists are parsed or refused with a named field`, () => {
      fc.assert(
        fc.property(fc.array(fc.oneof(flagWord(command.spec), valueWord), { maxLength: 10 }), (argv) => {
          try {
            const parsed = parseArgs(command.spec, argv);
            Object.values(parsed.flags).forEach(checkValue);
          } catch (error) {
            if (!(error instanceof ValidationError)) throw error;
            expect(error.message).toMatch(/^invalid \S+: .* \(.+\)$/);
            expect(error.field.length).toBeGreaterThan(0);
          }
        }),
        { numRuns: 10_000 },
      );
    });
  }
});
