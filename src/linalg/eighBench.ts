/**
 * Timing of HermitianEigensolver on random dense complex Hermitian matrices, and of SymmetricEigenvalues on random
 * real symmetric ones (one thread). timeEigenvalues is behind the CLI's `bench eigh --sizes … --json`.
 */
import { HermitianEigensolver } from './eigh.ts';
import { fillRandomHermitian, fillRandomSymmetric, xorshift32 } from './eighRandom.ts';
import { SymmetricEigenvalues } from './symmetricEigenvalues.ts';

/** Options of timeEigenvalues. */
export interface EigenvalueTimingOptions {
  /** Timed batches per size; the fastest counts. Default 15. */
  batches?: number;
  /** Seed of the matrix generator. Default 1. */
  seed?: number;
  /** false times the TypeScript kernels (the solvers' `simd` option); default: the solvers' own choice. */
  simd?: boolean;
}

/** One timing row: matrix order and the best seconds per matrix. */
export interface EigenvalueTiming {
  n: number;
  secondsPerMatrix: number;
}

/** Distinct matrices cycled through in a batch, so the timing is not of one lucky spectrum. */
const MATRICES_PER_SIZE = 8;
/**
 * Target wall time of one batch (s): long enough for the clock, short enough that on a busy machine some
 * batches escape preemption (the best batch is the one reported).
 */
const BATCH_SECONDS = 0.02;

/** Best-of-batches seconds per eigenvalue-only solve for each size. */
export function timeEigenvalues(sizes: number[], options: EigenvalueTimingOptions = {}): EigenvalueTiming[] {
  return timeSolves(sizes, options, (solver, re, im, out) => solver.eigenvalues(re, im, out.values));
}

/** Best-of-batches seconds per full solve (eigenvalues and eigenvectors) for each size. */
export function timeEigensystem(sizes: number[], options: EigenvalueTimingOptions = {}): EigenvalueTiming[] {
  return timeSolves(sizes, options, (solver, re, im, out) =>
    solver.eigensystem(re, im, out.values, out.vecRe, out.vecIm));
}

interface Outputs {
  values: Float64Array;
  vecRe: Float64Array;
  vecIm: Float64Array;
}

/** Best-of-batches seconds per SymmetricEigenvalues.eigenvalues call (random real symmetric matrices) for each size. */
export function timeSymmetricEigenvalues(sizes: number[], options: EigenvalueTimingOptions = {}): EigenvalueTiming[] {
  const uniform = xorshift32(options.seed ?? 1);
  return sizes.map((n) => {
    const solver = new SymmetricEigenvalues(n, { simd: options.simd });
    const matrices = Array.from({ length: MATRICES_PER_SIZE }, () => {
      const a = new Float64Array(n * n);
      fillRandomSymmetric(n, uniform, a);
      return a;
    });
    const out = new Float64Array(n);
    return { n, secondsPerMatrix: bestSeconds(options.batches ?? 15, (i) => solver.eigenvalues(matrices[i], out)) };
  });
}

function timeSolves(
  sizes: number[], options: EigenvalueTimingOptions,
  solve: (solver: HermitianEigensolver, re: Float64Array, im: Float64Array, out: Outputs) => void,
): EigenvalueTiming[] {
  const uniform = xorshift32(options.seed ?? 1);
  return sizes.map((n) => {
    const solver = new HermitianEigensolver(n, { simd: options.simd });
    const matrices: { re: Float64Array; im: Float64Array }[] = [];
    for (let m = 0; m < MATRICES_PER_SIZE; m++) {
      const re = new Float64Array(n * n);
      const im = new Float64Array(n * n);
      fillRandomHermitian(n, uniform, re, im);
      matrices.push({ re, im });
    }
    const out = { values: new Float64Array(n), vecRe: new Float64Array(n * n), vecIm: new Float64Array(n * n) };
    const seconds = bestSeconds(options.batches ?? 15, (i) => solve(solver, matrices[i].re, matrices[i].im, out));
    return { n, secondsPerMatrix: seconds };
  });
}

/** Best seconds per call of `solve(i)` (i cycling through the matrices) over `batches` batches of equal length. */
function bestSeconds(batches: number, solve: (i: number) => void): number {
  const run = (count: number): number => {
    const start = performance.now();
    for (let i = 0; i < count; i++) solve(i % MATRICES_PER_SIZE);
    return (performance.now() - start) / 1000;
  };
  // Warm up (JIT) and calibrate the batch length, then one untimed batch at that length.
  let count = 1;
  while (run(count) < BATCH_SECONDS / 4) count *= 2;
  count = Math.max(1, Math.ceil((count * BATCH_SECONDS) / Math.max(run(count), 1e-9)));
  run(count);
  let best = Infinity;
  for (let b = 0; b < batches; b++) best = Math.min(best, run(count) / count);
  return best;
}
