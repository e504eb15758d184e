/**
 * Density of states by the linear triangle method — the two-dimensional form of the linear tetrahedron method
 * (Lehmann & Taut, phys. stat. sol. (b) 54, 469 (1972); Jepsen & Andersen, Solid State Commun. 9, 1763 (1971)).
 *
 * Each cell of the M×M mesh (corners (i, j), (i+1, j), (i, j+1), (i+1, j+1), indices modulo M) is cut into two
 * triangles along the (i+1, j)–(i, j+1) diagonal; in each triangle every band is interpolated linearly between its
 * corner energies e1 ≤ e2 ≤ e3, which gives the exact DOS of the interpolated band:
 *   g(E) = 2(E − e1)/((e2 − e1)(e3 − e1)) for e1 < E < e2,   g(E) = 2(e3 − E)/((e3 − e1)(e3 − e2)) for e2 < E < e3,
 * per unit triangle weight (∫g dE = 1). The grid value is the exact mean of g over the grid bin [E − h/2, E + h/2]
 * (h the grid step), from the integrated fraction N(E) = (E − e1)²/((e2 − e1)(e3 − e1)) below e2 and
 * 1 − (e3 − E)²/((e3 − e1)(e3 − e2)) above, so no state is lost between grid points and the sum times h is
 * exactly the number of states. Each triangle weighs 1/(2M²) of the zone. Bands are taken in row order
 * within the spectrum's ascending groups (σ and π separately for planar sheets). The σ share of a triangle is the
 * mean of its three corners. Normalisation as src/tb/dos.ts: states per eV per atom, both spins, ∫ = 8.
 */
import type { DosResult } from './dos.ts';
import type { MeshSpectrum } from './meshSpectrum.ts';

/** Fraction of a linear triangle with corner energies e1 ≤ e2 ≤ e3 lying below E. */
function fractionBelow(x: number, e1: number, e2: number, e3: number): number {
  if (x <= e1) return 0;
  if (x >= e3) return 1;
  if (x <= e2) return ((x - e1) * (x - e1)) / ((e2 - e1) * (e3 - e1));
  return 1 - ((e3 - x) * (e3 - x)) / ((e3 - e1) * (e3 - e2));
}

export function triangleDos(spectrum: MeshSpectrum, energy: Float64Array): DosResult {
  const { mesh, bands, energies, sigmaWeight } = spectrum;
  const total = new Float64Array(energy.length);
  const sigma = new Float64Array(energy.length);
  const step = energy.length > 1 ? energy[1] - energy[0] : 1;
  const start = energy[0];
  const weight = (2 / spectrum.atoms) / (2 * mesh * mesh);
  const corners = new Int32Array(3);
  const e = new Float64Array(3);
  const add = (w: number) => {
    // Sort the three corner energies.
    let e1 = e[0], e2 = e[1], e3 = e[2], t: number;
    if (e1 > e2) { t = e1; e1 = e2; e2 = t; }
    if (e2 > e3) { t = e2; e2 = e3; e3 = t; }
    if (e1 > e2) { t = e1; e1 = e2; e2 = t; }
    const first = Math.max(0, Math.round((e1 - start) / step));
    const last = Math.min(energy.length - 1, Math.round((e3 - start) / step));
    let below = fractionBelow(start + (first - 0.5) * step, e1, e2, e3);
    for (let i = first; i <= last; i++) {
      const above = fractionBelow(start + (i + 0.5) * step, e1, e2, e3);
      const g = (weight * (above - below)) / step;
      below = above;
      if (g <= 0) continue;
      total[i] += g;
      sigma[i] += g * w;
    }
  };
  for (let i = 0; i < mesh; i++) {
    const i1 = (i + 1) % mesh;
    for (let j = 0; j < mesh; j++) {
      const j1 = (j + 1) % mesh;
      const p00 = i * mesh + j, p10 = i1 * mesh + j, p01 = i * mesh + j1, p11 = i1 * mesh + j1;
      for (let tri = 0; tri < 2; tri++) {
        corners[0] = tri === 0 ? p00 : p11;
        corners[1] = p10;
        corners[2] = p01;
        for (let b = 0; b < bands; b++) {
          let w = 0;
          for (let c = 0; c < 3; c++) {
            e[c] = energies[corners[c] * bands + b];
            w += sigmaWeight[corners[c] * bands + b];
          }
          add(w / 3);
        }
      }
    }
  }
  const pi = new Float64Array(energy.length);
  for (let i = 0; i < energy.length; i++) pi[i] = total[i] - sigma[i];
  return { parameters: spectrum.parameters, method: 'triangle', energy, total, sigma, pi, smearing: 0 };
}
