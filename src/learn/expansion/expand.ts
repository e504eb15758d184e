/**
 * The whole `expand` job for every front end (CLI, web view worker): fit the cluster expansion to the user's
 * energies, predict the patterns of a range, build the hull of the calculations, and suggest what to compute next.
 * A training set that cannot be fitted is refused here with the front end's own field names.
 */
import { canonicalForm } from '../../enumerate/canonical.ts';
import { refuseRendered } from '../../validate/fields.ts';
import { invalid } from '../../validate/invalid.ts';
import type { Pattern } from '../../lattice/sheet.ts';
import { clusterSet, type ClusterKind, type ClusterSet } from './clusters.ts';
import { fitExpansion, isFitProblem, type ExpansionFit, type TrainingStructure } from './fit.ts';
import { aboveHull, lowerHull, type HullVertex } from './hull.ts';
import { predictStructures, type PredictOptions } from './predict.ts';
import { suggestNext, WINDOW_CV_SCORES, type Suggestion } from './suggest.ts';

/** What the fit is, said under every result (CLI text, the web view, the figure's description). */
export const EXPANSION_CAVEAT =
  'A cluster expansion fitted to your own calculations: an interpolation of them, only as good as they are, not a prediction of its own — check it by computing the suggested patterns.';

/** Defaults of the contract: pairs up to the third neighbour shell, no triplets; five suggestions. */
export const EXPANSION_DEFAULTS = { pairShells: 3, tripletShells: 0, suggestions: 5 } as const;

/** A training structure with the name the user gave it, if any. */
export interface NamedTrainingStructure extends TrainingStructure {
  name?: string;
}

/** Names of the inputs as the front end shows them, for refusals. */
export interface ExpansionFields {
  structures: string;
  pairShells: string;
  tripletShells: string;
  /** The input that sets the range of predicted sites (named when there are too many patterns). */
  predictSites: string;
}

export const CLI_FIELDS: ExpansionFields = { structures: 'structures', pairShells: '--pair-shells', tripletShells: '--triplet-shells', predictSites: '--predict-sites' };

export interface ExpansionOptions {
  pairShells?: number;
  tripletShells?: number;
  /** Patterns to predict (none when absent). */
  predict?: Omit<PredictOptions, 'onProgress'>;
  /** Most suggestions. */
  suggestions?: number;
  /** Most patterns predicted; past it the range is refused naming fields.predictSites. Default: no limit. */
  maxPredictions?: number;
  onProgress?: PredictOptions['onProgress'];
  fields?: ExpansionFields;
}

export interface ClusterResult {
  kind: ClusterKind;
  shell: number;
  name: string;
  edges?: [number, number, number];
  distance?: number;
  perSite: number;
  /** ECI per cluster (eV) and its standard error. */
  eci: number;
  error: number;
}

/** One of the user's structures with what the fit makes of it. */
export interface ComputedPoint {
  index: number;
  name?: string;
  pattern: Pattern;
  sites: number;
  eta: number;
  /** Energy per cell as given (eV) and per lattice site. */
  energy: number;
  energyPerSite: number;
  /** The expansion's energy per site for it. */
  fitted: number;
  /** Above the hull of the calculations (eV per site, ≥ 0). */
  aboveHull: number;
}

/** One predicted pattern. */
export interface PredictedPoint {
  sites: number;
  holes: number;
  eta: number;
  pattern: Pattern;
  phase?: string;
  /** Predicted energy per cell of its smallest cell (eV) and per lattice site. */
  energy: number;
  energyPerSite: number;
  uncertainty: number;
  /** Predicted energy per site above the hull of the calculations (eV); NaN outside its η range. */
  aboveHull: number;
  /** Predicted energy per site above the fit's hull (eV, ≥ 0); NaN outside the calculations' η range. */
  aboveFitHull: number;
  /** A vertex of the fit's hull (a ground state of the fit) that is not computed. */
  fitGroundState: boolean;
  /** Index of the training structure it is, when computed. */
  trainingIndex?: number;
  computed: boolean;
}

/** A vertex of a hull, with its pattern and the boron chemical potential range where it is stable. */
export interface HullPoint extends HullVertex {
  source: 'computed' | 'predicted';
  pattern: Pattern;
  name?: string;
  /** Energy per cell of the pattern as given (computed) or predicted at its smallest cell (eV). */
  cellEnergy: number;
}

