/**
 * Work spread over worker threads, for the commands whose work is many independent solves (`rank`).
 * Each thread runs bin/lacuna.mjs, which sees its workerData and loads the shard entry (shardWorker.ts) instead of
 * the command line — so threads run the bundle or the sources exactly as the main thread does. Items are handed
 * out one at a time to whichever thread is free: solves differ in cost by orders of magnitude, and a fixed split
 * would leave threads idle.
 */
import { availableParallelism } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';

/** The workerData key that tells bin/lacuna.mjs to load the shard entry. */
export const SHARD_KEY = 'lacunaShard';

/** The kinds of work a shard thread can do (shardWorker.ts), each with the context every item shares. */
export type ShardKind = 'rank';

/** Below this estimate a job runs in the calling thread: starting a thread costs about 0.1–1 s. */
export const THREADS_FROM_SECONDS = 2;

/** Threads to use: the flag's value, else all cores when the job is long enough to pay for them, else 1. */
export function threadCount(flag: number | undefined, estimatedSeconds: number, items: number): number {
  if (flag !== undefined) return Math.max(1, Math.min(flag, items));
  if (estimatedSeconds < THREADS_FROM_SECONDS) return 1;
  return Math.max(1, Math.min(availableParallelism(), items));
}

/** bin/lacuna.mjs, two folders up from this file in the sources (src/cli) and in the bundle (dist/cli) alike. */
function launcher(): string {
  return join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'bin', 'lacuna.mjs');
}

/**
 * Maps `items` through the shard kind's solver on `threads` worker threads; results in the order of `items`.
 * `onDone(done, total)` after each item. A failing item rejects the whole job and stops every thread.
 */
export function mapInThreads<Item, Result>(
  kind: ShardKind, context: unknown, items: readonly Item[], threads: number,
  onDone?: (done: number, total: number) => void,
): Promise<Result[]> {
  const results = new Array<Result>(items.length);
  let next = 0;
  let done = 0;
  const workers: Worker[] = [];
  return new Promise<Result[]>((resolve, reject) => {
    let failed = false;
    const stopAll = () => {
      for (const w of workers) void w.terminate();
    };
    const fail = (error: Error) => {
      if (failed) return;
      failed = true;
      stopAll();
      reject(error);
    };
    const handOut = (worker: Worker) => {
      if (next < items.length) {
        worker.postMessage({ index: next, item: items[next] });
        next++;
      }
    };
    for (let t = 0; t < threads; t++) {
      const worker = new Worker(launcher(), { workerData: { [SHARD_KEY]: true, kind, context } });
      workers.push(worker);
      worker.on('message', (message: { index: number; result?: Result; error?: string }) => {
        if (message.error !== undefined) return fail(new Error(`thread: ${message.error}`));
        results[message.index] = message.result as Result;
        done++;
        onDone?.(done, items.length);
        if (done === items.length) {
          stopAll();
          resolve(results);
        } else {
          handOut(worker);
        }
      });
      worker.on('error', fail);
      worker.on('exit', (code) => {
        if (code !== 0 && done < items.length) fail(new Error(`thread stopped with status ${code}`));
      });
      handOut(worker);
    }
  });
}
