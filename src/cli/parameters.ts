/**
 * The --params option (a parameter-set preset name or a parameter file, DESIGN.md contract), and the model
 * that it and the SHEET argument make.
 */
import { invalid } from '../io/invalid.ts';
import { parseParameterFile } from '../io/paramsFile.ts';
import { DEFAULT_PARAMETERS, PARAMETER_PRESETS, findParameterPreset, type ParameterSet } from '../tb/params.ts';
import { TightBindingModel } from '../tb/model.ts';
import type { CliIo } from './io.ts';
import { guardSolve } from './workEstimate.ts';
import { DEFAULT_SMEARING } from '../tb/fill.ts';
import { DEFAULT_MESH, meshSpectrum, type MeshSpectrum } from '../tb/meshSpectrum.ts';
import { ProgressLine } from './progress.ts';
import { resolveSheet, type SheetArgument } from './sheetArgument.ts';

export function resolveParameters(value: string | undefined, io: CliIo): ParameterSet {
  const name = value ?? DEFAULT_PARAMETERS;
  const preset = findParameterPreset(name);
  if (preset) return preset;
  let content: string;
  try {
    content = io.readText(name);
  } catch (error) {
    const names = PARAMETER_PRESETS.map((p) => p.name).join(', ');
    const reason = (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such parameter set or file' : 'cannot read the file';
    invalid('--params', name, `${reason}; presets: ${names}`);
  }
  return parseParameterFile(content, name);
}

/** The sheet, the parameter set and the model of a command's SHEET argument and --params flag. */
export function resolveModel(
  sheetText: string,
  paramsText: string | undefined,
  io: CliIo,
  /** The flag that sizes the job, its value, and the k-points it means: refused up front if it would take hours. */
  work: JobSize,
): { sheet: SheetArgument; params: ParameterSet; model: TightBindingModel } {
  const sheet = resolveSheet(sheetText, io);
  const params = resolveParameters(paramsText, io);
  return { sheet, params, model: buildModel(sheet, params, io, work) };
}

/** What sizes a tight-binding job: a flag, its value, and the number of k-points a value means. */
export interface JobSize {
  flag: string;
  value: number;
  kpoints: (value: number) => number;
}

/** The model of a resolved sheet, after the work guard; warns on stderr when no bond lies within the cutoff. */
export function buildModel(sheet: SheetArgument, params: ParameterSet, io: CliIo, work: JobSize): TightBindingModel {
  guardSolve(sheet.sheet, work.flag, work.value, work.kpoints);
  const model = new TightBindingModel(sheet.sheet, params);
  if (model.bondCount === 0 && sheet.sheet.atoms.length > 0) {
    io.err.write(`warning: no two atoms of ${sheet.label} are closer than the cutoff ${params.cutoff} Å of ${params.name}; every band is flat\n`);
  }
  return model;
}

/** The k-point count of the --mesh flag: M² (filling uses each pair k, −k once, but the bound is what counts). */
export const MESH_WORK = (flags: Record<string, unknown>): JobSize => ({ flag: '--mesh', value: (flags.mesh as number | undefined) ?? DEFAULT_MESH, kpoints: (m: number) => m * m });

/** The mesh spectrum of a command's SHEET, --params, --mesh and --smearing, with a progress line on stderr. */
export function resolveSpectrum(sheetText: string, flags: Record<string, unknown>, io: CliIo): {
  sheet: SheetArgument;
  model: TightBindingModel;
  spectrum: MeshSpectrum;
  smearing: number;
} {
  const { sheet, model } = resolveModel(sheetText, flags.params as string | undefined, io, MESH_WORK(flags));
  const progress = new ProgressLine(io.err, 'k-points');
  const spectrum = meshSpectrum(model, { mesh: flags.mesh as number | undefined, onProgress: (done, total) => progress.update(done, done / total) });
  progress.done();
  return { sheet, model, spectrum, smearing: (flags.smearing as number | undefined) ?? DEFAULT_SMEARING };
}
