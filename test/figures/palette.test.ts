import { lab, hcl } from 'd3';
import { describe, expect, it } from 'vitest';
import { PI_COLOUR, SIGMA_COLOUR, phaseColour, shareColour } from '../../src/figures/palette.ts';

describe('palette', () => {
  it('σ and π differ by > 25 in CIELAB L* (kept by every colour-vision type and in greyscale; common practice)', () => {
    expect(Math.abs(lab(SIGMA_COLOUR).l - lab(PI_COLOUR).l)).toBeGreaterThan(25);
    // Opposite ends of the blue–yellow axis b*, the axis protan and deutan vision keeps (common practice).
    expect(lab(SIGMA_COLOUR).b).toBeLessThan(-30);
    expect(lab(PI_COLOUR).b).toBeGreaterThan(50);
  });

  it('shareColour runs from π (0) to σ (1), clamped', () => {
    expect(shareColour(1)).toBe(SIGMA_COLOUR);
    expect(shareColour(0)).toBe(PI_COLOUR);
    expect(shareColour(2)).toBe(SIGMA_COLOUR);
    expect(shareColour(Number.NaN)).toBe(PI_COLOUR);
    const middle = lab(shareColour(0.5)).l;
    expect(middle).toBeGreaterThan(lab(SIGMA_COLOUR).l);
    expect(middle).toBeLessThan(lab(PI_COLOUR).l);
  });

  it('phaseColour is cyclic with period 2π at constant lightness', () => {
    expect(phaseColour(-Math.PI)).toBe(phaseColour(Math.PI));
    expect(phaseColour(0.3)).toBe(phaseColour(0.3 + 4 * Math.PI));
    // Within 2.5 of L* = 62: a few hues at chroma 48 leave the sRGB gamut and are clipped to the nearest byte.
    for (let p = -3; p <= 3; p += 0.25) expect(Math.abs(hcl(phaseColour(p)).l - 62)).toBeLessThan(2.5);
  });
});
