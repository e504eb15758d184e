/**
 * A slow, independent enumeration for the tests: shares nothing with src/enumerate, only the lattice basics
 * (HNF list, the 12 operations of 6mm, the nearest-neighbour steps).
 *
 * Every index-n supercell lattice L contains n·Z² (the quotient Z²/L has order n), so every labeling of L is a
 * labeling of the n×n torus Z²/n·Z². On the torus a structure is canonicalised by brute force: the smallest
 * hole set (as a bit string, lowest differing cell decides) over all 12 operations and all translations that
 * bring a hole to the origin. Its smallest period has n²/|{t : S + t = S}| sites (common practice: the orbit-
 * stabiliser count on the torus).
 * Torus cells are x + n·y for (x mod n, y mod n).
 */
import { hnfsOfIndex, type Hnf } from '../../src/lattice/hnf.ts';
import { NEAREST_STEPS, POINT_GROUP_6MM } from '../../src/lattice/triangular.ts';

function mod(x: number, m: number): number {
  return ((x % m) + m) % m;
}

/** Look-up tables of the n×n torus. */
class Torus {
  readonly cells: number;
  /** shifted[c·cells + o] = cell c − cell o. */
  readonly shifted: Int32Array;
  /** turned[g·cells + c] = operation g applied to cell c. */
  readonly turned: Int32Array;
  /** step[c·6 + t] = cell c + NEAREST_STEPS[t]. */
  readonly step: Int32Array;

  constructor(readonly n: number) {
    const cells = n * n;
    this.cells = cells;
    this.shifted = new Int32Array(cells * cells);
    for (let c = 0; c < cells; c++) {
      for (let o = 0; o < cells; o++) {
        this.shifted[c * cells + o] = mod((c % n) - (o % n), n) + n * mod(Math.floor(c / n) - Math.floor(o / n), n);
      }
    }
    this.turned = new Int32Array(12 * cells);
    POINT_GROUP_6MM.forEach(([m00, m01, m10, m11], g) => {
      for (let c = 0; c < cells; c++) {
        const x = c % n, y = Math.floor(c / n);
        this.turned[g * cells + c] = mod(m00 * x + m01 * y, n) + n * mod(m10 * x + m11 * y, n);
      }
    });
    this.step = new Int32Array(cells * 6);
    for (let c = 0; c < cells; c++) {
      NEAREST_STEPS.forEach(([dx, dy], t) => {
        this.step[c * 6 + t] = mod((c % n) + dx, n) + n * mod(Math.floor(c / n) + dy, n);
      });
    }
  }

  /** For each torus cell, the index j·a + i of its class modulo L, reduced by hand (y by row two, then x by row one). */
  classes(h: Hnf): Int32Array {
    const out = new Int32Array(this.cells);
    for (let c = 0; c < this.cells; c++) {
      const x = c % this.n, y = Math.floor(c / this.n);
      const q = Math.floor(y / h.c);
      out[c] = (y - q * h.c) * h.a + mod(x - q * h.b, h.a);
    }
    return out;
  }

  /** Number of torus translations mapping the hole set onto itself. */
  period(holes: readonly number[], occupied: Uint8Array): number {
    if (holes.length === 0) return this.cells;
    let count = 0;
    for (const target of holes) {
      // The translation taking holes[0] to target is −(holes[0] − target): shift by (c − holes[0]) + target.
      let keeps = true;
      for (const c of holes) {
        const moved = this.shifted[this.shifted[c * this.cells + holes[0]] * this.cells + this.negate(target)];
        if (occupied[moved] !== 1) {
          keeps = false;
          break;
        }
      }
      if (keeps) count++;
    }
    return count;
  }

  private negate(c: number): number {
    return this.shifted[0 * this.cells + c];
  }

  /** Brute-force key: the smallest image bit string over the 12 operations and hole-to-origin translations. */
  key(holes: readonly number[]): string {
    if (holes.length === 0) return 'empty';
    const words = Math.ceil(this.cells / 32);
    const best = new Uint32Array(words);
    const image = new Uint32Array(words);
    let first = true;
    for (let g = 0; g < 12; g++) {
      for (const origin of holes) {
        image.fill(0);
        for (const c of holes) {
          const target = this.turned[g * this.cells + this.shifted[c * this.cells + origin]];
          image[target >>> 5] |= 1 << (target & 31);
        }
        let smaller = first;
        for (let w = 0; w < words && !smaller; w++) {
          if (image[w] === best[w]) continue;
          const d = (image[w] ^ best[w]) >>> 0;
          smaller = (image[w] & d & -d) !== 0;
          break;
        }
        if (smaller) {
          best.set(image);
          first = false;
        }
      }
    }
    return Array.from(best, (w) => w.toString(16)).join('.');
  }

  /** True when no hole has a hole among its six nearest neighbours (itself included, on a 1×1 torus). */
  isolated(holes: readonly number[], occupied: Uint8Array): boolean {
    return holes.every((c) => {
      for (let t = 0; t < 6; t++) if (occupied[this.step[c * 6 + t]] === 1) return false;
      return true;
    });
  }
}

/** What a brute-force structure is. */
export interface TorusStructure {
  holes: number;
  isolated: boolean;
}

const tori = new Map<number, Torus>();
function torusOf(n: number): Torus {
  let torus = tori.get(n);
  if (!torus) tori.set(n, (torus = new Torus(n)));
  return torus;
}

/** Brute-force key of the pattern (supercell h, vacant points) drawn on the n×n torus (n·Z² ⊂ L required). */
export function torusKeyOf(n: number, h: Hnf, vacancies: readonly (readonly [number, number])[]): string {
  const torus = torusOf(n);
  const classes = torus.classes(h);
  const wanted = new Set(vacancies.map(([i, j]) => {
    const q = Math.floor(j / h.c);
    return (j - q * h.c) * h.a + mod(i - q * h.b, h.a);
  }));
  const holes: number[] = [];
  for (let c = 0; c < torus.cells; c++) if (wanted.has(classes[c])) holes.push(c);
  return torus.key(holes);
}

/** All structures whose smallest cell has exactly n sites, by brute-force key: every HNF, every subset. */
export function bruteForceStructures(n: number): Map<string, TorusStructure> {
  const torus = torusOf(n);
  const found = new Map<string, TorusStructure>();
  const occupied = new Uint8Array(torus.cells);
  for (const h of hnfsOfIndex(n)) {
    const classes = torus.classes(h);
    for (let subset = 0; subset < 1 << n; subset++) {
      const holes: number[] = [];
      for (let c = 0; c < torus.cells; c++) if ((subset >> classes[c]) & 1) holes.push(c);
      occupied.fill(0);
      for (const c of holes) occupied[c] = 1;
      if (torus.cells / torus.period(holes, occupied) !== n) continue;
      const key = torus.key(holes);
      if (!found.has(key)) found.set(key, { holes: holes.length / n, isolated: torus.isolated(holes, occupied) });
    }
  }
  return found;
}
