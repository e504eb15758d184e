/**
 * Matching a measured picture to vacancy patterns: the isolated-hole patterns of the enumerator (src/enumerate) with
 * N sites in a range whose smallest cell fits the measured lattice or one of its sublattices of small index
 * (src/stm/correspondence.ts) are simulated (src/stm/simulate.ts) on that cell's fractional grid, for every fitting
 * choice of cell vectors, and ranked by the best Pearson correlation with the picture folded onto the same cell
 * (src/stm/fold.ts, src/stm/similarity.ts) over those choices and all translations. Registration is thus by the
 * lattice itself: rotation, scale and shear come from the fitted cell, translation from the correlation.
 * With a metal given, a candidate also fits through its coincidence cells with that metal (src/stm/coincidenceMatch.ts):
 * the free sheet's model picture on the sheet supercell that forms the coincidence cell is scored the same way. The
 * model has no metal, so the moiré contrast itself is not modelled: such a score compares the sheet-periodic part of
 * the picture only. At equal score the own cell is kept (the simpler explanation).
 * A high score says the model picture looks alike, not that the pattern is there: experiment and higher-level
 * calculations decide.
 */
import { enumerateStructures } from '../enumerate/enumerate.ts';
import type { Structure } from '../enumerate/types.ts';
import { patternToSheet } from '../lattice/pattern.ts';
import { reducedSheet } from '../lattice/reducedCell.ts';
import type { ParameterSet } from '../tb/params.ts';
import { TightBindingModel } from '../tb/model.ts';
import type { Analysis } from './analyse.ts';
import type { CoincidenceFit } from '../substrate/coincidence.ts';
import { coincidenceCellFits, type CellFit, type CoincidenceSearch } from './coincidenceMatch.ts';
import { CELL_TOLERANCE, correspondences, sublattices, type CellTolerance } from './correspondence.ts';
import { foldPicture } from './fold.ts';
import { realCell } from './lattice.ts';
import { bestCorrelation } from './similarity.ts';
import { evaluateStm, stmModel, type StmOptions } from './simulate.ts';

export interface MatchOptions {
  /** Lattice sites N per cell, inclusive (default [2, 12]). */
  sites?: [number, number];
  /** Candidates returned (default 5). */
  top?: number;
  /** Bond d (Å) of the candidates (default 1.69). */
  bond?: number;
  tolerance?: CellTolerance;
  /** Largest index of the sublattices of the measured lattice tried as the true cell (default 4). */
  maxIndex?: number;
  parameters: ParameterSet;
  /** The simulation of each candidate (default mesh 24, as stm). */
  stm?: StmOptions;
  /** Also try each candidate's coincidence cells with this metal (absent: the own cell only). */
  coincidence?: CoincidenceSearch;
  /** Called after each structure examined, with the count so far. */
  onProgress?: (examined: number) => void;
}

export interface MatchCandidate {
  structure: Structure;
  /** Best Pearson correlation, in [−1, 1]. */
  score: number;
  /** Fitted cell over candidate cell (√ of the area ratio). */
  scale: number;
  /** Candidate cell area over the measured lattice's cell area (1: the measured cell itself). */
  index: number;
  /** Shift (fraction of the fitted cell vectors) of the model against the measured motif. */
  shift: [number, number];
  /** The coincidence fit whose cell matched (absent: the candidate's own cell). */
  coincidence?: CoincidenceFit;
}

export interface MatchResult {
  candidates: MatchCandidate[];
  /** Structures enumerated. */
  examined: number;
  /** Structures whose cell fits (each simulated once). */
  fitting: number;
  /** Of those, fitting through a coincidence cell only (0 without a metal). */
  fittingByCoincidence: number;
  /** Fitting structures not scored: no state in the bias window (E_F in a gap of the model wider than the bias). */
  emptyWindow: Structure[];
}

/** Score differences below this are rounding. */
const TIE = 1e-6;

