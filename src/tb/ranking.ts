/**
 * Ranking of vacancy patterns by band energy per atom, within groups of equal hole density η.
 * Isolated-hole patterns of equal η have the same number of nearest-neighbour bonds per atom, so their band
 * energies compare on equal terms; across different η they do not (different bond counts and electron counts),
 * and the result says so.
 */
import { holeDensity, patternToSheet } from '../lattice/pattern.ts';
import type { Pattern } from '../lattice/sheet.ts';
import { fill, type FillOptions } from './fill.ts';
import { TightBindingModel } from './model.ts';
import type { ParameterSet } from './params.ts';

/** One ranked pattern. */
export interface RankedPattern {
  name: string;
  fermi: number;
  bandEnergyPerAtom: number;
  /** Band energy per atom above the lowest of its group (eV, ≥ 0). */
  aboveLowest: number;
}

/** Ranking result: one group per hole density, lowest band energy first. */
export interface RankingResult {
  parameters: string;
  groups: { holeDensity: number; patterns: RankedPattern[] }[];
  /** Why the comparison holds within a group only. */
  note: string;
}

/** Hole densities closer than this are one group. */
const SAME_ETA = 1e-9;

export function rankByBandEnergy(
  patterns: readonly { name: string; pattern: Pattern }[],
  params: ParameterSet,
  options: Omit<FillOptions, 'onProgress'> & { onProgress?: (patternsDone: number, total: number) => void } = {},
): RankingResult {
  const { onProgress, ...fillOptions } = options;
  const groups: { holeDensity: number; patterns: RankedPattern[] }[] = [];
  for (const [done, { name, pattern }] of patterns.entries()) {
    const eta = holeDensity(pattern);
    const result = fill(new TightBindingModel(patternToSheet(pattern), params), fillOptions);
    onProgress?.(done + 1, patterns.length);
    let group = groups.find((g) => Math.abs(g.holeDensity - eta) < SAME_ETA);
    if (!group) {
      group = { holeDensity: eta, patterns: [] };
      groups.push(group);
    }
    group.patterns.push({ name, fermi: result.fermi, bandEnergyPerAtom: result.bandEnergyPerAtom, aboveLowest: 0 });
  }
  groups.sort((a, b) => a.holeDensity - b.holeDensity);
  for (const group of groups) {
    group.patterns.sort((a, b) => a.bandEnergyPerAtom - b.bandEnergyPerAtom);
    const lowest = group.patterns[0].bandEnergyPerAtom;
    for (const p of group.patterns) p.aboveLowest = p.bandEnergyPerAtom - lowest;
  }
  return {
    parameters: params.name,
    groups,
    note: 'band energies per atom compare within one hole density η only (equal bond counts for isolated holes); not across η',
  };
}
