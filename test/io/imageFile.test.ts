import fc from 'fast-check';
import { encode as encodePng } from 'fast-png';
import { encode as encodeJpeg } from 'jpeg-js';
import { describe, expect, it } from 'vitest';
import { MAX_PICTURE_PIXELS, readPicture } from '../../src/io/imageFile.ts';
import { ValidationError } from '../../src/validate/invalid.ts';
import { encodeGreyPng } from '../../src/io/png.ts';
import { refusal } from './refusal.ts';

const text = (s: string) => new TextEncoder().encode(s);
const ramp = (w: number, h: number, scale: number) => Array.from({ length: w * h }, (_, i) => ((i % w) + 3 * Math.floor(i / w)) * scale);

describe('readPicture(file, bytes)', () => {
  it('reads 8-bit and 16-bit grey PNGs written by fast-png (an outside encoder) exactly', () => {
    const eight = encodePng({ width: 20, height: 18, data: Uint8Array.from(ramp(20, 18, 1)), depth: 8, channels: 1 });
    expect(Array.from(readPicture('a.png', eight).values)).toEqual(ramp(20, 18, 1));
    const sixteen = encodePng({ width: 20, height: 18, data: Uint16Array.from(ramp(20, 18, 97)), depth: 16, channels: 1 });
    const p = readPicture('b.png', sixteen);
    expect([p.width, p.height, p.format]).toEqual([20, 18, 'png']);
    expect(Array.from(p.values)).toEqual(ramp(20, 18, 97));
  });

  it('turns colour into grey by the ITU-R BT.601 luma weights 0.299, 0.587, 0.114', () => {
    const data = new Uint8Array(16 * 16 * 4);
    for (let i = 0; i < 256; i++) data.set([i % 2 ? 200 : 0, 100, 50, 255], 4 * i);
    const p = readPicture('c.png', encodePng({ width: 16, height: 16, data, depth: 8, channels: 4 }));
    expect(p.values[0]).toBeCloseTo(0.587 * 100 + 0.114 * 50, 10);
    expect(p.values[1]).toBeCloseTo(0.299 * 200 + 0.587 * 100 + 0.114 * 50, 10);
  });

  it('reads a JPEG written by jpeg-js (an outside encoder) to within its loss', () => {
    const w = 32, h = 24, data = new Uint8Array(w * h * 4);
    for (let i = 0; i < w * h; i++) data.set([128 + 100 * Math.sin(i % w / 5), 128 + 100 * Math.sin(i % w / 5), 128 + 100 * Math.sin(i % w / 5), 255], 4 * i);
    const p = readPicture('d.jpg', encodeJpeg({ width: w, height: h, data }, 95).data);
    expect([p.width, p.height, p.format]).toEqual([w, h, 'jpeg']);
    for (let i = 0; i < w * h; i += 37) expect(Math.abs(p.values[i] - (128 + 100 * Math.sin(i % w / 5)))).toBeLessThan(6);
  });

  it('reads our own PNG writer\'s files and text matrices (blanks, commas, semicolons, # comments)', () => {
    const grey = Uint8Array.from(ramp(16, 16, 1));
    expect(Array.from(readPicture('e.png', encodeGreyPng(16, 16, grey)).values)).toEqual(Array.from(grey));
    const rows = Array.from({ length: 16 }, (_, r) => Array.from({ length: 16 }, (_, c) => (r * 0.5 + c).toString()).join(r % 2 ? ', ' : '\t'));
    const m = readPicture('f.txt', text(`# heights in nm\n${rows.join('\n')}\n`));
    expect([m.width, m.height, m.format, m.values[17]]).toEqual([16, 16, 'text', 1.5]);
  });

  it('refuses bad input with the file named and what is wrong', () => {
    expect(refusal(() => readPicture('x.png', new Uint8Array(0)))).toBe('invalid x.png: "0 bytes" (empty file)');
    expect(refusal(() => readPicture('x.bin', Uint8Array.of(0, 1, 2, 3, 200, 7)))).toMatch(/^invalid x\.bin: .*not an image/);
    expect(refusal(() => readPicture('x.txt', text('1 2 3\n4 5\n')))).toMatch(/^invalid x\.txt:2: .*rows differ in length/);
    expect(refusal(() => readPicture('x.txt', text('1 2 x\n')))).toMatch(/^invalid x\.txt:1: "x" \(not a number/);
    expect(refusal(() => readPicture('x.txt', text('# nothing\n')))).toMatch(/empty/);
    expect(refusal(() => readPicture('flat.png', encodeGreyPng(16, 16, new Uint8Array(256).fill(9))))).toMatch(/^invalid flat\.png: .*flat: every pixel is 9/);
    expect(refusal(() => readPicture('small.png', encodeGreyPng(8, 8, Uint8Array.from(ramp(8, 8, 1)))))).toMatch(/too small/);
    // A PNG header announcing 5000 × 5000 pixels is refused before anything is decoded.
    const big = encodeGreyPng(16, 16, Uint8Array.from(ramp(16, 16, 1)));
    new DataView(big.buffer).setUint32(16, 5000);
    new DataView(big.buffer).setUint32(20, 5000);
    expect(refusal(() => readPicture('big.png', big))).toMatch(new RegExp(`too large: at most ${MAX_PICTURE_PIXELS} pixels`));
    const broken = encodeGreyPng(16, 16, Uint8Array.from(ramp(16, 16, 1))).slice(0, 60);
    expect(refusal(() => readPicture('broken.png', broken))).toMatch(/^invalid broken\.png: "PNG" \(cannot decode it/);
    expect(refusal(() => readPicture('broken.jpg', Uint8Array.of(0xff, 0xd8, 0xff, 0, 1, 2)))).toMatch(/^invalid broken\.jpg: "JPEG" \(cannot decode it/);
  });

  it('fuzz: any bytes (raw, or behind a PNG or JPEG signature) give a picture or a ValidationError, nothing else (fast-check, 10,000 inputs)', () => {
    const prefixes = [[], [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a], [0xff, 0xd8, 0xff], Array.from(text('1 2\n'))];
    fc.assert(fc.property(fc.constantFrom(...prefixes), fc.uint8Array({ maxLength: 200 }), (prefix, body) => {
      try {
        readPicture('f', Uint8Array.from([...prefix, ...body]));
      } catch (error) {
        if (!(error instanceof ValidationError)) throw error;
        expect(error.message.includes('\n')).toBe(false);
      }
    }), { numRuns: 10_000 });
  });
});
