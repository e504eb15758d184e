/**
 * The search worker: enumeration of candidates and their band-energy ranking, off the page's thread.
 */
import type { Pattern } from '../../lattice/sheet.ts';
import type { ParameterSet } from '../../tb/params.ts';
import { rankingFill } from '../../tb/ranking.ts';
import { findCandidates } from '../candidates.ts';
import type { SearchState } from '../state.ts';
import { serveJobs } from './protocol.ts';

export interface RankInput {
  patterns: Pattern[];
  params: ParameterSet;
  doping: number;
  smearing: number;
}

serveJobs(self as unknown as DedicatedWorkerGlobalScope, {
  candidates: (input: { search: SearchState; bond: number }, progress) => ({
    value: findCandidates(input.search, input.bond, (fraction) => progress(Math.round(1000 * fraction), 1000, 'labelings')),
  }),
  /** Band energies per atom as `lacuna rank` computes them: reduced cells, one k-point density for all. */
  rank: (input: RankInput, progress) => {
    const results = input.patterns.map((pattern, index) => {
      const result = rankingFill(pattern, input.params, { doping: input.doping, smearing: input.smearing });
      progress(index + 1, input.patterns.length, 'patterns');
      return { bandEnergy: result.bandEnergyPerAtom, fermi: result.fermi, mesh: result.mesh };
    });
    return { value: results };
  },
});
