/**
 * The STM panel's jobs as pure functions of the core (the STM worker serves them; the tests call them directly):
 * the simulated picture of a sheet, a measured picture read and analysed, the DEMO synthetic picture, and the
 * ranking of candidate patterns against a measured picture.
 */
import { prepareMeasuredPicture, prepareStmSimulation, type TipSettings } from '../figures/prepareStm.ts';
import type { StmPictureData } from '../figures/types.ts';
import { readPicture, type DecodedPicture } from '../io/imageFile.ts';
import { invalid } from '../validate/invalid.ts';
import { hnfRows, patternToSheet } from '../lattice/pattern.ts';
import { findSheetPreset } from '../lattice/presets.ts';
import type { Sheet, Vec2 } from '../lattice/sheet.ts';
import { analysePicture, type Analysis } from '../stm/analyse.ts';
import type { Background } from '../stm/background.ts';
import { matchPatterns } from '../stm/match.ts';
import { latticeOrigin } from '../stm/overlay.ts';
import { stmModel, STM_DEFAULTS } from '../stm/simulate.ts';
import { DEMO_LABEL, syntheticPicture } from '../stm/synthetic.ts';
import { requireSubstrate } from '../substrate/substrates.ts';
import { TightBindingModel } from '../tb/model.ts';
import type { ParameterSet } from '../tb/params.ts';

export type { TipSettings } from '../figures/prepareStm.ts';
export { tipLine } from '../figures/prepareStm.ts';

export interface SimulateInput extends TipSettings {
  label: string;
  sheet: Sheet;
  params: ParameterSet;
  doping: number;
  smearing: number;
  cells: number;
  pixels: number;
}

export interface SimulateOutput {
  figure: StmPictureData;
  fermi: number;
  /** States per cell in the bias window. */
  states: number;
}

export function simulate(input: SimulateInput): SimulateOutput {
  const { sheet, params, ...options } = input;
  return prepareStmSimulation(sheet, params, { ...options, biasField: 'bias V' });
}

/** A measured picture analysed, as the page keeps it (the analysis goes back to the worker for each match). */
export interface MeasuredOutput {
  figure: StmPictureData;
  analysis: Extract<Analysis, { ok: true }>;
  name: string;
  format: DecodedPicture['format'] | 'demo';
}

export interface AnalyseInput {
  name: string;
  bytes: Uint8Array;
  pixelSize: number;
  background: Background;
}

function analysed(name: string, decoded: Omit<DecodedPicture, 'format'>, pixelSize: number, background: Background, format: MeasuredOutput['format'], demo?: string): MeasuredOutput {
  const analysis = analysePicture({ ...decoded, pixelSize }, { background });
  if (!analysis.ok) invalid(name, `${decoded.width}×${decoded.height} pixels`, analysis.why);
  const l = analysis.lattice;
  const origin = latticeOrigin(analysis);
  const figure = prepareMeasuredPicture({ width: analysis.width, height: analysis.height, pixelSize, values: analysis.values }, {
    vectors: l.vectors, origin: [origin[0] * pixelSize, origin[1] * pixelSize] as Vec2,
  }, {
    label: name,
    demo,
    lines: [
      `${decoded.width}×${decoded.height} pixels of ${pixelSize} Å, background ${background === 'none' ? 'kept' : background === 'lines' ? 'removed line by line' : 'plane removed'}`,
      `fitted lattice: a = ${l.a.toFixed(3)} ± ${l.aError.toFixed(3)} Å, b = ${l.b.toFixed(3)} ± ${l.bError.toFixed(3)} Å, γ = ${l.gammaDeg.toFixed(1)} ± ${l.gammaDegError.toFixed(1)}°`,
    ],
  });
  return { figure, analysis, name, format };
}

export function analyseFile(input: AnalyseInput): MeasuredOutput {
  const decoded = readPicture(input.name, input.bytes);
  return analysed(input.name, decoded, input.pixelSize, input.background, decoded.format);
}

