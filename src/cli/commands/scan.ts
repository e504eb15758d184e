/**
 * `lacuna scan`: the Fermi level and the σ/π electron split as the doping changes — how a sheet's levels move as
 * a metal gives (δ > 0) or takes (δ < 0) electrons. One mesh spectrum, filled at every doping.
 */
import { invalid } from '../../validate/invalid.ts';
import { FermiSolver, fillSpectrum } from '../../tb/index.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { JSON_FLAG, KSPACING_FLAG, MESH_FLAG, MODEL_CAVEAT, PARAMS_FLAG, SHEET_ARGUMENT, SMEARING_FLAG, PROGRESS_FLAG } from '../commonFlags.ts';
import type { Command, CliIo } from '../io.ts';
import { meshJson, resolveSpectrum } from '../parameters.ts';

/** Most dopings one scan evaluates. */
export const MAX_SCAN_STEPS = 10_000;

const spec: CommandSpec = {
  name: 'scan',
  summary: 'Fermi level, σ and π electrons per atom and band energy over a range of doping δ',
  positionals: [SHEET_ARGUMENT],
  flags: {
    params: PARAMS_FLAG,
    dopings: { kind: 'numberList', min: -3, max: 5, length: 3, placeholder: 'δ1,δ2,step', help: 'from δ1 to δ2 in steps (default -1,1,0.1); each δ strictly between −3 and 5' },
    mesh: MESH_FLAG,
    kspacing: KSPACING_FLAG,
    smearing: SMEARING_FLAG,
    json: JSON_FLAG,
    progress: PROGRESS_FLAG,
  },
};

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  const [from, to, step] = (flags.dopings as number[] | undefined) ?? [-1, 1, 0.1];
  const shown = `${from},${to},${step}`;
  if (!(step > 0)) invalid('--dopings', shown, 'the step must be positive');
  if (!(to >= from)) invalid('--dopings', shown, 'δ2 must not be below δ1');
  if (from <= -3 || to >= 5) invalid('--dopings', shown, 'every δ must lie strictly between −3 and 5 (0 to 8 electrons per atom)');
  const steps = Math.floor((to - from) / step + 1e-9) + 1;
  if (steps > MAX_SCAN_STEPS) invalid('--dopings', shown, `${steps} dopings; at most ${MAX_SCAN_STEPS}`);
  const { sheet, model, spectrum, smearing, meshChoice } = resolveSpectrum(positionals.SHEET, flags, io, 'scan');
  const solver = new FermiSolver(spectrum);
  const rows = [];
  for (let i = 0; i < steps; i++) {
    const doping = +(from + i * step).toPrecision(12);
    const r = fillSpectrum(spectrum, { doping, smearing, model }, solver);
    rows.push({ doping, fermi: r.fermi, sigma: r.sigmaElectronsPerAtom, pi: r.piElectronsPerAtom, band: r.bandEnergyPerAtom, inGap: r.inGap, meshGap: r.meshGap });
  }
  if (flags.json) {
    io.out(`${JSON.stringify({
      sheet: sheet.label,
      parameters: spectrum.parameters,
      ...meshJson(meshChoice),
      smearing,
      rows: rows.map((r) => ({
        doping: r.doping,
        fermi: r.fermi,
        sigma_electrons_per_atom: r.sigma,
        pi_electrons_per_atom: r.pi,
        band_energy_per_atom: r.band,
        ...(r.inGap ? { in_gap: r.inGap } : {}),
        ...(r.meshGap ? { mesh_gap: { lower: r.meshGap.lower, upper: r.meshGap.upper } } : {}),
      })),
    })}\n`);
    return 0;
  }
  const lines = [
    `${sheet.label}: parameters ${spectrum.parameters}, ${meshChoice.why}, Gaussian width ${smearing} eV`,
    '      δ     E_F (eV)    σ e/atom   π e/atom   band energy (eV/atom)',
  ];
  for (const r of rows) {
    lines.push(`${r.doping.toFixed(3).padStart(7)}  ${r.fermi.toFixed(4).padStart(10)}  ${r.sigma.toFixed(4).padStart(9)}  ${r.pi.toFixed(4).padStart(9)}  ${r.band.toFixed(4).padStart(12)}${r.inGap ? '   (mid-gap)' : r.meshGap ? '   (in a gap of the mesh only)' : ''}`);
  }
  lines.push(MODEL_CAVEAT);
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

export const scanCommand: Command = { spec, run };
