/**
 * Metal (111) surfaces that a sheet grows on (data in presets/substrates/*.json, each value with its source).
 * Add one: drop a JSON file there and list it below (DEVELOPERS.md, "How to add a substrate").
 *
 * The surface lattice of an fcc (111) face is triangular with nearest-neighbour distance a/√2 (a the cubic
 * lattice constant); its primitive basis is b1 = a_s·(1, 0), b2 = a_s·(1/2, √3/2) (DESIGN.md, `fit` contract).
 */
import ag111 from '../../presets/substrates/ag111.json' with { type: 'json' };
import al111 from '../../presets/substrates/al111.json' with { type: 'json' };
import au111 from '../../presets/substrates/au111.json' with { type: 'json' };
import cu111 from '../../presets/substrates/cu111.json' with { type: 'json' };
import { fieldPath, invalid } from '../validate/invalid.ts';
import { requireFinite, requireRecord } from '../validate/fields.ts';

/** A metal surface with the provenance of every number. */
export interface Substrate {
  /** Registry name, e.g. `ag111`. */
  readonly name: string;
  /** Display name, e.g. `Ag(111)`. */
  readonly title: string;
  /** fcc cubic lattice constant a (Å). */
  readonly latticeConstant: number;
  /** Nearest-neighbour distance a/√2 (Å): the side of the surface's triangular lattice. */
  readonly nnDistance: number;
  readonly latticeSource: string;
  /** Work function W_M of the (111) face (eV). */
  readonly workFunction: number;
  readonly workFunctionSource: string;
  /** Typical height of a boron sheet above the top metal layer (Å), an estimate, when one is published. */
  readonly adsorptionHeight?: { readonly value: number; readonly source: string };
  /** Why no height is given, when none is. */
  readonly adsorptionHeightNote?: string;
}

function requireText(value: unknown, field: string): string {
  if (typeof value !== 'string' || value.trim().length === 0) invalid(field, value, 'not a non-empty string');
  return value;
}

function requireBetween(value: unknown, field: string, low: number, high: number, unit: string): number {
  const x = requireFinite(value, field, 1e6);
  if (!(x > low && x < high)) invalid(field, value, `must lie between ${low} and ${high} ${unit}`);
  return x;
}

/** Checks a substrate object (the file form) and returns it normalised; `field` prefixes every error path. */
export function validateSubstrate(value: unknown, field = ''): Substrate {
  const record = requireRecord(value, field || 'substrate');
  const at = (key: string) => fieldPath(field, key);
  const name = requireText(record.name, at('name'));
  if (!/^[a-z][a-z0-9_-]*$/.test(name)) invalid(at('name'), name, 'lower-case letters, digits, - and _ only');
  const latticeConstant = requireBetween(record.lattice_constant, at('lattice_constant'), 2, 8, 'Å');
  const substrate: Substrate = {
    name,
    title: requireText(record.title, at('title')),
    latticeConstant,
    nnDistance: latticeConstant / Math.SQRT2,
    latticeSource: requireText(record.lattice_source, at('lattice_source')),
    workFunction: requireBetween(record.work_function, at('work_function'), 1, 8, 'eV'),
    workFunctionSource: requireText(record.work_function_source, at('work_function_source')),
  };
  if (record.adsorption_height !== undefined) {
    const height = requireRecord(record.adsorption_height, at('adsorption_height'));
    const path = at('adsorption_height');
    return {
      ...substrate,
      adsorptionHeight: {
        value: requireBetween(height.value, fieldPath(path, 'value'), 0.5, 6, 'Å'),
        source: requireText(height.source, fieldPath(path, 'source')),
      },
    };
  }
  if (record.adsorption_height_note !== undefined) {
    return { ...substrate, adsorptionHeightNote: requireText(record.adsorption_height_note, at('adsorption_height_note')) };
  }
  return substrate;
}

/** All substrate presets, by increasing work function. */
export const SUBSTRATES: readonly Substrate[] = [al111, ag111, cu111, au111]
  .map((file) => validateSubstrate(file, `presets/substrates/${file.name}.json`));

export function findSubstrate(name: string): Substrate | undefined {
  return SUBSTRATES.find((s) => s.name === name);
}

/** The substrate called `name`, or `invalid <field>: <name> (unknown substrate; substrates: …)`. */
export function requireSubstrate(name: string, field = 'substrate'): Substrate {
  const found = findSubstrate(name);
  if (!found) invalid(field, name, `unknown substrate; substrates: ${SUBSTRATES.map((s) => s.name).join(', ')}`);
  return found;
}
