/**
 * The STM worker: the STM panel's jobs (src/app/stmJobs.ts) off the page's thread. Holds nothing between jobs: the
 * page keeps the measured picture's analysis and sends it with each match, so a stop (which ends the worker) loses
 * nothing.
 */
import { analyseFile, demoPicture, rankCandidates, simulate, type AnalyseInput, type MatchInput, type SimulateInput } from '../stmJobs.ts';
import type { ParameterSet } from '../../tb/params.ts';
import { serveJobs } from './protocol.ts';

serveJobs(self as unknown as DedicatedWorkerGlobalScope, {
  simulate: (input: SimulateInput, progress) => {
    progress(0, 1, 'picture');
    return { value: simulate(input) };
  },
  analyse: (input: AnalyseInput) => ({ value: analyseFile(input) }),
  demo: (input: { params: ParameterSet }) => ({ value: demoPicture(input) }),
  match: (input: MatchInput, progress) => ({ value: rankCandidates(input, (examined) => progress(examined, 0, 'patterns examined')) }),
});
