/**
 * The whole view as one value, and its form in the URL hash (shareable, restorable).
 *
 * Hash keys (our own): `sheet` (a preset name, or sheet-file JSON in either contract form — the CLI's SHEET
 * argument), `params` (a parameter-set preset name, or parameter-file JSON — the CLI's --params), `doping`,
 * `smearing`, `mesh` (the CLI's defaults and mesh rule when absent), `repeats`, `pick` (k index, band of the selected state),
 * `label`, the candidate search: `sites`, `holes`, `eta`, `isolated`, `cell` (a,b,γ), `tolerance` (Å,°), and the
 * Metal panel: `metal` (a substrate preset name), `sheet-work-function`, `dipole` (eV), `distance`, `d0` (Å) —
 * the alignment model's fields, absent when at their estimated defaults (the CLI's flag names) — and the STM
 * panel: `bias` (V, sample against tip), `tip-height` (Å), `tip-mode` (`current` | `height`), `match-sites` (N1-N2),
 * `match-top` (K). The measured picture is never put in the hash: it stays in the page that opened it.
 * Every field is validated like any input: a bad one is reported as `invalid URL <key>: <value> (<why>)` and
 * falls back to its default, the others are kept.
 */
import { ValidationError, invalid } from '../validate/invalid.ts';
import { parseParameterFile } from '../io/paramsFile.ts';
import { parseSheetText } from '../io/sheetFile.ts';
import { hnfRows } from '../lattice/pattern.ts';
import { findSheetPreset, SHEET_PRESETS } from '../lattice/presets.ts';
import type { Pattern, Sheet } from '../lattice/sheet.ts';
import { ALIGNMENT_FLAG_LIMITS, type AlignmentField } from '../substrate/alignmentLimits.ts';
import { requireSubstrate } from '../substrate/substrates.ts';
import { alignmentParameters, type AlignmentParameters } from '../substrate/transfer.ts';
import { DEFAULT_SMEARING } from '../tb/fill.ts';
import { MIN_BIAS } from '../stm/biasWindow.ts';
import { STM_DEFAULTS, type StmMode } from '../stm/simulate.ts';
import { DEFAULT_PARAMETERS, findParameterPreset, PARAMETER_PRESETS, type ParameterSet } from '../tb/params.ts';

/** Which sheet is shown: a named preset, a vacancy pattern (edited, picked, imported), or an explicit sheet. */
export type SheetChoice =
  | { kind: 'preset'; name: string }
  | { kind: 'pattern'; label: string; pattern: Pattern }
  | { kind: 'explicit'; label: string; sheet: Sheet };

/** Which parameter set: a named preset or the user's own (validated) set. */
export type ParamsChoice = { kind: 'preset'; name: string } | { kind: 'own'; set: ParameterSet };

/** The candidate search over the enumerator. */
export interface SearchState {
  /** Lattice sites per cell N1–N2. */
  sites: [number, number];
  /** Holes per cell K1–K2. */
  holes: [number, number];
  /** Hole-density window (inclusive), or none. */
  eta?: [number, number];
  /** No two holes nearest neighbours. */
  isolated: boolean;
  /** A measured cell: lengths a, b (Å), angle γ (°), and the tolerances (Å, °). */
  cell?: { a: number; b: number; gamma: number; lengthTolerance: number; angleTolerance: number };
}

/** The Metal panel: which substrate, and the alignment model's fields the user set (absent: the estimate). */
export interface MetalState {
  /** Substrate preset name (src/substrate/substrates.ts). */
  name: string;
  model: AlignmentParameters;
}

/** The STM panel: the tip of every simulated picture, and the match settings. */
export interface StmState {
  /** Sample bias V against the tip (volts; V > 0 images empty states; MIN_BIAS ≤ |V| ≤ 10). */
  bias: number;
  /** Tip height above the highest atom (Å). */
  height: number;
  mode: StmMode;
  /** Lattice sites per cell of the candidates matched. */
  sites: [number, number];
  /** Candidates listed. */
  top: number;
  /**
   * The metal (a substrate name) whose coincidence cells with each candidate are also tried as the measured cell;
   * null: the candidate's own cell only (the default, as `match` without --substrate).
   */
  metal: string | null;
}

