/**
 * calibrate: Slater–Koster parameters fitted to the user's own reference bands (issue 8, part 1) by damped least
 * squares (levenbergMarquardt.ts) with Hellmann–Feynman Jacobians (parametricBands.ts), from several starts.
 *
 * What is fitted: εs, εp and V_ssσ, V_spσ, V_ppσ, V_ppπ at the held d0; the exponent on request; the cutoff on
 * request by a scan over the sheets' neighbour shells (a discrete choice: it decides which bonds exist). d0 is never
 * fitted: it only says where the V are stated. With `shift`, one rigid shift per reference file takes that file's
 * arbitrary zero; since a constant added to εs and εp moves every band by that constant, εp then stays at the
 * first start's value and only εs − εp is learnt.
 *
 * Sign convention: the bands cannot tell the sign of V_spσ (changing the sign of every s orbital changes the sign
 * of every s–p integral and nothing else), so the fit reports V_spσ ≥ 0 — the sign of the named sets, for the
 * Slater–Koster table of src/tb/slaterKoster.ts (E_s,x = l·V_spσ with the bond from the s atom to the p atom).
 *
 * The result is an interpolation of the reference calculation: as good as that calculation, not a prediction.
 */
import type { Sheet } from '../../lattice/sheet.ts';
import { neighbours } from '../../lattice/neighbours.ts';
import type { ParameterSet } from '../../tb/params.ts';
import { matchRanges, type BandMatch } from './bandMatch.ts';
import { bandWeight, DEFAULT_WEIGHT_WIDTH, estimateFermi } from './bandWeights.ts';
import { levenbergMarquardt, type StopReason } from './levenbergMarquardt.ts';
import { MODEL_PARAMETERS, PARAMETER_INDEX, parameterSetOf, parameterVector, type ModelParameter } from './modelParameters.ts';
import { ParametricBands, type BandBlock } from './parametricBands.ts';
import { CalibrationProblem, type FitSheet } from './problem.ts';
import type { ReferenceBands } from './referenceBands.ts';
import { parameterCovariance } from './uncertainty.ts';

/** The sign convention stated with every result. */
export const SIGN_CONVENTION =
  'V_spσ is reported ≥ 0: bands do not fix its sign (changing the sign of every s orbital flips every s–p integral and leaves the bands unchanged); ≥ 0 is the sign of the named sets in the Slater–Koster table E_s,x = l·V_spσ, bond from the s atom to the p atom';

/** One sheet with its reference bands. */
export interface CalibrationSheet {
  sheet: Sheet;
  /** What the user called the sheet (preset name, file). */
  label: string;
  reference: ReferenceBands;
  /** What the user called the reference (file name, "DEMO …"). */
  referenceLabel: string;
  /** Which states are matched (default 'full'). */
  block?: BandBlock;
  /** Resolved by matchBands at the boundary. */
  match: BandMatch;
}

export interface CalibrateOptions {
  sheets: readonly CalibrationSheet[];
  /** Start sets, each fitted in turn; the first also gives d0, the exponent and the cutoff held (and εp with shift). */
  starts: readonly ParameterSet[];
  /** One rigid shift per reference file (default false: the references' energies are taken as they are). */
  shift?: boolean;
  /** Half-width W (eV) of the weights 1/(1 + ((E − E_F)/W)²); null for equal weights; default 4. */
  weightWidth?: number | null;
  /** Fit the exponent of the distance law too (refused at the boundary when every bond has one length). */
  freeExponent?: boolean;
  /** Scan the cutoff over the sheets' neighbour shells and keep the best. */
  scanCutoff?: boolean;
  /** Model parameters held at the first start's values. */
  hold?: readonly ModelParameter[];
  /** Name of the fitted set (default "calibrated-<sheets>"). */
  name?: string;
  /** When, for the source text (e.g. "2025-06-01"); the core reads no clock. */
  fittedAt?: string;
  /** Trial steps per start (default 200). */
  maxIterations?: number;
  /** Called after each start with the starts done and the total. */
  onProgress?: (done: number, total: number) => void;
}

