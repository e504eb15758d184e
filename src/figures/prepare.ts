/**
 * The data of the figures, computed from the core: pure, synchronous, structured-cloneable results (typed
 * arrays and plain objects), so the web view runs these in a Web Worker and the CLI calls them directly.
 */
import { invalid } from '../validate/invalid.ts';
import { coordination } from '../lattice/neighbours.ts';
import { hexagonalHoles } from '../lattice/holes.ts';
import { patternToSheet } from '../lattice/pattern.ts';
import { gaussReduce } from '../lattice/reduce.ts';
import type { Pattern, Sheet } from '../lattice/sheet.ts';
import { primitivePattern } from '../enumerate/period.ts';
import { diagonaliseRows } from '../tb/bands.ts';
import { blochState } from '../tb/blochState.ts';
import { energyGrid, gaussianDos } from '../tb/dos.ts';
import { DEFAULT_SMEARING, MAX_FILL_MESH, fillSpectrum } from '../tb/fill.ts';
import { autoPath } from '../tb/kspacePath.ts';
import { DEFAULT_MESH, meshSpectrum } from '../tb/meshSpectrum.ts';
import { TightBindingModel } from '../tb/model.ts';
import type { ParameterSet } from '../tb/params.ts';
import { brillouinZone } from '../tb/zone.ts';
import type { DopingMap } from '../substrate/dopingMap.ts';
import { formatFraction } from './format.ts';
import type { EtaDeltaData, PathBands, SelectedState, SheetData, SpectraData } from './types.ts';

/** Points on the automatic k-path by default (as `lacuna bands --path auto`). */
export const DEFAULT_PATH_POINTS = 300;
/** Energies of the DOS grid (as `lacuna dos`). */
export const DOS_GRID_POINTS = 2001;

export interface SpectraOptions {
  /** Name shown on the figures (a preset name, a file name). */
  label: string;
  /** δ, extra electrons per atom (default 0). */
  doping?: number;
  /** Gaussian width σ (eV) of the occupation and the DOS (default 0.1). */
  smearing?: number;
  /** Mesh side M (default 36). */
  mesh?: number;
  /** Points on the automatic k-path (default 300). */
  pathPoints?: number;
  /** Mesh progress: k-points done and total. */
  onProgress?: (done: number, total: number) => void;
}

/** The bands on the automatic path, planar sheets in block order (σ then π), so each band is one curve. */
export function pathBands(model: TightBindingModel, points = DEFAULT_PATH_POINTS): PathBands {
  const path = autoPath(model.sheet.cell, points);
  const bands = model.size('full');
  const energies = new Float64Array(path.count * bands);
  const sigmaWeight = new Float64Array(path.count * bands);
  diagonaliseRows(model, path.kpoints, energies, sigmaWeight, 'blocks');
  const groups: [number, number][] = model.planar ? [[0, model.size('sigma')], [model.size('sigma'), bands]] : [[0, bands]];
  return {
    kpoints: path.kpoints, distance: path.distance, labels: path.labels, cellType: path.cellType,
    count: path.count, bands, energies, sigmaWeight, groups,
  };
}

/**
 * Path bands, mesh spectrum, Gaussian DOS, E_F and the zone of one sheet with one parameter set. E_F is
 * `fillSpectrum` of the same mesh spectrum, so it equals `fill` (and `lacuna fill`) for the same inputs exactly.
 */
export function prepareSpectra(sheet: Sheet, params: ParameterSet, options: SpectraOptions): SpectraData {
  const mesh = options.mesh ?? DEFAULT_MESH;
  if (!(Number.isInteger(mesh) && mesh >= 1 && mesh <= MAX_FILL_MESH)) invalid('mesh', mesh, `must be an integer in [1, ${MAX_FILL_MESH}]`);
  const smearing = options.smearing ?? DEFAULT_SMEARING;
  const doping = options.doping ?? 0;
  const model = new TightBindingModel(sheet, params);
  const spectrum = meshSpectrum(model, { mesh, onProgress: options.onProgress });
  // Validates doping and smearing (invalid doping / smearing) before the DOS is built.
  const fermi = fillSpectrum(spectrum, { doping, smearing }).fermi;
  const dos = gaussianDos(spectrum, energyGrid(spectrum, { points: DOS_GRID_POINTS }), smearing);
  return {
    sheetLabel: options.label,
    parameters: params.name,
    atoms: model.atoms,
    planar: model.planar,
    path: pathBands(model, options.pathPoints ?? DEFAULT_PATH_POINTS),
    spectrum,
    dos,
    doping,
    smearing,
    mesh,
    fermi,
    zone: brillouinZone(sheet.cell),
  };
}

/** E_F at another doping from the stored spectrum (no diagonalisation): the doping slider's refill. */
export function refill(data: SpectraData, doping: number): number {
  return fillSpectrum(data.spectrum, { doping, smearing: data.smearing }).fermi;
}

