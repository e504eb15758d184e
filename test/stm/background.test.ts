import { describe, expect, it } from 'vitest';
import { removeBackground } from '../../src/stm/background.ts';

const width = 9, height = 7;
const picture = (f: (x: number, row: number) => number) => ({
  width, height, pixelSize: 1, values: Float64Array.from({ length: width * height }, (_, i) => f(i % width, Math.floor(i / width))),
});

describe('removeBackground(picture, mode)', () => {
  it('plane: a pure plane goes to zero (least squares reproduces a plane exactly)', () => {
    const out = removeBackground(picture((x, row) => 3 + 0.5 * x - 0.25 * row), 'plane');
    for (const v of out) expect(v).toBeCloseTo(0, 12);
  });

  it('lines: per-row offsets and slopes go to zero; a row pattern even about the centre and of zero mean is kept (analytic)', () => {
    const out = removeBackground(picture((x, row) => row * row + (0.1 * row) * x), 'lines');
    for (const v of out) expect(v).toBeCloseTo(0, 12);
    const even = [1, -1, 0, 0, 0, 0, 0, -1, 1];
    const kept = removeBackground(picture((x, row) => even[x] + row), 'lines');
    kept.forEach((v, i) => expect(v).toBeCloseTo(even[i % width], 12));
  });

  it('none: a copy, input untouched', () => {
    const p = picture((x) => x);
    const out = removeBackground(p, 'none');
    expect(out).not.toBe(p.values);
    expect(Array.from(out)).toEqual(Array.from(p.values));
  });
});
