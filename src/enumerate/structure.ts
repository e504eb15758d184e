/**
 * A found labeling as a Structure.
 */
import type { Hnf } from '../lattice/hnf.ts';
import type { Pattern } from '../lattice/sheet.ts';
import { formatCanonical } from './canonical.ts';
import { presetPhase } from './phase.ts';
import type { Structure } from './types.ts';

/** The structure of holes[0..count) (ascending HNF site indices, the canonical labeling) in supercell h. */
export function makeStructure(h: Hnf, holes: ArrayLike<number>, count: number, bond: number): Structure {
  const vacancies: [number, number][] = [];
  for (let t = 0; t < count; t++) vacancies.push([holes[t] % h.a, Math.floor(holes[t] / h.a)]);
  const pattern: Pattern = { bond, supercell: { a: h.a, b: h.b, c: h.c }, vacancies };
  const sites = h.a * h.c;
  const canonical = formatCanonical(h, holes, count);
  const structure: Structure = { sites, holes: count, eta: count / sites, pattern, canonical };
  const phase = presetPhase(canonical);
  if (phase !== undefined) structure.phase = phase;
  return structure;
}
