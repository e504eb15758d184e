/**
 * Correlation functions of a vacancy pattern: for each cluster orbit α,
 *   Φ_α = (1/(N·m_α)) Σ_sites p Σ_figures f Π_{t ∈ f} σ(p + t),
 * with σ = +1 on a boron site and −1 on a vacancy, N the lattice sites of the supercell and m_α the orbit's
 * clusters per site (Sanchez, Ducastelle & Gratias, Physica A 128, 334 (1984)). Sums over the supercell with its
 * periodic images are the averages over the infinite periodic pattern, so Φ does not depend on the cell chosen.
 * The pure lattice (no vacancies) has every Φ = 1; Φ_empty = 1 always.
 *
 * Layout: spins σ in a Float64Array by HNF site index s = j·a + i; per supercell a table of the site reached
 * from every site by every offset of the cluster set, `table[k·N + s]` (Int32Array), built once and cached.
 */
import { reduceSite, type Hnf } from '../../lattice/hnf.ts';
import type { ClusterSet } from './clusters.ts';

/** Supercell tables kept before the cache is emptied (the enumerator visits supercells in order, so few are live). */
const CACHE_LIMIT = 512;

export class CorrelationEngine {
  private readonly tables = new Map<string, Int32Array>();
  private spins = new Float64Array(64);

  constructor(readonly set: ClusterSet) {}

  /** Number of correlation functions (orbits, the empty one included). */
  get size(): number {
    return this.set.orbits.length;
  }

  private table(h: Hnf): Int32Array {
    const key = `${h.a},${h.b},${h.c}`;
    let table = this.tables.get(key);
    if (table) return table;
    if (this.tables.size >= CACHE_LIMIT) this.tables.clear();
    const n = h.a * h.c;
    const offsets = this.set.offsets;
    const count = offsets.length / 2;
    table = new Int32Array(count * n);
    for (let s = 0; s < n; s++) {
      const i = s % h.a;
      const j = (s - i) / h.a;
      for (let k = 0; k < count; k++) {
        const [ri, rj] = reduceSite(h, i + offsets[2 * k], j + offsets[2 * k + 1]);
        table[k * n + s] = rj * h.a + ri;
      }
    }
    this.tables.set(key, table);
    return table;
  }

  /**
   * Writes Φ_α of the pattern (supercell h, vacant sites given as reduced points or as HNF indices) into
   * out[0…orbits) and returns out. Vacancies are trusted: in the supercell, each once.
   */
  correlate(h: Hnf, vacancies: readonly (readonly [number, number])[] | ArrayLike<number>, out: Float64Array = new Float64Array(this.size)): Float64Array {
    const n = h.a * h.c;
    if (this.spins.length < n) this.spins = new Float64Array(Math.max(n, 2 * this.spins.length));
    const spins = this.spins;
    spins.fill(1, 0, n);
    for (let v = 0; v < vacancies.length; v++) {
      const entry = (vacancies as ArrayLike<unknown>)[v];
      if (typeof entry === 'number') {
        spins[entry] = -1;
      } else {
        const [i, j] = entry as readonly [number, number];
        const [ri, rj] = reduceSite(h, i, j);
        spins[rj * h.a + ri] = -1;
      }
    }
    const table = this.table(h);
    const orbits = this.set.orbits;
    for (let o = 0; o < orbits.length; o++) {
      const { size, perSite, figures } = orbits[o];
      if (size === 0) {
        out[o] = 1;
        continue;
      }
      let sum = 0;
      for (let f = 0; f < perSite; f++) {
        const base = f * size;
        for (let s = 0; s < n; s++) {
          let product = 1;
          for (let t = 0; t < size; t++) product *= spins[table[figures[base + t] * n + s]];
          sum += product;
        }
      }
      out[o] = sum / (n * perSite);
    }
    return out;
  }
}
