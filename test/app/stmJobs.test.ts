import { describe, expect, it } from 'vitest';
import { analyseFile, simulate, tipLine } from '../../src/app/stmJobs.ts';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { findParameterPreset } from '../../src/tb/params.ts';

const text = (s: string) => new TextEncoder().encode(s);

describe('analyseFile(input)', () => {
  it('names the file and what is wrong: not a picture, flat, no periodicity', () => {
    expect(() => analyseFile({ name: 'notes.txt', bytes: text('scan of 12 March\n'), pixelSize: 0.2, background: 'plane' }))
      .toThrow('invalid notes.txt:1: "scan" (not a number: a text matrix holds one row of numbers per line)');
    const flat = Array.from({ length: 16 }, () => Array(16).fill('1').join(' ')).join('\n');
    expect(() => analyseFile({ name: 'flat.txt', bytes: text(flat), pixelSize: 0.2, background: 'plane' })).toThrow(/^invalid flat\.txt: .*flat/);
    // A plane is removed exactly (background.ts), so a tilted picture has nothing periodic left.
    const tilted = Array.from({ length: 32 }, (_, r) => Array.from({ length: 32 }, (_, c) => String(r + 2 * c)).join(' ')).join('\n');
    expect(() => analyseFile({ name: 'tilt.txt', bytes: text(tilted), pixelSize: 0.2, background: 'plane' })).toThrow(/^invalid tilt\.txt: "32×32 pixels" \(flat/);
  });
});

describe('simulate(input)', () => {
  it('draws the sheet at the tip given and says so: the bias sign names filled or empty states (V > 0: empty, the CLI\'s convention)', () => {
    const out = simulate({
      label: 'alpha', sheet: patternToSheet(findSheetPreset('alpha')!.pattern), params: findParameterPreset('harrison1980')!,
      doping: 0, smearing: 0.1, bias: -1, height: 4, mode: 'constant-current', cells: 2, pixels: 32,
    });
    expect(out.figure.kind).toBe('simulated');
    expect([out.figure.width, out.figure.height]).toEqual([32, 32]);
    expect(out.figure.lines[0]).toMatch(/^V = −1 V \(filled states\)/);
    expect(out.states).toBeGreaterThan(0);
    expect(tipLine({ bias: 0.5, height: 3, mode: 'constant-height' })).toBe('V = +0.5 V (empty states), tip 3 Å, constant height');
  });
});