export interface CalibrationSheetResult {
  label: string;
  referenceLabel: string;
  block: BandBlock;
  /** 1-based inclusive runs of model and reference bands that were matched. */
  modelBands: [number, number];
  referenceBands: [number, number];
  points: number;
  /** Unweighted rms and largest |E_model + shift − E_reference| (eV) of this sheet. */
  rms: number;
  maxError: number;
  /** E_reference ≈ E_model + shift (eV); 0 without shift. */
  shift: number;
  /** Its standard uncertainty (NaN without shift). */
  shiftUncertainty: number;
  /** E_F of the reference used for the weights, and where it came from. */
  fermi: number | null;
  fermiFrom: 'file' | 'estimate' | 'none';
  /** The fitted model's bands of the block at the reference k-points, shifted onto the reference scale (count × bands). */
  modelEnergies: Float64Array;
  modelBandCount: number;
  /** w of every matched point (count × matched). */
  weights: Float64Array;
}

export interface StartResult {
  name: string;
  rms: number;
  weightedRms: number;
  iterations: number;
  converged: boolean;
  reason: StopReason;
}

export interface CalibrationResult {
  /** The fitted set, a parameter file of the contract. */
  parameters: ParameterSet;
  /** Over every matched point: unweighted rms and largest error (eV), weighted rms, and the number of points. */
  rms: number;
  maxError: number;
  weightedRms: number;
  points: number;
  /** Fitted model parameters in MODEL_PARAMETERS order. */
  fitted: ModelParameter[];
  /** Standard uncertainties of the fitted ones (NaN: not determined by these bands). */
  uncertainties: Partial<Record<ModelParameter, number>>;
  /** Correlation coefficients between the fitted parameters and shifts, in the order of `correlationNames`. */
  correlation: number[][];
  correlationNames: string[];
  /** Everything not fitted, with its value and why. */
  held: { name: ModelParameter | 'd0' | 'cutoff'; value: number; why: string }[];
  sheets: CalibrationSheetResult[];
  /** The start the result came from, and how every start ended (at the chosen cutoff). */
  start: string;
  starts: StartResult[];
  cutoffScan?: { cutoff: number; rms: number; weightedRms: number }[];
  weights: { width: number | null; formula: string };
  signConvention: string;
  iterations: number;
  converged: boolean;
}

/** A Jacobian column below this fraction of the largest: the matched bands do not depend on that parameter. */
const UNSEEN = 1e-9;
/** Bond lengths closer than this (Å) form one neighbour shell in the cutoff scan. */
const SHELL_GAP = 0.05;
/** Shells tried by the cutoff scan. */
const SCAN_SHELLS = 4;

/** Every bond length of the sheets within `reach` (Å), sorted. */
function bondLengths(sheets: readonly CalibrationSheet[], reach: number): number[] {
  const out: number[] = [];
  for (const s of sheets) for (const d of neighbours(s.sheet, reach).distance) out.push(d);
  return out.sort((a, b) => a - b);
}

/** True when all bonds within the cutoff have one length (then the distance law cannot be seen). */
export function oneBondLength(sheets: readonly CalibrationSheet[], cutoff: number): boolean {
  const lengths = bondLengths(sheets, cutoff);
  return lengths.length === 0 || lengths[lengths.length - 1] - lengths[0] < 1e-6;
}

/** Cutoffs midway between consecutive neighbour shells (bond lengths grouped within SHELL_GAP), first SCAN_SHELLS. */
export function cutoffCandidates(sheets: readonly CalibrationSheet[], limit = 8): number[] {
  const shortest = bondLengths(sheets, limit)[0];
  if (shortest === undefined) return [];
  const lengths = bondLengths(sheets, Math.min(limit, 3.2 * shortest));
  const out: number[] = [];
  for (let i = 1; i < lengths.length && out.length < SCAN_SHELLS; i++) {
    if (lengths[i] - lengths[i - 1] > SHELL_GAP) out.push(Number((0.5 * (lengths[i] + lengths[i - 1])).toFixed(3)));
  }
  return out;
}

