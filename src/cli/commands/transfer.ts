/**
 * `lacuna transfer`: electrons a sheet wants (counting rule, σ filling) beside electrons a metal gives (Fermi-level
 * alignment, Giovannetti et al. 2008 / Khomyakov et al. 2009 on the sheet's own spectrum) — DESIGN.md contract.
 */
import { estimateHoleDensity } from '../../lattice/geometry.ts';
import { holeDensity } from '../../lattice/pattern.ts';
import { cellMetrics } from '../../lattice/reducedCell.ts';
import { ALIGNMENT_DEFAULTS } from '../../substrate/defaults.ts';
import { requireSubstrate, SUBSTRATES } from '../../substrate/substrates.ts';
import { alignmentParameters, electronTransfer } from '../../substrate/transfer.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { JSON_FLAG, MESH_FLAG, PARAMS_FLAG, SHEET_ARGUMENT, SMEARING_FLAG } from '../commonFlags.ts';
import type { CliIo, Command } from '../io.ts';
import { resolveSpectrum } from '../parameters.ts';
import { invalid } from '../../io/invalid.ts';
import { SUBSTRATE_CAVEAT } from '../substrateCaveat.ts';

export const SUBSTRATE_FLAG = {
  kind: 'text', placeholder: 'NAME', help: `metal surface: ${SUBSTRATES.map((s) => s.name).join(', ')}; required`,
} as const;

const spec: CommandSpec = {
  name: 'transfer',
  summary: 'electrons a sheet wants (counting rule, σ filling) beside those a metal gives (Fermi-level alignment)',
  positionals: [SHEET_ARGUMENT],
  flags: {
    substrate: SUBSTRATE_FLAG,
    params: PARAMS_FLAG,
    mesh: MESH_FLAG,
    smearing: SMEARING_FLAG,
    'sheet-work-function': { kind: 'number', min: 1, max: 8, placeholder: 'W_S', help: `work function of the free sheet in eV (default ${ALIGNMENT_DEFAULTS.sheetWorkFunction.value}, an estimate)` },
    dipole: { kind: 'number', min: -5, max: 5, placeholder: 'Δc', help: `interface dipole from the chemical interaction in eV (default ${ALIGNMENT_DEFAULTS.dipole.value}, graphene's)` },
    distance: { kind: 'number', min: 0.5, max: 10, placeholder: 'd', help: `sheet–metal distance in Å (default ${ALIGNMENT_DEFAULTS.distance.value}, graphene's)` },
    d0: { kind: 'number', min: 0, max: 10, placeholder: 'd0', help: `offset of the interface charge layer in Å, d ≥ d0 (default ${ALIGNMENT_DEFAULTS.d0.value}, graphene's)` },
    json: JSON_FLAG,
  },
};

const RULE_NOTE = 'counting rule δ = 8/(3(1 − η)) − 3: the doping that just fills the σ bonding states by electron counting; a rule of thumb';

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  if (flags.substrate === undefined) invalid('--substrate', undefined, `required; substrates: ${SUBSTRATES.map((s) => s.name).join(', ')}`);
  const substrate = requireSubstrate(flags.substrate as string, '--substrate');
  const parameters = alignmentParameters({
    sheetWorkFunction: flags['sheet-work-function'] as number | undefined,
    dipole: flags.dipole as number | undefined,
    distance: flags.distance as number | undefined,
    d0: flags.d0 as number | undefined,
  }, { distance: '--distance', d0: '--d0' });
  const { sheet, spectrum, smearing } = resolveSpectrum(positionals.SHEET, flags, io);
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
      model: {
        sheet_work_function: parameters.sheetWorkFunction,
        dipole: parameters.dipole,
        distance: parameters.distance,
        d0: parameters.d0,
        defaults: Object.fromEntries(Object.entries(ALIGNMENT_DEFAULTS).map(([key, value]) => [key === 'sheetWorkFunction' ? 'sheet_work_function' : key, value])),
      },
      sheet: sheet.label,
      parameters: spectrum.parameters,
      mesh: spectrum.mesh,
      smearing,
      caveat: SUBSTRATE_CAVEAT,
    })}\n`);
    return 0;
  }
  const f = (x: number, digits = 3) => (x >= 0 ? ' ' : '') + x.toFixed(digits);
  const given = (key: keyof typeof parameters, flag: string) => (flags[flag] === undefined ? ` (default: ${ALIGNMENT_DEFAULTS[key].origin})` : ' (given)');
  const lines = [
    `${sheet.label} on ${substrate.title}: η = ${eta.toFixed(4)}${estimate && !estimate.exact ? ' (estimated from the geometry)' : ''}, parameters ${spectrum.parameters}, ${spectrum.mesh}×${spectrum.mesh} mesh, σ = ${smearing} eV`,
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
    'The alignment model describes weak (physisorption-like) coupling; where the sheet bonds to the metal (as B on Al(111) is reported to) it misses the chemistry and underestimates the transfer.',
    SUBSTRATE_CAVEAT,
  ];
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

export const transferCommand: Command = { spec, run };