export const MATCH_DEFAULTS = { sites: [2, 12] as [number, number], top: 5, bond: 1.69, mesh: 24, maxIndex: 4 };

export function matchPatterns(analysis: Extract<Analysis, { ok: true }>, options: MatchOptions): MatchResult {
  const sites = options.sites ?? MATCH_DEFAULTS.sites;
  const tolerance = options.tolerance ?? CELL_TOLERANCE;
  const { lattice, bins, values, width, height, pixelSize } = analysis;
  const targets = sublattices(lattice.vectors, options.maxIndex ?? MATCH_DEFAULTS.maxIndex);
  const motifs = new Map<number, Float64Array>();
  const motif = (t: number): Float64Array => {
    let m = motifs.get(t);
    if (!m) {
      const [u, v] = targets[t].vectors;
      const reciprocal = realCell([u[0] / pixelSize, u[1] / pixelSize], [v[0] / pixelSize, v[1] / pixelSize]);
      m = foldPicture(values, width, height, reciprocal, bins);
      motifs.set(t, m);
    }
    return m;
  };
  const found: MatchCandidate[] = [];
  let examined = 0;
  let fitting = 0;
  let fittingByCoincidence = 0;
  const emptyWindow: Structure[] = [];
  const points = bins * bins;
  for (const structure of enumerateStructures({ sites, holes: [1, sites[1]], isolated: true, bond: options.bond ?? MATCH_DEFAULTS.bond })) {
    examined++;
    options.onProgress?.(examined);
    const sheet = patternToSheet(structure.pattern);
    if (sheet.atoms.length === 0) continue;
    const cell = reducedSheet(sheet).cell;
    const fits: CellFit[] = [];
    targets.forEach((target, t) => {
      for (const { vectors, scale } of correspondences(cell, target.vectors, tolerance)) fits.push({ target: t, vectors, scale });
    });
    const own = fits.length;
    // The sheet's own frame (not the reduced one): its model below is built on `sheet`.
    if (options.coincidence) fits.push(...coincidenceCellFits(sheet, targets, options.coincidence, tolerance));
    if (fits.length === 0) continue;
    fitting++;
    if (own === 0) fittingByCoincidence++;
    const stm = stmModel(new TightBindingModel(sheet, options.parameters), { mesh: MATCH_DEFAULTS.mesh, ...options.stm });
    if (!(stm.states > 1e-6)) {
      emptyWindow.push(structure);
      continue;
    }
    const x = new Float64Array(points * fits.length), y = new Float64Array(points * fits.length);
    fits.forEach(({ vectors: [u, v] }, f) => {
      for (let i = 0; i < bins; i++) {
        for (let j = 0; j < bins; j++) {
          const s = (i + 0.5) / bins, t = (j + 0.5) / bins;
          x[f * points + i * bins + j] = s * u[0] + t * v[0];
          y[f * points + i * bins + j] = s * u[1] + t * v[1];
        }
      }
    });
    const model = evaluateStm(stm, x, y, new Float64Array(x.length));
    let best: MatchCandidate | undefined;
    fits.forEach(({ target, scale, coincidence }, f) => {
      const { score, shift } = bestCorrelation(motif(target), model.subarray(f * points, (f + 1) * points), bins);
      // A coincidence must beat an own-cell fit clearly (a one-cell coincidence draws the same picture, up to rounding).
      const margin = coincidence && best && !best.coincidence ? TIE : 0;
      if (!best || score > best.score + margin) {
        best = { structure, score, scale, index: targets[target].index, shift: [shift[0] / bins, shift[1] / bins] };
        if (coincidence) best.coincidence = coincidence;
      }
    });
    if (best) found.push(best);
  }
  found.sort((p, q) => q.score - p.score);
  return { candidates: found.slice(0, options.top ?? MATCH_DEFAULTS.top), examined, fitting, fittingByCoincidence, emptyWindow };
}