export interface ViewState {
  sheet: SheetChoice;
  params: ParamsChoice;
  /** Extra electrons per atom δ (strictly between −3 and 5, as the CLI). */
  doping: number;
  /** Gaussian width (eV). */
  smearing: number;
  /** Γ-centred mesh side; absent: the CLI's rule (36 for cells up to 12 atoms, else one k-point density). */
  mesh?: number;
  /** Copies of the cell drawn along each vector. */
  repeats: number;
  /** The selected Bloch state on the path, if any. */
  pick?: { kIndex: number; band: number };
  search: SearchState;
  metal: MetalState;
  stm: StmState;
}

/** Bounds of the view's own fields (the CLI's, where the CLI has one). */
export const LIMITS = {
  doping: [-3, 5] as const,
  smearing: [0, 10] as const,
  mesh: [1, 400] as const,
  repeats: [1, 8] as const,
  sites: [1, 24] as const,
  /** |V| (V): the CLI's --bias. */
  bias: [MIN_BIAS, 10] as const,
  /** Tip height (Å): the CLI's --height. */
  height: [1.5, 15] as const,
  /** Sites of the matched candidates: the CLI's `match --sites`. */
  matchSites: [1, 16] as const,
  top: [1, 100] as const,
};

/** The tip modes in the hash. */
export const TIP_MODES: Record<string, StmMode> = { current: 'constant-current', height: 'constant-height' };

export function defaultStm(): StmState {
  return { bias: STM_DEFAULTS.bias, height: STM_DEFAULTS.height, mode: STM_DEFAULTS.mode, sites: [1, 12], top: 8, metal: null };
}

/** Ag(111): the metal most boron sheets have been grown on. */
export const DEFAULT_METAL = 'ag111';

/** Hash keys of the alignment fields (the CLI's flag names). */
export const ALIGNMENT_KEYS: Record<AlignmentField, string> = {
  sheetWorkFunction: 'sheet-work-function', dipole: 'dipole', distance: 'distance', d0: 'd0',
};

export function defaultSearch(): SearchState {
  return { sites: [1, 12], holes: [1, 3], isolated: true };
}

export function defaultState(): ViewState {
  return {
    sheet: { kind: 'preset', name: 'alpha' },
    params: { kind: 'preset', name: DEFAULT_PARAMETERS },
    doping: 0,
    smearing: DEFAULT_SMEARING,
    repeats: 3,
    search: defaultSearch(),
    metal: { name: DEFAULT_METAL, model: {} },
    stm: defaultStm(),
  };
}

/** The parameter set a choice stands for. */
export function parameterSet(choice: ParamsChoice): ParameterSet {
  return choice.kind === 'own' ? choice.set : findParameterPreset(choice.name)!;
}

// --- reading -------------------------------------------------------------------------------------------------

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

function numberField(key: string, text: string, low: number, high: number, openLow: boolean, openHigh: boolean): number {
  if (!NUMBER.test(text)) invalid(`URL ${key}`, text, 'not a number');
  const x = Number(text);
  const ok = (openLow ? x > low : x >= low) && (openHigh ? x < high : x <= high);
  if (!ok) invalid(`URL ${key}`, text, `must lie in ${openLow ? '(' : '['}${low}, ${high}${openHigh ? ')' : ']'}`);
  return x;
}

function integerField(key: string, text: string, low: number, high: number): number {
  if (!/^[+-]?\d+$/.test(text)) invalid(`URL ${key}`, text, 'not an integer');
  const x = Number(text);
  if (!(x >= low && x <= high)) invalid(`URL ${key}`, text, `must be from ${low} to ${high}`);
  return x;
}

function rangeField(key: string, text: string, parse: (part: string) => number): [number, number] {
  const match = /^([^-]+)(?:-([^-]+))?$/.exec(text);
  if (!match) invalid(`URL ${key}`, text, 'not a range such as 1-12');
  const low = parse(match[1]);
  const high = parse(match[2] ?? match[1]);
  if (low > high) invalid(`URL ${key}`, text, 'the range is empty (low end above high end)');
  return [low, high];
}