/** The DEMO picture: β12's model picture turned 17°, tilted and noisy, 256 pixels of 0.2 Å. */
export const DEMO_PICTURE = { sheet: 'beta12', pixels: 256, pixelSize: 0.2, angleDeg: 17, tilt: 2, noise: 0.3, seed: 7 };

export function demoPicture(input: { params: ParameterSet }): MeasuredOutput {
  const sheet = patternToSheet(findSheetPreset(DEMO_PICTURE.sheet)!.pattern);
  const stm = stmModel(new TightBindingModel(sheet, input.params), { mesh: STM_DEFAULTS.mesh });
  const picture = syntheticPicture(stm, DEMO_PICTURE);
  return analysed(`demo-${DEMO_PICTURE.sheet}-synthetic`, picture, DEMO_PICTURE.pixelSize, 'plane', 'demo', `${DEMO_LABEL} (made from the ${DEMO_PICTURE.sheet} model, turned ${DEMO_PICTURE.angleDeg}°, tilted, noisy)`);
}

export interface MatchInput extends TipSettings {
  analysis: Extract<Analysis, { ok: true }>;
  params: ParameterSet;
  sites: [number, number];
  top: number;
  smearing: number;
  doping: number;
  /** A substrate name: its coincidence cells with each candidate are tried too (null: own cells only). */
  metal: string | null;
}

/** How a candidate fits the measured cell: its own cell, or a coincidence cell with the metal (as `match --substrate`). */
export type CandidateFit =
  | { kind: 'cell' }
  | { kind: 'coincidence'; metal: string; sites: number; sheetCells: number; angleDeg: number; strain: number; wood?: string;
    sheetSupercell: [[number, number], [number, number]]; substrateSupercell: [[number, number], [number, number]] };

/** One ranked candidate, as the table shows it and `app.showPattern` loads it. */
export interface RankedCandidate {
  name: string;
  sites: number;
  holes: number;
  eta: number;
  score: number;
  /** The candidate's cell against the fitted one (area ratio). */
  index: number;
  fit: CandidateFit;
  pattern: { bond: number; supercell: [[number, number], [number, number]]; vacancies: [number, number][] };
}

export interface MatchOutput {
  candidates: RankedCandidate[];
  examined: number;
  fitting: number;
  /** Of those, fitting only through a coincidence cell. */
  fittingByCoincidence: number;
  unscored: number;
}

export function rankCandidates(input: MatchInput, progress?: (examined: number) => void): MatchOutput {
  const metal = input.metal === null ? undefined : requireSubstrate(input.metal, 'metal for matching');
  const result = matchPatterns(input.analysis, {
    ...(metal ? { coincidence: { nnDistance: metal.nnDistance } } : {}),
    parameters: input.params, sites: input.sites, top: input.top,
    stm: { bias: input.bias, height: input.height, mode: input.mode, smearing: input.smearing, doping: input.doping, mesh: STM_DEFAULTS.mesh },
    onProgress: progress,
  });
  return {
    candidates: result.candidates.map((c) => {
      const p = c.structure.pattern;
      const f = c.coincidence;
      const fit: CandidateFit = !f || !metal ? { kind: 'cell' } : {
        kind: 'coincidence', metal: metal.name, sites: f.sites, sheetCells: f.sheetCells, angleDeg: f.angleDeg, strain: f.strain,
        sheetSupercell: f.sheetSupercell, substrateSupercell: f.substrateSupercell, ...(f.wood ? { wood: f.wood } : {}),
      };
      return {
        fit,
        name: c.structure.phase ?? `N${c.structure.sites}k${c.structure.holes}`, // as the Candidates panel names them
        sites: c.structure.sites, holes: c.structure.holes, eta: c.structure.eta, score: c.score, index: c.index,
        pattern: { bond: p.bond, supercell: hnfRows(p.supercell), vacancies: p.vacancies.map(([i, j]) => [i, j] as [number, number]) },
      };
    }),
    examined: result.examined, fitting: result.fitting, fittingByCoincidence: result.fittingByCoincidence, unscored: result.emptyWindow.length,
  };
}
