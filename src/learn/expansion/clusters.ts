/**
 * Cluster orbits of the triangular lattice for the vacancy cluster expansion (Sanchez, Ducastelle & Gratias,
 * Physica A 128, 334 (1984)): the empty cluster, the point, pairs by neighbour shell and triplets by the shells of
 * their edges, each orbit taken under the 12 operations of 6mm and all translations.
 *
 * Geometry: the lattice vector (i, j) = i·a1 + j·a2 has squared length (i² + ij + j²)·d², so the shells lie at
 * d·√q for q = 1, 3, 4, 7, 9, 12, 13, … (the numbers i² + ij + j²). A shell is one orbit of vectors under 6mm;
 * two orbits of one length (first at q = 49) are two shells, ordered by their key.
 *
 * Layout of a ClusterSet: the distinct offsets every figure uses, `offsets` = (di, dj) interleaved; an orbit's
 * figures — its clusters per lattice site, each translated so that its smallest point (by i, then j) is the
 * site — as indices into the offsets, `figures[f·size + t]` for point t of figure f.
 */
import { apply, POINT_GROUP_6MM } from '../../lattice/triangular.ts';

export type ClusterKind = 'empty' | 'point' | 'pair' | 'triplet';

/** One orbit of clusters. */
export interface ClusterOrbit {
  kind: ClusterKind;
  /**
   * Pairs: the neighbour shell (1 = nearest). Triplets: the largest shell among the three edges. Empty and point: 0.
   */
  shell: number;
  /** Triplets: the shells of the three edges, ascending. */
  edges?: [number, number, number];
  /** Pairs: the length in lattice spacings d (√(i² + ij + j²)). */
  distance?: number;
  /** Sites per cluster: 0, 1, 2 or 3. */
  size: number;
  /** Clusters of the orbit per lattice site, m (the multiplicity of the expansion). */
  perSite: number;
  /** Figures per site: indices into ClusterSet.offsets, perSite × size entries (layout in the module comment). */
  figures: Int32Array;
  /** A readable name: "empty", "point", "pair 2", "triplet 1-1-2". */
  name: string;
}

/** The orbits an expansion uses, in column order: empty, point, pairs by shell, triplets. */
export interface ClusterSet {
  orbits: ClusterOrbit[];
  /** Distinct offsets of all figures, (di, dj) interleaved (layout in the module comment). */
  offsets: Int32Array;
  pairShells: number;
  tripletShells: number;
}

/** Most pair shells and triplet shells an expansion may ask for (the 10th shell lies at √21 d). */
export const MAX_PAIR_SHELLS = 10;
export const MAX_TRIPLET_SHELLS = 4;

type Point = readonly [number, number];

/** i² + ij + j²: the squared length of i·a1 + j·a2 in units of d². */
export function squaredLength(i: number, j: number): number {
  return i * i + i * j + j * j;
}

/** The cluster translated so that its smallest point (by i, then j) is the origin, points sorted. */
function normalised(points: readonly Point[]): Point[] {
  const sorted = [...points].sort((p, q) => p[0] - q[0] || p[1] - q[1]);
  const [i0, j0] = sorted[0];
  return sorted.map(([i, j]) => [i - i0 + 0, j - j0 + 0] as const);
}

const keyOf = (points: readonly Point[]) => points.map(([i, j]) => `${i},${j}`).join(';');

/** The figures of a cluster's orbit per site (one per class under translations) and the orbit's key (the smallest). */
function orbitFigures(points: readonly Point[]): { key: string; figures: Point[][] } {
  const byKey = new Map<string, Point[]>();
  for (const op of POINT_GROUP_6MM) {
    const image = normalised(points.map(([i, j]) => apply(op, i, j)));
    byKey.set(keyOf(image), image);
  }
  const keys = [...byKey.keys()].sort();
  return { key: keys[0], figures: keys.map((k) => byKey.get(k)!) };
}

interface Shell {
  squared: number;
  key: string;
  vector: Point;
}

/** Shells in order of length (ties by key), enough of them to hold the first `count`. */
function pairShellList(count: number): Shell[] {
  for (let reach = 4; ; reach *= 2) {
    const byKey = new Map<string, Shell>();
    for (let i = -reach; i <= reach; i++) {
      for (let j = -reach; j <= reach; j++) {
        if (i === 0 && j === 0) continue;
        const { key } = orbitFigures([[0, 0], [i, j]]);
        if (!byKey.has(key)) byKey.set(key, { squared: squaredLength(i, j), key, vector: [i, j] });
      }
    }
    const shells = [...byKey.values()].sort((x, y) => x.squared - y.squared || (x.key < y.key ? -1 : 1));
    // Every vector of length ≤ reach·√3/2 lies inside the square searched, so those shells are complete.
    const complete = shells.filter((s) => s.squared <= (0.75 * reach * reach));
    if (complete.length >= count) return complete.slice(0, count);
  }
}

