/**
 * A synthetic spectrum with the linear DOS D0·|E| per cell of graphene near its conical point (both spins), for
 * testing the alignment solver against the closed form of Giovannetti et al. (2008). Levels are placed so that
 * the electrons per cell between 0 and E are D0·E²/2 to within one level; the neutral count (half filling) puts
 * E_F at 0. Invented as a test instrument, not data.
 */
import type { MeshSpectrum } from '../../src/tb/meshSpectrum.ts';

export function linearDosSpectrum(dosSlope: number, levelsPerSide: number, atoms = 2): MeshSpectrum {
  const count = 2 * levelsPerSide;
  const perLevel = 2 / count; // electrons per cell in one level
  const energies = new Float64Array(count);
  for (let i = 0; i < levelsPerSide; i++) {
    const e = Math.sqrt((2 * (i + 0.5) * perLevel) / dosSlope);
    energies[levelsPerSide + i] = e;
    energies[levelsPerSide - 1 - i] = -e;
  }
  return {
    parameters: 'synthetic linear DOS', atoms, planar: true, mesh: 1, count, bands: 1,
    energies, sigmaWeight: new Float64Array(count), groups: [[0, 1]],
  };
}

/** Electrons per atom at half filling of the synthetic spectrum. */
export const HALF_FILLING = (atoms: number) => 1 / atoms;
