/**
 * The candidate search of the view: enumerated vacancy patterns filtered by a measured cell, with what the
 * table shows of each. Pure; the search worker runs it.
 */
import { enumerateStructures, type EnumerateOptions } from '../enumerate/index.ts';
import { hnfRows, patternCell } from '../lattice/pattern.ts';
import { periodicityMismatch, periodicityOf, reducedPeriodicity } from '../lattice/periodicity.ts';
import type { Pattern } from '../lattice/sheet.ts';
import { countingRuleDoping } from '../tb/countingRule.ts';
import type { SearchState } from './state.ts';

/** One row of the candidates table. */
export interface Candidate {
  sites: number;
  holes: number;
  eta: number;
  pattern: Pattern;
  /** Preset name when the pattern is a named phase. */
  phase?: string;
  /** Reduced cell lengths (Å) and angle (°) at the bond length searched. */
  lattice: { a: number; b: number; gammaDeg: number };
  /** Counting-rule doping δ = 8/(3(1 − η)) − 3 (e/atom). */
  ruleDoping: number;
  /** Band energy per atom (eV), filled in by a ranking run. */
  bandEnergy?: number;
  /** Its band energy above the lowest of equal η in the list (eV). */
  aboveLowest?: number;
  /** Mesh the band energy was computed on. */
  mesh?: number;
}

/** Most candidates one search lists; the rest are counted and reported, not kept. */
export const MAX_CANDIDATES = 3000;

export interface CandidateList {
  candidates: Candidate[];
  /** Structures that passed the filters, including those past MAX_CANDIDATES. */
  matched: number;
  truncated: boolean;
}

/** Patterns of the search, filtered by the measured cell, in the enumerator's order. */
export function findCandidates(search: SearchState, bond: number, onProgress?: (fraction: number) => void): CandidateList {
  const options: EnumerateOptions = { sites: search.sites, holes: search.holes, isolated: search.isolated, bond };
  if (search.eta) options.holeDensity = search.eta;
  if (onProgress) options.onProgress = (p) => onProgress(p.fraction);
  const target = search.cell && periodicityOf(search.cell.a, search.cell.b, search.cell.gamma);
  const candidates: Candidate[] = [];
  let matched = 0;
  for (const structure of enumerateStructures(options)) {
    if (structure.sites === structure.holes) continue; // every site vacant: nothing to draw or solve
    const lattice = reducedPeriodicity(patternCell(structure.pattern));
    if (target && search.cell) {
      const miss = periodicityMismatch(lattice, target);
      if (miss.length > search.cell.lengthTolerance || miss.angleDeg > search.cell.angleTolerance) continue;
    }
    matched++;
    if (candidates.length >= MAX_CANDIDATES) continue;
    const candidate: Candidate = {
      sites: structure.sites,
      holes: structure.holes,
      eta: structure.eta,
      pattern: structure.pattern,
      lattice: { a: lattice.a, b: lattice.b, gammaDeg: lattice.gammaDeg },
      ruleDoping: countingRuleDoping(structure.eta),
    };
    if (structure.phase !== undefined) candidate.phase = structure.phase;
    candidates.push(candidate);
  }
  return { candidates, matched, truncated: matched > candidates.length };
}

/** A short name for a candidate: its phase, or N<sites>k<holes> with its supercell and holes. */
export function candidateName(candidate: Pick<Candidate, 'phase' | 'sites' | 'holes' | 'pattern'>): string {
  if (candidate.phase) return candidate.phase;
  const rows = hnfRows(candidate.pattern.supercell);
  return `N${candidate.sites}k${candidate.holes} ${JSON.stringify(rows)} ${JSON.stringify(candidate.pattern.vacancies)}`;
}

export type CandidateOrder = 'eta' | 'sites' | 'band' | 'rule';

/**
 * Sorted copy: by η (then sites), by cell size, by band energy within equal η (unranked last), or by the
 * counting-rule doping.
 */
export function sortCandidates(list: readonly Candidate[], order: CandidateOrder): Candidate[] {
  const byEta = (x: Candidate, y: Candidate) => x.eta - y.eta || x.sites - y.sites;
  const compare: Record<CandidateOrder, (x: Candidate, y: Candidate) => number> = {
    eta: byEta,
    sites: (x, y) => x.sites - y.sites || x.eta - y.eta,
    band: (x, y) => x.eta - y.eta || (x.bandEnergy ?? Infinity) - (y.bandEnergy ?? Infinity) || x.sites - y.sites,
    rule: (x, y) => x.ruleDoping - y.ruleDoping || x.sites - y.sites,
  };
  return [...list].sort(compare[order]);
}