export interface ExpansionResult {
  fit: ExpansionFit;
  clusters: ClusterResult[];
  computed: ComputedPoint[];
  predictions: PredictedPoint[];
  /** The hull of the user's calculations (their energies, not the fit's). */
  hull: HullPoint[];
  /**
   * The fit's hull: the expansion's energies of the computed structures (fitted) and of the predictions. Its
   * vertices are the fit's ground states (the ground-state check of suggest.ts).
   */
  fitHull: HullPoint[];
  suggestions: Suggestion<PredictedPoint>[];
  /** The window above the hull of the second suggestion rule (eV per site). */
  window: number;
  /** Things the user should know (extrapolations, structures that alone fix a cluster, …). */
  notes: string[];
}

function refuseProblem(set: ClusterSet, structures: number, problem: Exclude<ReturnType<typeof fitExpansion>, ExpansionFit>, fields: ExpansionFields): never {
  if (problem.kind === 'too-few') {
    const pairs = set.pairShells;
    const triplets = set.orbits.length - 2 - pairs;
    refuseRendered(fields.structures, `${structures} structure${structures === 1 ? '' : 's'}`,
      `${set.orbits.length} clusters asked (empty, point, ${pairs} pair shell${pairs === 1 ? '' : 's'}${triplets > 0 ? `, ${triplets} triplet orbits` : ''}) need at least ${problem.needed} structures for a fit with leave-one-out cross-validation; add structures or lower ${fields.pairShells}${triplets > 0 ? ` or ${fields.tripletShells}` : ''}`);
  }
  const orbit = set.orbits[problem.orbit];
  if (orbit.kind === 'point') {
    refuseRendered(fields.structures, `${structures} structures`, 'every structure has the same hole density η, so the point term cannot be told from the constant; add structures of other η');
  }
  const field = orbit.kind === 'pair' ? fields.pairShells : fields.tripletShells;
  const value = orbit.kind === 'pair' ? set.pairShells : set.tripletShells;
  invalid(field, String(value), `the ${structures} structures do not determine ${orbit.name}: its correlations are a combination of those of the clusters before it in every structure; add structures that differ in it, or lower ${field}`);
}

function hullPoints(vertices: HullVertex[], source: (index: number) => Omit<HullPoint, keyof HullVertex>): HullPoint[] {
  return vertices.map((v) => ({ ...v, ...source(v.index) }));
}

