/**
 * Predictions of a fitted expansion for every enumerated pattern of a range, streamed: the enumerator yields one
 * structure at a time (src/enumerate, each once up to 6mm and translations at its smallest cell), its correlations
 * come from the cached tables of its supercell, and nothing of it is kept but the numbers asked for.
 */
import { enumerateStructures, type EnumerateOptions, type Structure } from '../../enumerate/index.ts';
import { CorrelationEngine } from './correlations.ts';
import { predictFromCorrelations, type ExpansionFit } from './fit.ts';

export interface Prediction {
  structure: Structure;
  /** Predicted energy per lattice site (eV). */
  energyPerSite: number;
  /** Predicted energy per cell of the structure's smallest cell (eV): sites × energyPerSite. */
  energy: number;
  /** Standard error of the prediction per site (eV): s·√(x(XᵀX)⁻¹xᵀ). */
  uncertainty: number;
}

export interface PredictOptions {
  /** Lattice sites per cell, inclusive. */
  sites: [number, number];
  /** Vacancies per cell, inclusive. */
  holes: [number, number];
  /** Only patterns with no two vacancies nearest neighbours. */
  isolated?: boolean;
  /** Nearest-neighbour distance written into each pattern (Å); default the enumerator's 1.69. */
  bond?: number;
  /** Called as the enumeration advances: share of the work done (0…1) and patterns predicted so far. */
  onProgress?: (fraction: number, done: number) => void;
}

/**
 * Every pattern of the range with at least one atom, with its prediction, in the enumerator's order. Lazy: the
 * work is done as the caller iterates.
 */
export function* predictStructures(fit: ExpansionFit, options: PredictOptions): Generator<Prediction> {
  const engine = new CorrelationEngine(fit.set);
  const p = engine.size;
  const correlations = new Float64Array(p);
  const work = new Float64Array(2 * p);
  const out = new Float64Array(2);
  let done = 0;
  const enumeration: EnumerateOptions = { sites: options.sites, holes: options.holes, isolated: options.isolated === true };
  if (options.bond !== undefined) enumeration.bond = options.bond;
  if (options.onProgress) {
    const report = options.onProgress;
    enumeration.onProgress = (progress) => report(progress.fraction, done);
  }
  for (const structure of enumerateStructures(enumeration)) {
    if (structure.holes === structure.sites) continue; // every site vacant: no sheet
    engine.correlate(structure.pattern.supercell, structure.pattern.vacancies, correlations);
    predictFromCorrelations(fit, correlations, work, out);
    done++;
    yield { structure, energyPerSite: out[0], energy: structure.sites * out[0], uncertainty: out[1] };
  }
}
