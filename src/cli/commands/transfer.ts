/**
 * `lacuna transfer`: electrons a sheet wants (counting rule, σ filling) beside electrons a metal gives (Fermi-level
 * alignment, Giovannetti et al. 2008 / Khomyakov et al. 2009 on the sheet's own spectrum) — DESIGN.md contract.
 */
import { estimateHoleDensity } from '../../lattice/geometry.ts';
import { holeDensity } from '../../lattice/pattern.ts';
import { cellMetrics } from '../../lattice/reducedCell.ts';
import { ALIGNMENT_DEFAULTS } from '../../substrate/defaults.ts';
import { electronTransfer } from '../../substrate/transfer.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { JSON_FLAG, KSPACING_FLAG, MESH_FLAG, PARAMS_FLAG, PROGRESS_FLAG, SHEET_ARGUMENT, SMEARING_FLAG } from '../commonFlags.ts';
import type { CliIo, Command } from '../io.ts';
import { meshJson, resolveSpectrum } from '../parameters.ts';
import { ALIGNMENT_FLAGS, ALIGNMENT_SCOPE, SUBSTRATE_CAVEAT, SUBSTRATE_FLAG, alignmentJson, alignmentOf, substrateOf } from '../substrateFlags.ts';

const spec: CommandSpec = {
  name: 'transfer',
  summary: 'electrons a sheet wants (counting rule, σ filling) beside those a metal gives (Fermi-level alignment)',
  positionals: [SHEET_ARGUMENT],
  flags: {
    substrate: SUBSTRATE_FLAG,
    params: PARAMS_FLAG,
    mesh: MESH_FLAG,
    kspacing: KSPACING_FLAG,
    smearing: SMEARING_FLAG,
    ...ALIGNMENT_FLAGS,
    json: JSON_FLAG,
    progress: PROGRESS_FLAG,
  },
};

const RULE_NOTE = 'counting rule δ = 8/(3(1 − η)) − 3: the doping that just fills the σ bonding states by electron counting; a rule of thumb';

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  const substrate = substrateOf(flags);
  const parameters = alignmentOf(flags);
  const { sheet, spectrum, smearing, meshChoice } = resolveSpectrum(positionals.SHEET, flags, io, 'transfer');
  const estimate = sheet.pattern ? undefined : estimateHoleDensity(sheet.sheet);
  const eta = sheet.pattern ? holeDensity(sheet.pattern) : estimate!.eta;
  const result = electronTransfer(spectrum, {
    substrate, holeDensity: eta, cellArea: cellMetrics(sheet.sheet.cell).area, smearing, ...parameters,
  });
  const a = result.alignment;
  if (flags.json) {
    io.out(`${JSON.stringify({
      eta,
      eta_estimated: estimate !== undefined && !estimate.exact,
      counting_rule: { doping: result.countingRule.doping, note: RULE_NOTE },
      sigma_filling: { doping: result.sigmaFilling.doping, kind: result.sigmaFilling.kind, energy: result.sigmaFilling.energy },
      alignment: {
        electrons_per_atom: a.electronsPerAtom,
        fermi_shift: a.fermiShift,
        electrons_per_cell: a.electronsPerCell,
        neutral_fermi: a.neutralFermi,
        driving_potential: a.drivingPotential,
        capacitor_step: a.capacitorStep,
        alpha: a.alpha,
        preferred_eta: result.preferredHoleDensity,
      },
      substrate: { name: substrate.name, work_function: substrate.workFunction, title: substrate.title, work_function_source: substrate.workFunctionSource },
      model: alignmentJson(parameters),
      sheet: sheet.label,
      parameters: spectrum.parameters,
      ...meshJson(meshChoice),
      smearing,
      caveat: SUBSTRATE_CAVEAT,
    })}\n`);
    return 0;
  }
  const f = (x: number, digits = 3) => (x >= 0 ? ' ' : '') + x.toFixed(digits);
  const given = (key: keyof typeof parameters, flag: string) => (flags[flag] === undefined ? ` (default: ${ALIGNMENT_DEFAULTS[key].origin})` : ' (given)');
  const lines = [
    `${sheet.label} on ${substrate.title}: η = ${eta.toFixed(4)}${estimate && !estimate.exact ? ' (estimated from the geometry)' : ''}, parameters ${spectrum.parameters}, ${meshChoice.why}, Gaussian width ${smearing} eV`,
    'what the sheet wants (extra electrons per B atom):',
    `  counting rule                        ${f(result.countingRule.doping)}`,
    `  tight-binding σ filling              ${f(result.sigmaFilling.doping)}   (σ ${result.sigmaFilling.kind} at ${result.sigmaFilling.energy.toFixed(3)} eV)`,
    'what the metal gives (Fermi-level alignment, Giovannetti et al. 2008 on this sheet\'s DOS):',
    `  electrons per atom                   ${f(a.electronsPerAtom, 4)}   (Fermi level rises by ${a.fermiShift.toFixed(3)} eV; ${a.electronsPerCell.toFixed(4)} per cell)`,
    `  counting rule's η at that doping     ${f(result.preferredHoleDensity, 4)}`,
    `  W_M = ${substrate.workFunction} eV (${substrate.title}; source in presets/substrates/${substrate.name}.json)`,
    `  W_S = ${parameters.sheetWorkFunction} eV${given('sheetWorkFunction', 'sheet-work-function')}`,
    `  Δc = ${parameters.dipole} eV${given('dipole', 'dipole')}`,
    `  d = ${parameters.distance} Å${given('distance', 'distance')}`,
    `  d0 = ${parameters.d0} Å${given('d0', 'd0')}`,
    `  balance W_S + Δc − W_M = ${a.drivingPotential.toFixed(3)} eV = ΔE_F ${a.fermiShift.toFixed(3)} + α·q·(d − d0) ${a.capacitorStep.toFixed(3)} eV`,
    ALIGNMENT_SCOPE,
    SUBSTRATE_CAVEAT,
  ];
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

export const transferCommand: Command = { spec, run };
