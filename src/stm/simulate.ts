/**
 * Simulated STM images after Tersoff & Hamann (PRB 31, 805 (1985)): the current is proportional to the LDOS at the
 * tip summed over the bias window (src/stm/biasWindow.ts: V > 0 images empty states), from the tight-binding
 * eigenvectors on the Γ-centred mesh with the vacuum tails of src/stm/tails.ts. These are model images, not
 * predictions: tight binding, s and pz tails only, an s-wave tip, no substrate.
 *
 * Modes: constant height (the current at height h above the highest atom) and constant current (the tip height at
 * which the current equals its mean at h). Brighter is more current, or a higher tip, which is the same thing.
 */
import type { TightBindingModel } from '../tb/model.ts';
import { fill } from '../tb/fill.ts';
import { DEFAULT_WORK_FUNCTION, decayConstant } from './barrier.ts';
import { windowWeight } from './biasWindow.ts';
import { heightForCurrent } from './constantCurrent.ts';
import { halfMesh } from './halfMesh.ts';
import { ldosSeries } from './ldosSeries.ts';
import { evaluateField, seriesField, type SeriesField } from './seriesField.ts';

export type StmMode = 'constant-height' | 'constant-current';

/** What to simulate. Options arrive validated (the CLI and UI check them). */
export interface StmOptions {
  /** Sample bias V against the tip (volts, non-zero; default +1: empty states). */
  bias?: number;
  /** Tip height above the highest atom (Å, default 4; ≥ 1.5 for constant current, which also looks 0.5 Å lower). */
  height?: number;
  /** Default 'constant-current'. */
  mode?: StmMode;
  /** Barrier φ (eV) of κ = 0.5123·√φ Å⁻¹ (default 4.5). */
  workFunction?: number;
  /** Mesh side of the Fermi level and of the LDOS k-sum (default 24). */
  mesh?: number;
  /** Width σ (eV) of the occupation and of the window edges (default 0.1). */
  smearing?: number;
  /** Extra electrons per atom δ for the Fermi level (default 0). */
  doping?: number;
  /** Fermi level (eV) if already known: skips the filling. */
  fermi?: number;
}

/** Defaults of the simulation. */
export const STM_DEFAULTS = { bias: 1, height: 4, mode: 'constant-current' as StmMode, mesh: 24, smearing: 0.1, doping: 0 };
/** Height step Δ (Å) of the constant-current solve. */
export const CURRENT_STEP = 0.5;

/** A sheet's STM model, ready to be evaluated at any in-plane points. */
export interface StmModel {
  mode: StmMode;
  bias: number;
  height: number;
  fermi: number;
  kappa: number;
  /** States per cell in the window (0: the window is empty on this mesh). */
  states: number;
  /** Constant height: one field; constant current: heights h − Δ, h, h + Δ. */
  fields: SeriesField[];
  /** Set-point current (the mean at h) in the model's units. */
  setPoint: number;
  /** When E_F was found in a gap of the mesh spectrum: its edges (eV). */
  gap?: { lower: number; upper: number };
}

export function stmModel(model: TightBindingModel, options: StmOptions = {}): StmModel {
  const bias = options.bias ?? STM_DEFAULTS.bias;
  const height = options.height ?? STM_DEFAULTS.height;
  const mode = options.mode ?? STM_DEFAULTS.mode;
  const mesh = options.mesh ?? STM_DEFAULTS.mesh;
  const smearing = options.smearing ?? STM_DEFAULTS.smearing;
  const kappa = decayConstant(options.workFunction ?? DEFAULT_WORK_FUNCTION);
  const filled = options.fermi === undefined ? fill(model, { mesh, smearing, doping: options.doping ?? STM_DEFAULTS.doping }) : undefined;
  const fermi = options.fermi ?? (filled as NonNullable<typeof filled>).fermi;
  const heights = mode === 'constant-height' ? [height] : [height - CURRENT_STEP, height, height + CURRENT_STEP];
  const series = ldosSeries(model, {
    kappa, heights, kpoints: halfMesh(model.sheet.cell, mesh),
    weight: (energy) => windowWeight({ fermi, bias, smearing }, energy),
  });
  const fields = heights.map((_, j) => seriesField(series, j));
  const setPoint = fields[mode === 'constant-height' ? 0 : 1].mean;
  const out: StmModel = { mode, bias, height, fermi, kappa, states: series.states, fields, setPoint };
  if (filled?.inGap) out.gap = filled.inGap;
  return out;
}

/**
 * The image value at in-plane points (Å, the sheet's frame): the current (constant height) or the tip height above
 * the highest atom (constant current). Writes out[p]; returns out.
 */
export function evaluateStm(stm: StmModel, x: Float64Array, y: Float64Array, out: Float64Array): Float64Array {
  if (stm.mode === 'constant-height') return evaluateField(stm.fields[0], x, y, out);
  const below = evaluateField(stm.fields[0], x, y, new Float64Array(x.length));
  const middle = evaluateField(stm.fields[1], x, y, new Float64Array(x.length));
  evaluateField(stm.fields[2], x, y, out);
  const target = Math.log(stm.setPoint);
  for (let p = 0; p < x.length; p++) out[p] = stm.height + heightForCurrent(below[p], middle[p], out[p], target, CURRENT_STEP);
  return out;
}
