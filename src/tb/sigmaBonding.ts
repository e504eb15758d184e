/**
 * σ-bonding analysis of a mesh spectrum: where the σ bonding states end, how many electrons they hold, and what
 * doping fills them — side by side with the electron-counting rule (src/tb/countingRule.ts).
 *
 * The search runs between σ bonding and antibonding states: over the energies at which the σ states below hold
 * between 1.5 and 4.5 electrons per atom (of the 6 that s, px, py can hold; a choice of ours that brackets the
 * rule's values for 0 ≤ η ≤ 1/3). There it takes
 * 1. a gap of the σ spectrum, if one exists: on planar sheets between consecutive σ bands (max of one below min of
 *    the next over the mesh), on buckled sheets between consecutive bands of the whole spectrum, at least 4σ wide
 *    (narrower ones are bands that touch between mesh points, or too narrow to matter at width σ). Given the
 *    model, each is checked off the mesh (src/tb/gapCheck.ts: the path through the special points and a local
 *    search); one that a band crosses is a gap of the mesh only and is dropped. The widest left wins, with its
 *    checked edges; E* is its midpoint;
 * 2. otherwise the deepest pseudogap: the minimum, on a grid of step σ/20 (coarser only over a very wide spectrum,
 *    src/tb/dosInterpolated.ts), of the σ DOS of the bands interpolated
 *    between mesh points (linear triangle method) broadened by the same Gaussian (src/tb/dosInterpolated.ts).
 *    The Gaussian sum over mesh states would find sampling holes instead: intervals where a steep band has no
 *    mesh point, and that sum is exactly 0 (δ6 at mesh 36: a "pseudogap" inside the s-like band).
 * At E*, with the same occupation ½·erfc((E − E*)/σ) as `fill` (so `fill` at the returned doping puts E_F at E*):
 * σ capacity = σ electrons per atom below E*; filling doping = all electrons (σ and π) per atom below E* − 3.
 * π states often lie inside a σ gap, so for a gap the dopings that fill every state up to its lower and upper edge
 * (step occupation) are given too: any doping between them fills the σ bonding states and no σ antibonding state.
 *
 * Convergence (our criterion): the capacity and the doping are counted twice at E*, from the mesh states (as
 * `fill` counts) and from the interpolated DOS; the mesh resolves the answer when both differ by at most
 * CONVERGENCE_TOLERANCE electrons per atom, any gap was checked off the mesh, and E* does not lie in an interval
 * that only the mesh leaves empty (a band crossing there is not resolved). src/tb/sigmaBondingRefine.ts
 * refines the mesh until then, within a work budget.
 */
import { countingRuleDoping } from './countingRule.ts';
import { gaussianDos } from './dos.ts';
import { broadenedAt, interpolatedCount, interpolatedDos } from './dosInterpolated.ts';
import { observablesAt } from './fill.ts';
import { checkGap, type GapWitness } from './gapCheck.ts';
import type { MeshSpectrum } from './meshSpectrum.ts';
import type { TightBindingModel } from './model.ts';

/**
 * Largest difference (electrons per atom) between mesh and interpolated counts of a converged answer: a choice of
 * ours, above the triangle method's own interpolation error on the presets at mesh 36 (below 0.008 there).
 */
export const CONVERGENCE_TOLERANCE = 0.01;
/** σ DOS values within this (states per eV per atom) of the minimum count as one flat minimum. */
const PLATEAU = 1e-6;

/** Options of the σ-bonding analysis. */
export interface SigmaBondingOptions {
  /** Hole density η of the sheet (exact from a pattern, or an estimate). */
  holeDensity: number;
  /** True when η is an estimate from the geometry (default false). */
  holeDensityEstimated?: boolean;
  /** Gaussian width σ (eV) of occupation and DOS (default 0.1). */
  smearing?: number;
  /** σ electrons per atom bracketing the search (default [1.5, 4.5]). */
  window?: [number, number];
  /** The model of the spectrum: with it, gaps found on the mesh are checked off the mesh. */
  model?: TightBindingModel;
}

