/**
 * A guard at the CLI boundary against runs that would take hours: the cost of diagonalising H(k) grows as the
 * cube of its size, so a large cell on a fine mesh is refused up front with the estimate and a way out, instead
 * of running silently for a day. The constants are measured (bench/eigh.ts on a 2-core laptop-class machine),
 * rounded up; the estimate is an order of magnitude, not a promise.
 */
import { invalid } from '../io/invalid.ts';
import { isPlanar, type Sheet } from '../lattice/sheet.ts';

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

function readable(seconds: number): string {
  if (seconds < 120) return `${seconds.toFixed(0)} s`;
  if (seconds < 7200) return `${(seconds / 60).toFixed(0)} min`;
  if (seconds < 48 * 3600) return `${(seconds / 3600).toFixed(1)} h`;
  return `${(seconds / 86400).toFixed(0)} days`;
}

/**
 * Refuses a job estimated past MAX_ESTIMATED_SECONDS, naming the flag that sets its size (`--mesh`, `--points`).
 * `kpointsOf(v)` gives the k-point count for a flag value v, to suggest the largest value that fits.
 */
export function guardSolve(sheet: Sheet, flag: string, value: number, kpointsOf: (v: number) => number): void {
  const atoms = sheet.atoms.length;
  if (atoms > MAX_MODEL_ATOMS) invalid('SHEET', `${atoms} atoms`, `the tight-binding commands take at most ${MAX_MODEL_ATOMS} atoms per cell`);
  const seconds = estimatedSeconds(sheet, kpointsOf(value));
  if (seconds <= MAX_ESTIMATED_SECONDS) return;
  let fits = value;
  while (fits > 1 && estimatedSeconds(sheet, kpointsOf(fits)) > MAX_ESTIMATED_SECONDS) fits = Math.floor(fits / 1.25);
  const hint = fits >= 1 && estimatedSeconds(sheet, kpointsOf(fits)) <= MAX_ESTIMATED_SECONDS ? `; ${flag} ${fits} fits in an hour` : '; use a smaller cell';
  invalid(flag, value, `about ${readable(seconds)} for ${atoms} atoms per cell${hint}`);
}
