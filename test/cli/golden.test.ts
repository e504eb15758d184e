/**
 * Golden files of the CLI's JSON on the presets: regression guards for the contract output (shape and values),
 * not outside references — the outside checks live in the module tests. Numbers are rounded to 8 significant
 * digits, and those below 1e-12 in magnitude to 0, so that floating-point noise does not count. A failing
 * comparison writes `<name>.actual.json` beside the golden file; set LACUNA_UPDATE_GOLDEN=1 to accept the new output. Locally a missing golden file is written
 * (review it before committing); under CI (process.env.CI set) a missing file fails and nothing is written.
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/run.ts';
import { encode as encodePng } from 'fast-png';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset, SHEET_PRESETS } from '../../src/lattice/presets.ts';
import type { Vec2 } from '../../src/lattice/sheet.ts';
import { moirePicture } from '../stm/helpers.ts';
import { fakeIo } from './fakeIo.ts';

const GOLDEN = join(dirname(fileURLToPath(import.meta.url)), 'golden');

/** Below this magnitude a number is rounding noise of quantities of order one (weights, eV) and is written as 0. */
const NOISE_FLOOR = 1e-12;

function rounded(value: unknown): unknown {
  if (typeof value === 'number') return Math.abs(value) < NOISE_FLOOR ? 0 : Number(value.toPrecision(8));
  if (Array.isArray(value)) return value.map(rounded);
  if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, rounded(v)]));
  return value;
}

async function matchesGolden(name: string, argv: string[], files: Record<string, string | Uint8Array> = {}): Promise<void> {
  const io = fakeIo(files);
  expect(await runCli(argv, io)).toBe(0);
  const actual = `${JSON.stringify(rounded(JSON.parse(io.stdout())), null, 1)}\n`;
  const file = join(GOLDEN, `${name}.json`);
  if (process.env.CI) {
    // Under CI nothing is written first: a missing golden file would otherwise pass by construction.
    expect(existsSync(file), `golden file ${name}.json is missing (create it locally, review it, commit it)`).toBe(true);
    expect(process.env.LACUNA_UPDATE_GOLDEN, 'LACUNA_UPDATE_GOLDEN is refused under CI').toBeFalsy();
  } else if (process.env.LACUNA_UPDATE_GOLDEN || !existsSync(file)) writeFileSync(file, actual);
  const expected = readFileSync(file, 'utf8');
  if (actual !== expected) writeFileSync(join(GOLDEN, `${name}.actual.json`), actual);
  expect(actual).toBe(expected);
}

describe('CLI golden files', () => {
  for (const preset of SHEET_PRESETS) {
    it(`fill ${preset.name} --mesh 12 --json`, () => matchesGolden(`fill-${preset.name}`, ['fill', preset.name, '--mesh', '12', '--json']));
    it(`bonding ${preset.name} --mesh 12 --json`, () => matchesGolden(`bonding-${preset.name}`, ['bonding', preset.name, '--mesh', '12', '--json']));
    // The honeycomb's E_F lies mid-gap in this model (fill), 1.5 eV from either edge: its window needs 2 V.
    const bias = preset.name === 'honeycomb' ? '2' : '1';
    it(`stm ${preset.name} --pixels 32 --mesh 8 --bias ${bias} --json`, () => matchesGolden(`stm-${preset.name}`, ['stm', preset.name, '--pixels', '32', '--mesh', '8', '--bias', bias, '--png', 'p.png', '--json']));
  }
  it('match (a 128×128 stm picture of beta12) --sites 4-8 --json', async () => {
    const io = fakeIo();
    expect(await runCli(['stm', 'beta12', '--pixels', '128', '--cells', '12', '--mesh', '12', '--png', 'b.png', '--json'], io)).toBe(0);
    const pixelSize = String(JSON.parse(io.stdout()).pixel_size);
    await matchesGolden('match-beta12', ['match', 'b.png', '--pixel-size', pixelSize, '--sites', '4-8', '--mesh', '12', '--json'], { 'b.png': io.files.get('b.png') as Uint8Array });
  });
  it('match (α on its √21 coincidence cell with Ag(111), synthetic) --sites 9-9 --substrate ag111 --json', async () => {
    const AG = 4.0853 / Math.SQRT2;
    const sheet = patternToSheet(findSheetPreset('alpha')!.pattern);
    const rows = (r: [number, number][], [p, q]: [Vec2, Vec2]) => r.map(([i, j]) => [i * p[0] + j * q[0], i * p[1] + j * q[1]] as Vec2) as [Vec2, Vec2];
    const picture = moirePicture(sheet, rows([[2, 1], [-1, 3]], sheet.cell), rows([[4, 1], [-1, 5]], [[AG, 0], [AG / 2, (AG * Math.sqrt(3)) / 2]]), { pixels: 256, pixelSize: 0.25, angleDeg: 30, tilt: 1, noise: 0.2, seed: 4, moire: 0.5 });
    let lo = Infinity, hi = -Infinity;
    for (const v of picture.values) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
    const png = encodePng({ width: 256, height: 256, data: Uint16Array.from(picture.values, (v) => Math.round((65535 * (v - lo)) / (hi - lo))), depth: 16, channels: 1 });
    await matchesGolden('match-alpha-ag111', ['match', 'm.png', '--pixel-size', '0.25', '--sites', '9-9', '--mesh', '12', '--top', '3', '--substrate', 'ag111', '--json'], { 'm.png': png });
  });
  it('bands honeycomb --path auto --points 12 --json', () => matchesGolden('bands-honeycomb', ['bands', 'honeycomb', '--path', 'auto', '--points', '12', '--json']));
  it('unfold beta12 --path auto --points 12 --json', () => matchesGolden('unfold-beta12', ['unfold', 'beta12', '--path', 'auto', '--points', '12', '--json']));
  it('enumerate --sites 1-6 --holes 0-6 --json', () => matchesGolden('enumerate-1-6', ['enumerate', '--sites', '1-6', '--holes', '0-6', '--json']));
  it('transfer beta12 --substrate ag111 --mesh 12 --json', () => matchesGolden('transfer-beta12-ag111', ['transfer', 'beta12', '--substrate', 'ag111', '--mesh', '12', '--json']));
  it('fit chi3 --substrate ag111 --max-sites 12 --json', () => matchesGolden('fit-chi3-ag111', ['fit', 'chi3', '--substrate', 'ag111', '--max-sites', '12', '--json']));
  it('metals --mesh 12 --json', () => matchesGolden('metals', ['metals', '--mesh', '12', '--json']));
  it('export beta12 --format json', () => matchesGolden('export-beta12', ['export', 'beta12', '--format', 'json']));
});
