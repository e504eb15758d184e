/**
 * Holes of a vacancy pattern: vacancies joined by nearest-neighbour steps form clusters.
 *
 * A hexagonal hole is a vacancy whose six neighbour sites are all filled (a cluster of one, the hole of the
 * α sheet; Tang & Ismail-Beigi, Phys. Rev. Lett. 99, 115501 (2007)). Larger clusters are listed with their
 * sizes; a cluster that reaches its own periodic image is an endless row or net of holes ("periodic").
 */
import { reduceSite, type Hnf } from './hnf.ts';
import type { Pattern } from './sheet.ts';
import { NEAREST_STEPS } from './triangular.ts';

/** Vacancies joined by nearest-neighbour steps, within one supercell. */
export interface VacancyCluster {
  /** Its vacancies (the pattern's own entries: reduced lattice points), in the pattern's order. */
  readonly sites: [number, number][];
  /** Number of vacancies per supercell in the cluster. */
  readonly size: number;
  /** True when the cluster joins its own periodic image: an unbounded row or net of vacancies. */
  readonly periodic: boolean;
}

const index = (h: Hnf, site: readonly [number, number]) => site[1] * h.a + site[0];

/** The vacancy clusters of a pattern, in the order of their first vacancy. */
export function vacancyClusters(pattern: Pattern): VacancyCluster[] {
  const h = pattern.supercell;
  const n = h.a * h.c;
  const vacant = new Uint8Array(n);
  for (const site of pattern.vacancies) vacant[index(h, site)] = 1;
  // Cluster label per site (−1 unvisited) and the unreduced point each vacancy was reached at.
  const label = new Int32Array(n).fill(-1);
  const reachedI = new Float64Array(n), reachedJ = new Float64Array(n);
  const clusters: VacancyCluster[] = [];
  const entryAt = new Map<number, [number, number]>();
  for (const site of pattern.vacancies) entryAt.set(index(h, site), site);
  for (const start of pattern.vacancies) {
    const startIndex = index(h, start);
    if (label[startIndex] >= 0) continue;
    const id = clusters.length;
    const members: number[] = [startIndex];
    label[startIndex] = id;
    reachedI[startIndex] = start[0];
    reachedJ[startIndex] = start[1];
    let periodic = false;
    for (let head = 0; head < members.length; head++) {
      const from = members[head];
      for (const [di, dj] of NEAREST_STEPS) {
        const i = reachedI[from] + di, j = reachedJ[from] + dj;
        const to = index(h, reduceSite(h, i, j));
        if (!vacant[to]) continue;
        if (label[to] < 0) {
          label[to] = id;
          reachedI[to] = i;
          reachedJ[to] = j;
          members.push(to);
        } else if (reachedI[to] !== i || reachedJ[to] !== j) {
          // The same vacancy reached at another lattice point: the cluster meets its own image.
          periodic = true;
        }
      }
    }
    members.sort((x, y) => x - y);
    const sites = members.map((m) => entryAt.get(m)!);
    clusters.push({ sites, size: sites.length, periodic });
  }
  return clusters;
}

/** The vacancies whose six neighbour sites are all filled (hexagonal holes), in the pattern's order. */
export function hexagonalHoles(pattern: Pattern): [number, number][] {
  return vacancyClusters(pattern)
    .filter((cluster) => cluster.size === 1 && !cluster.periodic)
    .map((cluster) => cluster.sites[0]);
}