interface Fit {
  cutoff: number;
  problem: CalibrationProblem;
  x: Float64Array;
  cost: number;
  start: string;
  iterations: number;
  converged: boolean;
  starts: StartResult[];
  held: CalibrationResult['held'];
  weighted: { sum: number; points: number };
}

function fitSheets(options: CalibrateOptions, cutoff: number): FitSheet[] {
  const base = options.starts[0];
  const width = options.weightWidth === undefined ? DEFAULT_WEIGHT_WIDTH : options.weightWidth;
  return options.sheets.map((s) => {
    const block = s.block ?? 'full';
    const bands = new ParametricBands(s.sheet, s.reference.kpoints, { cutoff, d0: base.d0, block });
    const fermi = s.reference.fermi ?? estimateFermi(s.reference, s.match, s.sheet.atoms.length, block);
    const rootWeight = new Float64Array(s.reference.count * s.match.count);
    for (let k = 0; k < s.reference.count; k++) {
      for (let j = 0; j < s.match.count; j++) {
        const e = s.reference.energies[k * s.reference.bands + s.match.referenceFirst + j];
        rootWeight[k * s.match.count + j] = width === null || fermi === undefined ? 1 : Math.sqrt(bandWeight(e, fermi, width));
      }
    }
    return { bands, reference: s.reference, match: s.match, rootWeight };
  });
}

/** Weighted mean of E_reference − E_model over a sheet's matched points, at the last evaluation of `problem`. */
function meanOffset(problem: CalibrationProblem, s: number): { sum: number; weight: number } {
  const { bands, reference, match, rootWeight } = problem.sheets[s];
  const energies = problem.modelEnergies(s);
  let sum = 0;
  let weight = 0;
  for (let k = 0; k < reference.count; k++) {
    for (let j = 0; j < match.count; j++) {
      const w = rootWeight[k * match.count + j] ** 2;
      sum += w * (reference.energies[k * reference.bands + match.referenceFirst + j] - energies[k * bands.bands + match.modelFirst + j]);
      weight += w;
    }
  }
  return { sum, weight };
}