/** Result of the σ-bonding analysis. */
export interface SigmaBondingResult {
  /** Name of the parameter set used. */
  parameters: string;
  mesh: number;
  smearing: number;
  /** E* (eV): mid-gap, or the pseudogap minimum. */
  energy: number;
  kind: 'gap' | 'pseudogap';
  /** Edges of the gap (eV) when kind is 'gap'. */
  gap?: { lower: number; upper: number };
  /** σ-projected Gaussian DOS of the mesh states at E* (states per eV per atom, both spins). */
  sigmaDos: number;
  /** The same from the bands interpolated between mesh points (triangle method, same Gaussian). */
  sigmaDosInterpolated: number;
  /** σ electrons per atom held by the states below E*. */
  sigmaCapacity: number;
  /** Doping δ that fills every state (σ and π) below E*: electrons per atom below E* minus 3. */
  fillingDoping: number;
  /** For a gap: dopings that fill all states up to its lower and to its upper edge. */
  fillingRange?: { lower: number; upper: number };
  /** Whether the mesh resolves the answer (see the module comment). */
  convergence: {
    converged: boolean;
    /** σ capacity and filling doping at E* from the interpolated DOS. */
    sigmaCapacity: number;
    fillingDoping: number;
    /** For a gap: whether it was checked off the mesh (a model was given). */
    gapChecked?: boolean;
  };
  /** Intervals of the σ spectrum empty on the mesh that a band crosses off the mesh (not gaps of the sheet). */
  meshGaps?: { lower: number; upper: number; crossing?: GapWitness }[];
  /** The electron-counting rule at the sheet's hole density. */
  countingRule: { holeDensity: number; estimated: boolean; doping: number };
}

/** Gaps between consecutive bands of a group whose σ count below lies in the window, widest first. */
function meshGapsInWindow(spectrum: MeshSpectrum, first: number, end: number, window: [number, number], minimum: number): { lower: number; upper: number }[] {
  const { count, bands, energies, sigmaWeight } = spectrum;
  const perState = 2 / (count * spectrum.atoms);
  const found: { lower: number; upper: number }[] = [];
  let sigmaBelow = 0;
  for (let b = first; b < end - 1; b++) {
    let top = -Infinity;
    let bottom = Infinity;
    for (let k = 0; k < count; k++) {
      top = Math.max(top, energies[k * bands + b]);
      bottom = Math.min(bottom, energies[k * bands + b + 1]);
      sigmaBelow += sigmaWeight[k * bands + b] * perState;
    }
    if (!(bottom - top >= minimum) || sigmaBelow < window[0] || sigmaBelow > window[1]) continue;
    found.push({ lower: top, upper: bottom });
  }
  return found.sort((p, q) => q.upper - q.lower - (p.upper - p.lower));
}

/** Energies at which the step-occupied σ count per atom reaches the window's bounds. */
function windowEnergies(spectrum: MeshSpectrum, window: [number, number]): [number, number] {
  const { energies, sigmaWeight } = spectrum;
  const order = Array.from(energies.keys()).sort((a, b) => energies[a] - energies[b]);
  const perState = 2 / (spectrum.count * spectrum.atoms);
  let sum = 0;
  let low = energies[order[0]];
  let high = energies[order[order.length - 1]];
  let lowFound = false;
  for (const i of order) {
    sum += sigmaWeight[i] * perState;
    if (!lowFound && sum >= window[0]) {
      low = energies[i];
      lowFound = true;
    }
    if (sum >= window[1]) {
      high = energies[i];
      break;
    }
  }
  return [low, high];
}

