/**
 * Orderly generation of the hole labelings of one supercell, each once up to its translations and stabiliser.
 *
 * A labeling is kept when its ascending site list is the lexicographically smallest of its orbit. Every orbit
 * has a member containing site 0 (translate any hole there) and the smallest one does, so holes[0] = 0. Dropping
 * the largest hole of a smallest list leaves a smallest list, so the search grows lists hole by hole and prunes
 * every partial list that is not smallest (orderly generation; Read, Ann. Discrete Math. 2, 107 (1978); used for
 * fixed-concentration derivative structures by Hart, Nelson & Forcade, Comput. Mater. Sci. 59, 101 (2012)).
 * The test compares the list with its images O(S − h) for O in the stabiliser and h in S (the images that
 * contain site 0); an image equal to S under a pure translation (O = identity, h ≠ 0) marks a superperiodic
 * labeling, which is skipped at output but kept as a prefix. Isolated holes prune while growing.
 *
 * Layout: sites are HNF indices (see quotient.ts); `holes` is the ascending list holes[0..size); sets are bit
 * masks in Int32Array words, site s at bit (s & 31) of word s >> 5; `blocked[s]` counts the holes at or next to s.
 */
import type { SupercellQuotient } from './quotient.ts';

/** What one search visits; all arrays indexed by site or hole count. */
export interface SearchPlan {
  /** Deepest hole count to grow to (≤ sites). */
  readonly maxHoles: number;
  /** wanted[k] = 1 when labelings with k ≥ 1 holes are reported. */
  readonly wanted: Uint8Array;
  /** No two holes nearest neighbours (the caller skips supercells whose steps are supercell vectors). */
  readonly isolated: boolean;
  /** branch[c] = 1 when the subtree with holes[1] = c (c ≥ 1) is searched; branch[0] = 1 reports the one-hole labeling. */
  readonly branch: Uint8Array;
  /** Also report superperiodic labelings (a smaller cell repeats them); default false. */
  readonly superperiodic?: boolean;
  /** Labelings examined before this search (the run's running count continues from here). Default 0. */
  readonly examinedBefore?: number;
  /** Called whenever the run's count of labelings examined reaches a multiple of 4096. */
  readonly onTick?: () => void;
}

/** Verdicts of `LabelingSearch.test`. */
const NOT_SMALLEST = 0;
const PRIMITIVE = 1;
const SUPERPERIODIC = 2;

export class LabelingSearch {
  /** Ascending hole sites of the current labeling, holes[0..size). */
  readonly holes: Int32Array;
  /** Number of holes of the current labeling. */
  size = 1;
  /** Labelings tested so far in the run (partial ones included), starting from plan.examinedBefore. */
  examined: number;

  private readonly n: number;
  private readonly words: number;
  private readonly mask: Int32Array;
  private readonly image: Int32Array;
  private readonly blocked: Int32Array;
  private readonly cursor: Int32Array;
  private readonly keepAll: boolean;
  private pending: boolean;
  private primitive = true;
  private finished = false;

  constructor(
    private readonly quotient: SupercellQuotient,
    private readonly plan: SearchPlan,
  ) {
    const n = quotient.sites;
    this.n = n;
    this.examined = plan.examinedBefore ?? 0;
    this.keepAll = plan.superperiodic ?? false;
    this.words = (n + 31) >> 5;
    this.holes = new Int32Array(plan.maxHoles + 1);
    this.mask = new Int32Array(this.words);
    this.image = new Int32Array(this.words);
    this.blocked = new Int32Array(n);
    this.cursor = new Int32Array(plan.maxHoles + 2);
    this.mask[0] = 1;
    this.cursor[1] = 1;
    if (plan.isolated) this.block(0, 1);
    this.pending = plan.branch[0] === 1;
  }

  /** First hole of the branch being searched (0 while on the one-hole labeling), for progress. */
  get branchSite(): number {
    return this.size >= 2 ? this.holes[1] : this.cursor[1] - 1;
  }

  /** Advances to the next reported labeling (in holes[0..size)); false when the search is done. */
  next(): boolean {
    if (this.finished) return false;
    const { n, holes, mask, blocked, cursor, plan } = this;
    for (;;) {
      if (this.pending) {
        this.pending = false;
        if (plan.wanted[this.size] === 1 && (this.primitive || this.keepAll)) return true;
      }
      const size = this.size;
      if (size < plan.maxHoles) {
        let verdict = NOT_SMALLEST;
        let c = cursor[size];
        for (; c < n; c++) {
          if (size === 1 && plan.branch[c] !== 1) continue;
          if (plan.isolated && blocked[c] !== 0) continue;
          holes[size] = c;
          mask[c >> 5] |= 1 << (c & 31);
          if ((++this.examined & 4095) === 0) plan.onTick?.();
          verdict = this.test(size + 1);
          if (verdict !== NOT_SMALLEST) break;
          mask[c >> 5] &= ~(1 << (c & 31));
        }
        if (verdict !== NOT_SMALLEST) {
          cursor[size] = c + 1;
          cursor[size + 1] = c + 1;
          this.size = size + 1;
          this.primitive = verdict === PRIMITIVE;
          this.pending = true;
          if (plan.isolated) this.block(c, 1);
          continue;
        }
      }
      if (size === 1) {
        this.finished = true;
        return false;
      }
      const last = holes[size - 1];
      mask[last >> 5] &= ~(1 << (last & 31));
      if (plan.isolated) this.block(last, -1);
      this.size = size - 1;
    }
  }

  private block(site: number, delta: number): void {
    const neighbour = this.quotient.neighbour;
    const blocked = this.blocked;
    blocked[site] += delta;
    for (let t = 0; t < 6; t++) blocked[neighbour[site * 6 + t]] += delta;
  }

  /** Is holes[0..m) (also in `mask`) the smallest of its orbit, and is it primitive? */
  private test(m: number): number {
    const { n, holes, mask, image, words } = this;
    const { difference, permutation } = this.quotient;
    const ops = this.quotient.operations.length;
    let periodic = false;
    for (let o = 0; o < ops; o++) {
      const base = o * n;
      for (let t = o === 0 ? 1 : 0; t < m; t++) {
        const shift = holes[t];
        for (let w = 0; w < words; w++) image[w] = 0;
        for (let x = 0; x < m; x++) {
          const y = permutation[base + difference[holes[x] * n + shift]];
          image[y >> 5] |= 1 << (y & 31);
        }
        // Equal-size sets: the image is smaller iff it holds the smallest site of the symmetric difference.
        let w = 0;
        for (; w < words; w++) {
          const d = image[w] ^ mask[w];
          if (d !== 0) {
            if ((image[w] & d & -d) !== 0) return NOT_SMALLEST;
            break;
          }
        }
        if (w === words && o === 0) periodic = true;
      }
    }
    return periodic ? SUPERPERIODIC : PRIMITIVE;
  }
}
