/**
 * `lacuna enumerate`: every vacancy pattern of the triangular lattice in a range of cell sizes and hole counts,
 * each once up to the 12 operations of 6mm and translations, at its smallest cell (DESIGN.md contract).
 */
import { countRowKeys, countStructures, enumerateStructures, type CountRow, type EnumerateOptions, type Structure } from '../../enumerate/index.ts';
import { invalid } from '../../validate/invalid.ts';
import { hnfRows, patternCell, patternToSheet } from '../../lattice/pattern.ts';
import { periodicityMismatch, periodicityOf, reducedPeriodicity } from '../../lattice/periodicity.ts';
import { parseArgs, rangeText, type CommandSpec } from '../args.ts';
import { JSON_FLAG, PROGRESS_FLAG } from '../commonFlags.ts';
import { estimateEnumerate, expectedAt } from '../enumerateEstimate.ts';
import type { Command, CliIo } from '../io.ts';
import { ProgressLine, readableBytes, readableSeconds } from '../progress.ts';

/** Largest listing written without --allow-large-output (estimated bytes on stdout). */
export const MAX_OUTPUT_BYTES = 250e6;

/** Largest cell the command accepts; counts grow roughly like C(N, k)/(12N), so past this a run takes hours. */
export const MAX_SITES = 64;

const spec: CommandSpec = {
  name: 'enumerate',
  summary: 'list every vacancy pattern up to symmetry, by sites per cell and holes per cell (N = 1, k = 1 is the empty labeling: no atoms, marked "empty")',
  positionals: [],
  flags: {
    sites: { kind: 'integerRange', min: 1, max: MAX_SITES, placeholder: 'N1-N2', help: `lattice sites per cell (1–${MAX_SITES}); required` },
    holes: { kind: 'integerRange', min: 0, max: MAX_SITES, placeholder: 'K1-K2', help: 'vacancies per cell; required' },
    isolated: { kind: 'switch', help: 'only patterns where no two vacancies are nearest neighbours' },
    eta: { kind: 'numberRange', min: 0, max: 1, placeholder: 'η1-η2', help: 'only hole densities in this range' },
    'max-elongation': { kind: 'number', min: 1, max: 1e6, placeholder: 'r', help: 'only cells whose reduced vectors differ in length by at most this ratio' },
    shard: { kind: 'shard', placeholder: 'i/n', help: 'do the i-th of n deterministic parts of the work (outputs of all n concatenate to the whole)' },
    cell: { kind: 'numberList', min: 0, max: 1000, length: 3, exclusiveMin: true, placeholder: 'a,b,γ', help: 'only patterns whose reduced cell matches a measured one: lengths a, b in Å (at the --bond), angle γ in degrees' },
    'cell-tolerance': { kind: 'numberList', min: 0, max: 180, length: 2, placeholder: 'Å,°', help: 'how far lengths and angle may differ for --cell (default 0.15,3)' },
    bond: { kind: 'number', min: 0, max: 10, exclusiveMin: true, placeholder: 'Å', help: 'B–B distance for the Cartesian cell and atoms (default 1.69)' },
    'counts-only': { kind: 'switch', help: 'count without listing (memory stays flat)' },
    jsonl: { kind: 'switch', help: 'one JSON object per structure per line and nothing else (shard outputs concatenate with cat)' },
    json: JSON_FLAG,
    'allow-large-output': { kind: 'switch', help: `list even when the output is estimated above ${MAX_OUTPUT_BYTES / 1e6} MB (refused by default)` },
    progress: PROGRESS_FLAG,
  },
};

function structureJson(structure: Structure, bond: number): Record<string, unknown> {
  const sheet = patternToSheet({ ...structure.pattern, bond });
  const entry: Record<string, unknown> = {
    sites: structure.sites,
    holes: structure.holes,
    eta: structure.eta,
    supercell: hnfRows(structure.pattern.supercell),
    vacancies: structure.pattern.vacancies,
    cell: sheet.cell,
    atoms: sheet.atoms,
  };
  if (sheet.atoms.length === 0) entry.empty = true; // every site vacant: a labeling, not a sheet to solve
  const lattice = reducedPeriodicity(sheet.cell);
  entry.lattice = { a: lattice.a, b: lattice.b, gamma_deg: lattice.gammaDeg };
  if (structure.phase !== undefined) entry.phase = structure.phase;
  entry.canonical = structure.canonical;
  return entry;
}

