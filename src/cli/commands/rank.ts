/**
 * `lacuna rank`: enumerated patterns ranked by tight-binding band energy per atom, within groups of equal η.
 */
import { enumerateStructures, type EnumerateOptions } from '../../enumerate/index.ts';
import { invalid } from '../../validate/invalid.ts';
import { hnfRows, patternToSheet } from '../../lattice/pattern.ts';
import { reducedSheet } from '../../lattice/reducedCell.ts';
import { DEFAULT_KSPACING, groupRanking, rankByBandEnergy, type RankingOptions, type SolvedPattern } from '../../tb/index.ts';
import { mapInThreads, threadCount, THREADS_FROM_SECONDS } from '../threads.ts';
import { parseArgs, rangeText, type CommandSpec } from '../args.ts';
import { DOPING_FLAG, JSON_FLAG, KSPACING_FLAG, MESH_FLAG, MODEL_CAVEAT, PARAMS_FLAG, PROGRESS_FLAG, SMEARING_FLAG } from '../commonFlags.ts';
import type { Command, CliIo } from '../io.ts';
import { meshChoiceOf, resolveParameters } from '../parameters.ts';
import { ProgressLine } from '../progress.ts';
import { estimatedSeconds, MAX_ESTIMATED_SECONDS } from '../workEstimate.ts';
import { readableSeconds } from '../progress.ts';

/** Most patterns one ranking solves: each needs a full mesh, about 0.1 s for an 8-atom cell at M = 36. */
export const MAX_RANKED = 2000;

const spec: CommandSpec = {
  name: 'rank',
  summary: 'rank enumerated patterns by band energy per atom, within each hole density',
  positionals: [],
  flags: {
    sites: { kind: 'integerRange', min: 1, max: 36, placeholder: 'N1-N2', help: 'lattice sites per cell (1–36); required' },
    holes: { kind: 'integerRange', min: 1, max: 36, placeholder: 'K1-K2', help: 'vacancies per cell; required' },
    isolated: { kind: 'switch', help: 'only patterns where no two vacancies are nearest neighbours (equal bond counts within one η)' },
    eta: { kind: 'numberRange', min: 0, max: 1, placeholder: 'η1-η2', help: 'only hole densities in this range' },
    params: PARAMS_FLAG,
    doping: DOPING_FLAG,
    mesh: { ...MESH_FLAG, help: `the same Γ-centred M×M k-mesh for every cell (default: --kspacing ${DEFAULT_KSPACING}, the same density for every cell)` },
    kspacing: KSPACING_FLAG,
    smearing: SMEARING_FLAG,
    threads: { kind: 'integer', min: 1, max: 256, placeholder: 'T', help: `solve on T threads (default: every core when the work is estimated at ${THREADS_FROM_SECONDS} s or more, else 1)` },
    json: JSON_FLAG,
    progress: PROGRESS_FLAG,
  },
};