function fitAtCutoff(options: CalibrateOptions, cutoff: number, progress: { done: number; total: number }): Fit {
  const base = options.starts[0];
  const shift = options.shift === true;
  const sheets = fitSheets(options, cutoff);
  const baseValues = parameterVector(base, base.d0);
  const held: CalibrationResult['held'] = [
    { name: 'd0', value: base.d0, why: `where the V are stated (any d0 with the V rescaled gives the same bands); ${base.name}'s` },
  ];
  if (!options.scanCutoff) held.push({ name: 'cutoff', value: cutoff, why: `${base.name}'s; scanned only on request` });
  const heldIndices = new Set<number>();
  if (!options.freeExponent) {
    heldIndices.add(PARAMETER_INDEX.exponent);
    held.push({ name: 'exponent', value: base.exponent, why: `${base.name}'s; fitted only on request` });
  }
  for (const name of options.hold ?? []) {
    if (heldIndices.has(PARAMETER_INDEX[name])) continue;
    heldIndices.add(PARAMETER_INDEX[name]);
    held.push({ name, value: baseValues[PARAMETER_INDEX[name]], why: `held on request at ${base.name}'s value` });
  }
  if (shift && !heldIndices.has(PARAMETER_INDEX.p)) {
    heldIndices.add(PARAMETER_INDEX.p);
    held.push({ name: 'p', value: base.onsite.p, why: `with a shift per reference file only εs − εp can be learnt; εp stays at ${base.name}'s value` });
  }
  // Parameters the matched bands do not depend on (e.g. σ integrals when only π bands are matched) are held.
  const candidates = MODEL_PARAMETERS.map((_, index) => index).filter((index) => !heldIndices.has(index));
  {
    const probe = new CalibrationProblem(sheets, candidates, false, baseValues);
    const r = new Float64Array(probe.residuals);
    const j = new Float64Array(probe.residuals * probe.parameters);
    probe.evaluate(Float64Array.from(candidates, (index) => baseValues[index]), r, j);
    const norms = candidates.map((_, c) => {
      let sum = 0;
      for (let i = 0; i < probe.residuals; i++) sum += j[i * probe.parameters + c] ** 2;
      return Math.sqrt(sum);
    });
    const largest = Math.max(...norms);
    norms.forEach((norm, c) => {
      if (norm <= UNSEEN * largest) {
        heldIndices.add(candidates[c]);
        held.push({ name: MODEL_PARAMETERS[candidates[c]], value: baseValues[candidates[c]], why: `the matched bands do not depend on it; ${base.name}'s value` });
      }
    });
  }
  const free = MODEL_PARAMETERS.map((_, index) => index).filter((index) => !heldIndices.has(index));
  const problem = new CalibrationProblem(sheets, free, shift, baseValues);
  const residuals = new Float64Array(problem.residuals);

  let best: Omit<Fit, 'starts' | 'held' | 'weighted' | 'cutoff' | 'problem'> | undefined;
  const starts: StartResult[] = [];
  for (const start of options.starts) {
    const values = parameterVector(start, base.d0);
    for (const index of heldIndices) values[index] = baseValues[index];
    if (shift && !options.hold?.includes('p')) {
      // Only moves every band by a constant: the shift takes it up below.
      const delta = base.onsite.p - start.onsite.p;
      if (!heldIndices.has(PARAMETER_INDEX.s)) values[PARAMETER_INDEX.s] = start.onsite.s + delta;
    }
    const x0 = new Float64Array(problem.parameters);
    free.forEach((index, at) => (x0[at] = values[index]));
    // Line the start up with the references: the mean offset goes into the shifts, or into εs and εp together.
    problem.evaluate(x0, residuals, null);
    const offsets = sheets.map((_, s) => meanOffset(problem, s));
    if (shift) {
      offsets.forEach((o, s) => (x0[free.length + s] = o.weight > 0 ? o.sum / o.weight : 0));
    } else if (free.includes(PARAMETER_INDEX.s) && free.includes(PARAMETER_INDEX.p)) {
      const total = offsets.reduce((acc, o) => ({ sum: acc.sum + o.sum, weight: acc.weight + o.weight }), { sum: 0, weight: 0 });
      const offset = total.weight > 0 ? total.sum / total.weight : 0;
      x0[free.indexOf(PARAMETER_INDEX.s)] += offset;
      x0[free.indexOf(PARAMETER_INDEX.p)] += offset;
    }
    const result = levenbergMarquardt(problem, x0, { maxIterations: options.maxIterations });
    const weightedRms = Math.sqrt(result.cost / weightSum(sheets));
    starts.push({ name: start.name, rms: unweightedRms(problem, result.x), weightedRms, iterations: result.iterations, converged: result.converged, reason: result.reason });
    if (!best || result.cost < best.cost || !(best.cost >= 0)) {
      best = { x: result.x, cost: result.cost, start: start.name, iterations: result.iterations, converged: result.converged };
    }
    progress.done++;
    options.onProgress?.(progress.done, progress.total);
  }
  const chosen = best!;
  // The sign convention: V_spσ ≥ 0 (the bands are the same either way).
  const sp = free.indexOf(PARAMETER_INDEX.sp_sigma);
  if (sp >= 0 && chosen.x[sp] < 0) chosen.x[sp] = -chosen.x[sp];
  return { ...chosen, cutoff, problem, starts, held, weighted: { sum: weightSum(sheets), points: problem.residuals } };
}

