/**
 * `lacuna bench eigh [--vectors] [--sizes …]`: seconds per matrix of the Hermitian eigensolver, eigenvalues only or
 * (--vectors) eigenvalues and eigenvectors (DESIGN.md contract).
 */
import { invalid } from '../../validate/invalid.ts';
import { timeEigensystem, timeEigenvalues } from '../../linalg/eighBench.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { JSON_FLAG } from '../commonFlags.ts';
import type { Command, CliIo } from '../io.ts';

const spec: CommandSpec = {
  name: 'bench',
  summary: 'time a kernel: `bench eigh` times eigenvalues (with --vectors also eigenvectors) of random dense complex Hermitian matrices, one thread',
  positionals: [{ name: 'KERNEL', help: 'eigh' }],
  flags: {
    vectors: { kind: 'switch', help: 'time eigenvalues and eigenvectors (default: eigenvalues only)' },
    sizes: { kind: 'integerList', min: 1, max: 512, maxLength: 16, placeholder: 'n1,n2,…', help: 'matrix sizes (default 24,64,128)' },
    json: JSON_FLAG,
  },
};

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  if (positionals.KERNEL !== 'eigh') invalid('KERNEL', positionals.KERNEL, 'the only kernel is eigh');
  const sizes = (flags.sizes as number[] | undefined) ?? [24, 64, 128];
  const timings = flags.vectors ? timeEigensystem(sizes) : timeEigenvalues(sizes);
  if (flags.json) {
    io.out(`${JSON.stringify({ eigh: timings.map((t) => ({ n: t.n, seconds_per_matrix: t.secondsPerMatrix })) })}\n`);
  } else {
    for (const t of timings) io.out(`n = ${String(t.n).padStart(4)}   ${(t.secondsPerMatrix * 1e6).toFixed(1).padStart(10)} µs per matrix\n`);
  }
  return 0;
}

export const benchCommand: Command = { spec, run };
