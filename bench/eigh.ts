/**
 * Benchmark of the Hermitian eigensolver (one thread): µs per matrix for n = 24, 64, 128, eigenvalues only and
 * with eigenvectors, and, when python3 with numpy is present, the ratios to numpy.linalg.eigvalsh and
 * numpy.linalg.eigh on random complex Hermitian matrices of the same sizes, timed the same way (best of several
 * batches, single-threaded BLAS). Run: `npx tsx bench/eigh.ts`.
 */
import { spawnSync } from 'node:child_process';
import { pathToFileURL } from 'node:url';
import { timeEigensystem, timeEigenvalues } from '../src/linalg/eighBench.ts';

const SIZES = [24, 64, 128];
/** Project targets (issue 9) for the ratio ours/numpy by size: eigenvalues only, and with eigenvectors. */
const EIGENVALUE_TARGETS: Record<number, number> = { 24: 1.5, 64: 2.5, 128: 1.5 };
const EIGENSYSTEM_TARGETS: Record<number, number> = { 24: 1.5, 64: 1.5, 128: 1.5 };

// Best-of-batches seconds per numpy.linalg.eigvalsh and numpy.linalg.eigh call, printed as one JSON object
// {"eigvalsh": {n: seconds}, "eigh": {n: seconds}}.
const NUMPY_TIMER = `
import json, sys, time
import numpy as np
rng = np.random.default_rng(1)
result = {"eigvalsh": {}, "eigh": {}}
for n in [int(s) for s in sys.argv[1:]]:
    mats = []
    for _ in range(8):
        a = rng.uniform(-1, 1, (n, n)) + 1j * rng.uniform(-1, 1, (n, n))
        mats.append((a + a.conj().T) / 2)
    for name, solve in (("eigvalsh", np.linalg.eigvalsh), ("eigh", np.linalg.eigh)):
        count = 1
        while True:
            t = time.perf_counter()
            for i in range(count):
                solve(mats[i % 8])
            if time.perf_counter() - t > 0.02:
                break
            count *= 2
        best = float("inf")
        for _ in range(25):
            t = time.perf_counter()
            for i in range(count):
                solve(mats[i % 8])
            best = min(best, (time.perf_counter() - t) / count)
        result[name][str(n)] = best
print(json.dumps(result))
`;

/** numpy's seconds per matrix by routine and size, or null when python3/numpy is missing. */
function timeNumpy(sizes: number[]): Record<'eigvalsh' | 'eigh', Record<string, number>> | null {
  const env: NodeJS.ProcessEnv = {
    ...process.env, OMP_NUM_THREADS: '1', OPENBLAS_NUM_THREADS: '1', MKL_NUM_THREADS: '1',
  };
  // Set on this machine and slow OpenBLAS down; removed for this subprocess only.
  delete env.OPENBLAS_CORETYPE;
  delete env.OPENBLAS_L2_SIZE;
  const run = spawnSync('python3', ['-c', NUMPY_TIMER, ...sizes.map(String)], { env, encoding: 'utf8' });
  if (run.status !== 0 || !run.stdout) return null;
  try {
    return JSON.parse(run.stdout) as Record<'eigvalsh' | 'eigh', Record<string, number>>;
  } catch {
    return null;
  }
}

/** Prints one figure per line: µs per matrix for each size, then numpy's figures and the ratios when available. */
export async function benchEigh(): Promise<void> {
  const values = timeEigenvalues(SIZES, { batches: 25 });
  const systems = timeEigensystem(SIZES, { batches: 15 });
  const micro = (seconds: number): string => (seconds * 1e6).toFixed(1);
  for (const { n, secondsPerMatrix } of values) {
    console.log(`eigh eigenvalues n=${n}: ${micro(secondsPerMatrix)} µs per matrix`);
  }
  for (const { n, secondsPerMatrix } of systems) {
    console.log(`eigh eigenvalues+eigenvectors n=${n}: ${micro(secondsPerMatrix)} µs per matrix`);
  }
  const numpy = timeNumpy(SIZES);
  if (numpy === null) {
    console.log('numpy: python3 with numpy not available, no ratios');
    return;
  }
  for (const [label, rows, reference] of [
    ['numpy.linalg.eigvalsh', values, numpy.eigvalsh], ['numpy.linalg.eigh', systems, numpy.eigh],
  ] as const) {
    for (const { n, secondsPerMatrix } of rows) {
      const seconds = reference[String(n)];
      const target = (label === 'numpy.linalg.eigvalsh' ? EIGENVALUE_TARGETS : EIGENSYSTEM_TARGETS)[n];
      console.log(
        `${label} n=${n}: ${micro(seconds)} µs per matrix, ratio ours/numpy ${(secondsPerMatrix / seconds).toFixed(2)}` +
          (target === undefined ? '' : ` (target ≤ ${target})`),
      );
    }
  }
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) await benchEigh();
