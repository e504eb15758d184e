/**
 * Streaming enumeration of vacancy patterns: each structure once up to 6mm and translations, at its smallest
 * cell (derivative structures after Hart & Forcade, Phys. Rev. B 77, 224115 (2008), at fixed hole count after
 * Hart, Nelson & Forcade, Comput. Mater. Sci. 59, 101 (2012)).
 */
import { ProgressMeter } from './meter.ts';
import { branchWeights, planWeight, planWork, settingsOf, wantedList } from './plan.ts';
import { buildQuotient, type SupercellQuotient } from './quotient.ts';
import { LabelingSearch } from './search.ts';
import { makeStructure } from './structure.ts';
import type { EnumerateOptions, Structure } from './types.ts';

/**
 * Every structure with N1…N2 sites and K1…K2 holes per primitive cell passing the constraints, one at a time,
 * ordered by N, then k, then supercell (`inequivalentSupercells` order), then labeling (ascending hole sites,
 * lexicographic). With a shard, the same order restricted to the shard's units (see EnumerateOptions.shard).
 * Memory: the tables of the supercells of one N at a time; nothing is kept of the structures yielded.
 */
export function* enumerateStructures(options: EnumerateOptions): Generator<Structure> {
  const settings = settingsOf(options);
  const plan = planWork(settings);
  const meter = new ProgressMeter(settings.onProgress, planWeight(plan));
  for (const work of plan) {
    const n = work.sites;
    const quotients: (SupercellQuotient | undefined)[] = [];
    if (n === 1 && work.wanted[0] === 1 && work.supercells[0]?.branch[0] === 1) {
      meter.found++;
      meter.complete(meter.examined, 1);
      yield makeStructure(work.supercells[0].supercell, [], 0, settings.bond);
    }
    for (const k of wantedList(work)) {
      const wanted = new Uint8Array(k + 1);
      wanted[k] = 1;
      for (let s = 0; s < work.supercells.length; s++) {
        const cell = work.supercells[s];
        if (!cell.holesPossible) continue;
        const prefix = branchWeights(n, cell, [k]);
        if (prefix[n] === 0) continue; // no branch of this shard can hold k holes
        const quotient = (quotients[s] ??= buildQuotient(cell.supercell));
        const search: LabelingSearch = new LabelingSearch(quotient, {
          maxHoles: k,
          wanted,
          isolated: settings.isolated,
          branch: cell.branch,
          examinedBefore: meter.examined,
          onTick: () => meter.report(search.examined, prefix[search.branchSite]),
        });
        while (search.next()) {
          meter.found++;
          yield makeStructure(cell.supercell, search.holes, search.size, settings.bond);
        }
        meter.complete(search.examined, prefix[n]);
      }
    }
  }
  meter.end();
}
