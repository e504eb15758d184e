/**
 * The --params option (a parameter-set preset name or a parameter file, DESIGN.md contract), and the model
 * that it and the SHEET argument make.
 */
import { invalid, namingSource } from '../validate/invalid.ts';
import { parseParameterFile } from '../io/paramsFile.ts';
import { DEFAULT_PARAMETERS, PARAMETER_PRESETS, findParameterPreset, type ParameterSet } from '../tb/params.ts';
import { TightBindingModel } from '../tb/model.ts';
import type { CliIo } from './io.ts';
import { guardSolve } from './workEstimate.ts';
import { DEFAULT_SMEARING } from '../tb/fill.ts';
import { meshSpectrum, type MeshSpectrum } from '../tb/meshSpectrum.ts';
import { chooseMesh, meshForSpacing, type MeshChoice } from '../tb/meshDensity.ts';
import type { Sheet } from '../lattice/sheet.ts';
import { ProgressLine } from './progress.ts';
import { estimatedSeconds } from './workEstimate.ts';
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
  return namingSource('the parameter file', name, () => parseParameterFile(content, name));
}

/** The sheet, the parameter set and the model of a command's SHEET argument and --params flag. */
export function resolveModel(
  sheetText: string,
  paramsText: string | undefined,
  io: CliIo,
  /** The flag that sizes the job, its value, and the k-points it means (or these given the sheet): refused up front if it would take hours. */
  work: JobSize | ((sheet: Sheet) => JobSize),
): { sheet: SheetArgument; params: ParameterSet; model: TightBindingModel } {
  const sheet = resolveSheet(sheetText, io);
  const params = resolveParameters(paramsText, io);
  return { sheet, params, model: buildModel(sheet, params, io, typeof work === 'function' ? work(sheet.sheet) : work) };
}

/** What sizes a tight-binding job: a flag, its value, and the number of k-points a value means. */
export interface JobSize {
  flag: string;
  value: number;
  kpoints: (value: number) => number;
  /** The next cheaper value, for the suggestion of one that fits (default v/1.25 rounded down). */
  cheaper?: (value: number) => number;
}

/** The model of a resolved sheet, after the work guard; warns on stderr when no bond lies within the cutoff. */
export function buildModel(sheet: SheetArgument, params: ParameterSet, io: CliIo, work: JobSize): TightBindingModel {
  guardSolve(sheet.sheet, work.flag, work.value, work.kpoints, work.cheaper);
  const model = new TightBindingModel(sheet.sheet, params);
  if (model.bondCount === 0 && sheet.sheet.atoms.length > 0) {
    io.err.write(`warning: no two atoms of ${sheet.label} are closer than the cutoff ${params.cutoff} Å of ${params.name}; every band is flat\n`);
  }
  return model;
}

/**
 * The mesh of a mesh command from its --mesh and --kspacing flags (exclusive) by the rule of src/tb/meshDensity.ts;
 * `equalDensity` for jobs that compare cells.
 */
export function meshChoiceOf(flags: Record<string, unknown>, sheet: Pick<Sheet, 'cell' | 'atoms'>, equalDensity = false): MeshChoice {
  if (flags.mesh !== undefined && flags.kspacing !== undefined) invalid('--kspacing', String(flags.kspacing), 'give --mesh or --kspacing, not both');
  return chooseMesh(sheet, { mesh: flags.mesh as number | undefined, kspacing: flags.kspacing as number | undefined, equalDensity });
}

/** What sizes a mesh job, for the work guard: the flag the user gave (a spacing refused names --kspacing). */
export function meshWork(flags: Record<string, unknown>): (sheet: Sheet) => JobSize {
  return (sheet) => {
    const choice = meshChoiceOf(flags, sheet);
    if (choice.rule === 'kspacing') {
      return {
        flag: '--kspacing', value: choice.kspacing!, kpoints: (s) => meshForSpacing(sheet.cell, s) ** 2,
        cheaper: (s) => Number((s * 1.25).toPrecision(2)),
      };
    }
    return { flag: '--mesh', value: choice.mesh, kpoints: (m) => m * m };
  };
}

/** The JSON keys that say which mesh a result used and why (every mesh command prints them). */
export function meshJson(choice: MeshChoice): Record<string, unknown> {
  return { mesh: choice.mesh, mesh_rule: choice.rule, ...(choice.kspacing !== undefined ? { kspacing: choice.kspacing } : {}) };
}

/** States a mesh job's estimate before the work (stderr; see progress.ts). */
export function announceMesh(progress: ProgressLine, sheet: Sheet, choice: MeshChoice): void {
  const seconds = estimatedSeconds(sheet, choice.mesh * choice.mesh);
  progress.estimate(seconds, `${sheet.atoms.length} atoms on a ${choice.why}`, { atoms: sheet.atoms.length, mesh: choice.mesh, mesh_rule: choice.rule, kpoints: choice.mesh * choice.mesh });
}

/** The mesh spectrum of a command's SHEET, --params, --mesh or --kspacing, and --smearing, with progress on stderr. */
export function resolveSpectrum(sheetText: string, flags: Record<string, unknown>, io: CliIo, job: string): {
  sheet: SheetArgument;
  model: TightBindingModel;
  spectrum: MeshSpectrum;
  smearing: number;
  meshChoice: MeshChoice;
} {
  const { sheet, model } = resolveModel(sheetText, flags.params as string | undefined, io, meshWork(flags));
  const meshChoice = meshChoiceOf(flags, sheet.sheet);
  const progress = new ProgressLine(io.err, 'k-points', { machine: flags.progress === true, job });
  announceMesh(progress, sheet.sheet, meshChoice);
  const spectrum = meshSpectrum(model, { mesh: meshChoice.mesh, onProgress: (done, total) => progress.update(done, done / total) });
  progress.done();
  return { sheet, model, spectrum, smearing: (flags.smearing as number | undefined) ?? DEFAULT_SMEARING, meshChoice };
}
