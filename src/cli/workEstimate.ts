/**
 * A guard at the CLI boundary against runs that would take hours: the cost of diagonalising H(k) grows as the
 * cube of its size, so a large cell on a fine mesh is refused up front with the estimate and a way out, instead
 * of running silently for a day. The constants are measured (bench/eigh.ts on a 2-core laptop-class machine),
 * rounded up; the estimate is an order of magnitude, not a promise.
 */
import { invalid } from '../validate/invalid.ts';
import { isPlanar, type Sheet } from '../lattice/sheet.ts';
import { readableSeconds } from './progress.ts';

/** Largest sheet the tight-binding commands accept: H(k) is 4n × 4n complex, 256 MB at n = 1000. */
export const MAX_MODEL_ATOMS = 1000;
/** Longest run accepted without narrowing the job, seconds. */
export const MAX_ESTIMATED_SECONDS = 3600;
/** Seconds per (matrix size)³ for eigenvalues only, and with eigenvectors (bench/eigh.ts, rounded up). */
const EIGENVALUES_PER_CUBE = 1.5e-9;
const EIGENVECTORS_PER_CUBE = 5e-9;

/** Estimated seconds to solve `kpoints` k-points of a sheet (planar: σ and π blocks, eigenvalues only). */
export function estimatedSeconds(sheet: Sheet, kpoints: number): number {
  const n = sheet.atoms.length;
  const perK = isPlanar(sheet) ? EIGENVALUES_PER_CUBE * ((3 * n) ** 3 + n ** 3) : EIGENVECTORS_PER_CUBE * (4 * n) ** 3;
  return perK * kpoints;
}

/**
 * Refuses a job estimated past MAX_ESTIMATED_SECONDS, naming the flag that sets its size (`--mesh`, `--kspacing`,
 * `--points`). `kpointsOf(v)` gives the k-point count for a flag value v; `cheaper(v)` the next value to try when
 * suggesting one that fits (default: v/1.25 rounded down, for a mesh side or a point count).
 */
export function guardSolve(
  sheet: Sheet, flag: string, value: number, kpointsOf: (v: number) => number,
  cheaper: (v: number) => number = (v) => Math.floor(v / 1.25),
): void {
  const atoms = sheet.atoms.length;
  if (atoms > MAX_MODEL_ATOMS) invalid('SHEET', `${atoms} atoms`, `the tight-binding commands take at most ${MAX_MODEL_ATOMS} atoms per cell`);
  const seconds = estimatedSeconds(sheet, kpointsOf(value));
  if (seconds <= MAX_ESTIMATED_SECONDS) return;
  let fits = value;
  for (let tries = 0; tries < 100 && fits > 0 && estimatedSeconds(sheet, kpointsOf(fits)) > MAX_ESTIMATED_SECONDS; tries++) fits = cheaper(fits);
  const hint = fits > 0 && estimatedSeconds(sheet, kpointsOf(fits)) <= MAX_ESTIMATED_SECONDS ? `; ${flag} ${fits} fits in an hour` : '; use a smaller cell';
  invalid(flag, String(value), `about ${readableSeconds(seconds)} for ${atoms} atoms per cell${hint}`);
}