function weightSum(sheets: readonly FitSheet[]): number {
  let sum = 0;
  for (const s of sheets) for (const w of s.rootWeight) sum += w * w;
  return sum;
}

/** Unweighted rms of E_model + shift − E_reference at x (evaluates the problem). */
function unweightedRms(problem: CalibrationProblem, x: Float64Array): number {
  const r = new Float64Array(problem.residuals);
  problem.evaluate(x, r, null);
  let sum = 0;
  let i = 0;
  for (const s of problem.sheets) {
    for (const w of s.rootWeight) {
      const e = w > 0 ? r[i] / w : 0;
      sum += e * e;
      i++;
    }
  }
  return Math.sqrt(sum / Math.max(1, problem.residuals));
}

const short = (v: number) => Number(v.toPrecision(4));

export function calibrate(options: CalibrateOptions): CalibrationResult {
  if (options.starts.length === 0) throw new TypeError('invalid starts: [] (at least one start set)');
  if (options.sheets.length === 0) throw new TypeError('invalid sheets: [] (at least one sheet)');
  const base = options.starts[0];
  const cutoffs = options.scanCutoff ? cutoffCandidates(options.sheets) : [base.cutoff];
  if (cutoffs.length === 0) cutoffs.push(base.cutoff);
  const progress = { done: 0, total: cutoffs.length * options.starts.length };
  const scan: { cutoff: number; rms: number; weightedRms: number }[] = [];
  let fit: Fit | undefined;
  for (const cutoff of cutoffs) {
    const candidate = fitAtCutoff(options, cutoff, progress);
    scan.push({ cutoff, rms: unweightedRms(candidate.problem, candidate.x), weightedRms: Math.sqrt(candidate.cost / candidate.weighted.sum) });
    if (!fit || candidate.cost < fit.cost || !(fit.cost >= 0)) fit = candidate;
  }
  return report(options, fit!, options.scanCutoff ? scan : undefined);
}