async function run(argv: readonly string[], io: CliIo): Promise<number> {
  const { flags } = parseArgs(spec, argv);
  if (!flags.sites) invalid('--sites', undefined, 'required, e.g. --sites 3-12');
  if (!flags.holes) invalid('--holes', undefined, 'required, e.g. --holes 1-2');
  if (flags.mesh !== undefined && flags.kspacing !== undefined) invalid('--kspacing', String(flags.kspacing), 'give --mesh or --kspacing, not both');
  const sitesTyped = rangeText(flags.sites as number[]);
  const params = resolveParameters(flags.params as string | undefined, io);
  const options: EnumerateOptions = { sites: flags.sites as [number, number], holes: flags.holes as [number, number], isolated: flags.isolated === true };
  if (flags.eta) options.holeDensity = flags.eta as [number, number];
  const patterns: { name: string; pattern: import('../../lattice/sheet.ts').Pattern }[] = [];
  // The canonical form (as `enumerate` prints it) of each name, so a ranked pattern can be found in its output.
  const canonicalOf = new Map<string, string>();
  for (const structure of enumerateStructures(options)) {
    if (structure.sites === structure.holes) continue; // no atoms left to solve
    if (patterns.length >= MAX_RANKED) invalid('--sites', sitesTyped, `more than ${MAX_RANKED} patterns to rank; narrow --sites, --holes or --eta`);
    const name = structure.phase ?? `N${structure.sites}k${structure.holes}:${JSON.stringify(hnfRows(structure.pattern.supercell))}${JSON.stringify(structure.pattern.vacancies)}`;
    patterns.push({ name, pattern: structure.pattern });
    canonicalOf.set(name, structure.canonical);
  }
  if (patterns.length === 0) {
    const why = `no pattern with atoms left for --sites ${sitesTyped} --holes ${rangeText(flags.holes as number[])}${flags.isolated ? ' --isolated' : ''}${flags.eta ? ` --eta ${rangeText(flags.eta as number[])}` : ''}`;
    if (flags.json) io.out(`${JSON.stringify({ parameters: params.name, note: why, groups: [] })}\n`);
    else io.out(`none: ${why}\n`);
    return 0;
  }
  // Each pattern is solved in its reduced cell (ranking.ts); the estimate uses the same cell and mesh.
  let seconds = 0;
  for (const p of patterns) {
    const sheet = reducedSheet(patternToSheet(p.pattern));
    const m = meshChoiceOf(flags, sheet, true).mesh;
    // Half the mesh: k and −k share one solve (meshStars.ts; the sheet's own symmetry saves more, not counted here).
    seconds += estimatedSeconds(sheet, (m * m) / 2);
  }
  const flag = flags.mesh !== undefined ? '--mesh' : '--kspacing';
  const value = flags.mesh ?? flags.kspacing ?? DEFAULT_KSPACING;
  if (seconds > MAX_ESTIMATED_SECONDS) invalid(flag, String(value), `about ${readableSeconds(seconds)} for ${patterns.length} patterns; use ${flags.mesh !== undefined ? 'a smaller mesh' : 'a larger spacing'} or narrow --sites, --holes or --eta`);
  const threads = threadCount(flags.threads as number | undefined, seconds, patterns.length);
  const progress = new ProgressLine(io.err, 'patterns', { machine: flags.progress === true, job: 'rank' });
  progress.estimate(seconds / threads, `${patterns.length} patterns at ${flags.mesh !== undefined ? `mesh ${flags.mesh}` : `k-spacing ${value} Å⁻¹`}${threads > 1 ? ` on ${threads} threads` : ''}`, { patterns: patterns.length });
  const solveOptions: Omit<RankingOptions, 'onProgress'> = {
    doping: flags.doping as number | undefined,
    mesh: flags.mesh as number | undefined,
    kspacing: flags.kspacing as number | undefined,
    smearing: flags.smearing as number | undefined,
  };
  const onProgress = (done: number, total: number) => progress.update(done, done / total);
  const ranking = threads > 1
    ? groupRanking(await mapInThreads<(typeof patterns)[number], SolvedPattern>('rank', { params, options: solveOptions }, patterns, threads, onProgress), params.name)
    : rankByBandEnergy(patterns, params, { ...solveOptions, onProgress });
  progress.done();
  if (flags.json) {
    io.out(`${JSON.stringify({
      parameters: ranking.parameters,
      note: ranking.note,
      mesh_rule: flags.mesh !== undefined ? 'mesh' : flags.kspacing !== undefined ? 'kspacing' : 'default_kspacing',
      ...(flags.mesh === undefined ? { kspacing: value } : {}),
      groups: ranking.groups.map((g) => ({
        eta: g.holeDensity,
        patterns: g.patterns.map((p) => ({ name: p.name, canonical: canonicalOf.get(p.name), fermi: p.fermi, band_energy_per_atom: p.bandEnergyPerAtom, above_lowest: p.aboveLowest, mesh: p.mesh })),
      })),
    })}\n`);
    return 0;
  }
  const density = flags.mesh !== undefined ? `mesh ${flags.mesh}×${flags.mesh} for every cell (given)` : `k-spacing ${value} Å⁻¹ for every cell (${flags.kspacing !== undefined ? 'given' : 'default'}; each in its reduced cell, mesh side shown per pattern)`;
  const lines = [`parameters ${ranking.parameters}; ${density}; ${ranking.note}`];
  for (const group of ranking.groups) {
    lines.push(`η = ${group.holeDensity.toFixed(4)}`);
    for (const p of group.patterns) lines.push(`  ${p.aboveLowest.toFixed(4).padStart(9)} eV/atom above lowest   E_F ${p.fermi.toFixed(3)}   mesh ${String(p.mesh).padStart(3)}   ${p.name}`);
  }
  lines.push(MODEL_CAVEAT);
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

export const rankCommand: Command = { spec, run };
