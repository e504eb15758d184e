/**
 * `lacuna bands`: band energies and σ weights on an automatic k-path or on given k-points (DESIGN.md contract).
 */
import { invalid, namingSource, ValidationError } from '../../validate/invalid.ts';
import { parseKpointsText } from '../../io/kpointsFile.ts';
import { autoPath, computeBands, type KPath } from '../../tb/index.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { checkOutputPath, writeNamedFile, type Command, type CliIo } from '../io.ts';
import { JSON_FLAG, OVERWRITE_FLAG, PARAMS_FLAG, PROGRESS_FLAG, SHEET_ARGUMENT } from '../commonFlags.ts';
import { buildModel, resolveParameters } from '../parameters.ts';
import { estimatedSeconds } from '../workEstimate.ts';
import { resolveSheet } from '../sheetArgument.ts';
import { ProgressLine } from '../progress.ts';
import { bandsCsv } from '../../io/csv.ts';

const spec: CommandSpec = {
  name: 'bands',
  summary: 'tight-binding bands of a sheet with the σ share of every state',
  positionals: [SHEET_ARGUMENT],
  flags: {
    params: PARAMS_FLAG,
    kpoints: { kind: 'text', placeholder: 'FILE', help: 'k-points file {"kpoints": [[kx, ky]]}, Cartesian Å⁻¹' },
    path: { kind: 'choice', values: ['auto'], placeholder: 'auto', help: 'the automatic path through the special points of the reduced cell' },
    points: { kind: 'integer', min: 2, max: 100_000, placeholder: 'P', help: 'points on the automatic path (default 300)' },
    csv: { kind: 'text', placeholder: 'FILE', help: 'also write the bands as CSV' },
    overwrite: OVERWRITE_FLAG,
    json: JSON_FLAG,
    progress: PROGRESS_FLAG,
  },
};

/**
 * Each path label with its k-point in Cartesian Å⁻¹ of the sheet's own frame (x along its first cell vector): a
 * label such as X of a rectangular cell lies along whichever axis the cell puts it, so the output says where.
 */
function labelsWithK(path: KPath): { label: string; index: number; k: [number, number] }[] {
  return path.labels.map((l) => ({ ...l, k: [path.kpoints[2 * l.index], path.kpoints[2 * l.index + 1]] }));
}

/** Rows of a k-major Float64Array, rounded only by JSON's shortest round-trip printing. */
function rows(values: Float64Array, count: number, width: number): number[][] {
  const out: number[][] = [];
  for (let k = 0; k < count; k++) out.push(Array.from(values.subarray(k * width, (k + 1) * width)));
  return out;
}

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  checkOutputPath(io, '--csv', flags.csv as string | undefined, flags.overwrite === true);
  if (flags.kpoints !== undefined && flags.path !== undefined) invalid('--kpoints', flags.kpoints, 'give either --kpoints or --path auto, not both');
  if (flags.kpoints === undefined && flags.path === undefined) invalid('--path', undefined, 'give --path auto or --kpoints FILE');
  if (flags.points !== undefined && flags.path === undefined) invalid('--points', String(flags.points), 'only with --path auto');
  const sheet = resolveSheet(positionals.SHEET, io);
  const params = resolveParameters(flags.params as string | undefined, io);

  let kpoints: Float64Array;
  let path: KPath | undefined;
  if (flags.path === 'auto') {
    try {
      path = autoPath(sheet.sheet.cell, (flags.points as number | undefined) ?? 300);
    } catch (error) {
      // The path's own minimum depends on the cell type; report it against the flag the user typed.
      if (error instanceof ValidationError && error.field === 'points') throw new ValidationError('--points', error.value, error.why);
      throw error;
    }
    kpoints = path.kpoints;
  } else {
    const file = flags.kpoints as string;
    let text: string;
    try {
      text = io.readText(file);
    } catch {
      invalid('--kpoints', file, 'cannot read the file');
    }
    kpoints = namingSource('the k-points file', file, () => parseKpointsText(text, file));
  }
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
    if (path) document.path = { labels: labelsWithK(path), distance: Array.from(path.distance), cell_type: path.cellType };
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
      const seen = new Set<string>();
      const places = labelsWithK(path).filter((l) => !seen.has(l.label) && seen.add(l.label))
        .map((l) => `${l.label} (${l.k[0].toFixed(4)}, ${l.k[1].toFixed(4)})`);
      io.out(`path points in Cartesian Å⁻¹ (kx along the first cell vector): ${places.join(', ')}\n`);
    }
    if (flags.csv !== undefined) io.out(`wrote ${flags.csv}\n`);
  }
  return 0;
}

export const bandsCommand: Command = { spec, run };
