/**
 * Benchmark of the vacancy-pattern enumerator: wall time, labelings examined per second, structures found and
 * memory (peak RSS of the process, and the largest heap growth seen during the run — flat when nothing is kept).
 * Targets: isolated holes, N ≤ 30, k ≤ 6, counts only, ≤ 10 s on a 2-core machine; stretch N ≤ 36, k ≤ 8.
 * Run: `npx tsx bench/enumerate.ts`.
 */
import { pathToFileURL } from 'node:url';
import { countStructures, enumerateStructures, type EnumerateOptions } from '../src/enumerate/index.ts';

interface Case {
  title: string;
  options: EnumerateOptions;
  /** List the structures through the generator (dropping each) instead of counting only. */
  listing: boolean;
}

const CASES: Case[] = [
  { title: 'isolated, N 1–30, k 0–6, counts only (target ≤ 10 s)', options: { sites: [1, 30], holes: [0, 6], isolated: true }, listing: false },
  { title: 'isolated, N 1–30, k 0–6, streamed structures', options: { sites: [1, 30], holes: [0, 6], isolated: true }, listing: true },
  { title: 'isolated, N 1–36, k 0–8, counts only (stretch)', options: { sites: [1, 36], holes: [0, 8], isolated: true }, listing: false },
  { title: 'isolated, N 1–42, k 0–9, counts only (memory stays flat as the count grows)', options: { sites: [1, 42], holes: [0, 9], isolated: true }, listing: false },
  { title: 'unconstrained, N 1–30, k 0–6, counts only', options: { sites: [1, 30], holes: [0, 6] }, listing: false },
];

const mib = (bytes: number) => `${(bytes / 2 ** 20).toFixed(1)} MiB`;

function runCase({ title, options, listing }: Case): void {
  const heapBefore = process.memoryUsage().heapUsed;
  let heapPeak = heapBefore;
  let examined = 0;
  const onProgress = (p: { examined: number }) => {
    examined = p.examined;
    const heap = process.memoryUsage().heapUsed;
    if (heap > heapPeak) heapPeak = heap;
  };
  const started = performance.now();
  let found = 0;
  if (listing) {
    for (const _ of enumerateStructures({ ...options, onProgress })) found++;
  } else {
    for (const row of countStructures({ ...options, onProgress })) found += row.structures;
  }
  const seconds = (performance.now() - started) / 1000;
  console.log(`${title}`);
  console.log(`  wall time: ${seconds.toFixed(2)} s`);
  console.log(`  labelings examined: ${examined} (${(examined / seconds / 1e6).toFixed(2)} M/s)`);
  console.log(`  structures found: ${found}`);
  console.log(`  heap growth during run (peak − start): ${mib(heapPeak - heapBefore)}`);
  console.log(`  peak RSS of the process so far: ${mib(process.resourceUsage().maxRSS * 1024)}`);
}

export async function benchEnumerate(): Promise<void> {
  for (const c of CASES) runCase(c);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) await benchEnumerate();
