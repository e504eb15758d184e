/**
 * Recognises the named sheet presets among structures by their canonical forms.
 */
import { SHEET_PRESETS } from '../lattice/presets.ts';
import { canonicalForm } from './canonical.ts';

let byCanonical: Map<string, string> | undefined;

/** The preset name whose canonical form is `canonical`, if any. */
export function presetPhase(canonical: string): string | undefined {
  byCanonical ??= new Map(SHEET_PRESETS.map((preset) => [canonicalForm(preset.pattern), preset.name]));
  return byCanonical.get(canonical);
}
