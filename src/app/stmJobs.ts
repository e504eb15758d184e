/**
 * The STM panel's jobs as pure functions of the core (the STM worker serves them; the tests call them directly):
 * the simulated picture of a sheet, a measured picture read and analysed, the DEMO synthetic picture, and the
 * ranking of candidate patterns against a measured picture.
 */
import { prepareMeasuredPicture, prepareSimulatedPicture } from '../figures/prepareStm.ts';
import type { StmPictureData } from '../figures/types.ts';
import { readPicture, type DecodedPicture } from '../io/imageFile.ts';
import { invalid } from '../io/invalid.ts';
import { hnfRows, patternToSheet } from '../lattice/pattern.ts';
import { findSheetPreset } from '../lattice/presets.ts';
import type { Sheet, Vec2 } from '../lattice/sheet.ts';
import { analysePicture, type Analysis } from '../stm/analyse.ts';
import type { Background } from '../stm/background.ts';
import { matchPatterns } from '../stm/match.ts';
import { latticeOrigin } from '../stm/overlay.ts';
import { stmModel, STM_DEFAULTS, type StmMode } from '../stm/simulate.ts';
import { renderStm } from '../stm/stmImage.ts';
import { DEMO_LABEL, syntheticPicture } from '../stm/synthetic.ts';
import { TightBindingModel } from '../tb/model.ts';
import type { ParameterSet } from '../tb/params.ts';

/** The tip: sample bias V (V > 0 images empty states), height above the highest atom (Å), mode. */
export interface TipSettings {
  bias: number;
  height: number;
  mode: StmMode;
}

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

export const MODE_WORDS: Record<StmMode, string> = { 'constant-current': 'constant current', 'constant-height': 'constant height' };

/** The tip's settings as one line of text (shared by the pictures and the table). */
export function tipLine(tip: TipSettings): string {
  const sign = tip.bias > 0 ? '+' : '−';
  return `V = ${sign}${Math.abs(tip.bias)} V (${tip.bias > 0 ? 'empty' : 'filled'} states), tip ${tip.height} Å, ${MODE_WORDS[tip.mode]}`;
}

export function simulate(input: SimulateInput): SimulateOutput {
  const model = new TightBindingModel(input.sheet, input.params);
  const stm = stmModel(model, { bias: input.bias, height: input.height, mode: input.mode, doping: input.doping, smearing: input.smearing, mesh: STM_DEFAULTS.mesh });
  if (!(stm.states > 1e-6)) {
    const gap = stm.gap ? `: E_F = ${stm.fermi.toFixed(3)} eV lies in a gap of the model from ${stm.gap.lower.toFixed(3)} to ${stm.gap.upper.toFixed(3)} eV, so |V| must exceed ${Math.min(stm.fermi - stm.gap.lower, stm.gap.upper - stm.fermi).toFixed(2)} V` : '';
    invalid('bias V', String(input.bias), `no states of ${input.label} lie in the window E_F … E_F + eV${gap}`);
  }
  const picture = renderStm(stm, model.sheet.cell, { cells: input.cells, pixels: input.pixels });
  const brightness = input.mode === 'constant-height' ? 'brighter: more current at this height' : 'brighter: the tip higher at equal current';
  const figure = prepareSimulatedPicture(picture, model.sheet.cell, {
    label: input.label,
    lines: [`${tipLine(input)}; ${brightness}`, `Tersoff–Hamann on tight binding (${input.params.name}), E_F ${stm.fermi < 0 ? '−' : ''}${Math.abs(stm.fermi).toFixed(3)} eV: a model, not a prediction`],
  });
  return { figure, fermi: stm.fermi, states: stm.states };
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
}

/** One ranked candidate, as the table shows it and `app.showPattern` loads it. */
export interface RankedCandidate {
  name: string;
  sites: number;
  holes: number;
  eta: number;
  score: number;
  /** The candidate's cell against the fitted one (area ratio). */
  index: number;
  pattern: { bond: number; supercell: [[number, number], [number, number]]; vacancies: [number, number][] };
}

export interface MatchOutput {
  candidates: RankedCandidate[];
  examined: number;
  fitting: number;
  unscored: number;
}

export function rankCandidates(input: MatchInput, progress?: (examined: number) => void): MatchOutput {
  const result = matchPatterns(input.analysis, {
    parameters: input.params, sites: input.sites, top: input.top,
    stm: { bias: input.bias, height: input.height, mode: input.mode, smearing: input.smearing, doping: input.doping, mesh: STM_DEFAULTS.mesh },
    onProgress: progress,
  });
  return {
    candidates: result.candidates.map((c) => {
      const p = c.structure.pattern;
      return {
        name: c.structure.phase ?? `N${c.structure.sites}k${c.structure.holes}`, // as the Candidates panel names them
        sites: c.structure.sites, holes: c.structure.holes, eta: c.structure.eta, score: c.score, index: c.index,
        pattern: { bond: p.bond, supercell: hnfRows(p.supercell), vacancies: p.vacancies.map(([i, j]) => [i, j] as [number, number]) },
      };
    }),
    examined: result.examined, fitting: result.fitting, unscored: result.emptyWindow.length,
  };
}
