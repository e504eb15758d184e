/**
 * Benchmark of the Hermitian eigensolver (eigenvalues only, one thread): µs per matrix for n = 24, 64, 128 and,
 * when python3 with numpy is present, the ratio to numpy.linalg.eigvalsh on random complex Hermitian matrices
 * of the same sizes, timed the same way (best of several batches, single-threaded BLAS).
 * Run: `npx tsx bench/eigh.ts`.
 */
import { spawnSync } from 'node:child_process';
import { pathToFileURL } from 'node:url';
import { timeEigenvalues } from '../src/tb/eighBench.ts';

const SIZES = [24, 64, 128];

// Best-of-batches seconds per numpy.linalg.eigvalsh call, printed as one JSON object {n: seconds}.
const NUMPY_TIMER = `
import json, sys, time
import numpy as np
rng = np.random.default_rng(1)
result = {}
for n in [int(s) for s in sys.argv[1:]]:
    mats = []
    for _ in range(8):
        a = rng.uniform(-1, 1, (n, n)) + 1j * rng.uniform(-1, 1, (n, n))
        mats.append((a + a.conj().T) / 2)
    count = 1
    while True:
        t = time.perf_counter()
        for i in range(count):
            np.linalg.eigvalsh(mats[i % 8])
        if time.perf_counter() - t > 0.05:
            break
        count *= 2
    best = float('inf')
    for _ in range(7):
        t = time.perf_counter()
        for i in range(count):
            np.linalg.eigvalsh(mats[i % 8])
        best = min(best, (time.perf_counter() - t) / count)
    result[str(n)] = best
print(json.dumps(result))
`;

/** numpy's seconds per matrix by size, or null when python3/numpy is missing. */
function timeNumpy(sizes: number[]): Record<string, number> | null {
  const env: NodeJS.ProcessEnv = {
    ...process.env, OMP_NUM_THREADS: '1', OPENBLAS_NUM_THREADS: '1', MKL_NUM_THREADS: '1',
  };
  // Set on this machine and slow OpenBLAS down; removed for this subprocess only.
  delete env.OPENBLAS_CORETYPE;
  delete env.OPENBLAS_L2_SIZE;
  const run = spawnSync('python3', ['-c', NUMPY_TIMER, ...sizes.map(String)], { env, encoding: 'utf8' });
  if (run.status !== 0 || !run.stdout) return null;
  try {
    return JSON.parse(run.stdout) as Record<string, number>;
  } catch {
    return null;
  }
}

/** Prints one figure per line: µs per matrix for each size, then numpy's figure and the ratio when available. */
export async function benchEigh(): Promise<void> {
  const rows = timeEigenvalues(SIZES, { batches: 9 });
  for (const { n, secondsPerMatrix } of rows) {
    console.log(`eigh eigenvalues n=${n}: ${(secondsPerMatrix * 1e6).toFixed(1)} µs per matrix`);
  }
  const numpy = timeNumpy(SIZES);
  if (numpy === null) {
    console.log('numpy.linalg.eigvalsh: python3 with numpy not available, no ratio');
    return;
  }
  for (const { n, secondsPerMatrix } of rows) {
    const reference = numpy[String(n)];
    console.log(
      `numpy.linalg.eigvalsh n=${n}: ${(reference * 1e6).toFixed(1)} µs per matrix, ratio ours/numpy ${(secondsPerMatrix / reference).toFixed(2)}`,
    );
  }
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) await benchEigh();
