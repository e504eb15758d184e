/**
 * The expansion worker: the Energies panel's fit and predictions (src/app/expansionJob.ts) off the page's thread.
 * Holds nothing between jobs: the page keeps the energies file's text and sends it with each fit.
 */
import { runExpansion, type ExpansionInput } from '../expansionJob.ts';
import { serveJobs } from './protocol.ts';

serveJobs(self as unknown as DedicatedWorkerGlobalScope, {
  expand: (input: ExpansionInput, progress) => ({ value: runExpansion(input, (fraction, done) => progress(Math.round(1000 * fraction), 1000, `${done} patterns`)) }),
});
