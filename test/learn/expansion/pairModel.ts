/**
 * A known pair model on the triangular lattice, evaluated by an independent route: every pair of sites of the
 * supercell and its periodic images is found by Cartesian distance (no cluster orbits, no figure tables), and
 *   e = J_empty + J_point·⟨σ⟩ + Σ_k J_k·(1/N)·½·Σ_p Σ_{q at distance d_k} σ_p σ_q   (σ = +1 boron, −1 vacancy),
 * the pair sum counting each pair once per site's share. Shell distances 1, √3, 2 (units of d): geometry of the
 * triangular lattice, |i·a1 + j·a2|² = i² + ij + j² (common practice).
 */
import { enumerateStructures } from '../../../src/enumerate/index.ts';
import { latticePoint } from '../../../src/lattice/triangular.ts';
import type { Pattern } from '../../../src/lattice/sheet.ts';
import { mulberry32 } from '../../../src/stm/synthetic.ts';

export const SHELL_DISTANCES = [1, Math.sqrt(3), 2];

/** [J_empty, J_point, J_pair1, J_pair2, J_pair3] (eV), an invented model for the tests. */
export const KNOWN_ECI = [-3.05, -3.2, 0.081, -0.017, 0.012];

/** Energy per lattice site of the pair model, by brute force over Cartesian distances. */
export function pairModelEnergy(pattern: Pattern, eci: readonly number[] = KNOWN_ECI): number {
  const { a, b, c } = pattern.supercell;
  const n = a * c;
  const vacant = new Set(pattern.vacancies.map(([i, j]) => `${i},${j}`));
  const sites: { x: number; y: number; spin: number }[] = [];
  for (let j = 0; j < c; j++) {
    for (let i = 0; i < a; i++) {
      const [x, y] = latticePoint(i, j, 1);
      sites.push({ x, y, spin: vacant.has(`${i},${j}`) ? -1 : 1 });
    }
  }
  const [t1x, t1y] = latticePoint(a, 0, 1);
  const [t2x, t2y] = latticePoint(b, c, 1);
  // Images far enough that every pair closer than 2 is seen: |l| ≤ 4 covers the height c·√3/2 of the cell plus 2,
  // and m the width a + c/2 of the sites plus l·(b + c/2), the x of l times the second vector, in steps of a.
  const lReach = 4;
  const mReach = Math.ceil((a + c / 2 + lReach * (b + c / 2) + 3) / a) + 1;
  let energy = eci[0] + eci[1] * sites.reduce((sum, s) => sum + s.spin, 0) / n;
  const pairs = [0, 0, 0];
  for (const p of sites) {
    for (const q of sites) {
      for (let m = -mReach; m <= mReach; m++) {
        for (let l = -lReach; l <= lReach; l++) {
          const dx = q.x + m * t1x + l * t2x - p.x;
          const dy = q.y + m * t1y + l * t2y - p.y;
          const d = Math.hypot(dx, dy);
          SHELL_DISTANCES.forEach((shell, k) => {
            if (Math.abs(d - shell) < 1e-9) pairs[k] += p.spin * q.spin;
          });
        }
      }
    }
  }
  pairs.forEach((sum, k) => (energy += (eci[2 + k] * 0.5 * sum) / n));
  return energy;
}

/** Every enumerated pattern with N1…N2 sites (at least one atom; optionally isolated holes), in the enumerator's order. */
export function patternPool(sites: [number, number], holes: [number, number], isolated = false): Pattern[] {
  const out: Pattern[] = [];
  for (const s of enumerateStructures({ sites, holes, isolated })) if (s.holes < s.sites) out.push(s.pattern);
  return out;
}

/** The pool in a fixed random order (Fisher–Yates with a seeded generator). */
export function shuffled<T>(list: readonly T[], seed: number): T[] {
  const random = mulberry32(seed);
  const out = [...list];
  for (let i = out.length - 1; i > 0; i--) {
    const k = Math.floor(random() * (i + 1));
    [out[i], out[k]] = [out[k], out[i]];
  }
  return out;
}

/** Standard normal deviates from a seeded generator (Box–Muller). */
export function gaussian(seed: number): () => number {
  const random = mulberry32(seed);
  return () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
}
