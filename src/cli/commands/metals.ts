/**
 * `lacuna metals`: the η–δ map — for each candidate pattern, the doping it wants (counting rule, σ filling) and
 * the doping each metal gives (Fermi-level alignment), with the counting-rule curve and what is observed.
 * Candidates: the named sheets, or enumerated patterns with --sites and --holes.
 */
import { enumerateStructures, type EnumerateOptions } from '../../enumerate/index.ts';
import { invalid } from '../../validate/invalid.ts';
import { hnfRows, patternToSheet } from '../../lattice/pattern.ts';
import { SHEET_PRESETS } from '../../lattice/presets.ts';
import type { Pattern } from '../../lattice/sheet.ts';
import { dopingMap } from '../../substrate/dopingMap.ts';
import { SUBSTRATES } from '../../substrate/substrates.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { JSON_FLAG, PARAMS_FLAG, SMEARING_FLAG } from '../commonFlags.ts';
import type { CliIo, Command } from '../io.ts';
import { resolveParameters } from '../parameters.ts';
import { ProgressLine } from '../progress.ts';
import { ALIGNMENT_FLAGS, ALIGNMENT_SCOPE, SUBSTRATE_CAVEAT, alignmentJson, alignmentOf } from '../substrateFlags.ts';
import { estimatedSeconds, MAX_ESTIMATED_SECONDS } from '../workEstimate.ts';

/** Most patterns one map solves (each a full mesh). */
export const MAX_MAPPED = 500;
const DEFAULT_MAP_MESH = 24;

const spec: CommandSpec = {
  name: 'metals',
  summary: 'η–δ map: doping each pattern wants (counting rule, σ filling) beside the doping each metal gives',
  positionals: [],
  flags: {
    sites: { kind: 'integerRange', min: 1, max: 24, placeholder: 'N1-N2', help: 'enumerate patterns of these lattice sites per cell (1–24) instead of the named sheets' },
    holes: { kind: 'integerRange', min: 0, max: 24, placeholder: 'K1-K2', help: 'vacancies per cell (with --sites; default 1-3)' },
    isolated: { kind: 'switch', help: 'only patterns where no two vacancies are nearest neighbours' },
    eta: { kind: 'numberRange', min: 0, max: 1, placeholder: 'η1-η2', help: 'only hole densities in this range' },
    params: PARAMS_FLAG,
    mesh: { kind: 'integer', min: 1, max: 200, placeholder: 'M', help: `Γ-centred M×M k-mesh (default ${DEFAULT_MAP_MESH})` },
    smearing: SMEARING_FLAG,
    ...ALIGNMENT_FLAGS,
    json: JSON_FLAG,
  },
};

function candidates(flags: Record<string, unknown>): { name?: string; pattern: Pattern }[] {
  if (!flags.sites) {
    if (flags.holes || flags.isolated || flags.eta) invalid('--sites', undefined, 'required with --holes, --isolated or --eta, e.g. --sites 1-12');
    return SHEET_PRESETS.map((p) => ({ name: p.name, pattern: p.pattern }));
  }
  const options: EnumerateOptions = { sites: flags.sites as [number, number], holes: (flags.holes as [number, number] | undefined) ?? [1, 3], isolated: flags.isolated === true };
  if (flags.eta) options.holeDensity = flags.eta as [number, number];
  const out: { name?: string; pattern: Pattern }[] = [];
  for (const structure of enumerateStructures(options)) {
    if (structure.sites === structure.holes) continue;
    if (out.length >= MAX_MAPPED) invalid('--sites', `${flags.sites}`, `more than ${MAX_MAPPED} patterns; narrow --sites, --holes or --eta`);
    out.push(structure.phase ? { name: structure.phase, pattern: structure.pattern } : { pattern: structure.pattern });
  }
  return out;
}

