/**
 * The frame the CIF and XYZ writers share: the sheet in its right-handed reduced cell (by default) with the
 * first cell vector along +x, the CIF setting; and the vacuum spacing along z.
 */
import { alignFirstVector, reducedSheet } from '../lattice/reducedCell.ts';
import type { Sheet } from '../lattice/sheet.ts';
import { invalid } from '../validate/invalid.ts';
import { MIN_ATOM_SEPARATION } from './sheetLimits.ts';

/** Default length of the third (vacuum) cell vector, Å: wide enough that periodic copies of a sheet do not interact. */
export const DEFAULT_VACUUM = 15;

/** Options of the CIF and XYZ writers. */
export interface StructureExportOptions {
  /** Length of the third cell vector along z, Å; must exceed the sheet's thickness by 0.5 Å. Default 15. */
  readonly vacuum?: number;
  /**
   * Write the right-handed reduced cell (src/lattice/reducedCell.ts) instead of the sheet's own, default true.
   * Same structure either way; the reduced cell is the one crystallographic software expects.
   */
  readonly reduce?: boolean;
}

/** The sheet as written: reduced (unless told not to), turned so that the first vector lies along +x. */
export function exportFrame(sheet: Sheet, options: StructureExportOptions): { frame: Sheet; vacuum: number } {
  const vacuum = options.vacuum ?? DEFAULT_VACUUM;
  let zMin = 0, zMax = 0;
  for (const atom of sheet.atoms) {
    zMin = Math.min(zMin, atom[2]);
    zMax = Math.max(zMax, atom[2]);
  }
  if (!(vacuum >= zMax - zMin + MIN_ATOM_SEPARATION) || !Number.isFinite(vacuum)) {
    invalid('vacuum', vacuum, `must be finite and at least the sheet's thickness ${(zMax - zMin).toFixed(3)} Å + ${MIN_ATOM_SEPARATION} Å`);
  }
  const frame = alignFirstVector(options.reduce === false ? sheet : reducedSheet(sheet));
  return { frame, vacuum };
}

/** A name usable as a CIF data block code or an XYZ value: letters, digits, `_ . -` only. */
export function safeName(name: string | undefined): string {
  const cleaned = (name ?? '').replace(/[^A-Za-z0-9_.-]/g, '_').slice(0, 60);
  return cleaned.length > 0 ? cleaned : 'sheet';
}

/** Fixed-point text without a negative zero. */
export function fixed(x: number, digits: number): string {
  const text = x.toFixed(digits);
  return /^-0\.?0*$/.test(text) ? text.slice(1) : text;
}
