/**
 * The Fermi level of a mesh spectrum for a given number of electrons per atom, with the Gaussian occupation
 * f(E) = ½·erfc((E − E_F)/σ) and two electrons per state (DESIGN.md, `fill` contract).
 *
 * The count per atom is N(E_F) = (2 / (M²·atoms))·Σ_{k,b} f(E_kb). It is continuous and strictly increasing for
 * σ > 0, so a bracketed Newton iteration (bisection whenever a Newton step leaves the bracket) finds the root;
 * dN/dE_F is the Gaussian DOS. States farther than 7σ from E_F count as exactly 0 or 1 (erfc(7) ≈ 4e-23).
 * When the count fills whole states with an empty interval (lower, upper) above them — a gap on the mesh — and
 * the count at mid-gap already matches to 1e-10 (the gap is wide against σ), E_F is put mid-gap and the gap
 * is reported.
 */
import { erfc } from './erfc.ts';
import type { MeshSpectrum } from './meshSpectrum.ts';

/** Half-width (in σ) beyond which the occupation is taken as exactly 0 or 1. */
export const OCCUPATION_RANGE = 7;
/** Required agreement of the count at E_F with the requested count (electrons per atom). */
export const COUNT_TOLERANCE = 1e-10;
const ONE_OVER_SQRT_PI = 1 / Math.sqrt(Math.PI);
/** States closer than this (eV) are one degenerate level split by rounding, never a gap. */
const SMALLEST_GAP = 1e-9;

/** A Fermi level and what it was found in. */
export interface FermiLevel {
  /** E_F (eV). */
  fermi: number;
  /** Electrons per atom counted at E_F. */
  electronsPerAtom: number;
  /** Set when the count falls in a gap of the mesh spectrum: E_F is its midpoint. */
  inGap?: { lower: number; upper: number };
}

/** Occupation ½·erfc(x) with x = (E − E_F)/σ, exactly 0 or 1 beyond ±OCCUPATION_RANGE. */
export function occupation(x: number): number {
  if (x > OCCUPATION_RANGE) return 0;
  if (x < -OCCUPATION_RANGE) return 1;
  return 0.5 * erfc(x);
}

/** First index i with sorted[i] ≥ value (sorted ascending). */
function lowerBound(sorted: Float64Array, value: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid] < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Solves for Fermi levels of one spectrum; the sorted copy of its energies is made once, here. */
export class FermiSolver {
  private readonly sorted: Float64Array;
  /** Electrons per atom carried by one fully occupied state: 2 / (M²·atoms). */
  readonly perState: number;

  constructor(spectrum: MeshSpectrum) {
    this.sorted = Float64Array.from(spectrum.energies).sort();
    this.perState = 2 / (spectrum.count * spectrum.atoms);
  }

  /** Electrons per atom at E_F for width σ, and dN/dE_F (electrons per atom per eV). */
  countAt(fermi: number, smearing: number): { count: number; slope: number } {
    const sorted = this.sorted;
    const first = lowerBound(sorted, fermi - OCCUPATION_RANGE * smearing);
    const end = lowerBound(sorted, fermi + OCCUPATION_RANGE * smearing);
    let states = first;
    let slope = 0;
    for (let i = first; i < end; i++) {
      const x = (sorted[i] - fermi) / smearing;
      states += 0.5 * erfc(x);
      slope += Math.exp(-x * x);
    }
    return { count: states * this.perState, slope: (slope * this.perState * ONE_OVER_SQRT_PI) / smearing };
  }

  /** E_F for `electrons` per atom (0 < electrons < 8) and width σ > 0 (eV). */
  solve(electrons: number, smearing: number): FermiLevel {
    const sorted = this.sorted;
    const states = electrons / this.perState;
    const filled = Math.round(states);
    if (Math.abs(states - filled) <= 1e-9 * Math.max(1, states) && filled > 0 && filled < sorted.length) {
      const lower = sorted[filled - 1];
      const upper = sorted[filled];
      if (upper - lower > SMALLEST_GAP) {
        const middle = 0.5 * (lower + upper);
        const count = this.countAt(middle, smearing).count;
        if (Math.abs(count - electrons) <= COUNT_TOLERANCE) {
          return { fermi: middle, electronsPerAtom: count, inGap: { lower, upper } };
        }
      }
    }
    let lo = sorted[0] - (OCCUPATION_RANGE + 1) * smearing;
    let hi = sorted[sorted.length - 1] + (OCCUPATION_RANGE + 1) * smearing;
    // Start where a step occupation would put E_F.
    let fermi = sorted[Math.min(sorted.length - 1, Math.max(0, Math.floor(states)))];
    let best = fermi;
    let bestError = Infinity;
    for (let iteration = 0; iteration < 400; iteration++) {
      const { count, slope } = this.countAt(fermi, smearing);
      const error = count - electrons;
      if (Math.abs(error) < bestError) {
        bestError = Math.abs(error);
        best = fermi;
      }
      if (Math.abs(error) <= 1e-3 * COUNT_TOLERANCE) break;
      if (error > 0) hi = fermi;
      else lo = fermi;
      let next = slope > 0 ? fermi - error / slope : NaN;
      if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
      if (next === fermi || next <= lo || next >= hi) break;
      fermi = next;
    }
    return { fermi: best, electronsPerAtom: this.countAt(best, smearing).count };
  }
}

/** E_F as a function of doping δ (electrons per atom beyond 3) for one spectrum and width σ (eV). */
export function fermiVersusDoping(spectrum: MeshSpectrum, dopings: ArrayLike<number>, smearing: number): Float64Array {
  const solver = new FermiSolver(spectrum);
  const out = new Float64Array(dopings.length);
  for (let i = 0; i < dopings.length; i++) out[i] = solver.solve(3 + dopings[i], smearing).fermi;
  return out;
}
