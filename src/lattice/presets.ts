/**
 * Named sheet presets (data in presets/sheets/*.json, each with its source). Add one: drop a JSON file there
 * and list it below (DEVELOPERS.md, "Adding a sheet preset").
 */
import alpha from '../../presets/sheets/alpha.json' with { type: 'json' };
import beta12 from '../../presets/sheets/beta12.json' with { type: 'json' };
import chi3 from '../../presets/sheets/chi3.json' with { type: 'json' };
import delta6 from '../../presets/sheets/delta6.json' with { type: 'json' };
import honeycomb from '../../presets/sheets/honeycomb.json' with { type: 'json' };
import { makePattern } from './pattern.ts';
import type { Pattern } from './sheet.ts';

/** A preset's data file: the pattern form of the sheet contract plus its provenance. */
export interface PresetFile {
  name: string;
  title: string;
  bond: number;
  supercell: number[][];
  vacancies: number[][];
  source: string;
  bond_source: string;
}

export interface SheetPreset {
  readonly name: string;
  readonly title: string;
  readonly pattern: Pattern;
  /** Where the structure comes from. */
  readonly source: string;
  /** Where the bond length comes from. */
  readonly bondSource: string;
}

function preset(file: PresetFile): SheetPreset {
  const [[p, q], [r, s]] = file.supercell;
  const pattern = makePattern({
    name: file.name,
    bond: file.bond,
    supercell: [[p, q], [r, s]],
    vacancies: file.vacancies.map(([i, j]) => [i, j] as [number, number]),
  });
  return { name: file.name, title: file.title, pattern, source: file.source, bondSource: file.bond_source };
}

/** All sheet presets by name, in order of increasing hole density. */
export const SHEET_PRESETS: readonly SheetPreset[] = [delta6, alpha, beta12, chi3, honeycomb].map(preset);

export function findSheetPreset(name: string): SheetPreset | undefined {
  return SHEET_PRESETS.find((p) => p.name === name);
}
