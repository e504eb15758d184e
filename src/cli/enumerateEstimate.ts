/**
 * What an enumeration will cost before it runs: structures, seconds and bytes of output, to the order of
 * magnitude. Used to announce long runs and to refuse listings that would fill a disk.
 */
import { countRowKeys, type EnumerateOptions } from '../enumerate/index.ts';

/** How the structures leave the program. */
export type EnumerateOutput = 'counts' | 'json' | 'text';

export interface EnumerateEstimate {
  /** Expected structures (a lower estimate: the leading term of Burnside's count). */
  structures: number;
  seconds: number;
  /** Bytes on stdout (0 when only counting). */
  bytes: number;
}

/**
 * Measured on a 2-core machine (enumerate --sites 1-16 and 1-24, rounded): counting about 2e5 structures per
 * second, listing about 3e4 (building atoms, cell and canonical form of each). JSON costs about 150 + 20·N bytes
 * per structure of N sites (the atoms dominate), the text line about 100 + 5·k for k holes.
 */
const COUNTED_PER_SECOND = 2e5;
const LISTED_PER_SECOND = 3e4;

/**
 * Expected number of structures of N sites and k holes: σ(N)·C(N, k)/(12N) — the σ(N) supercells of index N, each
 * with C(N, k) labelings, up to the 12 operations and N translations (the leading term of Burnside's count) —
 * times the chance exp(−3k²/N) that k random holes have no nearest-neighbour pair (3N bonds, each joining two
 * holes with probability (k/N)²) when isolated. An order of magnitude only, and low for small N.
 */
export function expectedAt(n: number, k: number, isolated: boolean): number {
  let divisorSum = 0;
  for (let d = 1; d <= n; d++) if (n % d === 0) divisorSum += d;
  let binomial = 1;
  for (let j = 1; j <= k; j++) binomial = (binomial * (n - j + 1)) / j;
  return ((divisorSum * binomial) / (12 * n)) * (isolated ? Math.exp((-3 * k * k) / n) : 1);
}

/** The estimate of a run with these options (the η range and the shard taken into account). */
export function estimateEnumerate(options: EnumerateOptions, output: EnumerateOutput): EnumerateEstimate {
  let structures = 0;
  let bytes = 0;
  for (const { sites, holes } of countRowKeys({ ...options, shard: undefined })) {
    const expected = expectedAt(sites, holes, options.isolated === true);
    structures += expected;
    if (output === 'json') bytes += expected * (150 + 20 * sites);
    else if (output === 'text') bytes += expected * (100 + 5 * holes);
  }
  const share = options.shard ? 1 / options.shard.count : 1;
  structures *= share;
  bytes *= share;
  return { structures, bytes, seconds: structures / (output === 'counts' ? COUNTED_PER_SECOND : LISTED_PER_SECOND) };
}
