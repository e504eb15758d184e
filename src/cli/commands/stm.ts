/**
 * `lacuna stm`: a simulated STM picture of a sheet as a greyscale PNG (DESIGN.md contract).
 */
import { invalid } from '../../validate/invalid.ts';
import { encodeGreyPng } from '../../io/png.ts';
import { toGrey8 } from '../../stm/grey.ts';
import { STM_DEFAULTS, stmModel } from '../../stm/simulate.ts';
import { renderStm } from '../../stm/stmImage.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { DOPING_FLAG, JSON_FLAG, OVERWRITE_FLAG, PARAMS_FLAG, SHEET_ARGUMENT, SMEARING_FLAG } from '../commonFlags.ts';
import { checkOutputPath, writeNamedFile, type Command, type CliIo } from '../io.ts';
import { resolveModel } from '../parameters.ts';
import { BIAS_FLAG, HEIGHT_FLAG, MIN_BIAS, MODE_FLAG, STM_CAVEAT, STM_MESH_FLAG, WORK_FUNCTION_FLAG } from '../stmFlags.ts';

const spec: CommandSpec = {
  name: 'stm',
  summary: 'simulated STM picture of a sheet (Tersoff–Hamann on tight binding) as a greyscale PNG',
  positionals: [SHEET_ARGUMENT],
  flags: {
    bias: BIAS_FLAG,
    height: HEIGHT_FLAG,
    pixels: { kind: 'integer', min: 16, max: 2048, placeholder: 'P', help: 'pixels per side, 16 to 2048 (default 256)' },
    cells: { kind: 'integer', min: 1, max: 50, placeholder: 'n', help: 'cells per side: the picture is a square of side n·max(|A1|, |A2|) (default 4)' },
    png: { kind: 'text', placeholder: 'FILE', help: 'the PNG file to write; required' },
    overwrite: OVERWRITE_FLAG,
    mode: MODE_FLAG,
    'work-function': WORK_FUNCTION_FLAG,
    params: PARAMS_FLAG,
    mesh: STM_MESH_FLAG,
    smearing: SMEARING_FLAG,
    doping: DOPING_FLAG,
    json: JSON_FLAG,
  },
};

/** Checks the bias: the window between E_F and E_F + eV must not be empty. */
export function checkBias(bias: number): number {
  if (!(Math.abs(bias) >= MIN_BIAS)) invalid('--bias', bias, `|V| must be at least ${MIN_BIAS} V: the window E_F … E_F + eV is empty at zero bias`);
  return bias;
}

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  const png = flags.png as string | undefined;
  if (png === undefined) invalid('--png', undefined, 'required: the PNG file to write');
  checkOutputPath(io, '--png', png, flags.overwrite === true);
  const bias = checkBias((flags.bias as number | undefined) ?? STM_DEFAULTS.bias);
  const mesh = (flags.mesh as number | undefined) ?? STM_DEFAULTS.mesh;
  const { sheet, model } = resolveModel(positionals.SHEET, flags.params as string | undefined, io, { flag: '--mesh', value: mesh, kpoints: (m) => m * m });
  const stm = stmModel(model, {
    bias, mesh,
    height: flags.height as number | undefined,
    mode: flags.mode as 'constant-current' | 'constant-height' | undefined,
    workFunction: flags['work-function'] as number | undefined,
    smearing: flags.smearing as number | undefined,
    doping: flags.doping as number | undefined,
  });
  if (!(stm.states > 1e-6)) {
    const gap = stm.gap ? `: E_F = ${stm.fermi.toFixed(3)} eV lies in a gap from ${stm.gap.lower.toFixed(3)} to ${stm.gap.upper.toFixed(3)} eV, so |V| must exceed ${Math.min(stm.fermi - stm.gap.lower, stm.gap.upper - stm.fermi).toFixed(2)} V` : '';
    invalid('--bias', bias, `no states of ${sheet.label} lie in the window E_F … E_F + eV on this mesh${gap}; or widen --smearing`);
  }
  const picture = renderStm(stm, model.sheet.cell, { pixels: flags.pixels as number | undefined, cells: flags.cells as number | undefined });
  let lo = Infinity, hi = -Infinity;
  for (const v of picture.values) {
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  writeNamedFile(io, '--png', png, encodeGreyPng(picture.width, picture.height, toGrey8(picture.values)));
  const quantity = stm.mode === 'constant-height' ? 'current (arbitrary units)' : 'tip height above the highest atom (Å)';
  if (flags.json) {
    io.out(`${JSON.stringify({
      png, pixel_size: picture.pixelSize, width: picture.width, height: picture.height,
      sheet: sheet.label, parameters: model.parameters.name, mode: stm.mode, bias: stm.bias, tip_height: stm.height,
      fermi: stm.fermi, kappa: stm.kappa, states_in_window: stm.states, grey: { quantity, black: lo, white: hi },
      model: 'Tersoff–Hamann on tight binding (model image, not a prediction)',
    })}\n`);
  } else {
    io.out([
      `${sheet.label}: ${picture.width}×${picture.height} pixels of ${picture.pixelSize.toFixed(4)} Å written to ${png}`,
      `${stm.mode}, sample bias ${stm.bias} V (${stm.bias > 0 ? 'empty' : 'filled'} states), tip ${stm.height} Å above the highest atom, κ = ${stm.kappa.toFixed(4)} Å⁻¹, E_F = ${stm.fermi.toFixed(4)} eV (${model.parameters.name})`,
      `grey: ${quantity}, black ${lo.toPrecision(5)} … white ${hi.toPrecision(5)}; x along the first cell vector, y up`,
      STM_CAVEAT,
    ].join('\n') + '\n');
  }
  return 0;
}

export const stmCommand: Command = { spec, run };
