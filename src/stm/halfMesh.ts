/**
 * The Γ-centred M×M mesh of `fill` (src/tb/kspace.ts) halved by time reversal: the Slater–Koster blocks are real,
 * so H(−k) = H(k)* and a state at −k is the complex conjugate of one at k; |ψ|², hence the LDOS, is the same.
 * Each pair {k, −k} is kept once with the weight of both (a self-partner keeps its own). Weights sum to 1.
 * Layout: kpoints kx, ky interleaved (point p at [2p, 2p + 1]); weights[p].
 */
import type { Sheet } from '../lattice/sheet.ts';
import { kMesh } from '../tb/kspace.ts';

export interface WeightedKpoints {
  kpoints: Float64Array;
  weights: Float64Array;
}

export function halfMesh(cell: Sheet['cell'], m: number): WeightedKpoints {
  const all = kMesh(cell, m);
  const keep: number[] = [];
  const weight: number[] = [];
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      const p = i * m + j;
      const partner = ((m - i) % m) * m + ((m - j) % m);
      if (partner < p) continue;
      keep.push(p);
      weight.push((partner === p ? 1 : 2) / (m * m));
    }
  }
  const kpoints = new Float64Array(2 * keep.length);
  keep.forEach((p, r) => {
    kpoints[2 * r] = all[2 * p];
    kpoints[2 * r + 1] = all[2 * p + 1];
  });
  return { kpoints, weights: Float64Array.from(weight) };
}