/** The --cell filter: keeps structures whose reduced cell is within the tolerance of the measured one. */
function cellFilter(cell: number[] | undefined, tolerance: number[] | undefined): ((s: Structure, bond: number) => boolean) | undefined {
  if (!cell) return undefined;
  if (!(cell[2] > 0 && cell[2] < 180)) invalid('--cell', cell.join(','), 'γ must lie strictly between 0° and 180°');
  const target = periodicityOf(cell[0], cell[1], cell[2]);
  const [lengthTolerance, angleTolerance] = tolerance ?? [0.15, 3];
  return (structure, bond) => {
    const miss = periodicityMismatch(reducedPeriodicity(patternCell({ ...structure.pattern, bond })), target);
    return miss.length <= lengthTolerance && miss.angleDeg <= angleTolerance;
  };
}

/** Most structures a run may be expected to produce before it is refused (about an hour at 1e6 per second). */
export const MAX_EXPECTED_STRUCTURES = 4e9;

/** Expected number of structures in the range (enumerateEstimate.ts): refuses runs that would not end. */
export function expectedStructures(sites: [number, number], holes: [number, number], isolated: boolean): number {
  let total = 0;
  for (let n = sites[0]; n <= sites[1]; n++) for (let k = holes[0]; k <= Math.min(holes[1], n); k++) total += expectedAt(n, k, isolated);
  return total;
}

/** Why a range has no (sites, holes) row at all, for the user. */
function whyNoRows(options: EnumerateOptions): string {
  const n2 = options.sites[1];
  const [k1] = options.holes;
  if (k1 > n2) return `a cell of N sites holds at most N holes, and --holes starts at ${k1} while --sites ends at ${n2}`;
  return `no hole density k/N of these ranges lies within --eta ${rangeText(options.holeDensity ?? [0, 1])}`;
}

function countTable(rows: readonly CountRow[]): string {
  const lines = ['sites  holes   η        structures'];
  for (const row of rows) {
    lines.push(`${String(row.sites).padStart(5)}  ${String(row.holes).padStart(5)}   ${(row.holes / row.sites).toFixed(4).padEnd(8)} ${String(row.structures).padStart(10)}`);
  }
  return lines.join('\n');
}

