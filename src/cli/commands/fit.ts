/**
 * `lacuna fit`: coincidence fits of a sheet on a metal surface, smallest cell first (DESIGN.md contract).
 */
import { FIT_DEFAULTS, coincidenceFits } from '../../substrate/coincidence.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { JSON_FLAG, SHEET_ARGUMENT } from '../commonFlags.ts';
import type { CliIo, Command } from '../io.ts';
import { resolveSheet } from '../sheetArgument.ts';
import { SUBSTRATE_CAVEAT, SUBSTRATE_FLAG, substrateOf } from '../substrateFlags.ts';

/** Largest coincidence cell the CLI searches (substrate atoms): the search grows about as the cube of it. */
export const MAX_FIT_SITES = 120;

const spec: CommandSpec = {
  name: 'fit',
  summary: 'coincidence cells of a sheet on a metal surface: rotation, supercells and strain, smallest first',
  positionals: [SHEET_ARGUMENT],
  flags: {
    substrate: SUBSTRATE_FLAG,
    'max-strain': { kind: 'number', min: 0, max: 0.2, exclusiveMin: true, placeholder: 's', help: `largest strain, max |principal stretch − 1| (default ${FIT_DEFAULTS.maxStrain}; above 0 and at most 0.2)` },
    'max-sites': { kind: 'integer', min: 1, max: MAX_FIT_SITES, placeholder: 'N', help: `largest coincidence cell in substrate atoms (default ${FIT_DEFAULTS.maxSites}; 1–${MAX_FIT_SITES})` },
    json: JSON_FLAG,
  },
};

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  const substrate = substrateOf(flags);
  const sheet = resolveSheet(positionals.SHEET, io);
  const maxStrain = (flags['max-strain'] as number | undefined) ?? FIT_DEFAULTS.maxStrain;
  const maxSites = (flags['max-sites'] as number | undefined) ?? FIT_DEFAULTS.maxSites;
  const found = coincidenceFits(sheet.sheet, substrate.nnDistance, { maxStrain, maxSites, maxFits: FIT_DEFAULTS.maxFits + 1 });
  const truncated = found.length > FIT_DEFAULTS.maxFits;
  const fits = found.slice(0, FIT_DEFAULTS.maxFits);
  if (flags.json) {
    io.out(`${JSON.stringify({
      substrate: { name: substrate.name, nn_distance: substrate.nnDistance, title: substrate.title, lattice_source: substrate.latticeSource },
      matches: fits.map((fit) => ({
        angle_deg: fit.angleDeg,
        strain: fit.strain,
        sheet_supercell: fit.sheetSupercell,
        substrate_supercell: fit.substrateSupercell,
        sites: fit.sites,
        sheet_cells: fit.sheetCells,
        sheet_atoms: fit.sheetCells * sheet.sheet.atoms.length,
        stretches: fit.stretches,
        area: fit.area,
        moire: { period: fit.moire.a, a: fit.moire.a, b: fit.moire.b, gamma_deg: fit.moire.gammaDeg, angle_deg: fit.moire.angleDeg },
        ...(fit.wood ? { wood: fit.wood } : {}),
      })),
      sheet: sheet.label,
      max_strain: maxStrain,
      max_sites: maxSites,
      truncated,
      caveat: SUBSTRATE_CAVEAT,
    })}\n`);
    return 0;
  }
  const lines = [
    `${sheet.label} on ${substrate.title} (a_s = ${substrate.nnDistance.toFixed(4)} Å): ${fits.length} fit${fits.length === 1 ? '' : 's'} up to ${maxSites} metal atoms and strain ${maxStrain}`,
  ];
  if (truncated) lines.push(`  only the first ${FIT_DEFAULTS.maxFits} are listed: lower --max-strain or --max-sites to see all`);
  if (fits.length === 0) lines.push('  none: raise --max-strain or --max-sites');
  else lines.push('  metal atoms  sheet cells  angle (°)  strain (%)  moiré cell a × b (Å), γ (°), turned (°)   sheet rows → metal rows');
  for (const fit of fits) {
    const rows = (r: number[][]) => `[${r.map((x) => `[${x.join(',')}]`).join(',')}]`;
    lines.push(`  ${String(fit.sites).padStart(11)}  ${String(fit.sheetCells).padStart(11)}  ${fit.angleDeg.toFixed(3).padStart(9)}  ${(100 * fit.strain).toFixed(3).padStart(10)}  ${`${fit.moire.a.toFixed(3)} × ${fit.moire.b.toFixed(3)}, ${fit.moire.gammaDeg.toFixed(1)}, ${fit.moire.angleDeg.toFixed(2)}`.padEnd(36)}  ${rows(fit.sheetSupercell)} → ${rows(fit.substrateSupercell)}${fit.wood ? `  ${fit.wood}` : ''}`);
  }
  lines.push('The fit compares lattices only: it says which cells could coincide, not which one forms; strain is the largest |principal stretch − 1| of the map onto the metal.');
  lines.push(SUBSTRATE_CAVEAT);
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

export const fitCommand: Command = { spec, run };
