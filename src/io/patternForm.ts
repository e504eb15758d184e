/**
 * The pattern form of the sheet file (DESIGN.md, sheet contract): { name?, bond, supercell, vacancies },
 * validated. Any integer supercell rows of non-zero determinant are accepted and brought to HNF; vacancies
 * are any representatives, taken modulo the supercell.
 */
import { reduceSite, toHnf } from '../lattice/hnf.ts';
import { makePattern } from '../lattice/pattern.ts';
import type { Pattern } from '../lattice/sheet.ts';
import { refuseRendered, requireArray, requireFinite, requireInteger } from '../validate/fields.ts';
import { invalid } from '../validate/invalid.ts';
import { MAX_BOND, MAX_INTEGER_ENTRY, MAX_SUPERCELL_SITES, MIN_ATOM_SEPARATION } from './sheetLimits.ts';

type Rows = [[number, number], [number, number]];

function readBond(value: unknown): number {
  const bond = requireFinite(value, 'bond', Infinity);
  if (!(bond > 0)) invalid('bond', value, 'must be positive');
  if (bond < MIN_ATOM_SEPARATION) invalid('bond', value, `below the minimum atom separation ${MIN_ATOM_SEPARATION} Å`);
  if (bond > MAX_BOND) invalid('bond', value, `above the limit ${MAX_BOND} Å`);
  return bond;
}

function readIntegerPair(value: unknown, field: string): [number, number] {
  const entries = requireArray(value, field, 2);
  return [requireInteger(entries[0], `${field}[0]`, MAX_INTEGER_ENTRY), requireInteger(entries[1], `${field}[1]`, MAX_INTEGER_ENTRY)];
}

function readSupercell(value: unknown): Rows {
  const rows = requireArray(value, 'supercell', 2);
  const first = readIntegerPair(rows[0], 'supercell[0]');
  const second = readIntegerPair(rows[1], 'supercell[1]');
  const sites = Math.abs(first[0] * second[1] - first[1] * second[0]);
  if (sites === 0) invalid('supercell', value, 'singular: determinant 0');
  if (sites > MAX_SUPERCELL_SITES) invalid('supercell', value, `${sites} sites, more than the limit of ${MAX_SUPERCELL_SITES}`);
  return [first, second];
}

function readVacancies(value: unknown, rows: Rows): [number, number][] {
  const list = requireArray(value, 'vacancies');
  const hnf = toHnf(rows)!;
  const sites = hnf.a * hnf.c;
  if (list.length > sites) refuseRendered('vacancies', `${list.length} vacancies`, `more than the ${sites} sites of the supercell`);
  const seen = new Map<number, number>();
  const out = list.map((entry, k): [number, number] => {
    const point = readIntegerPair(entry, `vacancies[${k}]`);
    const [i, j] = reduceSite(hnf, point[0], point[1]);
    const earlier = seen.get(j * hnf.a + i);
    if (earlier !== undefined) invalid(`vacancies[${k}]`, entry, `same site as vacancies[${earlier}] modulo the supercell`);
    seen.set(j * hnf.a + i, k);
    return point;
  });
  if (out.length === sites) invalid('vacancies', value, `every one of the ${sites} sites is vacant: no atoms`);
  return out;
}

/** The pattern of a record already known to hold only pattern-form keys. */
export function readPatternForm(record: Record<string, unknown>, name: string | undefined): Pattern {
  const bond = readBond(record.bond);
  const supercell = readSupercell(record.supercell);
  const vacancies = readVacancies(record.vacancies, supercell);
  return makePattern({ ...(name !== undefined ? { name } : {}), bond, supercell, vacancies });
}
