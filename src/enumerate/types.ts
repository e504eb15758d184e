/**
 * Options and results of the vacancy-pattern enumerator.
 */
import type { Pattern } from '../lattice/sheet.ts';

/** Progress of a running enumeration, reported every few thousand labelings. */
export interface EnumerateProgress {
  /** Labelings tested so far (partial labelings of the search included). */
  examined: number;
  /** Structures found so far. */
  found: number;
  /** Estimated share of the work done, in [0, 1] (never decreases; 1 at the end). */
  fraction: number;
}

/**
 * What to enumerate. Options arrive validated (src/cli does it); the enumerator trusts them.
 * Limits: sites ≤ 64 is what the CLI accepts; tables take O(N²) memory per supercell and the run time grows
 * roughly like C(N, k)/(12N) structures per (N, k), so large N with many holes takes hours.
 */
export interface EnumerateOptions {
  /** Lattice sites per primitive cell N, inclusive range, 1 ≤ N1 ≤ N2. */
  sites: [number, number];
  /** Holes (vacancies) per primitive cell k, inclusive range, 0 ≤ K1 ≤ K2 (k > N is never reached). */
  holes: [number, number];
  /** Keep only patterns with no two vacancies nearest neighbours (a hole next to its own image counts). Default false. */
  isolated?: boolean;
  /** Hole density η = k/N, inclusive range (tolerance 1e-12). Default: all. */
  holeDensity?: [number, number];
  /** Largest elongation |v|/|u| of the Gauss-reduced primitive cell, ≥ 1. Default: no limit. */
  maxElongation?: number;
  /**
   * Do only the index-th of count parts (index 1-based). Work units (N, supercell, second hole site) are dealt
   * round-robin; each shard lists its structures in the global order (N, k, supercell, labeling), so the
   * shards' outputs concatenate to the full list as a multiset and sort back to it. Default: {1, 1}.
   */
  shard?: { index: number; count: number };
  /** Nearest-neighbour distance d in Å written into each structure's pattern (for its Cartesian cell). Default 1.69. */
  bond?: number;
  /** Called every few thousand labelings and once at the end with fraction 1. */
  onProgress?: (progress: EnumerateProgress) => void;
}

/** One structure: a vacancy pattern on its smallest cell, distinct from all others up to 6mm and translations. */
export interface Structure {
  /** Lattice sites N of the primitive cell. */
  sites: number;
  /** Vacancies k per primitive cell. */
  holes: number;
  /** Hole density η = k/N. */
  eta: number;
  /** The pattern on its primitive cell (HNF), vacancies the canonical labeling, reduced and ascending. */
  pattern: Pattern;
  /** Canonical form (see canonicalForm): equal for any two descriptions of the same structure. */
  canonical: string;
  /** Name of the sheet preset this structure is, if any (e.g. "alpha"). */
  phase?: string;
}

/** Number of structures with N sites and k holes. */
export interface CountRow {
  sites: number;
  holes: number;
  structures: number;
}
