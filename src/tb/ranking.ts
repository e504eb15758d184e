/**
 * Ranking of vacancy patterns by band energy per atom, within groups of equal hole density η.
 * Isolated-hole patterns of equal η have the same number of nearest-neighbour bonds per atom, so their band
 * energies compare on equal terms; across different η they do not (different bond counts and electron counts),
 * and the result says so.
 */
import { holeDensity, patternToSheet } from '../lattice/pattern.ts';
import { reducedSheet } from '../lattice/reducedCell.ts';
import type { Pattern } from '../lattice/sheet.ts';
import { fill, type FillOptions } from './fill.ts';
import { chooseMesh, type MeshChoiceOptions, type MeshRule } from './meshDensity.ts';
import { TightBindingModel } from './model.ts';
import type { ParameterSet } from './params.ts';

/** One ranked pattern. */
export interface RankedPattern {
  name: string;
  fermi: number;
  bandEnergyPerAtom: number;
  /** Band energy per atom above the lowest of its group (eV, ≥ 0). */
  aboveLowest: number;
  /** Mesh side this pattern was solved on, and the rule that chose it (meshDensity.ts). */
  mesh: number;
  meshRule: MeshRule;
}

/**
 * Options of a ranking: doping and width as for fill; the mesh by meshDensity.ts's rule with `equalDensity` on
 * unless `mesh` is given — every pattern at the same k-point density (DEFAULT_KSPACING or `kspacing`), so band
 * energies per atom compare on equal terms and a large cell costs no more k-points than its zone needs.
 */
export type RankingOptions = Omit<FillOptions, 'onProgress' | 'mesh'> & Omit<MeshChoiceOptions, 'equalDensity'> & {
  onProgress?: (patternsDone: number, total: number) => void;
};

/** Ranking result: one group per hole density, lowest band energy first. */
export interface RankingResult {
  parameters: string;
  groups: { holeDensity: number; patterns: RankedPattern[] }[];
  /** Why the comparison holds within a group only. */
  note: string;
}

/** Hole densities closer than this are one group. */
const SAME_ETA = 1e-9;

/**
 * The band energy per atom of one pattern as a ranking computes it: in the pattern's reduced cell (the same sheet,
 * but its square mesh needs far fewer points than an elongated HNF cell's), at the ranking's k-point density.
 */
export function rankingFill(
  pattern: Pattern,
  params: ParameterSet,
  options: Omit<RankingOptions, 'onProgress'> = {},
): { fermi: number; bandEnergyPerAtom: number; mesh: number; meshRule: MeshRule } {
  const { mesh: givenMesh, kspacing, ...fillOptions } = options;
  const sheet = reducedSheet(patternToSheet(pattern));
  const choice = chooseMesh(sheet, { mesh: givenMesh, kspacing, equalDensity: true });
  const result = fill(new TightBindingModel(sheet, params), { ...fillOptions, mesh: choice.mesh });
  return { fermi: result.fermi, bandEnergyPerAtom: result.bandEnergyPerAtom, mesh: choice.mesh, meshRule: choice.rule };
}

export function rankByBandEnergy(
  patterns: readonly { name: string; pattern: Pattern }[],
  params: ParameterSet,
  options: RankingOptions = {},
): RankingResult {
  const { onProgress, ...solveOptions } = options;
  const solved = patterns.map(({ name, pattern }, done) => {
    const result = rankingFill(pattern, params, solveOptions);
    onProgress?.(done + 1, patterns.length);
    return { name, eta: holeDensity(pattern), ...result };
  });
  return groupRanking(solved, params.name);
}

/** One solved pattern, as rankingFill gives it, with its name and hole density: what groupRanking sorts. */
export type SolvedPattern = ReturnType<typeof rankingFill> & { name: string; eta: number };

/**
 * Patterns solved one by one (here, or elsewhere in any order — the CLI spreads them over threads) grouped by
 * hole density, lowest band energy first. The order of `solved` does not matter.
 */
export function groupRanking(solved: readonly SolvedPattern[], parameters: string): RankingResult {
  const groups: { holeDensity: number; patterns: RankedPattern[] }[] = [];
  for (const { name, eta, fermi, bandEnergyPerAtom, mesh, meshRule } of solved) {
    let group = groups.find((g) => Math.abs(g.holeDensity - eta) < SAME_ETA);
    if (!group) {
      group = { holeDensity: eta, patterns: [] };
      groups.push(group);
    }
    group.patterns.push({ name, fermi, bandEnergyPerAtom, aboveLowest: 0, mesh, meshRule });
  }
  groups.sort((a, b) => a.holeDensity - b.holeDensity);
  for (const group of groups) {
    // Ties broken by name, so that the order never depends on the order the patterns were solved in.
    group.patterns.sort((a, b) => a.bandEnergyPerAtom - b.bandEnergyPerAtom || (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
    const lowest = group.patterns[0].bandEnergyPerAtom;
    for (const p of group.patterns) p.aboveLowest = p.bandEnergyPerAtom - lowest;
  }
  return {
    parameters,
    groups,
    note: 'band energies per atom compare within one hole density η only (equal bond counts for isolated holes); not across η',
  };
}
