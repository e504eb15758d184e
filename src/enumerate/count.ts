/**
 * Counts of structures per (N, k) without listing them: one search per supercell over all wanted hole counts,
 * memory flat (one supercell's tables at a time).
 */
import { ProgressMeter } from './meter.ts';
import { branchWeights, planWeight, planWork, settingsOf, wantedList } from './plan.ts';
import { buildQuotient } from './quotient.ts';
import { LabelingSearch } from './search.ts';
import type { CountRow, EnumerateOptions } from './types.ts';

/**
 * One row per (N, k) with N1 ≤ N ≤ N2 and K1 ≤ k ≤ min(K2, N), ordered by N then k, zeros included (also for
 * k outside the hole-density range). With a shard, the shard's counts; the shards' rows add up to the whole.
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
    for (let k = settings.holes[0]; k <= Math.min(settings.holes[1], n); k++) {
      rows.push({ sites: n, holes: k, structures: counts[k] });
    }
  }
  meter.end();
  return rows;
}
