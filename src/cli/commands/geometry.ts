/**
 * `lacuna geometry`: what a sheet is, read off its structure — pattern form (when it has one), hole density,
 * reduced cell, coordination numbers and holes. No model, no estimate beyond the ones it names.
 */
import { canonicalForm } from '../../enumerate/index.ts';
import { presetPhase } from '../../enumerate/phase.ts';
import { coordinationHistogram, estimateHoleDensity, sheetCoordination } from '../../lattice/geometry.ts';
import { hexagonalHoles, vacancyClusters } from '../../lattice/holes.ts';
import { holeDensity, hnfRows } from '../../lattice/pattern.ts';
import { reducedPeriodicity } from '../../lattice/periodicity.ts';
import { sheetToPattern } from '../../lattice/recognise.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { JSON_FLAG, SHEET_ARGUMENT } from '../commonFlags.ts';
import type { Command, CliIo } from '../io.ts';
import { resolveSheet } from '../sheetArgument.ts';

const spec: CommandSpec = {
  name: 'geometry',
  summary: 'hole density, reduced cell, coordination and holes of a sheet (and its vacancy pattern when it has one)',
  positionals: [SHEET_ARGUMENT],
  flags: { json: JSON_FLAG },
};

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  const { sheet, pattern: given, label } = resolveSheet(positionals.SHEET, io);
  const pattern = given ?? sheetToPattern(sheet);
  const cell = reducedPeriodicity(sheet.cell);
  const histogram = coordinationHistogram(sheetCoordination(sheet));
  const estimate = pattern ? undefined : estimateHoleDensity(sheet);
  const eta = pattern ? holeDensity(pattern) : estimate!.eta;
  const canonical = pattern ? canonicalForm(pattern) : undefined;
  const phase = canonical ? presetPhase(canonical) : undefined;
  const clusters = pattern ? vacancyClusters(pattern) : [];
  const hexagonal = pattern ? hexagonalHoles(pattern) : [];
  const document: Record<string, unknown> = {
    sheet: label,
    atoms: sheet.atoms.length,
    eta,
    eta_estimated: pattern === undefined,
    lattice: { a: cell.a, b: cell.b, gamma_deg: cell.gammaDeg },
    coordination: Object.fromEntries(histogram.flatMap((count, c) => (count ? [[String(c), count]] : []))),
  };
  if (pattern) {
    document.pattern = { bond: pattern.bond, supercell: hnfRows(pattern.supercell), vacancies: pattern.vacancies, sites: pattern.supercell.a * pattern.supercell.c };
    document.canonical = canonical;
    if (phase) document.phase = phase;
    // `holes` is a count in every output (enumerate); the shapes of the holes are their own key.
    document.hole_clusters = { hexagonal: hexagonal.length, clusters: clusters.map((c) => ({ size: c.size, periodic: c.periodic })) };
  }
  if (flags.json) {
    io.out(`${JSON.stringify(document)}\n`);
    return 0;
  }
  const coordination = Object.entries(document.coordination as Record<string, number>).map(([c, n]) => `${n} × ${c}-fold`).join(', ');
  const lines = [
    `${label}: ${sheet.atoms.length} atoms per cell${phase ? ` (the ${phase} sheet)` : ''}`,
    `  hole density η   ${eta.toFixed(4)}${pattern ? '' : '  (estimated from the areal density: not recognised as a flat triangular-lattice pattern)'}`,
    `  reduced cell     ${cell.a.toFixed(3)} × ${cell.b.toFixed(3)} Å, γ = ${cell.gammaDeg.toFixed(2)}°`,
    `  coordination     ${coordination || 'none (no neighbours within 1.2 × the shortest distance)'}`,
  ];
  if (pattern) {
    lines.push(`  pattern          supercell ${JSON.stringify(hnfRows(pattern.supercell))} of ${pattern.supercell.a * pattern.supercell.c} sites, bond ${pattern.bond.toFixed(4)} Å, vacancies ${pattern.vacancies.map(([i, j]) => `(${i},${j})`).join(' ') || 'none'}`);
    const sizes = clusters.filter((c) => c.size > 1 || c.periodic).map((c) => `${c.size}${c.periodic ? ' (endless row)' : ''}`);
    lines.push(`  holes            ${hexagonal.length} hexagonal${sizes.length ? `; larger clusters of ${sizes.join(', ')} vacancies` : ''}`);
  }
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

export const geometryCommand: Command = { spec, run };
