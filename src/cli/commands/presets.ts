/**
 * `lacuna presets`: the named sheets and parameter sets with their sources.
 */
import { holeDensity, hnfRows, patternToSheet } from '../../lattice/pattern.ts';
import { SHEET_PRESETS } from '../../lattice/presets.ts';
import { SUBSTRATES } from '../../substrate/substrates.ts';
import { PARAMETER_PRESETS } from '../../tb/params.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { JSON_FLAG } from '../commonFlags.ts';
import type { Command, CliIo } from '../io.ts';

const spec: CommandSpec = {
  name: 'presets',
  summary: 'list the named sheets, parameter sets and substrates, with their sources',
  positionals: [],
  flags: { json: JSON_FLAG },
};

function run(argv: readonly string[], io: CliIo): number {
  const { flags } = parseArgs(spec, argv);
  const sheets = SHEET_PRESETS.map((p) => ({
    name: p.name,
    title: p.title,
    eta: holeDensity(p.pattern),
    atoms: patternToSheet(p.pattern).atoms.length,
    bond: p.pattern.bond,
    supercell: hnfRows(p.pattern.supercell),
    vacancies: p.pattern.vacancies,
    source: p.source,
    bond_source: p.bondSource,
  }));
  const params = PARAMETER_PRESETS.map((p) => ({ name: p.name, source: p.source }));
  const substrates = SUBSTRATES.map((s) => ({
    name: s.name,
    title: s.title,
    lattice_constant: s.latticeConstant,
    nn_distance: s.nnDistance,
    lattice_source: s.latticeSource,
    work_function: s.workFunction,
    work_function_source: s.workFunctionSource,
    ...(s.adsorptionHeight ? { adsorption_height: s.adsorptionHeight } : {}),
    ...(s.adsorptionHeightNote ? { adsorption_height_note: s.adsorptionHeightNote } : {}),
  }));
  if (flags.json) {
    // `parameters` names the one set a result used in every other output; the list of sets is its own key.
    io.out(`${JSON.stringify({ sheets, parameter_sets: params, substrates })}\n`);
    return 0;
  }
  const lines = ['sheets:'];
  for (const s of sheets) {
    lines.push(`  ${s.name.padEnd(10)} η = ${s.eta.toFixed(4)}  ${s.atoms} atoms/cell  d = ${s.bond} Å  ${s.title}`);
    lines.push(`  ${''.padEnd(10)} ${s.source}`);
  }
  lines.push('parameter sets:');
  for (const p of params) lines.push(`  ${p.name.padEnd(14)} ${p.source}`);
  lines.push('substrates:');
  for (const s of substrates) {
    const height = s.adsorption_height ? `, boron sheet about ${s.adsorption_height.value} Å above (an estimate)` : '';
    lines.push(`  ${s.name.padEnd(10)} ${s.title}: a = ${s.lattice_constant} Å, a_s = a/√2 = ${s.nn_distance.toFixed(4)} Å, W = ${s.work_function} eV${height}`);
    lines.push(`  ${''.padEnd(10)} ${s.lattice_source}; ${s.work_function_source}`);
  }
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

export const presetsCommand: Command = { spec, run };
