import { encode as encodePng } from 'fast-png';
import { describe, expect, it } from 'vitest';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import type { Vec2 } from '../../src/lattice/sheet.ts';
import { moirePicture } from '../stm/helpers.ts';
import { cli, refused } from './runCommand.ts';



// α strained onto its (√21×√21)R10.9° coincidence cell with Ag(111) (worked by hand in test/stm/coincidenceMatch.test.ts:
// √7 of α's 3d cell on √21 of a_s = 4.0853/√2 Å, CRC Handbook, from memory; strain |√21·a_s/(√7·3d) − 1| = 0.0131),
// with a moiré modulation of that cell: a synthetic 16-bit PNG made here (DEMO geometry).
const AG = 4.0853 / Math.SQRT2;
const sheet = patternToSheet(findSheetPreset('alpha')!.pattern);
const rows = (r: [number, number][], [p, q]: [Vec2, Vec2]) => r.map(([i, j]) => [i * p[0] + j * q[0], i * p[1] + j * q[1]] as Vec2) as [Vec2, Vec2];
const picture = moirePicture(sheet, rows([[2, 1], [-1, 3]], sheet.cell), rows([[4, 1], [-1, 5]], [[AG, 0], [AG / 2, (AG * Math.sqrt(3)) / 2]]), { pixels: 512, pixelSize: 0.2, angleDeg: -41, tilt: 2, noise: 0.3, seed: 8, moire: 0.5 });
let lo = Infinity, hi = -Infinity;
for (const v of picture.values) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
const files = { 'm.png': encodePng({ width: 512, height: 512, data: Uint16Array.from(picture.values, (v) => Math.round((65535 * (v - lo)) / (hi - lo))), depth: 16, channels: 1 }) };

describe('lacuna match --substrate', () => {
  it('names α on Ag(111) through its coincidence cell, keeps the contract keys and says how each candidate fits', async () => {
    const { code, stdout } = await cli(['match', 'm.png', '--pixel-size', '0.2', '--sites', '8-10', '--top', '3', '--substrate', 'ag111', '--json'], files);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(Object.keys(document.lattice)).toEqual(expect.arrayContaining(['a', 'b', 'gamma_deg']));
    expect(document.lattice.a).toBeCloseTo(Math.sqrt(21) * AG, 0); // the coincidence cell, hand-worked above
    const best = document.candidates[0];
    expect(Object.keys(best)).toEqual(expect.arrayContaining(['sites', 'holes', 'supercell', 'vacancies', 'score', 'fit']));
    expect(best).toMatchObject({ sites: 9, holes: 1, phase: 'alpha', fit: { kind: 'coincidence', sites: 21, sheet_cells: 7 } });
    expect(best.fit.strain).toBeCloseTo(0.0131, 4);
    expect(Object.keys(best.fit)).toEqual(expect.arrayContaining(['angle_deg', 'strain', 'sheet_supercell', 'substrate_supercell']));
    const scores = document.candidates.map((c: { score: number }) => c.score);
    expect(scores).toEqual([...scores].sort((a, b) => b - a));
    expect(document.substrate).toMatchObject({ name: 'ag111', max_strain: 0.03 });
    expect(document.coincidence_score).toMatch(/moiré contrast itself is not modelled/);
  });

  it('without --substrate the same picture gives no α (its own cell is not the measured one); the text names the coincidence', async () => {
    const own = JSON.parse((await cli(['match', 'm.png', '--pixel-size', '0.2', '--sites', '8-10', '--top', '20', '--json'], files)).stdout);
    expect(own.candidates.some((c: { phase?: string }) => c.phase === 'alpha')).toBe(false);
    expect(own.candidates.every((c: object) => !('fit' in c))).toBe(true); // the contract's output, unchanged
    const text = await cli(['match', 'm.png', '--pixel-size', '0.2', '--sites', '9-9', '--top', '1', '--substrate', 'ag111', '--max-strain', '0.02'], files);
    expect(text.code).toBe(0);
    expect(text.stdout).toMatch(/fits by a coincidence cell: 7 sheet cells on 21 metal atoms \(√21×√21\)R10\.9°/);
    // Below the fit's strain the coincidence is not allowed.
    const tight = JSON.parse((await cli(['match', 'm.png', '--pixel-size', '0.2', '--sites', '9-9', '--substrate', 'ag111', '--max-strain', '0.01', '--json'], files)).stdout);
    expect(tight.candidates.some((c: { phase?: string }) => c.phase === 'alpha')).toBe(false);
  });

  it('bad input names the flag: an unknown metal lists the known ones; --max-strain out of range or without --substrate', async () => {
    await refused(['match', 'm.png', '--pixel-size', '0.2', '--substrate', 'pt111'], /^invalid --substrate: "pt111" \(unknown substrate; substrates: .*ag111/, files);
    await refused(['match', 'm.png', '--pixel-size', '0.2', '--substrate', 'ag111', '--max-strain', '0.5'], /^invalid --max-strain: "0\.5"/, files);
    await refused(['match', 'm.png', '--pixel-size', '0.2', '--substrate', 'ag111', '--max-strain', '0'], /^invalid --max-strain: "0"/, files);
    await refused(['match', 'm.png', '--pixel-size', '0.2', '--max-strain', '0.020'], /^invalid --max-strain: "0\.020" \(only with --substrate/, files);
    await refused(['match', 'm.png', '--pixel-size', '0.2', '--max-strain=0.02'], /^invalid --max-strain: "0\.02" \(only with --substrate/, files);
  });
});
