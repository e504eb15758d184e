/**
 * The calibrate worker: the calibrate panel's jobs (src/app/calibrateJobs.ts) off the page's thread. Holds
 * nothing between jobs: the page keeps the reference bands and sends them with each fit.
 */
import { demoReference, fitReference, readReference, type FitInput } from '../calibrateJobs.ts';
import { serveJobs } from './protocol.ts';

serveJobs(self as unknown as DedicatedWorkerGlobalScope, {
  read: (input: { name: string; text: string }) => ({ value: readReference(input) }),
  demo: () => ({ value: demoReference() }),
  fit: (input: FitInput, progress) => ({ value: fitReference(input, (done, total) => progress(done, total, 'starts fitted')) }),
});
