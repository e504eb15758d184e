/**
 * Benchmark of the Hermitian eigensolver (one thread): µs per matrix for n = 24, 64, 128, eigenvalues only and
 * with eigenvectors, and, when python3 with numpy is present, the ratios to numpy.linalg.eigvalsh and
 * numpy.linalg.eigh on random complex Hermitian matrices of the same sizes, timed the same way (best of several
 * batches, single-threaded BLAS). Then the real symmetric eigenvalue kernel (SymmetricEigenvalues, the mesh solves
 * of sheets with a 2-fold axis) at the orders those solves have, on both routes, beside numpy.linalg.eigvalsh on
 * random real symmetric matrices (no target). Run: `npx tsx bench/eigh.ts`.
 */
import { spawnSync } from 'node:child_process';
import { pathToFileURL } from 'node:url';
import { timeEigensystem, timeEigenvalues, timeSymmetricEigenvalues } from '../src/linalg/eighBench.ts';

const SIZES = [24, 64, 128];
/** Orders of SymmetricEigenvalues: planar σ blocks of 8, 15, 19 atoms (3 orbitals each), 64 and 128. */
const REAL_SIZES = [24, 45, 57, 64, 128];
/** Project targets (issue 9) for the ratio ours/numpy by size: eigenvalues only, and with eigenvectors. */
const EIGENVALUE_TARGETS: Record<number, number> = { 24: 1.5, 64: 2.5, 128: 1.5 };
const EIGENSYSTEM_TARGETS: Record<number, number> = { 24: 1.5, 64: 1.5, 128: 1.5 };

// Best-of-batches seconds per numpy.linalg.eigvalsh and numpy.linalg.eigh call on complex Hermitian matrices
// (sizes in argv[1]) and per numpy.linalg.eigvalsh call on real symmetric ones (sizes in argv[2]), printed as one
// JSON object {"eigvalsh": {n: seconds}, "eigh": {n: seconds}, "eigvalsh_real": {n: seconds}}.
const NUMPY_TIMER = `
import json, sys, time
import numpy as np
rng = np.random.default_rng(1)
result = {"eigvalsh": {}, "eigh": {}, "eigvalsh_real": {}}
def best_seconds(solve, mats):
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
    return best
for n in [int(s) for s in sys.argv[1].split(",")]:
    mats = []
    for _ in range(8):
        a = rng.uniform(-1, 1, (n, n)) + 1j * rng.uniform(-1, 1, (n, n))
        mats.append((a + a.conj().T) / 2)
    for name, solve in (("eigvalsh", np.linalg.eigvalsh), ("eigh", np.linalg.eigh)):
        result[name][str(n)] = best_seconds(solve, mats)
for n in [int(s) for s in sys.argv[2].split(",")]:
    mats = []
    for _ in range(8):
        a = rng.uniform(-1, 1, (n, n))
        mats.append((a + a.T) / 2)
    result["eigvalsh_real"][str(n)] = best_seconds(np.linalg.eigvalsh, mats)
print(json.dumps(result))
`;

type NumpyTimes = Record<'eigvalsh' | 'eigh' | 'eigvalsh_real', Record<string, number>>;

/** numpy's seconds per matrix by routine and size, or null when python3/numpy is missing. */
function timeNumpy(sizes: number[], realSizes: number[]): NumpyTimes | null {
  const env: NodeJS.ProcessEnv = {
    ...process.env, OMP_NUM_THREADS: '1', OPENBLAS_NUM_THREADS: '1', MKL_NUM_THREADS: '1',
  };
  // Set on this machine and slow OpenBLAS down; removed for this subprocess only.
  delete env.OPENBLAS_CORETYPE;
  delete env.OPENBLAS_L2_SIZE;
  const run = spawnSync('python3', ['-c', NUMPY_TIMER, sizes.join(','), realSizes.join(',')], { env, encoding: 'utf8' });
  if (run.status !== 0 || !run.stdout) return null;
  try {
    return JSON.parse(run.stdout) as NumpyTimes;
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
  const real = timeSymmetricEigenvalues(REAL_SIZES, { batches: 25 });
  const realTypeScript = timeSymmetricEigenvalues(REAL_SIZES, { batches: 25, simd: false });
  real.forEach(({ n, secondsPerMatrix }, i) => {
    console.log(
      `real symmetric eigenvalues n=${n}: ${micro(secondsPerMatrix)} µs per matrix ` +
        `(TypeScript route ${micro(realTypeScript[i].secondsPerMatrix)} µs)`,
    );
  });
  const numpy = timeNumpy(SIZES, REAL_SIZES);
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
  for (const { n, secondsPerMatrix } of real) {
    const seconds = numpy.eigvalsh_real[String(n)];
    console.log(
      `numpy.linalg.eigvalsh real n=${n}: ${micro(seconds)} µs per matrix, ratio ours/numpy ${(secondsPerMatrix / seconds).toFixed(2)}`,
    );
  }
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) await benchEigh();