function run(argv: readonly string[], io: CliIo): number {
  const { flags } = parseArgs(spec, argv);
  const model = alignmentOf(flags);
  const parameters = resolveParameters(flags.params as string | undefined, io);
  const patterns = candidates(flags);
  const mesh = (flags.mesh as number | undefined) ?? DEFAULT_MAP_MESH;
  const seconds = patterns.reduce((sum, p) => sum + estimatedSeconds(patternToSheet(p.pattern), mesh * mesh), 0);
  if (seconds > MAX_ESTIMATED_SECONDS) invalid('--mesh', mesh, `about ${(seconds / 3600).toFixed(1)} h for ${patterns.length} patterns; use a smaller mesh or narrow --sites, --holes or --eta`);
  const progress = new ProgressLine(io.err, 'patterns');
  const map = dopingMap(patterns, {
    substrates: SUBSTRATES, parameters, mesh, smearing: flags.smearing as number | undefined, ...model,
    onProgress: (done, total) => progress.update(done, done / total),
  });
  progress.done();
  if (flags.json) {
    io.out(`${JSON.stringify({
      curve: map.curve,
      points: map.points.map((p) => ({
        ...(p.name ? { name: p.name } : {}),
        eta: p.eta,
        atoms: p.atoms,
        supercell: hnfRows(p.pattern.supercell),
        vacancies: p.pattern.vacancies,
        bond: p.pattern.bond,
        counting_rule: p.countingRule,
        sigma_filling: p.sigmaFilling,
        alignment: Object.fromEntries(Object.entries(p.alignment).map(([k, v]) => [k, { doping: v.doping, fermi_shift: v.fermiShift }])),
      })),
      metals: map.metals.map((m) => ({ name: m.name, title: m.title, work_function: m.workFunction, doping_range: m.dopingRange, preferred_eta: m.preferredEta })),
      observed: map.observed.map((o) => ({ substrate: o.substrate, eta: o.holeDensities, ...(o.doping !== undefined ? { doping: o.doping } : {}), coupling: o.coupling, source: o.source })),
      parameters: map.parameters,
      mesh: map.mesh,
      smearing: map.smearing,
      model: alignmentJson(map.model),
      caveat: SUBSTRATE_CAVEAT,
    })}\n`);
    return 0;
  }
  const f = (x: number) => (x >= 0 ? ' ' : '') + x.toFixed(3);
  const label = (p: (typeof map.points)[number]) => p.name ?? `${JSON.stringify(hnfRows(p.pattern.supercell))}${JSON.stringify(p.pattern.vacancies)}`;
  const lines = [
    `η–δ map: ${map.points.length} patterns, parameters ${map.parameters}, ${map.mesh}×${map.mesh} mesh; W_S = ${map.model.sheetWorkFunction} eV, Δc = ${map.model.dipole} eV, d = ${map.model.distance} Å, d0 = ${map.model.d0} Å`,
    'electrons per B atom: wanted (counting rule, σ filling) | given by each metal (Fermi-level alignment)',
    `      η   rule      σ  | ${map.metals.map((m) => m.name.padStart(7)).join(' ')}   pattern`,
  ];
  for (const p of map.points) {
    lines.push(`  ${p.eta.toFixed(3)} ${f(p.countingRule)} ${f(p.sigmaFilling)}  | ${map.metals.map((m) => f(p.alignment[m.name].doping).padStart(7)).join(' ')}   ${label(p)}`);
  }
  lines.push('the counting rule at the mean doping each metal gives:');
  for (const m of map.metals) lines.push(`  ${m.title.padEnd(8)} W = ${m.workFunction} eV   gives ${m.dopingRange[0].toFixed(3)} … ${m.dopingRange[1].toFixed(3)} e/atom   rule's η* ${m.preferredEta.toFixed(3)}`);
  lines.push('observed (not model output):');
  for (const o of map.observed) lines.push(`  ${o.substrate}: η = ${o.holeDensities.map((x) => x.toFixed(3)).join(', ')}${o.doping !== undefined ? `, about ${o.doping} e/B` : ''} — ${o.coupling} (${o.source})`);
  lines.push(ALIGNMENT_SCOPE, SUBSTRATE_CAVEAT);
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

export const metalsCommand: Command = { spec, run };
