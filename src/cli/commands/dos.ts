/**
 * `lacuna dos`: total and σ/π-projected density of states, by Gaussian broadening or the linear triangle method.
 */
import { energyGrid, fillSpectrum, gaussianDos, triangleDos } from '../../tb/index.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { JSON_FLAG, KSPACING_FLAG, MESH_FLAG, MODEL_CAVEAT, OVERWRITE_FLAG, PARAMS_FLAG, SHEET_ARGUMENT, SMEARING_FLAG, PROGRESS_FLAG } from '../commonFlags.ts';
import { checkOutputPath, writeNamedFile, type Command, type CliIo } from '../io.ts';
import { meshJson, resolveSpectrum } from '../parameters.ts';
import { dosCsv } from '../../io/csv.ts';

const spec: CommandSpec = {
  name: 'dos',
  summary: 'density of states, total and σ/π-projected, in states per eV per atom (both spins; integrates to 8)',
  positionals: [SHEET_ARGUMENT],
  flags: {
    params: PARAMS_FLAG,
    mesh: MESH_FLAG,
    kspacing: KSPACING_FLAG,
    method: { kind: 'choice', values: ['gaussian', 'triangle'], placeholder: 'gaussian|triangle', help: 'Gaussian broadening of width --smearing, or the linear triangle method (default gaussian)' },
    smearing: SMEARING_FLAG,
    'energy-grid': { kind: 'integer', min: 2, max: 200_000, placeholder: 'P', help: 'number of energies on the DOS grid (default 2001)' },
    csv: { kind: 'text', placeholder: 'FILE', help: 'also write the DOS as CSV' },
    overwrite: OVERWRITE_FLAG,
    json: JSON_FLAG,
    progress: PROGRESS_FLAG,
  },
};

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  checkOutputPath(io, '--csv', flags.csv as string | undefined, flags.overwrite === true);
  const { sheet, spectrum, smearing, meshChoice } = resolveSpectrum(positionals.SHEET, flags, io, 'dos');
  const grid = energyGrid(spectrum, { points: (flags['energy-grid'] as number | undefined) ?? 2001 });
  const dos = flags.method === 'triangle' ? triangleDos(spectrum, grid) : gaussianDos(spectrum, grid, smearing);
  const fermi = fillSpectrum(spectrum, { smearing }).fermi;
  if (flags.csv !== undefined) writeNamedFile(io, '--csv', flags.csv as string, dosCsv(dos));
  if (flags.json) {
    io.out(`${JSON.stringify({
      sheet: sheet.label,
      parameters: dos.parameters,
      method: dos.method,
      ...meshJson(meshChoice),
      smearing: dos.smearing,
      units: 'states per eV per atom, both spins',
      fermi,
      energy: Array.from(dos.energy),
      total: Array.from(dos.total),
      sigma: Array.from(dos.sigma),
      pi: Array.from(dos.pi),
    })}\n`);
    return 0;
  }
  io.out(`${sheet.label}: parameters ${dos.parameters}, DOS by the ${dos.method} method on a ${meshChoice.why}, ${grid.length} energies from ${grid[0].toFixed(2)} to ${grid[grid.length - 1].toFixed(2)} eV; neutral E_F ${fermi.toFixed(3)} eV\n`);
  if (flags.csv !== undefined) io.out(`wrote ${flags.csv}\n`);
  io.out(`${MODEL_CAVEAT}\n`);
  return 0;
}

export const dosCommand: Command = { spec, run };