function report(options: CalibrateOptions, fit: Fit, cutoffScan: CalibrationResult['cutoffScan']): CalibrationResult {
  const base = options.starts[0];
  const { problem, x } = fit;
  const residuals = new Float64Array(problem.residuals);
  const jacobian = new Float64Array(problem.residuals * problem.parameters);
  problem.evaluate(x, residuals, jacobian);
  const values = Float64Array.from(problem.expand(x));
  const covariance = parameterCovariance(jacobian, residuals, problem.residuals, problem.parameters);
  const fitted = problem.free.map((index) => MODEL_PARAMETERS[index]);
  const uncertainties: Partial<Record<ModelParameter, number>> = {};
  fitted.forEach((name, c) => (uncertainties[name] = covariance.sigma[c]));
  const correlationNames = [...fitted, ...(problem.shift ? options.sheets.map((s) => `shift ${s.referenceLabel}`) : [])];
  const p = problem.parameters;
  const correlation = Array.from({ length: p }, (_, c) => Array.from({ length: p }, (_, d) => covariance.correlation[c * p + d]));

  let sumSquares = 0;
  let maxError = 0;
  let i = 0;
  const width = options.weightWidth === undefined ? DEFAULT_WEIGHT_WIDTH : options.weightWidth;
  const sheets: CalibrationSheetResult[] = options.sheets.map((s, index) => {
    const fitSheet = problem.sheets[index];
    const shift = problem.shiftOf(x, index);
    let sheetSquares = 0;
    let sheetMax = 0;
    for (const w of fitSheet.rootWeight) {
      const error = Math.abs(w > 0 ? residuals[i] / w : 0);
      sheetSquares += error * error;
      sheetMax = Math.max(sheetMax, error);
      i++;
    }
    sumSquares += sheetSquares;
    maxError = Math.max(maxError, sheetMax);
    const model = Float64Array.from(problem.modelEnergies(index), (e) => e + shift);
    const fermi = s.reference.fermi ?? estimateFermi(s.reference, s.match, s.sheet.atoms.length, s.block ?? 'full');
    const ranges = matchRanges(s.match);
    const points = s.reference.count * s.match.count;
    return {
      label: s.label,
      referenceLabel: s.referenceLabel,
      block: s.block ?? 'full',
      modelBands: ranges.model,
      referenceBands: ranges.reference,
      points,
      rms: Math.sqrt(sheetSquares / points),
      maxError: sheetMax,
      shift,
      shiftUncertainty: problem.shift ? covariance.sigma[problem.free.length + index] : NaN,
      fermi: fermi ?? null,
      fermiFrom: s.reference.fermi !== undefined ? 'file' : fermi !== undefined ? 'estimate' : 'none',
      modelEnergies: model,
      modelBandCount: fitSheet.bands.bands,
      weights: Float64Array.from(fitSheet.rootWeight, (w) => w * w),
    };
  });
  const points = problem.residuals;
  const rms = Math.sqrt(sumSquares / points);
  const weightedRms = Math.sqrt(fit.cost / fit.weighted.sum);
  const formula = width === null ? 'equal weights' : `w = 1/(1 + ((E − E_F)/W)²), W = ${width} eV, E the reference energy`;

  const references = options.sheets.map((s) => `${s.referenceLabel} (sheet ${s.label}, ${s.reference.count} k-points, reference bands ${matchRanges(s.match).reference.join('–')} ↔ model bands ${matchRanges(s.match).model.join('–')}${(s.block ?? 'full') !== 'full' ? ` of the ${s.block} block` : ''})`);
  const source = clip(
    `fitted by lacuna calibrate${options.fittedAt ? ` on ${options.fittedAt}` : ''} to the reference bands ${references.join('; ')}: `
    + `${points} points, rms ${short(rms)} eV, largest error ${short(maxError)} eV, weighted rms ${short(weightedRms)} eV (${formula}); `
    + `best of ${options.starts.length} start${options.starts.length > 1 ? 's' : ''} (${fit.start}); V_spσ ≥ 0 by convention (bands do not fix its sign). `
    + 'An interpolation of that calculation, as good as it is; not a prediction.',
  );
  const heldText = fit.held.map((h) => `${h.name} ${short(h.value)} (${h.why})`).join('; ');
  const sigmaText = fitted.map((name) => `${name} ± ${Number.isNaN(uncertainties[name]!) ? 'undetermined' : short(uncertainties[name]!)}`).join(', ');
  const shiftText = problem.shift ? `; shifts E_reference ≈ E_model + shift: ${sheets.map((s) => `${s.referenceLabel} ${short(s.shift)} eV`).join(', ')}` : '';
  const provenance = clip(`standard uncertainties s·√((JᵀWJ)⁻¹) from the Jacobian at the minimum: ${sigmaText}${shiftText}. Held: ${heldText}.`);
  const name = (options.name ?? `calibrated-${options.sheets.map((s) => s.label).join('+')}`).slice(0, 100).trim() || 'calibrated';
  const parameters = parameterSetOf(values, { d0: base.d0, cutoff: fit.cutoff }, { name, source, provenance });
  return {
    parameters,
    rms,
    maxError,
    weightedRms,
    points,
    fitted,
    uncertainties,
    correlation,
    correlationNames,
    held: fit.held,
    sheets,
    start: fit.start,
    starts: fit.starts,
    ...(cutoffScan ? { cutoffScan } : {}),
    weights: { width, formula },
    signConvention: SIGN_CONVENTION,
    iterations: fit.iterations,
    converged: fit.converged,
  };
}

/** Text fields of a parameter file hold at most 4000 characters. */
function clip(text: string): string {
  return text.length <= 4000 ? text : `${text.slice(0, 3997)}...`;
}
