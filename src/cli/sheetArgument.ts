/**
 * The SHEET argument of every command: a preset name, a path to a sheet file, or the JSON text itself.
 */
import { invalid, namingSource } from '../validate/invalid.ts';
import { parseSheetText } from '../io/sheetFile.ts';
import { patternToSheet } from '../lattice/pattern.ts';
import { SHEET_PRESETS, findSheetPreset } from '../lattice/presets.ts';
import type { Pattern, Sheet } from '../lattice/sheet.ts';
import type { CliIo } from './io.ts';

export interface SheetArgument {
  /** What the user called it: the preset name, the file path, or "inline JSON". */
  label: string;
  sheet: Sheet;
  pattern?: Pattern;
}

export function resolveSheet(text: string, io: CliIo, field = 'SHEET'): SheetArgument {
  const preset = findSheetPreset(text);
  if (preset) return { label: preset.name, sheet: patternToSheet(preset.pattern), pattern: preset.pattern };
  if (text.trimStart().startsWith('{')) return { label: 'inline JSON', ...parseSheetText(text, field) };
  let content: string;
  try {
    content = io.readText(text);
  } catch (error) {
    const names = SHEET_PRESETS.map((p) => p.name).join(', ');
    const reason = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such preset or file' : 'cannot read the file';
    invalid(field, text, `${reason}; presets: ${names}`);
  }
  return { label: text, ...namingSource('the sheet file', text, () => parseSheetText(content, text)) };
}