/** The shell number (1-based) of the vector (i, j) within `shells`, or 0 when it lies beyond them. */
function shellOf(shells: readonly Shell[], i: number, j: number): number {
  const squared = squaredLength(i, j);
  if (squared > shells[shells.length - 1].squared) return 0;
  const { key } = orbitFigures([[0, 0], [i, j]]);
  const index = shells.findIndex((s) => s.key === key);
  return index + 1;
}

/** Triplet orbits whose three edges all lie within the first `count` shells, ordered by their edge shells. */
function tripletOrbits(shells: readonly Shell[], count: number): { points: Point[]; edges: [number, number, number] }[] {
  if (count === 0) return [];
  const within = shells.slice(0, count);
  const longest = within[within.length - 1].squared;
  const reach = Math.ceil(Math.sqrt(longest)) * 2;
  const vectors: Point[] = [];
  for (let i = -reach; i <= reach; i++) {
    for (let j = -reach; j <= reach; j++) {
      if ((i !== 0 || j !== 0) && shellOf(within, i, j) > 0) vectors.push([i, j]);
    }
  }
  const found = new Map<string, { points: Point[]; edges: [number, number, number] }>();
  for (const u of vectors) {
    for (const w of vectors) {
      const edge = shellOf(within, w[0] - u[0], w[1] - u[1]);
      if (edge === 0 || (u[0] === w[0] && u[1] === w[1])) continue;
      const points: Point[] = [[0, 0], u, w];
      const { key } = orbitFigures(points);
      if (found.has(key)) continue;
      const edges = [shellOf(within, u[0], u[1]), shellOf(within, w[0], w[1]), edge].sort((x, y) => x - y) as [number, number, number];
      found.set(key, { points, edges });
    }
  }
  const keyed = [...found.entries()].map(([key, value]) => ({ key, ...value }));
  keyed.sort((x, y) => x.edges[2] - y.edges[2] || x.edges[0] - y.edges[0] || x.edges[1] - y.edges[1] || (x.key < y.key ? -1 : 1));
  return keyed;
}

/** The neighbour shells of the triangular lattice: squared length (units d²), a vector, and neighbours per site. */
export function neighbourShells(count: number): { squared: number; vector: [number, number]; neighbours: number }[] {
  return pairShellList(count).map((s) => ({
    squared: s.squared,
    vector: [s.vector[0], s.vector[1]],
    neighbours: 2 * orbitFigures([[0, 0], s.vector]).figures.length,
  }));
}

/**
 * The cluster set of an expansion: empty, point, pairs of shells 1…pairShells, triplets whose edges lie within
 * shells 1…tripletShells. Inputs are trusted (0 ≤ pairShells ≤ MAX_PAIR_SHELLS, 0 ≤ tripletShells ≤ MAX_TRIPLET_SHELLS).
 */
export function clusterSet(options: { pairShells: number; tripletShells: number }): ClusterSet {
  const { pairShells, tripletShells } = options;
  const shells = pairShellList(Math.max(pairShells, tripletShells, 1));
  const offsetIndex = new Map<string, number>();
  const offsets: number[] = [];
  const index = ([i, j]: Point) => {
    const key = `${i},${j}`;
    let at = offsetIndex.get(key);
    if (at === undefined) {
      at = offsets.length / 2;
      offsetIndex.set(key, at);
      offsets.push(i, j);
    }
    return at;
  };
  const orbit = (kind: ClusterKind, name: string, shell: number, points: Point[], extra: Partial<ClusterOrbit> = {}): ClusterOrbit => {
    const { figures } = orbitFigures(points);
    const flat = new Int32Array(figures.length * points.length);
    figures.forEach((figure, f) => figure.forEach((p, t) => (flat[f * points.length + t] = index(p))));
    return { kind, name, shell, size: points.length, perSite: figures.length, figures: flat, ...extra };
  };
  const orbits: ClusterOrbit[] = [
    { kind: 'empty', name: 'empty', shell: 0, size: 0, perSite: 1, figures: new Int32Array(0) },
    orbit('point', 'point', 0, [[0, 0]]),
  ];
  for (let s = 0; s < pairShells; s++) {
    orbits.push(orbit('pair', `pair ${s + 1}`, s + 1, [[0, 0], shells[s].vector], { distance: Math.sqrt(shells[s].squared) }));
  }
  for (const t of tripletOrbits(shells, tripletShells)) {
    orbits.push(orbit('triplet', `triplet ${t.edges.join('-')}`, t.edges[2], t.points, { edges: t.edges }));
  }
  return { orbits, offsets: Int32Array.from(offsets), pairShells, tripletShells };
}