export function sigmaBonding(spectrum: MeshSpectrum, options: SigmaBondingOptions): SigmaBondingResult {
  const smearing = options.smearing ?? 0.1;
  const window = options.window ?? [1.5, 4.5];
  const [first, end] = spectrum.groups[0];
  const minimum = 4 * smearing;
  const meshGaps: { lower: number; upper: number; crossing?: GapWitness }[] = [];
  let gap: { lower: number; upper: number } | undefined;
  for (const candidate of meshGapsInWindow(spectrum, first, end, window, minimum)) {
    if (!options.model) {
      gap = candidate;
      break;
    }
    const verdict = checkGap(options.model, spectrum, candidate, { bands: 'sigma' });
    if (verdict.gap && verdict.gap.upper - verdict.gap.lower >= minimum) {
      gap = verdict.gap;
      break;
    }
    meshGaps.push(verdict.crossing ? { ...candidate, crossing: verdict.crossing } : { ...candidate });
  }
  const [low, high] = windowEnergies(spectrum, window);
  const top = (gap ? gap.upper : high) + 9 * smearing;
  const interpolated = interpolatedDos(spectrum, smearing, top);
  const index = (e: number) => Math.round((e - interpolated.start) / interpolated.step);
  let energy: number;
  if (gap) {
    energy = 0.5 * (gap.lower + gap.upper);
  } else {
    // Deepest minimum of the interpolated σ DOS on the window, on its grid.
    let best = index(low);
    let bestValue = Infinity;
    for (let i = Math.max(0, index(low)); i <= index(high) && i < interpolated.sigma.length; i++) {
      const value = broadenedAt(interpolated, i);
      if (value < bestValue) {
        bestValue = value;
        best = i;
      }
    }
    // A flat minimum (the interpolated bands leave a hole too, e.g. a band crossing whose apex lies off the
    // mesh): take the middle of the flat run rather than its first point.
    let first = best;
    let last = best;
    const flat = bestValue + PLATEAU;
    while (first > index(low) && broadenedAt(interpolated, first - 1) <= flat) first--;
    while (last < index(high) && last + 1 < interpolated.sigma.length && broadenedAt(interpolated, last + 1) <= flat) last++;
    energy = interpolated.start + Math.round(0.5 * (first + last)) * interpolated.step;
  }
  const sigmaDos = gaussianDos(spectrum, Float64Array.of(energy), smearing).sigma[0];
  const sigmaDosInterpolated = broadenedAt(interpolated, index(energy));
  const below = observablesAt(spectrum, energy, smearing);
  const counted = interpolatedCount(interpolated, energy);
  const fillingDoping = below.sigma + below.pi - 3;
  const converged = Math.abs(counted.sigma - below.sigma) <= CONVERGENCE_TOLERANCE
    && Math.abs(counted.total - 3 - fillingDoping) <= CONVERGENCE_TOLERANCE
    && (!gap || options.model !== undefined)
    && !meshGaps.some((g) => energy > g.lower && energy < g.upper);
  const result: SigmaBondingResult = {
    parameters: spectrum.parameters,
    mesh: spectrum.mesh,
    smearing,
    energy,
    kind: gap ? 'gap' : 'pseudogap',
    sigmaDos,
    sigmaDosInterpolated,
    sigmaCapacity: below.sigma,
    fillingDoping,
    convergence: {
      converged,
      sigmaCapacity: counted.sigma,
      fillingDoping: counted.total - 3,
      ...(gap ? { gapChecked: options.model !== undefined } : {}),
    },
    countingRule: {
      holeDensity: options.holeDensity,
      estimated: options.holeDensityEstimated ?? false,
      doping: countingRuleDoping(options.holeDensity),
    },
  };
  if (meshGaps.length > 0) result.meshGaps = meshGaps;
  if (gap) {
    result.gap = gap;
    const perState = 2 / (spectrum.count * spectrum.atoms);
    let toLower = 0;
    let toUpper = 0;
    for (const e of spectrum.energies) {
      if (e <= gap.lower) toLower++;
      if (e < gap.upper) toUpper++;
    }
    result.fillingRange = { lower: toLower * perState - 3, upper: toUpper * perState - 3 };
  }
  return result;
}
