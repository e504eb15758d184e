/**
 * A candidate's coincidence (moiré) cells with a metal as cells that may fit a measured lattice. On a metal a picture
 * often repeats with the coincidence cell of sheet and metal, not with the sheet's own cell. Each coincidence fit
 * (src/substrate/coincidence.ts) pairs a sheet supercell S (rows in the sheet's cell basis) with a metal supercell M
 * (rows in b1, b2); M, in Å on the metal, is compared with the measured cell (src/stm/correspondence.ts), so the
 * common scale absorbs only the pixel-size error (the metal's spacing is known, the strain is within the fit). The
 * choice U of vectors that lines M up with the measured cell is applied to S as well (row i of S maps onto row i
 * of M): U·S, in the free sheet's frame, is where the candidate's model picture is evaluated.
 * Not checked: the angle of the fit against the picture (the metal's orientation in the picture is not known).
 */
import type { Sheet, Vec2 } from '../lattice/sheet.ts';
import { SQRT3 } from '../lattice/triangular.ts';
import { coincidenceFits, FIT_DEFAULTS, type CoincidenceFit, type IntRows } from '../substrate/coincidence.ts';
import { correspondences, type CellTolerance, type Sublattice } from './correspondence.ts';

export interface CoincidenceSearch {
  /** The metal surface's nearest-neighbour distance (Å). */
  nnDistance: number;
  /** Largest strain of a coincidence, max |principal stretch − 1| (default 0.03, as `fit`). */
  maxStrain?: number;
  /** Largest coincidence cell in metal atoms (default: the largest that the measured cells allow, at most 120). */
  maxSites?: number;
  /** Coincidence fits of one candidate kept, smallest cell then least strain first (default 12). */
  maxFits?: number;
  /**
   * Largest index of the measured lattice's sublattices tried as the coincidence cell (default 1: the measured cell
   * itself). The moiré is usually the strongest periodicity of such a picture; allowing larger cells lets nearly
   * every candidate fit some coincidence by lattice alone.
   */
  maxIndex?: number;
}

/** One way a candidate fits one target cell (a sublattice of the measured lattice). */
export interface CellFit {
  /** Index into the target list. */
  target: number;
  /** The candidate's vectors (Å, the free sheet's frame) that play the target's A1, A2. */
  vectors: [Vec2, Vec2];
  /** √(target area / cell area): for a coincidence, the cell on the metal. */
  scale: number;
  /** Present when the cell is a coincidence cell with the metal; absent for the sheet's own cell. */
  coincidence?: CoincidenceFit;
}

export const COINCIDENCE_MATCH_DEFAULTS = { maxStrain: FIT_DEFAULTS.maxStrain, maxSitesCap: 120, maxFits: 12, maxIndex: 1 } as const;

const area = ([u, v]: [Vec2, Vec2]) => Math.abs(u[0] * v[1] - u[1] * v[0]);
const rowsTimes = (rows: IntRows, [p, q]: [Vec2, Vec2]): [Vec2, Vec2] =>
  rows.map(([i, j]) => [i * p[0] + j * q[0], i * p[1] + j * q[1]] as Vec2) as [Vec2, Vec2];

/** The coincidence cells of `sheet` on the metal that fit a target within `tolerance`, as cell fits. */
export function coincidenceCellFits(sheet: Sheet, targets: readonly Sublattice[], search: CoincidenceSearch, tolerance: CellTolerance): CellFit[] {
  const s = search.nnDistance;
  const maxIndex = search.maxIndex ?? COINCIDENCE_MATCH_DEFAULTS.maxIndex;
  const usable = targets.filter((t) => t.index <= maxIndex);
  if (usable.length === 0) return [];
  const metal: [Vec2, Vec2] = [[s, 0], [s / 2, (s * SQRT3) / 2]];
  const siteArea = area(metal);
  const largest = Math.max(...usable.map((t) => area(t.vectors)));
  const smallest = Math.min(...usable.map((t) => area(t.vectors)));
  // The common scale is within 1 ± tolerance.scale, so the cell on the metal lies in this area window.
  const bound = Math.floor((largest * (1 + tolerance.scale) ** 2) / siteArea + 1e-9);
  const maxSites = Math.min(search.maxSites ?? COINCIDENCE_MATCH_DEFAULTS.maxSitesCap, bound);
  if (!(maxSites >= 1)) return [];
  const minArea = (smallest / (1 + tolerance.scale) ** 2) * (1 - 1e-9);
  const fits = coincidenceFits(sheet, s, { maxStrain: search.maxStrain ?? COINCIDENCE_MATCH_DEFAULTS.maxStrain, maxSites });
  const out: CellFit[] = [];
  let kept = 0;
  for (const fit of fits) {
    if (fit.area < minArea) continue;
    const onMetal = rowsTimes(fit.substrateSupercell, metal);
    const inSheet = rowsTimes(fit.sheetSupercell, sheet.cell);
    const found: CellFit[] = [];
    targets.forEach((target, t) => {
      if (target.index > maxIndex) return;
      for (const c of correspondences(onMetal, target.vectors, tolerance)) {
        const [a, b, cc, d] = c.transform;
        const [p, q] = inSheet;
        const u: Vec2 = [a * p[0] + b * q[0], a * p[1] + b * q[1]];
        const v: Vec2 = [cc * p[0] + d * q[0], cc * p[1] + d * q[1]];
        found.push({ target: t, vectors: [u, v], scale: c.scale, coincidence: fit });
      }
    });
    if (found.length === 0) continue;
    out.push(...found);
    if (++kept >= (search.maxFits ?? COINCIDENCE_MATCH_DEFAULTS.maxFits)) break;
  }
  return out;
}