async function run(argv: readonly string[], io: CliIo): Promise<number> {
  const { flags } = parseArgs(spec, argv);
  if (!flags.sites) invalid('--sites', undefined, 'required, e.g. --sites 1-12');
  if (!flags.holes) invalid('--holes', undefined, 'required, e.g. --holes 1-3');
  const expected = expectedStructures(flags.sites as [number, number], flags.holes as [number, number], flags.isolated === true);
  if (expected > MAX_EXPECTED_STRUCTURES) {
    invalid('--sites', rangeText(flags.sites as number[]), `about ${expected.toExponential(1)} structures with these --holes; narrow the ranges, add --isolated, or split the job with --shard`);
  }
  const bond = (flags.bond as number | undefined) ?? 1.69;
  const progress = new ProgressLine(io.err, 'labelings', { machine: flags.progress === true, job: 'enumerate' });
  const options: EnumerateOptions = {
    sites: flags.sites as [number, number],
    holes: flags.holes as [number, number],
    isolated: flags.isolated === true,
    bond,
    onProgress: (p) => progress.update(p.examined, p.fraction, `${p.found} found`),
  };
  if (flags.eta) options.holeDensity = flags.eta as [number, number];
  if (flags['max-elongation'] !== undefined) options.maxElongation = flags['max-elongation'] as number;
  if (flags.shard) options.shard = flags.shard as { index: number; count: number };
  const json = flags.json === true;
  const jsonl = flags.jsonl === true;
  if (json && jsonl) invalid('--jsonl', '--jsonl', 'give --json or --jsonl, not both');
  if (jsonl && flags['counts-only']) invalid('--jsonl', '--jsonl', 'lists structures; with --counts-only use --json');
  if (flags['cell-tolerance'] !== undefined && flags.cell === undefined) invalid('--cell-tolerance', (flags['cell-tolerance'] as number[]).join(','), 'only with --cell');
  const fits = cellFilter(flags.cell as number[] | undefined, flags['cell-tolerance'] as number[] | undefined);

  if (countRowKeys(options).length === 0) {
    const why = whyNoRows(options);
    if (jsonl) return 0;
    io.out(json ? `${JSON.stringify({ counts: [], structures: [], note: `none: ${why}` })}\n` : `none: ${why}\n`);
    return 0;
  }
  const output = flags['counts-only'] ? 'counts' : json || jsonl ? 'json' : 'text';
  const estimate = estimateEnumerate(options, output);
  if (output !== 'counts' && estimate.bytes > MAX_OUTPUT_BYTES && flags['allow-large-output'] !== true) {
    invalid('--sites', rangeText(flags.sites as number[]), `about ${readableBytes(estimate.bytes)} of output or more (about ${estimate.structures.toExponential(1)} structures, ${readableSeconds(estimate.seconds)}); count them with --counts-only, narrow --sites or --holes, add --isolated, split the job with --shard, or add --allow-large-output`);
  }
  progress.estimate(
    estimate.seconds,
    `about ${estimate.structures.toExponential(1)} structures${output === 'counts' ? '' : `, about ${readableBytes(estimate.bytes)} of output`}`,
    { structures: Math.round(estimate.structures), bytes: Math.round(estimate.bytes) },
  );

  if (flags['counts-only'] && !fits) {
    const counts = countStructures(options);
    progress.done();
    io.out(json ? `${JSON.stringify({ counts, structures: [], counts_only: true })}\n` : `${countTable(counts)}\n`);
    return 0;
  }

  // Stream the structures (memory flat in their number), tallying counts as they pass.
  const tally = new Map<string, number>();
  const list = !flags['counts-only'];
  if (json && list) io.out('{"structures":[');
  let first = true;
  for (const structure of enumerateStructures(options)) {
    if (fits && !fits(structure, bond)) continue;
    const key = `${structure.sites}/${structure.holes}`;
    tally.set(key, (tally.get(key) ?? 0) + 1);
    if (!list) continue;
    if (jsonl) {
      io.out(`${JSON.stringify(structureJson(structure, bond))}\n`);
    } else if (json) {
      io.out(`${first ? '\n' : ',\n'}${JSON.stringify(structureJson(structure, bond))}`);
    } else {
      const phase = structure.phase ? `  = ${structure.phase}` : '';
      const vacancies = structure.pattern.vacancies.map(([i, j]) => `(${i},${j})`).join(' ');
      const cell = reducedPeriodicity(patternCell({ ...structure.pattern, bond }));
      io.out(`N=${structure.sites} k=${structure.holes} η=${structure.eta.toFixed(4)}  cell ${cell.a.toFixed(2)} × ${cell.b.toFixed(2)} Å, γ ${cell.gammaDeg.toFixed(1)}°  supercell ${JSON.stringify(hnfRows(structure.pattern.supercell))} holes ${vacancies}${phase}\n`);
    }
    first = false;
  }
  progress.done();
  const counts: CountRow[] = countRowKeys(options).map(({ sites, holes }) => ({ sites, holes, structures: tally.get(`${sites}/${holes}`) ?? 0 }));
  if (jsonl) return 0;
  if (json && list) io.out(`\n],"counts":${JSON.stringify(counts)}}\n`);
  else if (json) io.out(`${JSON.stringify({ counts, structures: [], counts_only: true })}\n`);
  else io.out(`${list ? '\n' : ''}${countTable(counts)}\n`);
  return 0;
}

export const enumerateCommand: Command = { spec, run };
