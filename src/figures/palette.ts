/**
 * Colours of the figures, chosen by us.
 *
 * σ and π: a deep blue and an amber. They lie on opposite ends of the blue–yellow axis, which protanopes and
 * deuteranopes keep, and differ by more than 25 in CIELAB lightness L*, which tritanopes and greyscale prints
 * keep (checked in test/figures/palette.test.ts). Mixed states of buckled sheets blend the two in CIELAB, so a
 * half-and-half state is a neutral grey-violet of middle lightness, never a third hue.
 * Density (unfolded spectral weight): viridis (van der Walt & Smith's perceptually uniform scale, as in d3), dark at
 * no weight, its lightness rising monotonically, readable in greyscale and with every type of colour vision.
 * Phase: a cyclic hue circle at constant CIELAB lightness and chroma (HCL), so no phase looks brighter than another
 * and −π meets π without a seam.
 */
import { hcl, interpolateLab, interpolateViridis, rgb } from 'd3';

/** σ states (s, px, py). */
export const SIGMA_COLOUR = '#1f5aa6';
/** π states (pz). */
export const PI_COLOUR = '#e39b17';
export const INK = '#1d232b';
export const MUTED = '#6b7480';
export const GRID = '#d5d9de';
export const FERMI_COLOUR = '#b3261e';
export const OCCUPIED_FILL = '#cfd5dd';
export const ATOM_FILL = '#4a5563';
export const BOND_COLOUR = '#9aa3ad';
export const HOLE_FILL = '#f4e3b5';
export const TOTAL_COLOUR = INK;
/** Opacity of empty states (above E_F). */
export const EMPTY_OPACITY = 0.3;
/** Reference energies (the user's own calculation) in the calibration figure: a teal, apart from σ blue, π amber and E_F red. */
export const REFERENCE_COLOUR = '#138a72';

const blend = interpolateLab(PI_COLOUR, SIGMA_COLOUR);

/** Colour of a state with σ share w ∈ [0, 1]: π colour at 0, σ colour at 1, a CIELAB blend between. */
export function shareColour(w: number): string {
  if (w >= 1) return SIGMA_COLOUR;
  if (!(w > 0)) return PI_COLOUR;
  return blend(w);
}

/** Hue offset (degrees) so that phase 0 is a blue-green, clear of the σ/π colours' meaning. */
const PHASE_HUE_OFFSET = 200;

/** Colour of a phase (radians), cyclic with period 2π, at constant lightness 62 and chroma 48. */
export function phaseColour(phase: number): string {
  const degrees = (phase * 180) / Math.PI + PHASE_HUE_OFFSET;
  return hcl(((degrees % 360) + 360) % 360, 48, 62).formatHex();
}

/**
 * Metals on the η–δ map, in the order given (the registry orders them by work function, so lightness rises with
 * it): each pair differs by more than 15 in CIELAB L*, so the four stay apart in greyscale and for every type of
 * colour vision; each metal also has its own marker shape, which carries the identity on its own.
 */
export const METAL_COLOURS = ['#20305f', '#a8326e', '#2f9c8f', '#d9c24a'] as const;
/** Observations (experiment, not model output). */
export const OBSERVED_COLOUR = INK;

/** Colour of a density in [0, 1] (clipped): viridis. */
export const densityColour = (t: number): string => interpolateViridis(Math.min(1, Math.max(0, t)));

/** The density scale as 256 RGB triples (index = round(255·t)), for images: no colour parsing per pixel. */
export function densityTable(): Uint8Array {
  const table = new Uint8Array(3 * 256);
  for (let i = 0; i < 256; i++) {
    const c = rgb(interpolateViridis(i / 255));
    table[3 * i] = c.r;
    table[3 * i + 1] = c.g;
    table[3 * i + 2] = c.b;
  }
  return table;
}
