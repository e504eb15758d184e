/** Best wall time (ms) of `runs` calls after one warm-up call: the benchmarks' one timing rule. */
export function best(runs: number, task: () => unknown): number {
  task();
  let fastest = Infinity;
  for (let r = 0; r < runs; r++) {
    const start = performance.now();
    task();
    fastest = Math.min(fastest, performance.now() - start);
  }
  return fastest;
}
