/**
 * `lacuna export`: a sheet as CIF, extended XYZ or the explicit JSON form (DESIGN.md contract).
 */
import { sheetToCif } from '../../io/cif.ts';
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
  const text = format === 'cif' ? sheetToCif(named) : format === 'xyz' ? sheetToXyz(named) : sheetToJson(named);
  if (flags.out !== undefined) writeNamedFile(io, '--out', flags.out as string, text);
  else io.out(text.endsWith('\n') ? text : `${text}\n`);
  return 0;
}

export const exportCommand: Command = { spec, run };
