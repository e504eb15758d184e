/**
 * `lacuna bonding`: the σ-bonding analysis of a sheet beside the electron-counting rule — where its σ bonding
 * states end, how many electrons they hold, which doping fills them, and what the rule says for its η.
 */
import { estimateHoleDensity } from '../../lattice/geometry.ts';
import { holeDensity } from '../../lattice/pattern.ts';
import { fillSpectrum, sigmaBonding } from '../../tb/index.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { JSON_FLAG, KSPACING_FLAG, MESH_FLAG, MODEL_CAVEAT, PARAMS_FLAG, SHEET_ARGUMENT, SMEARING_FLAG, PROGRESS_FLAG } from '../commonFlags.ts';
import type { Command, CliIo } from '../io.ts';
import { meshJson, resolveSpectrum } from '../parameters.ts';

const spec: CommandSpec = {
  name: 'bonding',
  summary: 'σ bonding states of a sheet — capacity and the doping that fills them — beside the electron-counting rule',
  positionals: [SHEET_ARGUMENT],
  flags: { params: PARAMS_FLAG, mesh: MESH_FLAG, kspacing: KSPACING_FLAG, smearing: SMEARING_FLAG, json: JSON_FLAG, progress: PROGRESS_FLAG },
};

const RULE_NOTE = 'counting rule δ = 8/(3(1 − η)) − 3: the classic estimate of the doping that just fills the in-plane σ bonding states; a rule of thumb, not a result';

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  const { sheet, model, spectrum, smearing, meshChoice } = resolveSpectrum(positionals.SHEET, flags, io, 'bonding');
  const estimate = sheet.pattern ? undefined : estimateHoleDensity(sheet.sheet);
  const eta = sheet.pattern ? holeDensity(sheet.pattern) : estimate!.eta;
  const analysis = sigmaBonding(spectrum, { holeDensity: eta, holeDensityEstimated: estimate !== undefined && !estimate.exact, smearing });
  const neutral = fillSpectrum(spectrum, { smearing });
  if (flags.json) {
    const document: Record<string, unknown> = {
      sheet: sheet.label,
      parameters: analysis.parameters,
      ...meshJson(meshChoice),
      smearing: analysis.smearing,
      eta,
      eta_estimated: analysis.countingRule.estimated,
      counting_rule: { doping: analysis.countingRule.doping, note: RULE_NOTE },
      sigma_filling: {
        kind: analysis.kind,
        energy: analysis.energy,
        ...(analysis.gap ? { gap: analysis.gap } : {}),
        sigma_dos: analysis.sigmaDos,
        sigma_capacity: analysis.sigmaCapacity,
        doping: analysis.fillingDoping,
        ...(analysis.fillingRange ? { doping_range: analysis.fillingRange } : {}),
      },
      neutral: { fermi: neutral.fermi, sigma_electrons_per_atom: neutral.sigmaElectronsPerAtom, pi_electrons_per_atom: neutral.piElectronsPerAtom },
    };
    io.out(`${JSON.stringify(document)}\n`);
    return 0;
  }
  const f = (x: number, digits = 3) => (x >= 0 ? ' ' : '') + x.toFixed(digits);
  const where = analysis.gap
    ? `σ gap ${analysis.gap.lower.toFixed(3)} … ${analysis.gap.upper.toFixed(3)} eV (E* = ${analysis.energy.toFixed(3)}, mid-gap)`
    : `σ pseudogap at E* = ${analysis.energy.toFixed(3)} eV (σ DOS ${analysis.sigmaDos.toFixed(4)} states/eV/atom)`;
  const lines = [
    `${sheet.label}: ${model.atoms} atoms, η = ${eta.toFixed(4)}${analysis.countingRule.estimated ? ' (estimated from the geometry)' : ''}, parameters ${analysis.parameters}, ${meshChoice.why}, Gaussian width ${analysis.smearing} eV`,
    `  ${where}`,
    `  σ bonding capacity               ${f(analysis.sigmaCapacity)} electrons per atom`,
    `  doping that fills it (to E*)     ${f(analysis.fillingDoping)} e/atom${analysis.fillingRange ? `   (any of ${analysis.fillingRange.lower.toFixed(3)} … ${analysis.fillingRange.upper.toFixed(3)} keeps σ bonding full and σ antibonding empty)` : ''}`,
    `  counting rule for this η         ${f(analysis.countingRule.doping)} e/atom`,
    `  neutral sheet: E_F ${neutral.fermi.toFixed(3)} eV, σ ${neutral.sigmaElectronsPerAtom.toFixed(3)} and π ${neutral.piElectronsPerAtom.toFixed(3)} electrons per atom`,
    `  A positive doping means the sheet wants electrons from the metal. The ${RULE_NOTE}.`,
    MODEL_CAVEAT,
  ];
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

export const bondingCommand: Command = { spec, run };
