/**
 * Reading a sheet back from a CIF (IUCr Crystallographic Information File, core dictionary names): the one data
 * block's `_cell_length_a/b/c`, `_cell_angle_alpha/beta/gamma` and the atom-site loop with
 * `_atom_site_fract_x/y/z` (and `_atom_site_type_symbol` or `_atom_site_label` when present: only boron is
 * kept). The in-plane cell is built the standard way, a along x and b in the xy plane at angle γ (International
 * Tables for Crystallography Vol. B, orthogonalisation with a ∥ x; common practice); heights z = fract_z·c,
 * with fract_z above ½ read as negative (c is the vacuum spacing: a sheet written about z = 0 wraps just below
 * it to near 1). A sheet is a slab: α = β = 90° is required.
 *
 * Every refusal names the CIF item and its line: `invalid CIF _cell_length_a (line 3): … (…)`.
 */
import { parseSheetObject, type ParsedSheet } from './sheetFile.ts';
import { invalid } from '../validate/invalid.ts';
import { MAX_SHEET_TEXT_LENGTH } from './sheetLimits.ts';

interface Item {
  value: string;
  line: number;
}

interface Loop {
  names: string[];
  rows: Item[][];
}

/** CIF values: bare words or quoted strings (no multi-line text fields needed for a structure). */
function tokens(line: string): string[] {
  return line.match(/'[^']*'|"[^"]*"|\S+/g) ?? [];
}

function unquote(value: string): string {
  return /^(['"]).*\1$/.test(value) ? value.slice(1, -1) : value;
}

/** A CIF number; standard uncertainties in brackets, e.g. 4.0853(2), are dropped. */
function cifNumber(item: Item | undefined, name: string): number {
  if (!item) invalid(`CIF ${name}`, undefined, 'missing');
  const text = unquote(item.value).replace(/\(\d+\)$/, '');
  const value = Number(text);
  if (text === '' || !Number.isFinite(value)) invalid(`CIF ${name} (line ${item.line})`, item.value, 'not a number');
  return value;
}

export function parseCifText(text: string, origin = 'CIF'): ParsedSheet {
  if (text.length > MAX_SHEET_TEXT_LENGTH) invalid(origin, `${text.length} characters`, `longer than the limit of ${MAX_SHEET_TEXT_LENGTH}`);
  if (!/^\s*data_/im.test(text)) invalid(origin, text.slice(0, 40), 'no data_ block: not a CIF');
  const items = new Map<string, Item>();
  const loops: Loop[] = [];
  const lines = text.split(/\r?\n/);
  let blocks = 0;
  let loop: Loop | undefined;
  let readingNames = false;
  for (let index = 0; index < lines.length; index++) {
    const line = lines[index].trim();
    const number = index + 1;
    if (line === '' || line.startsWith('#')) continue;
    if (line.startsWith(';')) invalid(`${origin} (line ${number})`, line, 'multi-line text fields are not read; remove them');
    if (/^data_/i.test(line)) {
      if (++blocks > 1) invalid(`${origin} (line ${number})`, line, 'more than one data block; a sheet file holds one structure');
      loop = undefined;
      continue;
    }
    if (/^loop_$/i.test(line)) {
      loop = { names: [], rows: [] };
      loops.push(loop);
      readingNames = true;
      continue;
    }
    if (line.startsWith('_')) {
      if (loop && readingNames) {
        loop.names.push(line.split(/\s+/)[0].toLowerCase());
        continue;
      }
      loop = undefined;
      const [name, ...rest] = tokens(line);
      if (rest.length === 0) invalid(`CIF ${name} (line ${number})`, undefined, 'no value on its line');
      items.set(name.toLowerCase(), { value: rest.join(' '), line: number });
      continue;
    }
    if (!loop) invalid(`${origin} (line ${number})`, line, 'a value outside any item or loop');
    readingNames = false;
    const values = tokens(line);
    const last = loop.rows[loop.rows.length - 1];
    // A loop row may run over several lines: fill the last row first.
    let row = last && last.length < loop.names.length ? last : undefined;
    for (const value of values) {
      if (!row || row.length === loop.names.length) {
        row = [];
        loop.rows.push(row);
      }
      row.push({ value, line: number });
    }
  }

  const a = cifNumber(items.get('_cell_length_a'), '_cell_length_a');
  const b = cifNumber(items.get('_cell_length_b'), '_cell_length_b');
  const c = cifNumber(items.get('_cell_length_c'), '_cell_length_c');
  for (const [name, value] of [['_cell_length_a', a], ['_cell_length_b', b], ['_cell_length_c', c]] as const) {
    if (!(value > 0)) invalid(`CIF ${name} (line ${items.get(name)!.line})`, value, 'must be positive');
  }
  for (const name of ['_cell_angle_alpha', '_cell_angle_beta']) {
    const item = items.get(name);
    if (item && Math.abs(cifNumber(item, name) - 90) > 1e-6) {
      invalid(`CIF ${name} (line ${item.line})`, item.value, 'a sheet is read as a slab: the vacuum axis c must be normal to a and b (90°)');
    }
  }
  const gammaItem = items.get('_cell_angle_gamma');
  const gamma = gammaItem ? cifNumber(gammaItem, '_cell_angle_gamma') : 90;
  if (!(gamma > 0 && gamma < 180)) invalid(`CIF _cell_angle_gamma (line ${gammaItem!.line})`, gamma, 'must lie strictly between 0 and 180°');

  const sites = loops.find((l) => l.names.includes('_atom_site_fract_x'));
  if (!sites) invalid('CIF _atom_site_fract_x', undefined, 'no atom-site loop with fractional coordinates');
  const column = (name: string) => sites.names.indexOf(name);
  const [cx, cy, cz] = ['_atom_site_fract_x', '_atom_site_fract_y', '_atom_site_fract_z'].map(column);
  if (cy < 0) invalid('CIF _atom_site_fract_y', undefined, 'missing from the atom-site loop');
  const species = column('_atom_site_type_symbol') >= 0 ? column('_atom_site_type_symbol') : column('_atom_site_label');
  const atoms: [number, number, number][] = [];
  for (const row of sites.rows) {
    if (row.length !== sites.names.length) invalid(`CIF atom-site loop (line ${row[0].line})`, row.map((r) => r.value).join(' '), `${row.length} values for ${sites.names.length} names`);
    if (species >= 0 && !/^B(?![a-z])/.test(unquote(row[species].value))) continue;
    const fx = cifNumber(row[cx], `_atom_site_fract_x (line ${row[cx].line})`);
    const fy = cifNumber(row[cy], `_atom_site_fract_y (line ${row[cy].line})`);
    let fz = cz >= 0 ? cifNumber(row[cz], `_atom_site_fract_z (line ${row[cz].line})`) : 0;
    if (fz > 0.5) fz -= 1; // heights about the sheet plane: just below z = 0 wraps to near 1
    atoms.push([fx, fy, fz * c]);
  }
  if (atoms.length === 0) invalid('CIF atom-site loop', `${sites.rows.length} sites`, 'no boron atom (type symbol B)');
  const rad = (Math.PI / 180) * gamma;
  const name = unquote(lines.find((l) => /^\s*data_/i.test(l))!.trim().slice(5));
  const sheet = {
    ...(name ? { name } : {}),
    cell: [[a, 0], [b * Math.cos(rad), b * Math.sin(rad)]],
    atoms,
  };
  return parseSheetObject(sheet);
}
