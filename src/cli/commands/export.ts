/**
 * `lacuna export`: a sheet as CIF, extended XYZ or the explicit JSON form (DESIGN.md contract).
 */
import { sheetToCif } from '../../io/cif.ts';
import { ValidationError } from '../../validate/invalid.ts';
import { sheetToJson } from '../../io/sheetJson.ts';
import { sheetToXyz } from '../../io/xyz.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { OVERWRITE_FLAG, SHEET_ARGUMENT } from '../commonFlags.ts';
import { checkOutputPath, writeNamedFile, type Command, type CliIo } from '../io.ts';
import { resolveSheet } from '../sheetArgument.ts';

const spec: CommandSpec = {
  name: 'export',
  summary: 'write a sheet as CIF, extended XYZ or explicit JSON',
  positionals: [SHEET_ARGUMENT],
  flags: {
    format: { kind: 'choice', values: ['cif', 'xyz', 'json'], placeholder: 'cif|xyz|json', help: 'output format (default json)' },
    out: { kind: 'text', placeholder: 'FILE', help: 'write to FILE instead of stdout' },
    overwrite: OVERWRITE_FLAG,
    'own-cell': { kind: 'switch', help: 'CIF and XYZ in the sheet\'s own cell instead of its right-handed reduced cell (the default)' },
    vacuum: { kind: 'number', min: 0, max: 1000, exclusiveMin: true, placeholder: 'Å', help: 'length of the third (vacuum) cell vector for CIF and XYZ (default 15)' },
  },
};

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  checkOutputPath(io, '--out', flags.out as string | undefined, flags.overwrite === true);
  const { sheet, label } = resolveSheet(positionals.SHEET, io);
  // An unnamed sheet from a file takes the file's base name (not its path) as the data name.
  const fallback = label.replace(/^.*[\\/]/, '').replace(/\.json$/i, '') || 'sheet';
  const named = sheet.name === undefined ? { ...sheet, name: fallback } : sheet;
  const format = (flags.format as string | undefined) ?? 'json';
  const frame = { reduce: flags['own-cell'] !== true, ...(flags.vacuum !== undefined ? { vacuum: flags.vacuum as number } : {}) };
  let text: string;
  try {
    text = format === 'cif' ? sheetToCif(named, frame) : format === 'xyz' ? sheetToXyz(named, frame) : sheetToJson(named);
  } catch (error) {
    // The writers check the vacuum against the sheet's thickness; report it against the flag the user typed.
    if (error instanceof ValidationError && error.field === 'vacuum') throw new ValidationError('--vacuum', error.value, error.why);
    throw error;
  }
  if (flags.out !== undefined) writeNamedFile(io, '--out', flags.out as string, text);
  else io.out(text.endsWith('\n') ? text : `${text}\n`);
  return 0;
}

export const exportCommand: Command = { spec, run };
