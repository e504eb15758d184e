/**
 * What a sheet choice means for the figures and the solver, and the edits the sheet figure offers: toggling a
 * site, a new supercell. Pure (no DOM): the panels call these and keep the results in the view state.
 */
import { primitivePattern } from '../enumerate/period.ts';
import { invalid } from '../validate/invalid.ts';
import { hnfRows, holeDensity, makePattern, patternToSheet } from '../lattice/pattern.ts';
import { reduceSite, toHnf } from '../lattice/hnf.ts';
import { findSheetPreset } from '../lattice/presets.ts';
import { estimateHoleDensity } from '../lattice/geometry.ts';
import type { Pattern, Sheet } from '../lattice/sheet.ts';
import type { SheetChoice } from './state.ts';

/** Largest edited supercell (sites): beyond it the sheet figure and the solver stop being interactive. */
export const MAX_EDIT_SITES = 144;

/** A sheet choice resolved: what is drawn and what is solved. */
export interface ResolvedSheet {
  label: string;
  /** The pattern as edited (its supercell is the one outlined), when the sheet is on the triangular lattice. */
  pattern?: Pattern;
  /** The same pattern at its smallest cell; the solver runs on patternToSheet(cellPattern). */
  cellPattern?: Pattern;
  /** What the solver runs on. */
  sheet: Sheet;
  /** Hole density (exact for patterns, else an areal estimate) and whether it is estimated. */
  eta: number;
  etaEstimated: boolean;
}

export function resolveSheetChoice(choice: SheetChoice): ResolvedSheet {
  if (choice.kind === 'explicit') {
    const estimate = estimateHoleDensity(choice.sheet);
    return { label: choice.label, sheet: choice.sheet, eta: estimate.eta, etaEstimated: !estimate.exact };
  }
  const pattern = choice.kind === 'preset' ? findSheetPreset(choice.name)!.pattern : choice.pattern;
  const label = choice.kind === 'preset' ? choice.name : choice.label;
  const cellPattern = primitivePattern(pattern);
  return { label, pattern, cellPattern, sheet: patternToSheet(cellPattern), eta: holeDensity(pattern), etaEstimated: false };
}

/** The pattern with lattice site (i, j) toggled between atom and vacancy; refuses to empty the cell. */
export function toggleSite(pattern: Pattern, i: number, j: number): Pattern {
  const h = pattern.supercell;
  const [si, sj] = reduceSite(h, i, j);
  const vacant = pattern.vacancies.some(([vi, vj]) => vi === si && vj === sj);
  const vacancies = vacant ? pattern.vacancies.filter(([vi, vj]) => vi !== si || vj !== sj) : [...pattern.vacancies, [si, sj] as [number, number]];
  if (vacancies.length >= h.a * h.c) invalid('site', `${si},${sj}`, 'the last atom of the cell cannot be removed');
  return makePattern({ name: pattern.name, bond: pattern.bond, supercell: hnfRows(h), vacancies });
}

/**
 * The pattern in a new supercell (integer rows in the basis a1, a2). When the new cell is a supercell of the
 * pattern's own period lattice the pattern is kept (only the outline changes); otherwise it cannot repeat in the
 * new cell and its vacancies are kept only where they fall, which `kept` reports as false.
 */
export function changeSupercell(pattern: Pattern, rows: [[number, number], [number, number]]): { pattern: Pattern; kept: boolean } {
  const h = toHnf(rows);
  if (!h) invalid('supercell', JSON.stringify(rows), 'the two rows are parallel (zero area)');
  const sites = h.a * h.c;
  if (sites > MAX_EDIT_SITES) invalid('supercell', JSON.stringify(rows), `${sites} sites; the view edits cells of at most ${MAX_EDIT_SITES}`);
  const period = primitivePattern(pattern);
  const p = period.supercell;
  // Every row of the new cell must be a period: (i, j) reduces to the origin modulo the period lattice.
  const isPeriod = (i: number, j: number) => {
    const [ri, rj] = reduceSite(p, i, j);
    return ri === 0 && rj === 0;
  };
  const kept = isPeriod(h.a, 0) && isPeriod(h.b, h.c);
  const vacancies: [number, number][] = [];
  const vacantInPeriod = new Set(period.vacancies.map(([i, j]) => `${i},${j}`));
  for (let j = 0; j < h.c; j++) {
    for (let i = 0; i < h.a; i++) {
      const [ri, rj] = reduceSite(p, i, j);
      if (vacantInPeriod.has(`${ri},${rj}`)) vacancies.push([i, j]);
    }
  }
  if (vacancies.length >= sites) invalid('supercell', JSON.stringify(rows), 'every site of that cell would be vacant');
  return { pattern: makePattern({ name: pattern.name, bond: pattern.bond, supercell: hnfRows(h), vacancies }), kept };
}
