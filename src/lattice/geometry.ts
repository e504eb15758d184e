/**
 * Coordination and hole density of a sheet.
 *
 * Coordination of a pattern is exact: the filled sites among each atom's six lattice neighbours.
 * For an explicit sheet it counts neighbours closer than a cutoff between the first and second shells:
 * by default 1.2 × the shortest separation, between the triangular lattice's shells at d and √3·d and
 * loose enough for bonds a buckling stretches (common practice).
 */
import { reduceSite } from './hnf.ts';
import { coordination } from './neighbours.ts';
import { holeDensity } from './pattern.ts';
import { sheetToPattern } from './recognise.ts';
import { cellMetrics } from './reducedCell.ts';
import { nearestDistances, shortestSeparation } from './separation.ts';
import type { Pattern, Sheet } from './sheet.ts';
import { NEAREST_STEPS, SQRT3 } from './triangular.ts';

/** Default bond cutoff as a multiple of the shortest separation. */
export const BOND_CUTOFF_FACTOR = 1.2;

/** Bond cutoff (Å) of a sheet: `factor` × its shortest atom separation (periodic images included). */
export function bondCutoff(sheet: Sheet, factor: number = BOND_CUTOFF_FACTOR): number {
  return factor * shortestSeparation(sheet).distance;
}

/** Coordination of an explicit sheet: neighbours of each atom within `cutoff` Å (default `bondCutoff`). */
export function sheetCoordination(sheet: Sheet, cutoff: number = bondCutoff(sheet)): Int32Array {
  return coordination(sheet, cutoff);
}

/**
 * Exact coordination of a pattern: filled nearest-neighbour sites of each atom, in the atom order of
 * `patternToSheet` (sites j·a + i, vacancies skipped). A site that neighbours itself through the
 * supercell (a 1-wide supercell) counts each such bond.
 */
export function patternCoordination(pattern: Pattern): Int32Array {
  const h = pattern.supercell;
  const vacant = new Uint8Array(h.a * h.c);
  for (const [i, j] of pattern.vacancies) vacant[j * h.a + i] = 1;
  const out = new Int32Array(h.a * h.c - pattern.vacancies.length);
  let atom = 0;
  for (let j = 0; j < h.c; j++) {
    for (let i = 0; i < h.a; i++) {
      if (vacant[j * h.a + i]) continue;
      let count = 0;
      for (const [di, dj] of NEAREST_STEPS) {
        const [ni, nj] = reduceSite(h, i + di, j + dj);
        if (!vacant[nj * h.a + ni]) count++;
      }
      out[atom++] = count;
    }
  }
  return out;
}

/** Histogram of coordination numbers: entry k is the number of atoms with k neighbours. */
export function coordinationHistogram(counts: Int32Array): number[] {
  const out: number[] = [];
  for (const k of counts) {
    while (out.length <= k) out.push(0);
    out[k]++;
  }
  return out;
}

/** Hole density of a sheet: exact when it is recognised as a pattern, else an areal estimate. */
export interface HoleDensityEstimate {
  /** η = vacancies / lattice sites. */
  readonly eta: number;
  /** True when η comes from the recognised pattern. */
  readonly exact: boolean;
  /** Bond d (Å) of the reference triangular lattice. */
  readonly bond: number;
  /** The recognised pattern, when there is one. */
  readonly pattern?: Pattern;
}

/**
 * η of an explicit sheet. Recognised as a pattern: exact. Otherwise: 1 − n·(√3/2)·d²/A, the share of a
 * filled triangular lattice of spacing d (the median in-plane nearest-neighbour distance) that the n atoms
 * of the cell of area A leave empty, clamped at 0 — a density estimate, not a count.
 */
export function estimateHoleDensity(sheet: Sheet): HoleDensityEstimate {
  const pattern = sheetToPattern(sheet);
  if (pattern) return { eta: holeDensity(pattern), exact: true, bond: pattern.bond, pattern };
  const nearest = Float64Array.from(nearestDistances(sheet, { inPlane: true })).sort();
  const mid = nearest.length >> 1;
  const bond = nearest.length % 2 ? nearest[mid] : (nearest[mid - 1] + nearest[mid]) / 2;
  const siteArea = (SQRT3 / 2) * bond * bond;
  const eta = 1 - (sheet.atoms.length * siteArea) / cellMetrics(sheet.cell).area;
  return { eta: Math.max(eta, 0), exact: false, bond };
}
