/**
 * `lacuna bands`: band energies and σ weights on an automatic k-path or on given k-points (DESIGN.md contract).
 */
import { autoPath, computeBands } from '../../tb/index.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { checkOutputPath, writeNamedFile, type Command, type CliIo } from '../io.ts';
import { JSON_FLAG, OVERWRITE_FLAG, PARAMS_FLAG, PROGRESS_FLAG, SHEET_ARGUMENT } from '../commonFlags.ts';
import { buildModel, resolveParameters } from '../parameters.ts';
import { estimatedSeconds } from '../workEstimate.ts';
import { resolveSheet } from '../sheetArgument.ts';
import { ProgressLine } from '../progress.ts';
import { bandsCsv } from '../../io/csv.ts';
import { checkKpointFlags, KPOINTS_FLAGS, labelPlaces, pathJson, readKpoints, rows } from '../kpointsFlags.ts';

const spec: CommandSpec = {
  name: 'bands',
  summary: 'tight-binding bands of a sheet with the σ share of every state',
  positionals: [SHEET_ARGUMENT],
  flags: {
    params: PARAMS_FLAG,
    ...KPOINTS_FLAGS,
    csv: { kind: 'text', placeholder: 'FILE', help: 'also write the bands as CSV' },
    overwrite: OVERWRITE_FLAG,
    json: JSON_FLAG,
    progress: PROGRESS_FLAG,
  },
};

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  checkOutputPath(io, '--csv', flags.csv as string | undefined, flags.overwrite === true);
  checkKpointFlags(flags);
  const sheet = resolveSheet(positionals.SHEET, io);
  const params = resolveParameters(flags.params as string | undefined, io);
  const { kpoints, path } = readKpoints(flags, io, (points) => autoPath(sheet.sheet.cell, points));
  const count = kpoints.length / 2;
  const model = buildModel(sheet, params, io, { flag: path ? '--points' : '--kpoints', value: count, kpoints: (p) => p });

  const progress = new ProgressLine(io.err, 'k-points', { machine: flags.progress === true, job: 'bands' });
  progress.estimate(estimatedSeconds(sheet.sheet, count), `${model.atoms} atoms at ${count} k-points`, { atoms: model.atoms, kpoints: count });
  const result = computeBands(model, kpoints, { onProgress: (done, total) => progress.update(done, done / total) });
  progress.done();

  if (flags.csv !== undefined) writeNamedFile(io, '--csv', flags.csv as string, bandsCsv({ ...result, kpoints, distance: path?.distance }));
  if (flags.json) {
    const document: Record<string, unknown> = {
      kpoints: rows(kpoints, count, 2),
      energies: rows(result.energies, count, result.bands),
      sigma_weight: rows(result.sigmaWeight, count, result.bands),
    };
    if (path) document.path = pathJson(path);
    document.parameters = params.name;
    document.sheet = sheet.label;
    io.out(`${JSON.stringify(document)}\n`);
  } else {
    io.out(`${sheet.label}: ${model.atoms} atoms, ${result.bands} bands at ${count} k-points, parameters ${params.name}\n`);
    let low = Infinity, high = -Infinity;
    for (const e of result.energies) {
      if (e < low) low = e;
      if (e > high) high = e;
    }
    io.out(`energies from ${low.toFixed(3)} to ${high.toFixed(3)} eV${path ? `; path ${path.labels.map((l) => l.label).join('–')} (${path.cellType} cell)` : ''}\n`);
    if (path) {
      // Where each label lies: x along the sheet's first cell vector, y perpendicular in its plane.
      io.out(`path points in Cartesian Å⁻¹ (kx along the first cell vector): ${labelPlaces(path)}\n`);
    }
    if (flags.csv !== undefined) io.out(`wrote ${flags.csv}\n`);
  }
  return 0;
}

export const bandsCommand: Command = { spec, run };