function listField(key: string, text: string, length: number): number[] {
  const parts = text.split(',');
  if (parts.length !== length) invalid(`URL ${key}`, text, `needs ${length} comma-separated numbers`);
  return parts.map((part) => numberField(key, part, 0, 1000, false, false));
}

/** A sheet from a preset name or sheet-file JSON (the CLI's SHEET); `field` names it in errors. */
export function readSheetChoice(text: string, field: string, label?: string): SheetChoice {
  if (findSheetPreset(text)) return { kind: 'preset', name: text };
  if (!text.trimStart().startsWith('{')) {
    invalid(field, text, `no such preset; presets: ${SHEET_PRESETS.map((p) => p.name).join(', ')}, or sheet-file JSON`);
  }
  const parsed = parseSheetText(text, field);
  const name = label ?? parsed.sheet.name ?? 'shared sheet';
  return parsed.pattern && parsed.form === 'pattern'
    ? { kind: 'pattern', label: name, pattern: parsed.pattern }
    : { kind: 'explicit', label: name, sheet: parsed.sheet };
}

/** A parameter set from a preset name or parameter-file JSON (the CLI's --params). */
export function readParamsChoice(text: string, field: string): ParamsChoice {
  if (findParameterPreset(text)) return { kind: 'preset', name: text };
  if (!text.trimStart().startsWith('{')) {
    invalid(field, text, `no such parameter set; presets: ${PARAMETER_PRESETS.map((p) => p.name).join(', ')}, or parameter-file JSON`);
  }
  return { kind: 'own', set: parseParameterFile(text, field) };
}

/**
 * The view a hash describes, on top of `base` (the defaults or the demo); each bad field is reported and left
 * at its base value.
 */
