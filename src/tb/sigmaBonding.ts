/**
 * σ-bonding analysis of a mesh spectrum: where the σ bonding states end, how many electrons they hold, and what
 * doping fills them — side by side with the electron-counting rule (src/tb/countingRule.ts).
 *
 * The search runs between σ bonding and antibonding states: over the energies at which the σ states below hold
 * between 1.5 and 4.5 electrons per atom (of the 6 that s, px, py can hold; a choice of ours that brackets the
 * rule's values for 0 ≤ η ≤ 1/3). There it takes
 * 1. a gap of the σ spectrum, if one exists: on planar sheets between consecutive σ bands (max of one below min of
 *    the next over the mesh), on buckled sheets between consecutive bands of the whole spectrum, at least 4σ wide
 *    (narrower ones are bands that touch between mesh points, or too narrow to matter at width σ); the widest
 *    wins, and E* is its midpoint;
 * 2. otherwise the deepest pseudogap: the minimum of the Gaussian σ-projected DOS on a grid of step σ/20.
 * At E*, with the same occupation ½·erfc((E − E*)/σ) as `fill` (so `fill` at the returned doping puts E_F at E*):
 * σ capacity = σ electrons per atom below E*; filling doping = all electrons (σ and π) per atom below E* − 3.
 * π states often lie inside a σ gap, so for a gap the dopings that fill every state up to its lower and upper edge
 * (step occupation) are given too: any doping between them fills the σ bonding states and no σ antibonding state.
 */
import { countingRuleDoping } from './countingRule.ts';
import { gaussianDos } from './dos.ts';
import { observablesAt } from './fill.ts';
import type { MeshSpectrum } from './meshSpectrum.ts';

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
  /** σ-projected Gaussian DOS at E* (states per eV per atom, both spins). */
  sigmaDos: number;
  /** σ electrons per atom held by the states below E*. */
  sigmaCapacity: number;
  /** Doping δ that fills every state (σ and π) below E*: electrons per atom below E* minus 3. */
  fillingDoping: number;
  /** For a gap: dopings that fill all states up to its lower and to its upper edge. */
  fillingRange?: { lower: number; upper: number };
  /** The electron-counting rule at the sheet's hole density. */
  countingRule: { holeDensity: number; estimated: boolean; doping: number };
}

/** Widest gap between consecutive bands of a group whose σ count below lies in the window. */
function widestGap(spectrum: MeshSpectrum, first: number, end: number, window: [number, number], minimum: number): { lower: number; upper: number } | undefined {
  const { count, bands, energies, sigmaWeight } = spectrum;
  const perState = 2 / (count * spectrum.atoms);
  let best: { lower: number; upper: number } | undefined;
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
    if (!best || bottom - top > best.upper - best.lower) best = { lower: top, upper: bottom };
  }
  return best;
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
  const gap = widestGap(spectrum, first, end, window, 4 * smearing);
  let energy: number;
  let sigmaDos: number;
  if (gap) {
    energy = 0.5 * (gap.lower + gap.upper);
    sigmaDos = gaussianDos(spectrum, Float64Array.of(energy), smearing).sigma[0];
  } else {
    const [low, high] = windowEnergies(spectrum, window);
    const step = smearing / 20;
    const points = Math.max(2, Math.ceil((high - low) / step) + 1);
    const grid = new Float64Array(points);
    for (let i = 0; i < points; i++) grid[i] = low + i * step;
    const dos = gaussianDos(spectrum, grid, smearing);
    let best = 0;
    for (let i = 1; i < points; i++) if (dos.sigma[i] < dos.sigma[best]) best = i;
    energy = grid[best];
    sigmaDos = dos.sigma[best];
  }
  const below = observablesAt(spectrum, energy, smearing);
  const result: SigmaBondingResult = {
    parameters: spectrum.parameters,
    mesh: spectrum.mesh,
    smearing,
    energy,
    kind: gap ? 'gap' : 'pseudogap',
    sigmaDos,
    sigmaCapacity: below.sigma,
    fillingDoping: below.sigma + below.pi - 3,
    countingRule: {
      holeDensity: options.holeDensity,
      estimated: options.holeDensityEstimated ?? false,
      doping: countingRuleDoping(options.holeDensity),
    },
  };
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
