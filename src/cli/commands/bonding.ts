/**
 * `lacuna bonding`: the σ-bonding analysis of a sheet beside the electron-counting rule — where its σ bonding
 * states end, how many electrons they hold, which doping fills them, and what the rule says for its η.
 */
import { estimateHoleDensity } from '../../lattice/geometry.ts';
import { holeDensity } from '../../lattice/pattern.ts';
import { CONVERGENCE_TOLERANCE, DEFAULT_SMEARING, fillSpectrum, refinedSigmaBonding, type SigmaBondingResult } from '../../tb/index.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { JSON_FLAG, KSPACING_FLAG, MESH_FLAG, MODEL_CAVEAT, PARAMS_FLAG, PROGRESS_FLAG, SHEET_ARGUMENT, SMEARING_FLAG } from '../commonFlags.ts';
import type { Command, CliIo } from '../io.ts';
import { announceMesh, meshChoiceOf, meshJson, meshWork, resolveModel } from '../parameters.ts';
import { ProgressLine } from '../progress.ts';

const spec: CommandSpec = {
  name: 'bonding',
  summary: 'σ bonding states of a sheet — capacity and the doping that fills them — beside the electron-counting rule',
  positionals: [SHEET_ARGUMENT],
  flags: { params: PARAMS_FLAG, mesh: MESH_FLAG, kspacing: KSPACING_FLAG, smearing: SMEARING_FLAG, json: JSON_FLAG, progress: PROGRESS_FLAG },
};

const RULE_NOTE = 'counting rule δ = 8/(3(1 − η)) − 3: the classic estimate of the doping that just fills the in-plane σ bonding states; a rule of thumb, not a result';

const CONVERGENCE_NOTE = 'capacity and doping are counted from the mesh states and again from the bands interpolated between mesh points (linear triangle method, same Gaussian); converged when both agree within the tolerance (electrons per atom) and any gap was checked on the path through the special points';

/** What the text output says about the mesh: refined, converged or not, mesh-only gaps. */
function convergenceLines(analysis: SigmaBondingResult, meshes: number[], suggestedMesh: number | undefined): string[] {
  const lines: string[] = [];
  if (meshes.length > 1) lines.push(`  mesh refined ${meshes.join(' → ')}: the coarser meshes did not resolve width σ near E*`);
  for (const g of analysis.meshGaps ?? []) {
    const at = g.crossing ? ` (a σ band passes ${g.crossing.energy.toFixed(3)} eV at ${g.crossing.label ?? 'a k-point off the mesh'})` : '';
    lines.push(`  ${g.lower.toFixed(3)} … ${g.upper.toFixed(3)} eV holds no σ state of the mesh but is no gap of the sheet${at}`);
  }
  if (!analysis.convergence.converged) {
    const c = analysis.convergence;
    lines.push(`  NOT CONVERGED at mesh ${analysis.mesh}: the bands interpolated between mesh points give capacity ${c.sigmaCapacity.toFixed(3)} and doping ${c.fillingDoping.toFixed(3)}${suggestedMesh ? `; try --mesh ${suggestedMesh}` : ''}`);
  }
  return lines;
}

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  const { sheet, model } = resolveModel(positionals.SHEET, flags.params as string | undefined, io, meshWork(flags));
  const meshChoice = meshChoiceOf(flags, sheet.sheet);
  const smearing = (flags.smearing as number | undefined) ?? DEFAULT_SMEARING;
  const estimate = sheet.pattern ? undefined : estimateHoleDensity(sheet.sheet);
  const eta = sheet.pattern ? holeDensity(sheet.pattern) : estimate!.eta;
  const progress = new ProgressLine(io.err, 'k-points', { machine: flags.progress === true, job: 'bonding' });
  announceMesh(progress, sheet.sheet, meshChoice);
  // A mesh the user chose (--mesh or --kspacing) is kept as given; the default one is refined until the answer
  // converges (within a work budget).
  const chosen = meshChoice.rule === 'mesh' || meshChoice.rule === 'kspacing';
  const { result: analysis, spectrum, meshes, suggestedMesh } = refinedSigmaBonding(model, {
    holeDensity: eta,
    holeDensityEstimated: estimate !== undefined && !estimate.exact,
    smearing,
    mesh: meshChoice.mesh,
    refine: !chosen,
    onProgress: (done, total) => progress.update(done, done / total),
  });
  progress.done();
  const neutral = fillSpectrum(spectrum, { smearing });
  const convergence = {
    converged: analysis.convergence.converged,
    meshes,
    ...(suggestedMesh ? { suggested_mesh: suggestedMesh } : {}),
    interpolated: { sigma_capacity: analysis.convergence.sigmaCapacity, doping: analysis.convergence.fillingDoping },
    tolerance: CONVERGENCE_TOLERANCE,
    ...(analysis.convergence.gapChecked !== undefined ? { gap_checked: analysis.convergence.gapChecked } : {}),
    note: CONVERGENCE_NOTE,
  };
  if (flags.json) {
    const document: Record<string, unknown> = {
      sheet: sheet.label,
      parameters: analysis.parameters,
      ...meshJson(meshChoice),
      mesh: analysis.mesh,
      smearing: analysis.smearing,
      eta,
      eta_estimated: analysis.countingRule.estimated,
      counting_rule: { doping: analysis.countingRule.doping, note: RULE_NOTE },
      sigma_filling: {
        kind: analysis.kind,
        energy: analysis.energy,
        ...(analysis.gap ? { gap: analysis.gap } : {}),
        sigma_dos: analysis.sigmaDos,
        sigma_dos_interpolated: analysis.sigmaDosInterpolated,
        sigma_capacity: analysis.sigmaCapacity,
        doping: analysis.fillingDoping,
        ...(analysis.fillingRange ? { doping_range: analysis.fillingRange } : {}),
        ...(analysis.meshGaps ? { mesh_gaps: analysis.meshGaps } : {}),
      },
      convergence,
      neutral: { fermi: neutral.fermi, sigma_electrons_per_atom: neutral.sigmaElectronsPerAtom, pi_electrons_per_atom: neutral.piElectronsPerAtom },
    };
    io.out(`${JSON.stringify(document)}\n`);
    return 0;
  }
  const f = (x: number, digits = 3) => (x >= 0 ? ' ' : '') + x.toFixed(digits);
  const where = analysis.gap
    ? `σ gap ${analysis.gap.lower.toFixed(3)} … ${analysis.gap.upper.toFixed(3)} eV (E* = ${analysis.energy.toFixed(3)}, mid-gap)`
    : `σ pseudogap at E* = ${analysis.energy.toFixed(3)} eV (σ DOS ${analysis.sigmaDosInterpolated.toFixed(4)} states/eV/atom, bands interpolated between mesh points)`;
  const lines = [
    `${sheet.label}: ${model.atoms} atoms, η = ${eta.toFixed(4)}${analysis.countingRule.estimated ? ' (estimated from the geometry)' : ''}, parameters ${analysis.parameters}, ${meshes.length > 1 ? `${analysis.mesh}×${analysis.mesh} mesh (refined from ${meshChoice.why})` : meshChoice.why}, Gaussian width ${analysis.smearing} eV`,
    ...convergenceLines(analysis, meshes, suggestedMesh),
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
