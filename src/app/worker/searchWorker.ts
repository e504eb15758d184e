/**
 * The search worker: enumeration of candidates and their band-energy ranking, off the page's thread.
 */
import { patternToSheet } from '../../lattice/pattern.ts';
import type { Pattern } from '../../lattice/sheet.ts';
import { fill } from '../../tb/fill.ts';
import { TightBindingModel } from '../../tb/model.ts';
import type { ParameterSet } from '../../tb/params.ts';
import { findCandidates } from '../candidates.ts';
import type { SearchState } from '../state.ts';
import { rankingMesh } from '../meshChoice.ts';
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
  rank: (input: RankInput, progress) => {
    const results: { bandEnergy: number; fermi: number; mesh: number }[] = [];
    input.patterns.forEach((pattern, index) => {
      const sheet = patternToSheet(pattern);
      const mesh = rankingMesh(sheet.cell);
      const result = fill(new TightBindingModel(sheet, input.params), { mesh, doping: input.doping, smearing: input.smearing });
      results.push({ bandEnergy: result.bandEnergyPerAtom, fermi: result.fermi, mesh });
      progress(index + 1, input.patterns.length, 'patterns');
    });
    return { value: results };
  },
});