/** Fits, predicts, builds the hulls and suggests (see the module comment). Refuses an unfittable training set. */
export function expandEnergies(structures: readonly NamedTrainingStructure[], options: ExpansionOptions = {}): ExpansionResult {
  const fields = options.fields ?? CLI_FIELDS;
  const set = clusterSet({ pairShells: options.pairShells ?? EXPANSION_DEFAULTS.pairShells, tripletShells: options.tripletShells ?? EXPANSION_DEFAULTS.tripletShells });
  const fit = fitExpansion(set, structures);
  if (isFitProblem(fit)) refuseProblem(set, structures.length, fit, fields);

  const clusters: ClusterResult[] = set.orbits.map((o, k) => {
    const c: ClusterResult = { kind: o.kind, shell: o.shell, name: o.name, perSite: o.perSite, eci: fit.eci[k], error: fit.eciError[k] };
    if (o.edges) c.edges = o.edges;
    if (o.distance !== undefined) c.distance = o.distance;
    return c;
  });

  const hullVertices = lowerHull(fit.eta, fit.energyPerSite);
  const computed: ComputedPoint[] = structures.map((s, index) => {
    const point: ComputedPoint = {
      index, pattern: s.pattern, sites: s.pattern.supercell.a * s.pattern.supercell.c, eta: fit.eta[index], energy: s.energy,
      energyPerSite: fit.energyPerSite[index], fitted: fit.fitted[index], aboveHull: aboveHull(hullVertices, fit.eta[index], fit.energyPerSite[index]),
    };
    if (s.name !== undefined) point.name = s.name;
    return point;
  });
  const hull = hullPoints(hullVertices, (i) => ({
    source: 'computed', pattern: computed[i].pattern, cellEnergy: computed[i].energy, ...(computed[i].name !== undefined ? { name: computed[i].name } : {}),
  }));

  const trainingIndex = new Map<string, number>();
  structures.forEach((s, i) => trainingIndex.set(canonicalForm(s.pattern), i));
  const predictions: PredictedPoint[] = [];
  if (options.predict) {
    const most = options.maxPredictions ?? Infinity;
    for (const p of predictStructures(fit, { ...options.predict, onProgress: options.onProgress })) {
      if (predictions.length >= most) {
        const [low, high] = options.predict.sites;
        invalid(fields.predictSites, low === high ? `${low}` : `${low}-${high}`, `more than ${most} patterns in this range; narrow the sites or holes, or keep only isolated holes`);
      }
      const s = p.structure;
      const point: PredictedPoint = {
        sites: s.sites, holes: s.holes, eta: s.eta, pattern: s.pattern, energy: p.energy, energyPerSite: p.energyPerSite,
        uncertainty: p.uncertainty, aboveHull: aboveHull(hullVertices, s.eta, p.energyPerSite), aboveFitHull: NaN,
        fitGroundState: false, computed: false,
      };
      if (s.phase !== undefined) point.phase = s.phase;
      const index = trainingIndex.get(s.canonical);
      if (index !== undefined) {
        point.trainingIndex = index;
        point.computed = true;
      }
      predictions.push(point);
    }
  }

  // The fit's hull: the expansion's energies of all patterns, computed or not (the ground-state check compares the
  // expansion with itself, so that the noise of the calculations does not make ground states of its own).
  const fresh = predictions.filter((p) => !p.computed);
  const fitHullVertices = lowerHull([...fit.eta, ...fresh.map((p) => p.eta)], [...fit.fitted, ...fresh.map((p) => p.energyPerSite)]);
  const fitHull = hullPoints(fitHullVertices, (i) => (i < structures.length
    ? { source: 'computed', pattern: computed[i].pattern, cellEnergy: computed[i].sites * fit.fitted[i], ...(computed[i].name !== undefined ? { name: computed[i].name } : {}) }
    : { source: 'predicted', pattern: fresh[i - structures.length].pattern, cellEnergy: fresh[i - structures.length].energy }));
  for (const v of fitHullVertices) if (v.index >= structures.length) fresh[v.index - structures.length].fitGroundState = true;
  for (const p of predictions) {
    // Within the calculations' η range only, as aboveHull (the fit's hull may reach past it).
    p.aboveFitHull = Number.isFinite(p.aboveHull) ? aboveHull(fitHullVertices, p.eta, p.energyPerSite) : NaN;
  }
  // Ground states of the calculations the fit does not share: by a fault of the fit (not on the hull of the fitted
  // energies of the computed structures), or undercut by a prediction not computed.
  const fitVertices = new Set(fitHullVertices.map((v) => v.index));
  const ownFitVertices = new Set(lowerHull(fit.eta, fit.fitted).map((v) => v.index));
  const label = (i: number) => computed[i].name ?? `structures[${i}]`;
  const misfit = hullVertices.filter((v) => !ownFitVertices.has(v.index)).map((v) => label(v.index));
  const undercut = hullVertices.filter((v) => ownFitVertices.has(v.index) && !fitVertices.has(v.index)).map((v) => label(v.index));

  // Without a CV score (a structure alone fixes a cluster) the fit's rms stands in for the window.
  const window = WINDOW_CV_SCORES * (Number.isFinite(fit.cvRms) ? fit.cvRms : fit.fitRms);
  const suggestions = suggestNext(predictions, { count: options.suggestions ?? EXPANSION_DEFAULTS.suggestions, window });

  const notes: string[] = [];
  for (const i of fit.soleSupport) {
    notes.push(`structures[${i}]${structures[i].name ? ` (${structures[i].name})` : ''} alone fixes a cluster (leverage 1): leaving it out leaves the fit undetermined, so there is no cross-validation score; add structures like it`);
  }
  const outside = predictions.filter((p) => !Number.isFinite(p.aboveHull)).length;
  if (outside > 0) {
    notes.push(`${outside} predicted pattern${outside === 1 ? ' lies' : 's lie'} outside the η range ${hullVertices[0].eta.toFixed(4)}–${hullVertices[hullVertices.length - 1].eta.toFixed(4)} of your calculations: extrapolations, with no distance to the hull and never suggested`);
  }
  if (misfit.length > 0) {
    notes.push(`the fit does not reproduce ${misfit.join(', ')} as a ground state of your calculations: the fit and your calculations disagree there — add structures near ${misfit.length === 1 ? 'it' : 'them'} or change the clusters`);
  }
  if (undercut.length > 0) {
    notes.push(`${undercut.join(', ')} ${undercut.length === 1 ? 'is a ground state' : 'are ground states'} of your calculations but not of the fit: predicted patterns you have not computed lie lower; compute the suggested ground states to tell whether the fit is right`);
  }
  const grounds = fresh.filter((p) => p.fitGroundState && Number.isFinite(p.aboveHull)).length;
  const suggested = suggestions.filter((s) => s.reason === 'ground-state').length;
  if (grounds > suggested) notes.push(`${grounds} patterns you have not computed are ground states of the fit; the ${suggested} deepest below your hull are suggested`);
  return { fit, clusters, computed, predictions, hull, fitHull, suggestions, window, notes };
}