export interface SheetSource {
  label: string;
  /** The explicit sheet; ignored when `pattern` is given (its smallest cell is used). */
  sheet?: Sheet;
  pattern?: Pattern;
}

export interface SheetOptions {
  /** Bonds shorter than this (Å) are drawn: the parameter set's cutoff. */
  bondCutoff: number;
  /** Copies of the edited cell along each cell vector (default [3, 3]). */
  repeats?: [number, number];
  state?: SelectedState;
}

/** What the sheet figure draws. For a pattern, `sheet` is its smallest cell: compute the spectra on it. */
export function prepareSheet(source: SheetSource, options: SheetOptions): SheetData {
  if (!(options.bondCutoff > 0)) invalid('bondCutoff', options.bondCutoff, 'must be a positive length in Å');
  const repeats = options.repeats ?? [3, 3];
  for (const [i, n] of repeats.entries()) {
    if (!(Number.isInteger(n) && n >= 1 && n <= 20)) invalid(`repeats[${i}]`, n, 'must be an integer from 1 to 20');
  }
  const cellPattern = source.pattern ? primitivePattern(source.pattern) : undefined;
  const sheet = cellPattern ? patternToSheet(cellPattern) : source.sheet;
  if (!sheet) invalid('sheet', undefined, 'give a sheet or a pattern');
  const reduced = gaussReduce(sheet.cell[0], sheet.cell[1]);
  const data: SheetData = {
    label: source.label,
    sheet,
    repeats: [repeats[0], repeats[1]],
    bondCutoff: options.bondCutoff,
    coordination: coordination(sheet, options.bondCutoff),
    hexagonalHoles: source.pattern ? hexagonalHoles(source.pattern) : [],
    reducedCell: [reduced.u, reduced.v],
  };
  if (source.pattern) data.pattern = source.pattern;
  if (cellPattern) data.cellPattern = cellPattern;
  if (options.state) data.state = options.state;
  return data;
}

/** The Bloch state of path point `kIndex`, band `band` (PathBands order) of the sheet the spectra were computed on. */
export function prepareState(sheet: Sheet, params: ParameterSet, path: PathBands, kIndex: number, band: number): SelectedState {
  if (!(Number.isInteger(kIndex) && kIndex >= 0 && kIndex < path.count)) invalid('kIndex', kIndex, `must be an integer from 0 to ${path.count - 1}`);
  if (!(Number.isInteger(band) && band >= 0 && band < path.bands)) invalid('band', band, `must be an integer from 0 to ${path.bands - 1}`);
  const model = new TightBindingModel(sheet, params);
  const kx = path.kpoints[2 * kIndex];
  const ky = path.kpoints[2 * kIndex + 1];
  const state = blochState(model, kx, ky, band, 'blocks');
  return {
    kIndex, band, k: [kx, ky], energy: state.energy, weight: state.weight, phase: state.phase, sigma: state.sigma, parameters: params.name,
  };
}

/**
 * The η–δ figure's data from a doping map (src/substrate/dopingMap.ts): plain numbers and labels, the patterns
 * dropped; unnamed patterns labelled by their cell. `current` marks the page's sheet.
 */
export function prepareEtaDelta(map: DopingMap, current?: { label: string; eta: number }): EtaDeltaData {
  const titles = new Map(map.metals.map((m) => [m.name, m.title]));
  const data: EtaDeltaData = {
    curve: map.curve.map((c) => ({ eta: c.eta, doping: c.doping })),
    points: map.points.map((p) => ({
      label: p.name ?? `${p.pattern.supercell.a * p.pattern.supercell.c} sites, ${p.pattern.vacancies.length} holes`,
      eta: p.eta,
      sigmaFilling: p.sigmaFilling,
      dopings: Object.fromEntries(Object.entries(p.alignment).map(([name, a]) => [name, a.doping])),
    })),
    metals: map.metals.map((m) => ({ name: m.name, title: m.title, workFunction: m.workFunction })),
    observed: map.observed.map((o) => {
      const title = titles.get(o.substrate) ?? o.substrate;
      const cite = o.source.replace(/,.*?\((\d{4})\).*$/, ' $1');
      const what = o.doping !== undefined ? `about ${o.doping} e/B` : `η = ${o.holeDensities.map((h) => formatFraction(Math.round(h * 60), 60)).join(', ')}`;
      return { metal: o.substrate, title, holeDensities: [...o.holeDensities], ...(o.doping !== undefined ? { doping: o.doping } : {}), label: `${title} seen: ${what} (${cite})`, source: o.source };
    }),
    parameters: map.parameters,
    mesh: map.mesh,
    smearing: map.smearing,
    model: { ...map.model },
  };
  if (current) data.current = { ...current };
  return data;
}
