/**
 * The k-points of the commands that solve on a list of k (bands, unfold): `--kpoints FILE` (DESIGN.md k-points
 * file, Cartesian Å⁻¹) or `--path auto [--points P]`, declared and read once; and the JSON forms of their results.
 */
import { invalid, namingSource, ValidationError } from '../validate/invalid.ts';
import { parseKpointsText } from '../io/kpointsFile.ts';
import type { KPath } from '../tb/kspacePath.ts';
import type { FlagSpec } from './args.ts';
import type { CliIo } from './io.ts';

/** Points on the automatic path by default. */
export const DEFAULT_PATH_POINTS = 300;

export const KPOINTS_FLAGS: Record<'kpoints' | 'path' | 'points', FlagSpec> = {
  kpoints: { kind: 'text', placeholder: 'FILE', help: 'k-points file {"kpoints": [[kx, ky]]}, Cartesian Å⁻¹' },
  path: { kind: 'choice', values: ['auto'], placeholder: 'auto', help: 'the automatic path through the special points of the reduced cell' },
  points: { kind: 'integer', min: 2, max: 100_000, placeholder: 'P', help: `points on the automatic path (default ${DEFAULT_PATH_POINTS})` },
};

/** Refuses --kpoints with --path, neither of them, and --points without --path (before any other work). */
export function checkKpointFlags(flags: Record<string, unknown>): void {
  if (flags.kpoints !== undefined && flags.path !== undefined) invalid('--kpoints', flags.kpoints, 'give either --kpoints or --path auto, not both');
  if (flags.kpoints === undefined && flags.path === undefined) invalid('--path', undefined, 'give --path auto or --kpoints FILE');
  if (flags.points !== undefined && flags.path === undefined) invalid('--points', String(flags.points), 'only with --path auto');
}

/**
 * The k-points the flags ask for: the file's, or the path `makePath(points)` (its own minimum of points is
 * reported against --points); checkKpointFlags first.
 */
export function readKpoints(flags: Record<string, unknown>, io: CliIo, makePath: (points: number) => KPath): { kpoints: Float64Array; path?: KPath } {
  checkKpointFlags(flags);
  if (flags.path === 'auto') {
    try {
      const path = makePath((flags.points as number | undefined) ?? DEFAULT_PATH_POINTS);
      return { kpoints: path.kpoints, path };
    } catch (error) {
      // The path's own minimum depends on the cell type; report it against the flag the user typed.
      if (error instanceof ValidationError && error.field === 'points') throw new ValidationError('--points', error.value, error.why);
      throw error;
    }
  }
  const file = flags.kpoints as string;
  let text: string;
  try {
    text = io.readText(file);
  } catch {
    invalid('--kpoints', file, 'cannot read the file');
  }
  return { kpoints: namingSource('the k-points file', file, () => parseKpointsText(text, file)) };
}

/**
 * Each path label with its k-point in Cartesian Å⁻¹ of the sheet's own frame (x along its first cell vector): a
 * label such as X of a rectangular cell lies along whichever axis the cell puts it, so the output says where.
 */
export function labelsWithK(path: KPath): { label: string; index: number; k: [number, number] }[] {
  return path.labels.map((l) => ({ ...l, k: [path.kpoints[2 * l.index], path.kpoints[2 * l.index + 1]] }));
}

/** The `"path"` object of a JSON result. */
export function pathJson(path: KPath): Record<string, unknown> {
  return { labels: labelsWithK(path), distance: Array.from(path.distance), cell_type: path.cellType };
}

/** Where each distinct label lies, for text output: `Γ (0.0000, 0.0000), M (…)`. */
export function labelPlaces(path: KPath): string {
  const seen = new Set<string>();
  return labelsWithK(path).filter((l) => !seen.has(l.label) && seen.add(l.label))
    .map((l) => `${l.label} (${l.k[0].toFixed(4)}, ${l.k[1].toFixed(4)})`).join(', ');
}

/** Rows of a k-major Float64Array, rounded only by JSON's shortest round-trip printing. */
export function rows(values: Float64Array, count: number, width: number): number[][] {
  const out: number[][] = [];
  for (let k = 0; k < count; k++) out.push(Array.from(values.subarray(k * width, (k + 1) * width)));
  return out;
}
