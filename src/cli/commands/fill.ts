/**
 * `lacuna fill`: the Fermi level and the σ/π electron split for 3 + δ electrons per atom (DESIGN.md contract).
 */
import { fill, type FillResult } from '../../tb/index.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import type { Command, CliIo } from '../io.ts';
import { DOPING_FLAG, JSON_FLAG, KSPACING_FLAG, MESH_FLAG, MODEL_CAVEAT, PARAMS_FLAG, PROGRESS_FLAG, SHEET_ARGUMENT, SMEARING_FLAG } from '../commonFlags.ts';
import { announceMesh, meshChoiceOf, meshJson, meshWork, resolveModel } from '../parameters.ts';
import { ProgressLine } from '../progress.ts';

const spec: CommandSpec = {
  name: 'fill',
  summary: 'Fermi level, σ and π electrons per atom and band energy for 3 + δ electrons per atom',
  positionals: [SHEET_ARGUMENT],
  flags: {
    params: PARAMS_FLAG,
    doping: DOPING_FLAG,
    mesh: MESH_FLAG,
    kspacing: KSPACING_FLAG,
    smearing: SMEARING_FLAG,
    json: JSON_FLAG,
    progress: PROGRESS_FLAG,
  },
};

const MESH_GAP_NOTE = 'no state of the mesh lies in this interval, but the bands cross it between mesh points: a gap of the k-mesh, not of the sheet; E_F is put at its middle';

/** What the text output says after E_F when the count falls in an interval the mesh leaves empty. */
function gapText(result: FillResult): string {
  if (result.inGap) {
    return `  (in a gap of the bands ${result.inGap.lower.toFixed(3)} … ${result.inGap.upper.toFixed(3)} eV, checked on the mesh and the path through the special points: placed mid-gap)`;
  }
  if (!result.meshGap) return '';
  const { lower, upper, crossing } = result.meshGap;
  const where = crossing ? `; a band passes ${crossing.energy.toFixed(3)} eV at ${crossing.label ?? `k = (${crossing.k.map((x) => x.toFixed(3)).join(', ')}) Å⁻¹`}` : '';
  return `  (no mesh state in ${lower.toFixed(3)} … ${upper.toFixed(3)} eV, but that is a gap of the ${result.mesh}×${result.mesh} mesh only, not of the sheet${where}; E_F placed in its middle)`;
}

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  const { sheet, params, model } = resolveModel(positionals.SHEET, flags.params as string | undefined, io, meshWork(flags));
  const meshChoice = meshChoiceOf(flags, sheet.sheet);
  const progress = new ProgressLine(io.err, 'k-points', { machine: flags.progress === true, job: 'fill' });
  announceMesh(progress, sheet.sheet, meshChoice);
  const result = fill(model, {
    doping: flags.doping as number | undefined,
    mesh: meshChoice.mesh,
    smearing: flags.smearing as number | undefined,
    onProgress: (done, total) => progress.update(done, done / total),
  });
  progress.done();
  if (flags.json) {
    const document: Record<string, unknown> = {
      fermi: result.fermi,
      electrons_per_atom: result.electronsPerAtom,
      sigma_electrons_per_atom: result.sigmaElectronsPerAtom,
      pi_electrons_per_atom: result.piElectronsPerAtom,
      band_energy_per_atom: result.bandEnergyPerAtom,
      doping: result.doping,
      ...meshJson(meshChoice),
      smearing: result.smearing,
      parameters: result.parameters,
      sheet: sheet.label,
    };
    if (result.inGap) document.in_gap = result.inGap;
    if (result.meshGap) {
      const { lower, upper, crossing } = result.meshGap;
      document.mesh_gap = { lower, upper, ...(crossing ? { crossing: { k: crossing.k, ...(crossing.label ? { label: crossing.label } : {}), energy: crossing.energy } } : {}), note: MESH_GAP_NOTE };
    }
    io.out(`${JSON.stringify(document)}\n`);
  } else {
    const lines = [
      `${sheet.label}: ${model.atoms} atoms, parameters ${result.parameters}, δ = ${result.doping} e/atom, ${meshChoice.why}, Gaussian width ${result.smearing} eV`,
      `Fermi level            ${result.fermi.toFixed(4)} eV${gapText(result)}`,
      `electrons per atom     ${result.electronsPerAtom.toFixed(4)}  (σ ${result.sigmaElectronsPerAtom.toFixed(4)}, π ${result.piElectronsPerAtom.toFixed(4)})`,
      `band energy per atom   ${result.bandEnergyPerAtom.toFixed(4)} eV`,
      MODEL_CAVEAT,
    ];
    io.out(`${lines.join('\n')}\n`);
  }
  return 0;
}

export const fillCommand: Command = { spec, run };
