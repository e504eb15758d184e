import { describe, expect, it } from 'vitest';
import { analyseFile, rankCandidates, simulate, tipLine } from '../../src/app/stmJobs.ts';
import type { Vec2 } from '../../src/lattice/sheet.ts';
import { analysePicture } from '../../src/stm/analyse.ts';
import { moirePicture } from '../stm/helpers.ts';
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

describe('rankCandidates(input) with a metal', () => {
  // α strained onto its (√21×√21)R10.9° coincidence cell with Ag(111), with a moiré of that cell (hand-worked geometry,
  // see test/stm/coincidenceMatch.test.ts; a_s = 4.0853/√2 Å, CRC Handbook, from memory): synthetic, made here.
  const AG = 4.0853 / Math.SQRT2;
  const sheet = patternToSheet(findSheetPreset('alpha')!.pattern);
  const rows = (r: [number, number][], [p, q]: [Vec2, Vec2]) => r.map(([i, j]) => [i * p[0] + j * q[0], i * p[1] + j * q[1]] as Vec2) as [Vec2, Vec2];
  const picture = moirePicture(sheet, rows([[2, 1], [-1, 3]], sheet.cell), rows([[4, 1], [-1, 5]], [[AG, 0], [AG / 2, (AG * Math.sqrt(3)) / 2]]), { pixels: 512, pixelSize: 0.2, angleDeg: 11, tilt: 1, noise: 0.3, seed: 2, moire: 0.5 });
  const analysis = analysePicture(picture);
  const input = { params: findParameterPreset('harrison1980')!, sites: [9, 9] as [number, number], top: 3, smearing: 0.1, doping: 0, bias: 1, height: 4, mode: 'constant-current' as const };

  it('names α with the coincidence cell it fits by, and none without the metal', () => {
    if (!analysis.ok) throw new Error(analysis.why);
    const on = rankCandidates({ ...input, analysis, metal: 'ag111' });
    expect(on.candidates[0]).toMatchObject({ name: 'alpha', fit: { kind: 'coincidence', metal: 'ag111', sites: 21, sheetCells: 7, wood: '(√21×√21)R10.9°' } });
    expect(on.fittingByCoincidence).toBeGreaterThan(0);
    const off = rankCandidates({ ...input, analysis, metal: null });
    expect(off.candidates.some((c) => c.name === 'alpha')).toBe(false);
    expect(() => rankCandidates({ ...input, analysis, metal: 'pt111' })).toThrow(/^invalid metal for matching: "pt111" \(unknown substrate; substrates: /);
  });
});
