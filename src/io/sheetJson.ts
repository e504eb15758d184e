/**
 * Sheets as sheet-file text (DESIGN.md, sheet contract): the explicit form with every atom's z, or the
 * pattern form. Numbers keep full double precision, so parseSheetText reads back the same values.
 * The explicit form keeps the sheet's own cell (unlike CIF/XYZ, which reduce it by default).
 */
import { hnfRows } from '../lattice/pattern.ts';
import type { Pattern, Sheet } from '../lattice/sheet.ts';

const json = (x: unknown) => JSON.stringify(x);

/** The explicit form `{ name?, cell, atoms: [[f1, f2, z]] }`, one atom per line. */
export function sheetToJson(sheet: Sheet): string {
  const head = sheet.name !== undefined ? [`  "name": ${json(sheet.name)},`] : [];
  const atoms = sheet.atoms.map((atom, k) => `    ${json(atom)}${k + 1 < sheet.atoms.length ? ',' : ''}`);
  return ['{', ...head, `  "cell": ${json(sheet.cell)},`, '  "atoms": [', ...atoms, '  ]', '}', ''].join('\n');
}

/** The pattern form `{ name?, bond, supercell (HNF rows), vacancies }`. */
export function patternToJson(pattern: Pattern): string {
  const head = pattern.name !== undefined ? [`  "name": ${json(pattern.name)},`] : [];
  return [
    '{', ...head,
    `  "bond": ${json(pattern.bond)},`,
    `  "supercell": ${json(hnfRows(pattern.supercell))},`,
    `  "vacancies": ${json(pattern.vacancies)}`,
    '}', '',
  ].join('\n');
}
