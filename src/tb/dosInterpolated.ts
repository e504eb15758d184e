/**
 * The DOS of the bands interpolated between mesh points, seen through the same Gaussian as `fill`: the linear
 * triangle DOS (src/tb/dosTriangle.ts) on a fine grid, then broadened by δ_σ(x) = exp(−(x/σ)²)/(σ√π) and
 * counted with the occupation ½·erfc((E − E_F)/σ).
 *
 * Why: the Gaussian sum over mesh states (src/tb/dos.ts) is a faithful DOS only where neighbouring mesh points
 * differ by less than about σ in energy; a steep band leaves intervals with no mesh state at all, where that sum
 * is exactly 0. The triangle method interpolates each band linearly between mesh points and has no such holes,
 * so comparing the two at an energy says whether the mesh resolves width σ there.
 *
 * Layout: one grid from the lowest mesh state − 8σ up to `top`, step h = max(σ/20, span/40000); Float64Arrays
 * aligned with it. States above `top` are left out, so counts are exact only at E_F ≤ top − 8σ.
 */
import { triangleDos } from './dosTriangle.ts';
import { occupation } from './fermi.ts';
import type { MeshSpectrum } from './meshSpectrum.ts';

/** Gaussian tails are cut at this many σ (exp(−64) ≈ 1.6e-28). */
const RANGE = 8;
/** Grid points at most (bounds the work for tiny σ over a wide spectrum). */
const MAX_POINTS = 40_000;

/** The triangle DOS on the fine grid, ready to broaden and count. */
export interface InterpolatedDos {
  /** First grid energy (eV) and the step (eV). */
  start: number;
  step: number;
  smearing: number;
  /** Triangle DOS, total and σ part (states per eV per atom, both spins), on the grid. */
  total: Float64Array;
  sigma: Float64Array;
  /** The broadening kernel δ_σ(j·h)·h for j = −radius … radius. */
  kernel: Float64Array;
  radius: number;
}

export function interpolatedDos(spectrum: MeshSpectrum, smearing: number, top: number): InterpolatedDos {
  let bottom = Infinity;
  for (const e of spectrum.energies) if (e < bottom) bottom = e;
  const start = bottom - RANGE * smearing;
  const step = Math.max(smearing / 20, (top - start) / MAX_POINTS);
  const points = Math.max(2, Math.ceil((top - start) / step) + 1);
  const grid = new Float64Array(points);
  for (let i = 0; i < points; i++) grid[i] = start + i * step;
  const dos = triangleDos(spectrum, grid);
  const radius = Math.max(1, Math.ceil((RANGE * smearing) / step));
  const kernel = new Float64Array(2 * radius + 1);
  for (let j = -radius; j <= radius; j++) {
    const x = (j * step) / smearing;
    kernel[j + radius] = (Math.exp(-x * x) * step) / (smearing * Math.sqrt(Math.PI));
  }
  return { start, step, smearing, total: dos.total, sigma: dos.sigma, kernel, radius };
}

/** The broadened σ (or total) DOS at grid point i. */
export function broadenedAt(dos: InterpolatedDos, i: number, part: 'sigma' | 'total' = 'sigma'): number {
  const values = dos[part];
  const { kernel, radius } = dos;
  let sum = 0;
  const first = Math.max(0, i - radius);
  const last = Math.min(values.length - 1, i + radius);
  for (let q = first; q <= last; q++) sum += values[q] * kernel[q - i + radius];
  return sum;
}

/** σ and all electrons per atom below E_F with the occupation ½·erfc((E − E_F)/σ). */
export function interpolatedCount(dos: InterpolatedDos, fermi: number): { sigma: number; total: number } {
  let sigma = 0;
  let total = 0;
  for (let i = 0; i < dos.total.length; i++) {
    const f = occupation((dos.start + i * dos.step - fermi) / dos.smearing);
    if (f === 0) break;
    sigma += dos.sigma[i] * f;
    total += dos.total[i] * f;
  }
  return { sigma: sigma * dos.step, total: total * dos.step };
}
