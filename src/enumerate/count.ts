/**
 * Counts of structures per (N, k) without listing them: one search per supercell over all wanted hole counts,
 * memory flat (one supercell's tables at a time).
 */
import { ProgressMeter } from './meter.ts';
import { branchWeights, planWeight, planWork, settingsOf, wantedHoles, wantedList } from './plan.ts';
import { buildQuotient } from './quotient.ts';
import { LabelingSearch } from './search.ts';
import type { CountRow, EnumerateOptions } from './types.ts';

/**
 * The (N, k) rows a count reports: N1 ≤ N ≤ N2, K1 ≤ k ≤ min(K2, N) and, with a hole-density range, k/N inside
 * it; ordered by N then k. Listing and counting drivers (and the CLI) tally into these same rows.
 */
export function countRowKeys(options: EnumerateOptions): { sites: number; holes: number }[] {
  const settings = settingsOf(options);
  const keys: { sites: number; holes: number }[] = [];
  for (let n = settings.sites[0]; n <= settings.sites[1]; n++) {
    const wanted = wantedHoles(settings, n);
    for (let k = 0; k <= n; k++) if (wanted[k]) keys.push({ sites: n, holes: k });
  }
  return keys;
}

/**
 * One row per key of countRowKeys, zeros included. With a shard, the shard's counts; the shards' rows add up to
 * the whole.
 */
export function countStructures(options: EnumerateOptions): CountRow[] {
  const settings = settingsOf(options);
  const plan = planWork(settings);
  const meter = new ProgressMeter(settings.onProgress, planWeight(plan));
  const rows: CountRow[] = [];
  let next = 0;
  for (let n = settings.sites[0]; n <= settings.sites[1]; n++) {
    const counts = new Float64Array(n + 1);
    const work = plan[next]?.sites === n ? plan[next++] : undefined;
    if (work) {
      if (n === 1 && work.wanted[0] === 1 && work.supercells[0]?.branch[0] === 1) {
        counts[0] = 1;
        meter.found++;
        meter.complete(meter.examined, 1);
      }
      const ks = wantedList(work);
      for (const cell of ks.length > 0 ? work.supercells : []) {
        if (!cell.holesPossible) continue;
        const prefix = branchWeights(n, cell, ks);
        if (prefix[n] === 0) continue;
        const search: LabelingSearch = new LabelingSearch(buildQuotient(cell.supercell), {
          maxHoles: work.maxHoles,
          wanted: work.wanted,
          isolated: settings.isolated,
          branch: cell.branch,
          examinedBefore: meter.examined,
          onTick: () => meter.report(search.examined, prefix[search.branchSite]),
        });
        while (search.next()) {
          counts[search.size]++;
          meter.found++;
        }
        meter.complete(search.examined, prefix[n]);
      }
    }
    const wanted = wantedHoles(settings, n);
    for (let k = 0; k <= n; k++) if (wanted[k]) rows.push({ sites: n, holes: k, structures: counts[k] });
  }
  meter.end();
  return rows;
}
