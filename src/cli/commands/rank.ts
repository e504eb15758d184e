/**
 * `lacuna rank`: enumerated patterns ranked by tight-binding band energy per atom, within groups of equal η.
 */
import { enumerateStructures, type EnumerateOptions } from '../../enumerate/index.ts';
import { invalid } from '../../io/invalid.ts';
import { hnfRows, patternToSheet } from '../../lattice/pattern.ts';
import { DEFAULT_MESH, rankByBandEnergy } from '../../tb/index.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { DOPING_FLAG, JSON_FLAG, MESH_FLAG, MODEL_CAVEAT, PARAMS_FLAG, SMEARING_FLAG } from '../commonFlags.ts';
import type { Command, CliIo } from '../io.ts';
import { resolveParameters } from '../parameters.ts';
import { ProgressLine } from '../progress.ts';
import { estimatedSeconds, MAX_ESTIMATED_SECONDS } from '../workEstimate.ts';

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
    mesh: MESH_FLAG,
    smearing: SMEARING_FLAG,
    json: JSON_FLAG,
  },
};

function run(argv: readonly string[], io: CliIo): number {
  const { flags } = parseArgs(spec, argv);
  if (!flags.sites) invalid('--sites', undefined, 'required, e.g. --sites 3-12');
  if (!flags.holes) invalid('--holes', undefined, 'required, e.g. --holes 1-2');
  const params = resolveParameters(flags.params as string | undefined, io);
  const options: EnumerateOptions = { sites: flags.sites as [number, number], holes: flags.holes as [number, number], isolated: flags.isolated === true };
  if (flags.eta) options.holeDensity = flags.eta as [number, number];
  const patterns: { name: string; pattern: import('../../lattice/sheet.ts').Pattern }[] = [];
  for (const structure of enumerateStructures(options)) {
    if (structure.sites === structure.holes) continue; // no atoms left to solve
    if (patterns.length >= MAX_RANKED) invalid('--sites', `${flags.sites}`, `more than ${MAX_RANKED} patterns to rank; narrow --sites, --holes or --eta`);
    const name = structure.phase ?? `N${structure.sites}k${structure.holes}:${JSON.stringify(hnfRows(structure.pattern.supercell))}${JSON.stringify(structure.pattern.vacancies)}`;
    patterns.push({ name, pattern: structure.pattern });
  }
  const mesh = (flags.mesh as number | undefined) ?? DEFAULT_MESH;
  const seconds = patterns.reduce((sum, p) => sum + estimatedSeconds(patternToSheet(p.pattern), mesh * mesh), 0);
  if (seconds > MAX_ESTIMATED_SECONDS) invalid('--mesh', mesh, `about ${(seconds / 3600).toFixed(1)} h for ${patterns.length} patterns; use a smaller mesh or narrow --sites, --holes or --eta`);
  const progress = new ProgressLine(io.err, 'patterns');
  const ranking = rankByBandEnergy(patterns, params, {
    doping: flags.doping as number | undefined,
    mesh: flags.mesh as number | undefined,
    smearing: flags.smearing as number | undefined,
    onProgress: (done, total) => progress.update(done, done / total),
  });
  progress.done();
  if (flags.json) {
    io.out(`${JSON.stringify({
      parameters: ranking.parameters,
      note: ranking.note,
      groups: ranking.groups.map((g) => ({
        hole_density: g.holeDensity,
        patterns: g.patterns.map((p) => ({ name: p.name, fermi: p.fermi, band_energy_per_atom: p.bandEnergyPerAtom, above_lowest: p.aboveLowest })),
      })),
    })}\n`);
    return 0;
  }
  const lines = [`parameters ${ranking.parameters}; ${ranking.note}`];
  for (const group of ranking.groups) {
    lines.push(`η = ${group.holeDensity.toFixed(4)}`);
    for (const p of group.patterns) lines.push(`  ${p.aboveLowest.toFixed(4).padStart(9)} eV/atom above lowest   E_F ${p.fermi.toFixed(3)}   ${p.name}`);
  }
  lines.push(MODEL_CAVEAT);
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

export const rankCommand: Command = { spec, run };
