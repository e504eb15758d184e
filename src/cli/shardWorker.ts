/**
 * Entry of a shard thread (threads.ts): bin/lacuna.mjs loads this instead of main.ts when its workerData carries
 * SHARD_KEY. It solves the items it is sent, one at a time, and posts each result back.
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { Pattern } from '../lattice/sheet.ts';
import { holeDensity } from '../lattice/pattern.ts';
import type { ParameterSet } from '../tb/params.ts';
import { rankingFill, type RankingOptions, type SolvedPattern } from '../tb/ranking.ts';
import type { ShardKind } from './threads.ts';

type Solver = (item: unknown) => unknown;

const solvers: Record<ShardKind, (context: unknown) => Solver> = {
  rank: (context) => {
    const { params, options } = context as { params: ParameterSet; options: Omit<RankingOptions, 'onProgress'> };
    return (item) => {
      const { name, pattern } = item as { name: string; pattern: Pattern };
      const solved: SolvedPattern = { name, eta: holeDensity(pattern), ...rankingFill(pattern, params, options) };
      return solved;
    };
  },
};

const { kind, context } = workerData as { kind: ShardKind; context: unknown };
const solve = solvers[kind](context);
parentPort!.on('message', ({ index, item }: { index: number; item: unknown }) => {
  try {
    parentPort!.postMessage({ index, result: solve(item) });
  } catch (error) {
    parentPort!.postMessage({ index, error: (error as Error).message });
  }
});