export function readHash(hash: string, base: ViewState): { state: ViewState; errors: ValidationError[] } {
  const state: ViewState = structuredClone(base);
  const errors: ValidationError[] = [];
  const params = new URLSearchParams(hash.replace(/^#/, ''));
  const known = new Set(['sheet', 'params', 'doping', 'smearing', 'mesh', 'repeats', 'pick', 'label', 'sites', 'holes', 'eta', 'isolated', 'cell', 'tolerance', 'metal', ...Object.values(ALIGNMENT_KEYS), ...STM_KEYS]);
  const attempt = (action: () => void) => {
    try {
      action();
    } catch (error) {
      if (error instanceof ValidationError) errors.push(error);
      else throw error;
    }
  };
  for (const key of params.keys()) {
    if (!known.has(key)) attempt(() => invalid(`URL ${key}`, params.get(key), `unknown key; known: ${[...known].join(', ')}`));
  }
  const get = (key: string) => params.get(key) ?? undefined;
  const sheet = get('sheet');
  if (sheet !== undefined) attempt(() => { state.sheet = readSheetChoice(sheet, 'URL sheet', get('label')); delete state.pick; });
  const paramsText = get('params');
  if (paramsText !== undefined) attempt(() => { state.params = readParamsChoice(paramsText, 'URL params'); });
  const doping = get('doping');
  if (doping !== undefined) attempt(() => { state.doping = numberField('doping', doping, LIMITS.doping[0], LIMITS.doping[1], true, true); });
  const smearing = get('smearing');
  if (smearing !== undefined) attempt(() => { state.smearing = numberField('smearing', smearing, LIMITS.smearing[0], LIMITS.smearing[1], true, false); });
  const mesh = get('mesh');
  if (mesh !== undefined) attempt(() => { state.mesh = integerField('mesh', mesh, LIMITS.mesh[0], LIMITS.mesh[1]); });
  const repeats = get('repeats');
  if (repeats !== undefined) attempt(() => { state.repeats = integerField('repeats', repeats, LIMITS.repeats[0], LIMITS.repeats[1]); });
  const pick = get('pick');
  if (pick !== undefined) {
    attempt(() => {
      const match = /^(\d+),(\d+)$/.exec(pick);
      if (!match) invalid('URL pick', pick, 'not of the form k,band');
      state.pick = { kIndex: Number(match[1]), band: Number(match[2]) };
    });
  }
  const sites = get('sites');
  if (sites !== undefined) attempt(() => { state.search.sites = rangeField('sites', sites, (p) => integerField('sites', p, LIMITS.sites[0], LIMITS.sites[1])); });
  const holes = get('holes');
  if (holes !== undefined) attempt(() => { state.search.holes = rangeField('holes', holes, (p) => integerField('holes', p, 0, LIMITS.sites[1])); });
  const eta = get('eta');
  if (eta !== undefined) attempt(() => { state.search.eta = rangeField('eta', eta, (p) => numberField('eta', p, 0, 1, false, false)); });
  const isolated = get('isolated');
  if (isolated !== undefined) {
    attempt(() => {
      if (isolated !== '0' && isolated !== '1') invalid('URL isolated', isolated, 'must be 0 or 1');
      state.search.isolated = isolated === '1';
    });
  }
  const cell = get('cell');
  if (cell !== undefined) {
    attempt(() => {
      const [a, b, gamma] = listField('cell', cell, 3);
      if (!(a > 0 && b > 0)) invalid('URL cell', cell, 'lengths must be positive');
      if (!(gamma > 0 && gamma < 180)) invalid('URL cell', cell, 'γ must lie strictly between 0° and 180°');
      state.search.cell = { a, b, gamma, lengthTolerance: 0.15, angleTolerance: 3 };
    });
  }
  const tolerance = get('tolerance');
  if (tolerance !== undefined) {
    attempt(() => {
      if (!state.search.cell) invalid('URL tolerance', tolerance, 'only with cell');
      const [lengthTolerance, angleTolerance] = listField('tolerance', tolerance, 2);
      state.search.cell = { ...state.search.cell, lengthTolerance, angleTolerance };
    });
  }
  const metal = get('metal');
  if (metal !== undefined) attempt(() => { state.metal.name = requireSubstrate(metal, 'URL metal').name; });
  for (const [field, key] of Object.entries(ALIGNMENT_KEYS) as [AlignmentField, string][]) {
    const text = get(key);
    const [low, high] = ALIGNMENT_FLAG_LIMITS[field];
    if (text !== undefined) attempt(() => { state.metal.model[field] = numberField(key, text, low, high, false, false); });
  }
  readStmKeys(get, state.stm, attempt);
  // d ≥ d0 across the two fields: the one given is dropped (the other kept).
  attempt(() => {
    try {
      alignmentParameters(state.metal.model, { distance: 'URL distance', d0: 'URL d0' });
    } catch (error) {
      if (error instanceof ValidationError) delete state.metal.model[error.field === 'URL d0' ? 'd0' : 'distance'];
      throw error;
    }
  });
  return { state, errors };
}

/** The STM panel's keys, in the order they are written. */
const STM_KEYS = ['bias', 'tip-height', 'tip-mode', 'match-sites', 'match-top', 'match-metal'];

function readStmKeys(get: (key: string) => string | undefined, stm: StmState, attempt: (action: () => void) => void): void {
  const bias = get('bias');
  if (bias !== undefined) {
    attempt(() => {
      const v = numberField('bias', bias, -LIMITS.bias[1], LIMITS.bias[1], false, false);
      if (!(Math.abs(v) >= LIMITS.bias[0])) invalid('URL bias', bias, `|V| must be at least ${LIMITS.bias[0]} V: the window E_F … E_F + eV is empty at zero bias`);
      stm.bias = v;
    });
  }
  const height = get('tip-height');
  if (height !== undefined) attempt(() => { stm.height = numberField('tip-height', height, LIMITS.height[0], LIMITS.height[1], false, false); });
  const mode = get('tip-mode');
  if (mode !== undefined) {
    attempt(() => {
      if (!Object.hasOwn(TIP_MODES, mode)) invalid('URL tip-mode', mode, `must be ${Object.keys(TIP_MODES).join(' or ')}`);
      stm.mode = TIP_MODES[mode];
    });
  }
  const sites = get('match-sites');
  if (sites !== undefined) attempt(() => { stm.sites = rangeField('match-sites', sites, (p) => integerField('match-sites', p, LIMITS.matchSites[0], LIMITS.matchSites[1])); });
  const top = get('match-top');
  if (top !== undefined) attempt(() => { stm.top = integerField('match-top', top, LIMITS.top[0], LIMITS.top[1]); });
  const metal = get('match-metal');
  if (metal !== undefined) attempt(() => { stm.metal = requireSubstrate(metal, 'URL match-metal').name; });
}

function writeStmKeys(out: URLSearchParams, stm: StmState): void {
  const base = defaultStm();
  if (stm.bias !== base.bias) out.set('bias', String(stm.bias));
  if (stm.height !== base.height) out.set('tip-height', String(stm.height));
  if (stm.mode !== base.mode) out.set('tip-mode', Object.keys(TIP_MODES).find((k) => TIP_MODES[k] === stm.mode)!);
  if (stm.sites.join('-') !== base.sites.join('-')) out.set('match-sites', stm.sites.join('-'));
  if (stm.top !== base.top) out.set('match-top', String(stm.top));
  if (stm.metal !== null) out.set('match-metal', stm.metal);
}

// --- writing -------------------------------------------------------------------------------------------------

function sheetText(choice: SheetChoice): string {
  if (choice.kind === 'preset') return choice.name;
  if (choice.kind === 'pattern') {
    const p = choice.pattern;
    return JSON.stringify({ bond: p.bond, supercell: hnfRows(p.supercell), vacancies: p.vacancies });
  }
  return JSON.stringify({ cell: choice.sheet.cell, atoms: choice.sheet.atoms });
}

/** The hash of a view; defaults are left out, so a preset with defaults is just `#sheet=NAME`. */
export function writeHash(state: ViewState): string {
  const out = new URLSearchParams();
  const defaults = defaultState();
  out.set('sheet', sheetText(state.sheet));
  if (state.sheet.kind !== 'preset') out.set('label', state.sheet.label);
  if (state.params.kind === 'own') out.set('params', JSON.stringify(state.params.set));
  else if (state.params.name !== DEFAULT_PARAMETERS) out.set('params', state.params.name);
  if (state.doping !== defaults.doping) out.set('doping', String(state.doping));
  if (state.smearing !== defaults.smearing) out.set('smearing', String(state.smearing));
  if (state.mesh !== undefined) out.set('mesh', String(state.mesh));
  if (state.repeats !== defaults.repeats) out.set('repeats', String(state.repeats));
  if (state.pick) out.set('pick', `${state.pick.kIndex},${state.pick.band}`);
  const search = state.search;
  const base = defaults.search;
  if (search.sites.join('-') !== base.sites.join('-')) out.set('sites', search.sites.join('-'));
  if (search.holes.join('-') !== base.holes.join('-')) out.set('holes', search.holes.join('-'));
  if (search.eta) out.set('eta', search.eta.join('-'));
  if (search.isolated !== base.isolated) out.set('isolated', search.isolated ? '1' : '0');
  if (search.cell) {
    out.set('cell', [search.cell.a, search.cell.b, search.cell.gamma].join(','));
    if (search.cell.lengthTolerance !== 0.15 || search.cell.angleTolerance !== 3) {
      out.set('tolerance', `${search.cell.lengthTolerance},${search.cell.angleTolerance}`);
    }
  }
  if (state.metal.name !== DEFAULT_METAL) out.set('metal', state.metal.name);
  for (const [field, key] of Object.entries(ALIGNMENT_KEYS) as [AlignmentField, string][]) {
    const value = state.metal.model[field];
    if (value !== undefined) out.set(key, String(value));
  }
  writeStmKeys(out, state.stm);
  // URLSearchParams writes spaces as '+'; keep the hash readable and exact with %20.
  return `#${out.toString().replace(/\+/g, '%20')}`;
}
