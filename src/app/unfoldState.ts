/**
 * The unfolding panel's part of the view: the energy of the constant-energy cut (relative to E_F) and which orbitals
 * the densities show, and their keys in the URL hash: `cut-energy` (eV, the CLI's --cut-energy) and `unfold-part`
 * (`total` | `sigma` | `pi`, the CLI's plot --part). Validated like every hash key.
 */
import type { SpectralPart } from '../figures/types.ts';
import { invalid } from '../validate/invalid.ts';

export interface UnfoldState {
  /** E − E_F of the cut (eV). */
  cut: number;
  part: SpectralPart;
}

/** Bounds of the cut energy (eV from E_F), as the CLI's --cut-energy. */
export const CUT_LIMITS = [-50, 50] as const;
export const PARTS: readonly SpectralPart[] = ['total', 'sigma', 'pi'];
export const UNFOLD_KEYS = ['cut-energy', 'unfold-part'];

export function defaultUnfold(): UnfoldState {
  return { cut: 0, part: 'total' };
}

/** The cut energy from text (a field or the hash), refused with `field` named. */
export function readCutEnergy(text: string, field: string): number {
  const trimmed = text.trim();
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(trimmed)) invalid(field, text, 'not a number');
  const x = Number(trimmed);
  if (!(x >= CUT_LIMITS[0] && x <= CUT_LIMITS[1])) invalid(field, text, `must lie in [${CUT_LIMITS[0]}, ${CUT_LIMITS[1]}] eV from E_F`);
  return x;
}

export function readPart(text: string, field: string): SpectralPart {
  if (!(PARTS as readonly string[]).includes(text)) invalid(field, text, `must be ${PARTS.join(', ')}`);
  return text as SpectralPart;
}

export function readUnfoldKeys(get: (key: string) => string | undefined, state: UnfoldState, attempt: (action: () => void) => void): void {
  const cut = get('cut-energy');
  if (cut !== undefined) attempt(() => { state.cut = readCutEnergy(cut, 'URL cut-energy'); });
  const part = get('unfold-part');
  if (part !== undefined) attempt(() => { state.part = readPart(part, 'URL unfold-part'); });
}

export function writeUnfoldKeys(out: URLSearchParams, state: UnfoldState): void {
  const base = defaultUnfold();
  if (state.cut !== base.cut) out.set('cut-energy', String(state.cut));
  if (state.part !== base.part) out.set('unfold-part', state.part);
}
