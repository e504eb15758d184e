/**
 * The work of one enumeration: the (N, k) pairs wanted, the supercells per N, and the shard's share.
 *
 * Work units are (N, supercell, c) with c the second hole site of the labelings (c = 0: the labelings with at
 * most one hole), numbered in order of N, supercell, c — skipping units that are empty by construction — and
 * dealt round-robin: unit u belongs to shard (u mod count) + 1. Small c carry the largest subtrees, so dealing
 * them out one by one balances the shards.
 */
import { siteIndex, type Hnf } from '../lattice/hnf.ts';
import { elongation } from '../lattice/reduce.ts';
import { latticePoint, NEAREST_STEPS } from '../lattice/triangular.ts';
import { inequivalentSupercells, stabiliser } from './supercells.ts';
import type { EnumerateOptions } from './types.ts';

const DENSITY_TOLERANCE = 1e-12;
const ELONGATION_TOLERANCE = 1e-9;

/** One supercell's share of the work. */
export interface SupercellWork {
  readonly supercell: Hnf;
  /** Size of its stabiliser in 6mm. */
  readonly operationCount: number;
  /** False when isolated holes are asked for and a nearest-neighbour step is a supercell vector. */
  readonly holesPossible: boolean;
  /** branch[c] = 1 when unit (N, supercell, c) belongs to this shard. */
  readonly branch: Uint8Array;
}

/** The work at one site count N. */
export interface SitesWork {
  readonly sites: number;
  /** wanted[k] = 1 for the hole counts k = 0…N asked for. */
  readonly wanted: Uint8Array;
  /** Largest wanted k (−1 when none). */
  readonly maxHoles: number;
  readonly supercells: readonly SupercellWork[];
}

/** Options with defaults filled in. */
export interface Settings {
  readonly sites: readonly [number, number];
  readonly holes: readonly [number, number];
  readonly isolated: boolean;
  readonly holeDensity: readonly [number, number];
  readonly maxElongation: number;
  readonly shard: { readonly index: number; readonly count: number };
  readonly bond: number;
  readonly onProgress: EnumerateOptions['onProgress'];
}

export function settingsOf(options: EnumerateOptions): Settings {
  return {
    sites: options.sites,
    holes: options.holes,
    isolated: options.isolated ?? false,
    holeDensity: options.holeDensity ?? [0, 1],
    maxElongation: options.maxElongation ?? Infinity,
    shard: options.shard ?? { index: 1, count: 1 },
    bond: options.bond ?? 1.69,
    onProgress: options.onProgress,
  };
}

/** The hole counts k = 0…n wanted at n sites (in the holes range, at most n, density in range). */
export function wantedHoles(settings: Settings, n: number): Uint8Array {
  const wanted = new Uint8Array(n + 1);
  const [k1, k2] = settings.holes;
  const [eta1, eta2] = settings.holeDensity;
  for (let k = k1; k <= Math.min(k2, n); k++) {
    const eta = k / n;
    if (eta >= eta1 - DENSITY_TOLERANCE && eta <= eta2 + DENSITY_TOLERANCE) wanted[k] = 1;
  }
  return wanted;
}

export function planWork(settings: Settings): SitesWork[] {
  const plan: SitesWork[] = [];
  let unit = 0;
  const { index, count } = settings.shard;
  for (let n = settings.sites[0]; n <= settings.sites[1]; n++) {
    const wanted = wantedHoles(settings, n);
    const maxHoles = wanted.lastIndexOf(1);
    if (maxHoles < 0) continue;
    const supercells: SupercellWork[] = [];
    for (const h of inequivalentSupercells(n)) {
      const ratio = elongation(latticePoint(h.a, 0, 1), latticePoint(h.b, h.c, 1));
      if (ratio > settings.maxElongation * (1 + ELONGATION_TOLERANCE)) continue;
      const steps = NEAREST_STEPS.map(([i, j]) => siteIndex(h, i, j));
      const holesPossible = !(settings.isolated && steps.includes(0));
      const branch = new Uint8Array(n);
      for (let c = 0; c < n; c++) {
        const exists = c === 0 || (maxHoles >= 2 && holesPossible && !(settings.isolated && steps.includes(c)));
        if (!exists) continue;
        if (unit % count === index - 1) branch[c] = 1;
        unit++;
      }
      supercells.push({ supercell: h, operationCount: stabiliser(h).length, holesPossible, branch });
    }
    plan.push({ sites: n, wanted, maxHoles, supercells });
  }
  return plan;
}

function binomial(m: number, r: number): number {
  if (r < 0 || r > m) return 0;
  let value = 1;
  for (let t = 1; t <= r; t++) value = (value * (m - r + t)) / t;
  return value;
}

/**
 * Progress weights of one search: prefix[c] = Σ over branches c' < c of this shard of the estimated labelings
 * with k ∈ ks holes, C(n − 1 − c', k − 2)/|stabiliser| (the lists holes[1] = c' before symmetry), plus 1 for the
 * one-hole branch; prefix[n] is the search's whole weight.
 */
export function branchWeights(n: number, work: SupercellWork, ks: readonly number[]): Float64Array {
  const prefix = new Float64Array(n + 1);
  for (let c = 0; c < n; c++) {
    let weight = 0;
    if (work.branch[c] === 1) {
      for (const k of ks) {
        if (c === 0) weight += k <= 1 ? 1 : 0;
        else weight += binomial(n - 1 - c, k - 2) / work.operationCount;
      }
    }
    prefix[c + 1] = prefix[c] + weight;
  }
  return prefix;
}

/** Hole counts k ≥ 1 wanted at one N. */
export function wantedList(work: SitesWork): number[] {
  const ks: number[] = [];
  for (let k = 1; k <= work.maxHoles; k++) if (work.wanted[k] === 1) ks.push(k);
  return ks;
}

/** Total progress weight of a plan (the same for listing and counting). */
export function planWeight(plan: readonly SitesWork[]): number {
  let total = 0;
  for (const work of plan) {
    if (work.sites === 1 && work.wanted[0] === 1 && work.supercells[0]?.branch[0] === 1) total += 1;
    const ks = wantedList(work);
    if (ks.length === 0) continue;
    for (const cell of work.supercells) if (cell.holesPossible) total += branchWeights(work.sites, cell, ks)[work.sites];
  }
  return total;
}
