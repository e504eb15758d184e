/**
 * The calibrate panel's jobs as pure functions of the core (the calibrate worker serves them; the tests call them
 * directly): a reference bands file read, the DEMO reference bands, and the fit of reference bands to a sheet.
 */
import demoBands from '../../presets/demo/hsl-beta12-reference-bands.json' with { type: 'json' };
import { prepareCalibration } from '../figures/prepareCalibration.ts';
import type { CalibrationFigureData } from '../figures/types.ts';
import { invalid, namingSource, ValidationError } from '../validate/invalid.ts';
import { validateParameterObject } from '../tb/paramsCheck.ts';
import { parseReferenceBandsText, validateReferenceBands } from '../io/referenceBandsFile.ts';
import {
  calibrate, checkBlock, checkKpointsFitSheet, cutoffCandidates, defaultStarts, matchBands, MODEL_PARAMETERS, oneBondLength,
  type BandBlock, type CalibrationSheetResult, type ModelParameter, type ReferenceBands, type StartResult,
} from '../learn/calibrate/index.ts';
import type { Sheet } from '../lattice/sheet.ts';
import type { ParameterSet } from '../tb/params.ts';
import { CALIBRATE_FIELD_NAMES as FIELDS } from './calibrateFields.ts';

/** The name the DEMO reference is shown under. */
export const DEMO_REFERENCE_LABEL = 'DEMO β12 reference bands (invented)';

export interface LoadedReference {
  label: string;
  reference: ReferenceBands;
}

/** A reference bands file's text, checked field by field (errors name the file). */
export function readReference(input: { name: string; text: string }): LoadedReference {
  return { label: input.name, reference: namingSource('the reference bands file', input.name, () => parseReferenceBandsText(input.text, input.name)) };
}

/** The DEMO reference bands (presets/demo): invented, labelled DEMO in the file and on the figure. */
export function demoReference(): LoadedReference {
  return { label: DEMO_REFERENCE_LABEL, reference: validateReferenceBands(demoBands) };
}

export interface FitInput {
  sheet: Sheet;
  sheetLabel: string;
  reference: ReferenceBands;
  referenceLabel: string;
  /** The first start (the page's parameter set): its d0, exponent and cutoff are held, and εp with a shift. */
  start: ParameterSet;
  shift: boolean;
  block: BandBlock;
  modelBands?: [number, number];
  referenceBands?: [number, number];
  /** Half-width W (eV) of the weights, or null for equal weights. */
  weightWidth: number | null;
  freeExponent: boolean;
  scanCutoff: boolean;
  /** The date put in the fitted set's source (the worker reads no clock of its own accord). */
  fittedAt: string;
}

/** One row of the parameter table: the fitted value and its standard uncertainty, or why it was held. */
export interface FitRow {
  name: ModelParameter;
  value: number;
  sigma: number | null;
  held?: string;
}

export interface FitOutput {
  sheetLabel: string;
  referenceLabel: string;
  figure: CalibrationFigureData;
  parameters: ParameterSet;
  rows: FitRow[];
  rms: number;
  maxError: number;
  weightedRms: number;
  points: number;
  start: string;
  starts: StartResult[];
  sheet: Omit<CalibrationSheetResult, 'modelEnergies' | 'weights'>;
  weights: string;
  signConvention: string;
  converged: boolean;
  cutoffScan?: { cutoff: number; rms: number }[];
}

const LIMITS_NOTE = 'check which bands are matched (model bands, reference bands, bands matched) and the shift';

/** Fits the reference to the sheet from the page's set and the other starts; refusals name the panel's fields. */
export function fitReference(input: FitInput, progress?: (done: number, total: number) => void): FitOutput {
  const { sheet, reference } = input;
  namingSource('the reference bands file', input.referenceLabel, () => checkKpointsFitSheet(sheet, reference));
  checkBlock(sheet, input.block, FIELDS.block);
  const atoms = sheet.atoms.length;
  const modelBands = (input.block === 'full' ? 4 : input.block === 'sigma' ? 3 : 1) * atoms;
  const what = `${modelBands} ${input.block === 'full' ? 'bands (4 per atom)' : `${input.block} bands`}`;
  const match = matchBands(modelBands, reference.bands, { model: input.modelBands, reference: input.referenceBands }, { model: FIELDS.modelBands, reference: FIELDS.referenceBands, file: input.referenceLabel }, what);
  const sheets = [{ sheet, label: input.sheetLabel, reference, referenceLabel: input.referenceLabel, block: input.block, match }];
  if (input.freeExponent) {
    const reach = input.scanCutoff ? Math.max(input.start.cutoff, ...cutoffCandidates(sheets)) : input.start.cutoff;
    if (oneBondLength(sheets, reach)) invalid(FIELDS.free, 'exponent', `every bond of this sheet within ${reach} Å has one length, so the distance law cannot be seen in its bands`);
  }
  const points = reference.count * match.count;
  if (points <= MODEL_PARAMETERS.length + 1) invalid(FIELDS.file, input.referenceLabel, `${points} matched energies are too few to fit the parameters`);
  const result = calibrate({
    sheets, starts: defaultStarts(input.start), shift: input.shift, weightWidth: input.weightWidth,
    freeExponent: input.freeExponent, scanCutoff: input.scanCutoff, fittedAt: input.fittedAt,
    name: `calibrated-${input.sheetLabel}`.slice(0, 90), onProgress: progress,
  });
  try {
    validateParameterObject(result.parameters);
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    invalid(FIELDS.file, input.referenceLabel, `the fit left the limits of a parameter file (${error.message}): ${LIMITS_NOTE}`);
  }
  const p = result.parameters;
  const valueOf = (name: ModelParameter) => (name === 's' || name === 'p' ? p.onsite[name] : name === 'exponent' ? p.exponent : p.hopping[name]);
  const rows: FitRow[] = MODEL_PARAMETERS.map((name) => {
    const sigma = result.uncertainties[name];
    const held = result.held.find((h) => h.name === name);
    return { name, value: valueOf(name), sigma: sigma === undefined || Number.isNaN(sigma) ? null : sigma, ...(held ? { held: held.why } : {}) };
  });
  const { modelEnergies: _model, weights: _weights, ...sheetSummary } = result.sheets[0];
  return {
    sheetLabel: input.sheetLabel,
    referenceLabel: input.referenceLabel,
    figure: prepareCalibration(result, 0, reference),
    parameters: p,
    rows,
    rms: result.rms,
    maxError: result.maxError,
    weightedRms: result.weightedRms,
    points: result.points,
    start: result.start,
    starts: result.starts,
    sheet: sheetSummary,
    weights: result.weights.formula,
    signConvention: result.signConvention,
    converged: result.converged,
    ...(result.cutoffScan ? { cutoffScan: result.cutoffScan.map((c) => ({ cutoff: c.cutoff, rms: c.rms })) } : {}),
  };
}
