/**
 * `lacuna fill`: the Fermi level and the σ/π electron split for 3 + δ electrons per atom (DESIGN.md contract).
 */
import { fill, TightBindingModel } from '../../tb/index.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import type { Command, CliIo } from '../io.ts';
import { resolveParameters } from '../parameters.ts';
import { ProgressLine } from '../progress.ts';
import { resolveSheet } from '../sheetArgument.ts';

/** Largest k-mesh side: 400² k-points of an 8-atom cell take about a minute. */
export const MAX_MESH = 400;

const spec: CommandSpec = {
  name: 'fill',
  summary: 'Fermi level, σ and π electrons per atom and band energy for 3 + δ electrons per atom',
  positionals: [{ name: 'SHEET', help: 'a preset name, a sheet file, or sheet JSON text' }],
  flags: {
    params: { kind: 'text', placeholder: 'FILE|NAME', help: 'parameter set: a preset name or a parameter file (default harrison1980)' },
    doping: { kind: 'number', min: -3, max: 5, placeholder: 'δ', help: 'extra electrons per atom, positive when given by the substrate (default 0; −3 … 5)' },
    mesh: { kind: 'integer', min: 1, max: MAX_MESH, placeholder: 'M', help: 'Γ-centred M×M k-mesh (default 36)' },
    smearing: { kind: 'number', min: 0, max: 10, exclusiveMin: true, placeholder: 'σ', help: 'Gaussian occupation width in eV (default 0.1)' },
    json: { kind: 'switch', help: 'one JSON document on stdout' },
  },
};

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  const sheet = resolveSheet(positionals.SHEET, io);
  const params = resolveParameters(flags.params as string | undefined, io);
  const model = new TightBindingModel(sheet.sheet, params);
  const progress = new ProgressLine(io.err, 'k-points');
  const result = fill(model, {
    doping: flags.doping as number | undefined,
    mesh: flags.mesh as number | undefined,
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
      mesh: result.mesh,
      smearing: result.smearing,
      parameters: result.parameters,
      sheet: sheet.label,
    };
    if (result.inGap) document.in_gap = result.inGap;
    io.out(`${JSON.stringify(document)}\n`);
  } else {
    const lines = [
      `${sheet.label}: ${model.atoms} atoms, parameters ${result.parameters}, δ = ${result.doping} e/atom, ${result.mesh}×${result.mesh} mesh, σ = ${result.smearing} eV`,
      `Fermi level            ${result.fermi.toFixed(4)} eV${result.inGap ? `  (in a gap ${result.inGap.lower.toFixed(3)} … ${result.inGap.upper.toFixed(3)} eV: placed mid-gap)` : ''}`,
      `electrons per atom     ${result.electronsPerAtom.toFixed(4)}  (σ ${result.sigmaElectronsPerAtom.toFixed(4)}, π ${result.piElectronsPerAtom.toFixed(4)})`,
      `band energy per atom   ${result.bandEnergyPerAtom.toFixed(4)} eV`,
      'A tight-binding estimate on the parameter set named above, not a prediction: check against experiment and higher-level calculations.',
    ];
    io.out(`${lines.join('\n')}\n`);
  }
  return 0;
}

export const fillCommand: Command = { spec, run };
