import { describe, expect, it } from 'vitest';
import { readBackground, readBias, readCells, readHeight, readMode, readPixels, readPixelSize, readSites, readTop } from '../../src/app/stmFields.ts';

describe('the STM panel\'s field readers', () => {
  it('readBias: signed volts; refuses zero (empty window, as the CLI\'s --bias), beyond 10 V and text, naming the field', () => {
    expect(readBias(' -0.5 ')).toBe(-0.5);
    expect(readBias('2')).toBe(2);
    expect(() => readBias('0')).toThrow('invalid bias V: "0" (|V| must be at least 0.01 V: the window E_F … E_F + eV is empty at zero bias)');
    expect(() => readBias('-12')).toThrow('invalid bias V: "-12" (|V| must be at most 10 V)');
    expect(() => readBias('one')).toThrow('invalid bias V: "one" (not a number)');
    expect(() => readBias('')).toThrow('invalid bias V: "" (required)');
  });

  it('readHeight, readMode: the CLI\'s bounds and choices', () => {
    expect(readHeight('6.5')).toBe(6.5);
    expect(() => readHeight('1')).toThrow('invalid tip height: "1" (must lie in [1.5, 15] Å)');
    expect(readMode('constant-height')).toBe('constant-height');
    expect(() => readMode('hover')).toThrow('invalid tip mode: "hover"');
  });

  it('readCells, readPixels, readTop: whole numbers in range', () => {
    expect(readCells('4')).toBe(4);
    expect(() => readCells('2.5')).toThrow('invalid cells per side: "2.5" (not a whole number)');
    expect(readPixels('192')).toBe(192);
    expect(() => readPixels('4096')).toThrow('invalid pixels per side: "4096" (must be from 32 to 512)');
    expect(readTop('8')).toBe(8);
    expect(() => readTop('0')).toThrow('invalid candidates listed: "0" (must be from 1 to 100)');
  });

  it('readPixelSize: required and positive; the message says what it is', () => {
    expect(readPixelSize('0.2')).toBe(0.2);
    expect(() => readPixelSize(' ')).toThrow('invalid pixel size: " " (required: Å per pixel of the picture (scan size divided by pixels))');
    expect(() => readPixelSize('0')).toThrow('invalid pixel size: "0" (must lie in (0, 100] Å)');
    expect(() => readPixelSize('-1')).toThrow('invalid pixel size: "-1" (must lie in (0, 100] Å)');
  });

  it('readBackground and readSites', () => {
    expect(readBackground('lines')).toBe('lines');
    expect(() => readBackground('sky')).toThrow('invalid background: "sky"');
    expect(readSites('1-12')).toEqual([1, 12]);
    expect(readSites(' 6 ')).toEqual([6, 6]);
    expect(() => readSites('9-3')).toThrow('invalid sites per cell: "9-3" (the range is empty (low end above high end))');
    expect(() => readSites('1-40')).toThrow('invalid sites per cell: "40" (must be from 1 to 16)');
  });
});
