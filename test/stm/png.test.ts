import { decode } from 'fast-png';
import { describe, expect, it } from 'vitest';
import { adler32, crc32, encodeGreyPng } from '../../src/io/png.ts';
import { toGrey8 } from '../../src/stm/grey.ts';

const ascii = (text: string) => new TextEncoder().encode(text);

describe('encodeGreyPng(width, height, grey)', () => {
  it('CRC-32 and Adler-32 check values (CRC-32 of "123456789" is 0xCBF43926, the catalogue check value; Adler-32 of "Wikipedia" is 0x11E60398, from memory)', () => {
    expect(crc32(ascii('123456789'))).toBe(0xcbf43926);
    expect(adler32(ascii('Wikipedia'))).toBe(0x11e60398);
  });

  it('writes files that the fast-png decoder (an outside reference) reads back exactly, small and multi-block', () => {
    for (const [w, h] of [[1, 1], [17, 5], [300, 260]]) {
      const grey = Uint8Array.from({ length: w * h }, (_, i) => (i * 37 + (i >> 3)) & 0xff);
      const png = decode(encodeGreyPng(w, h, grey));
      expect([png.width, png.height, png.depth, png.channels]).toEqual([w, h, 8, 1]);
      expect(Array.from(png.data)).toEqual(Array.from(grey));
    }
  });

  it('toGrey8 maps the minimum to 0 and the maximum to 255; a flat picture is mid-grey', () => {
    expect(Array.from(toGrey8(Float64Array.of(-1, 0, 1)))).toEqual([0, 128, 255]);
    expect(Array.from(toGrey8(Float64Array.of(2, 2)))).toEqual([128, 128]);
  });
});
