import { decode } from 'fast-png';
import { describe, expect, it } from 'vitest';
import { encode as encodeJpeg } from 'jpeg-js';
import { encode as encodePng } from 'fast-png';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { mulberry32, syntheticPicture } from '../stm/helpers.ts';
import { cli, refused } from './runCommand.ts';



describe('lacuna stm', () => {
  it('--json prints the contract keys and writes a greyscale PNG that fast-png (an outside decoder) reads', async () => {
    const { code, stdout, files } = await cli(['stm', 'chi3', '--pixels', '64', '--cells', '3', '--mesh', '8', '--png', 'chi3.png', '--json']);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document).toMatchObject({ png: 'chi3.png', width: 64, height: 64 });
    // Square of side n·max(|A1|, |A2|): chi3's cell is 5·1.69 × … Å (src/lattice), so 3·8.45 Å / 64 pixels.
    expect(document.pixel_size).toBeCloseTo((3 * Math.max(5 * 1.69, Math.hypot(...[1.69 * 2.5, 1.69 * Math.sqrt(3) / 2]))) / 64, 10);
    const png = decode(files.get('chi3.png') as Uint8Array);
    expect([png.width, png.height, png.depth, png.channels]).toEqual([64, 64, 8, 1]);
    expect(Math.max(...png.data)).toBe(255);
    expect(Math.min(...png.data)).toBe(0);
  });

  it('text output says what the picture is and that it is a model image, not a prediction', async () => {
    const { code, stdout } = await cli(['stm', 'beta12', '--pixels', '32', '--mesh', '6', '--bias', '-0.5', '--mode', 'constant-height', '--png', 'b.png']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/filled states/);
    expect(stdout).toMatch(/Tersoff–Hamann/);
    expect(stdout).toMatch(/not predictions/);
  });

  it('bad flags are named: bias, height, pixels, a missing or existing --png', async () => {
    await refused(['stm', 'alpha', '--png', 'a.png', '--bias', '0'], /^invalid --bias: 0 \(/);
    await refused(['stm', 'alpha', '--png', 'a.png', '--bias', '12'], /^invalid --bias: "12"/);
    await refused(['stm', 'alpha', '--png', 'a.png', '--height', '0.5'], /^invalid --height: "0.5"/);
    await refused(['stm', 'alpha', '--png', 'a.png', '--pixels', '5000'], /^invalid --pixels: "5000"/);
    await refused(['stm', 'alpha'], /^invalid --png: missing/);
    // The honeycomb's E_F is mid-gap in this model (fill reports the gap): ±1 V reaches no state.
    await refused(['stm', 'honeycomb', '--png', 'h.png', '--mesh', '8'], /^invalid --bias: 1 \(no states of honeycomb .* lies in a gap from/);
    await refused(['stm', 'alpha', '--png', 'a.png'], /^invalid --png: "a.png" \(the file exists/, { 'a.png': 'mine' });
  });
});

describe('lacuna match', () => {
  it('matches a picture written by lacuna stm back to its pattern, best first, with the contract keys', async () => {
    const made = await cli(['stm', 'chi3', '--pixels', '256', '--cells', '10', '--png', 'chi3.png', '--json']);
    const { pixel_size: pixelSize } = JSON.parse(made.stdout);
    const files = { 'chi3.png': made.files.get('chi3.png') as Uint8Array };
    const { code, stdout } = await cli(['match', 'chi3.png', '--pixel-size', String(pixelSize), '--sites', '4-6', '--top', '3', '--json'], files);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(Object.keys(document.lattice)).toEqual(expect.arrayContaining(['a', 'b', 'gamma_deg']));
    // chi3's reduced cell: 2.93 × 4.47 Å, γ 109.1° (src/lattice/periodicity.ts of the preset).
    expect(document.lattice.a).toBeCloseTo(2.927, 2);
    expect(document.lattice.b).toBeCloseTo(4.471, 2);
    const best = document.candidates[0];
    expect(Object.keys(best)).toEqual(expect.arrayContaining(['sites', 'holes', 'supercell', 'vacancies', 'score']));
    expect(best).toMatchObject({ sites: 5, holes: 1, phase: 'chi3' });
    const scores = document.candidates.map((c: { score: number }) => c.score);
    expect(scores).toEqual([...scores].sort((a, b) => b - a));
    const drawn = await cli(['match', 'chi3.png', '--pixel-size', String(pixelSize), '--sites', '5-5', '--overlay', 'lattice.png'], files);
    expect(drawn.code).toBe(0);
    const overlay = decode(drawn.files.get('lattice.png') as Uint8Array);
    expect([overlay.width, overlay.height, overlay.channels]).toEqual([256, 256, 1]);
    await refused(['match', 'chi3.png', '--pixel-size', '0.33', '--overlay', 'chi3.png'], /^invalid --overlay: "chi3\.png" \(the file exists/, files);
  });

  it('reads the same synthetic β12 picture (rotated 37°, tilted, noisy) as a height matrix in text, a colour JPEG and a 16-bit PNG, and names β12 each time', async () => {
    const picture = syntheticPicture(patternToSheet(findSheetPreset('beta12')!.pattern), { pixels: 192, pixelSize: 0.2, angleDeg: 37, tilt: 2, noise: 0.2, seed: 9 });
    let lo = Infinity, hi = -Infinity;
    for (const v of picture.values) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
    const level = (v: number) => (v - lo) / (hi - lo);
    const rows: string[] = [];
    for (let r = 0; r < 192; r++) rows.push(Array.from(picture.values.subarray(r * 192, (r + 1) * 192), (v) => v.toFixed(5)).join(' '));
    const rgba = new Uint8Array(192 * 192 * 4);
    picture.values.forEach((v, i) => rgba.set([255 * level(v), 200 * level(v), 40, 255], 4 * i));
    const deep = Uint16Array.from(picture.values, (v) => Math.round(65535 * level(v)));
    const files = {
      'b.txt': `# demo heights (Å), synthetic\n${rows.join('\n')}\n`,
      'b.jpg': encodeJpeg({ width: 192, height: 192, data: rgba }, 90).data,
      'b16.png': encodePng({ width: 192, height: 192, data: deep, depth: 16, channels: 1 }),
    };
    for (const file of Object.keys(files)) {
      const { code, stdout } = await cli(['match', file, '--pixel-size', '0.2', '--sites', '5-7', '--top', '2', '--json'], files);
      expect(code).toBe(0);
      expect(JSON.parse(stdout).candidates[0]).toMatchObject({ sites: 6, holes: 1, phase: 'beta12' });
    }
  });

  it('lists fitting patterns whose bias window is empty as unscored (the honeycomb: E_F mid-gap in this model), and scores them at a larger bias', async () => {
    const made = await cli(['stm', 'honeycomb', '--bias', '2', '--pixels', '128', '--cells', '8', '--mesh', '12', '--png', 'h.png', '--json']);
    const files = { 'h.png': made.files.get('h.png') as Uint8Array };
    const pixelSize = String(JSON.parse(made.stdout).pixel_size);
    const low = JSON.parse((await cli(['match', 'h.png', '--pixel-size', pixelSize, '--sites', '2-4', '--mesh', '12', '--json'], files)).stdout);
    expect(low.unscored).toContainEqual(expect.objectContaining({ sites: 3, holes: 1 }));
    expect(low.candidates.some((c: { phase?: string }) => c.phase === 'honeycomb')).toBe(false);
    const high = JSON.parse((await cli(['match', 'h.png', '--pixel-size', pixelSize, '--sites', '2-4', '--mesh', '12', '--bias', '2', '--json'], files)).stdout);
    expect(high.candidates[0]).toMatchObject({ sites: 3, holes: 1, phase: 'honeycomb' });
  });

  it('bad input names the file and what is wrong: not an image, empty, flat, no periodicity, missing file, no --pixel-size', async () => {
    const random = mulberry32(3);
    const noise = Array.from({ length: 64 }, () => Array.from({ length: 64 }, () => random().toFixed(4)).join(' ')).join('\n');
    const flat = Array.from({ length: 32 }, () => Array(32).fill('1.5').join(' ')).join('\n');
    const files = { 'junk.bin': Uint8Array.of(0, 1, 2, 255, 3), 'empty.png': new Uint8Array(0), 'flat.txt': flat, 'noise.txt': noise };
    await refused(['match', 'junk.bin', '--pixel-size', '0.1'], /^invalid junk\.bin: .*not an image/, files);
    await refused(['match', 'empty.png', '--pixel-size', '0.1'], /^invalid empty\.png: .*empty file/, files);
    await refused(['match', 'flat.txt', '--pixel-size', '0.1'], /^invalid flat\.txt: .*flat/, files);
    await refused(['match', 'noise.txt', '--pixel-size', '0.1'], /^invalid noise\.txt: "64×64 pixels" \(no periodicity/, files);
    await refused(['match', 'gone.png', '--pixel-size', '0.1'], /^invalid IMAGE: "gone\.png" \(no such file\)/, files);
    await refused(['match', 'noise.txt'], /^invalid --pixel-size: missing/, files);
    await refused(['match', 'noise.txt', '--pixel-size', '0'], /^invalid --pixel-size: "0"/, files);
  });
});
