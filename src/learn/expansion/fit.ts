/**
 * Fitting the effective cluster interactions (ECIs) to the user's energies, and the errors of the fit.
 *
 * The energy per lattice site (vacant sites counted: E_cell/N, N = a·c sites of the supercell) is expanded as
 *   e = Σ_α m_α J_α Φ_α,
 * J_α the ECI of one cluster of orbit α, m_α its clusters per site, Φ_α the correlation function (correlations.ts).
 * The empty and point terms make e linear in η; they carry the energy reference (a boron atom's energy in the
 * user's code), which the chemical potentials of boron and vacancy absorb: the hull and every distance above it
 * do not depend on them. J is the ordinary least-squares solution; the errors follow van de Walle & Ceder,
 * J. Phase Equilib. 23, 348 (2002): the rms of the fit, and the leave-one-out cross-validation score by the
 * hat-matrix shortcut CV² = (1/n) Σ (r_i/(1 − H_ii))², which needs no refitting.
 */
import { CorrelationEngine } from './correlations.ts';
import type { ClusterSet } from './clusters.ts';
import { leastSquares, quadraticForm, type LeastSquares } from './leastSquares.ts';
import type { Pattern } from '../../lattice/sheet.ts';

/** A training structure: a pattern and its energy per cell (eV) from the user's own calculation. */
export interface TrainingStructure {
  pattern: Pattern;
  /** Total energy of the supercell as given (eV). */
  energy: number;
}

/** Leverage above which leaving a structure out leaves a cluster undetermined (its CV term is infinite). */
export const LEVERAGE_LIMIT = 1 - 1e-9;

export interface ExpansionFit {
  set: ClusterSet;
  /** ECI per cluster J_α (eV), in the set's orbit order. */
  eci: Float64Array;
  /** Standard error of each ECI (eV): s·√((XᵀX)⁻¹)_αα; NaN when n = p. */
  eciError: Float64Array;
  /** Energy per site of each training structure (eV), as given, and as fitted. */
  energyPerSite: Float64Array;
  fitted: Float64Array;
  /** Hole density of each training structure. */
  eta: Float64Array;
  /** rms of the residuals (eV per lattice site). */
  fitRms: number;
  /** Leave-one-out CV score (eV per lattice site); NaN when some structure alone fixes a cluster (see `soleSupport`). */
  cvRms: number;
  /** Indices of structures whose leverage is 1: without each, a cluster would be undetermined. */
  soleSupport: number[];
  /** s² = Σr²/(n − p), the residual variance (eV²/site²); NaN when n = p. */
  residualVariance: number;
  /** The least-squares solution (R for prediction variances). */
  solution: LeastSquares;
}

/** The reason a training set cannot be fitted with a cluster set. */
export type FitProblem =
  | { kind: 'too-few'; structures: number; needed: number }
  | { kind: 'dependent'; orbit: number };

/** The design matrix X[i + n·α] = m_α Φ_α of the structures (column-major, layout of leastSquares.ts). */
export function designMatrix(engine: CorrelationEngine, patterns: readonly Pattern[]): Float64Array {
  const n = patterns.length;
  const p = engine.size;
  const x = new Float64Array(n * p);
  const row = new Float64Array(p);
  patterns.forEach((pattern, i) => {
    engine.correlate(pattern.supercell, pattern.vacancies, row);
    for (let k = 0; k < p; k++) x[i + n * k] = engine.set.orbits[k].perSite * row[k];
  });
  return x;
}

/**
 * Fits the ECIs. Needs n ≥ p + 1 structures (p orbits) so that leaving one out still fixes every ECI in general;
 * returns the problem instead when there are fewer, or when the structures do not tell an orbit apart (its
 * column is a combination of the ones before it). Never throws.
 */
export function fitExpansion(set: ClusterSet, structures: readonly TrainingStructure[]): ExpansionFit | FitProblem {
  const n = structures.length;
  const p = set.orbits.length;
  if (n < p + 1) return { kind: 'too-few', structures: n, needed: p + 1 };
  const engine = new CorrelationEngine(set);
  const x = designMatrix(engine, structures.map((s) => s.pattern));
  const y = new Float64Array(n);
  const eta = new Float64Array(n);
  structures.forEach((s, i) => {
    const sites = s.pattern.supercell.a * s.pattern.supercell.c;
    y[i] = s.energy / sites;
    eta[i] = s.pattern.vacancies.length / sites;
  });
  const solution = leastSquares(x, y, n, p);
  if (solution.dependentColumn >= 0) return { kind: 'dependent', orbit: solution.dependentColumn };
  let squares = 0;
  let cvSquares = 0;
  const soleSupport: number[] = [];
  const fitted = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const r = solution.residuals[i];
    fitted[i] = y[i] - r;
    squares += r * r;
    const h = solution.leverage[i];
    if (h > LEVERAGE_LIMIT) soleSupport.push(i);
    else cvSquares += (r / (1 - h)) ** 2;
  }
  const residualVariance = n > p ? squares / (n - p) : NaN;
  const eciError = new Float64Array(p);
  const unit = new Float64Array(p);
  const work = new Float64Array(p);
  for (let k = 0; k < p; k++) {
    // (XᵀX)⁻¹_kk = e_k(XᵀX)⁻¹e_kᵀ; the ECI is J_k = β_k (the column holds m_k Φ_k).
    unit.fill(0);
    unit[k] = 1;
    eciError[k] = Math.sqrt(residualVariance * quadraticForm(solution.r, p, unit, work));
  }
  return {
    set,
    eci: Float64Array.from(solution.coefficients),
    eciError,
    energyPerSite: y,
    fitted,
    eta,
    fitRms: Math.sqrt(squares / n),
    cvRms: soleSupport.length > 0 ? NaN : Math.sqrt(cvSquares / n),
    soleSupport,
    residualVariance,
    solution,
  };
}

/** True when fitExpansion gave a problem rather than a fit. */
export function isFitProblem(value: ExpansionFit | FitProblem): value is FitProblem {
  return 'kind' in value;
}

/**
 * The predicted energy per site of correlations Φ (length p) and its standard error s·√(x(XᵀX)⁻¹xᵀ),
 * x_α = m_α Φ_α. `work` (length 2p) is scratch. Writes [energy, error] into out.
 */
export function predictFromCorrelations(fit: ExpansionFit, correlations: Float64Array, work: Float64Array, out: Float64Array): Float64Array {
  const orbits = fit.set.orbits;
  const p = orbits.length;
  const x = work.subarray(0, p);
  let energy = 0;
  for (let k = 0; k < p; k++) {
    x[k] = orbits[k].perSite * correlations[k];
    energy += x[k] * fit.eci[k];
  }
  out[0] = energy;
  out[1] = Math.sqrt(fit.residualVariance * quadraticForm(fit.solution.r, p, x, work.subarray(p, 2 * p)));
  return out;
}
