/**
 * The --params option (a parameter-set preset name or a parameter file, DESIGN.md contract), and the model
 * that it and the SHEET argument make.
 */
import { invalid } from '../io/invalid.ts';
import { parseParameterFile } from '../io/paramsFile.ts';
import { DEFAULT_PARAMETERS, PARAMETER_PRESETS, findParameterPreset, type ParameterSet } from '../tb/params.ts';
import { TightBindingModel } from '../tb/model.ts';
import type { CliIo } from './io.ts';
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
  return parseParameterFile(content);
}

/** The sheet, the parameter set and the model of a command's SHEET argument and --params flag. */
export function resolveModel(sheetText: string, paramsText: string | undefined, io: CliIo): { sheet: SheetArgument; params: ParameterSet; model: TightBindingModel } {
  const sheet = resolveSheet(sheetText, io);
  const params = resolveParameters(paramsText, io);
  return { sheet, params, model: new TightBindingModel(sheet.sheet, params) };
}
