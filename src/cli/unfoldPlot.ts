/**
 * `lacuna plot --figure unfolded | cut`: the unfolded bands on the primitive path, or a constant-energy cut over
 * the primitive zone, with E_F from `fill` for the same sheet, parameters, mesh, width and doping.
 */
import { invalid } from '../validate/invalid.ts';
import { cutFigure } from '../figures/cut.ts';
import { CUT_PIXELS, prepareCut, prepareUnfolded, solveUnfolding } from '../figures/prepareUnfold.ts';
import type { FigureOptions, SpectralPart } from '../figures/types.ts';
import { unfoldedFigure } from '../figures/unfolded.ts';
import { fill } from '../tb/fill.ts';
import type { ParameterSet } from '../tb/params.ts';
import { unfoldedRange } from '../tb/spectral.ts';
import { unfoldingOf } from './commands/unfold.ts';
import type { FlagSpec } from './args.ts';
import type { CliIo } from './io.ts';
import { buildModel, meshChoiceOf, meshWork } from './parameters.ts';
import { ProgressLine } from './progress.ts';
import type { SheetArgument } from './sheetArgument.ts';
import { guardSolve, vectorsFactor } from './workEstimate.ts';

/** The flags only these two figures take. */
export const UNFOLD_PLOT_FLAGS: Record<string, FlagSpec> = {
  part: { kind: 'choice', values: ['total', 'sigma', 'pi'], placeholder: 'total|sigma|pi', help: 'which orbitals the density shows (default total); only for --figure unfolded or cut' },
  'cut-energy': { kind: 'number', min: -50, max: 50, placeholder: 'ΔE', help: 'energy of the cut relative to E_F, in eV (default 0); only for --figure cut' },
  'cut-points': { kind: 'integer', min: 5, max: 801, placeholder: 'N', help: `pixels per side of the cut's k grid (default ${CUT_PIXELS}); only for --figure cut` },
};

/** Refuses the unfolding flags with other figures, and --points with the cut. */
export function checkUnfoldPlotFlags(figure: string, flags: Record<string, unknown>): void {
  if (figure !== 'cut') for (const flag of ['cut-energy', 'cut-points']) if (flags[flag] !== undefined) invalid(`--${flag}`, String(flags[flag]), 'only for --figure cut');
  if (figure !== 'cut' && figure !== 'unfolded' && flags.part !== undefined) invalid('--part', flags.part, 'only for --figure unfolded or cut');
  if (figure === 'cut' && flags.points !== undefined) invalid('--points', String(flags.points), 'not used by the cut figure (see --cut-points)');
}

/** The Gaussian width of A(k, E) and of the occupation, by default (as `fill`). */
const DEFAULT_WIDTH = 0.1;

export function drawUnfoldFigure(
  figure: 'unfolded' | 'cut', source: SheetArgument, params: ParameterSet, flags: Record<string, unknown>, io: CliIo, options: FigureOptions,
): { svg: SVGSVGElement; fermi: number } {
  const unfolding = unfoldingOf(source);
  const pathPoints = figure === 'unfolded' ? (flags.points as number | undefined) ?? 300 : 4;
  const cutPixels = figure === 'cut' ? (flags['cut-points'] as number | undefined) ?? CUT_PIXELS : 0;
  const work = meshWork(flags)(unfolding.sheet);
  const model = buildModel({ label: source.label, sheet: unfolding.sheet }, params, io, work);
  const factor = vectorsFactor(unfolding.sheet);
  if (figure === 'unfolded') guardSolve(unfolding.sheet, '--points', pathPoints, (p) => factor * p);
  else guardSolve(unfolding.sheet, '--cut-points', cutPixels, (side) => 0.38 * side * side * factor);
  const smearing = (flags.smearing as number | undefined) ?? DEFAULT_WIDTH;
  const fermi = fill(model, {
    doping: flags.doping as number | undefined, mesh: meshChoiceOf(flags, unfolding.sheet).mesh, smearing,
  }).fermi;
  const progress = new ProgressLine(io.err, 'k-points');
  const solution = solveUnfolding(unfolding, params, { label: source.label, pathPoints, cutPixels, onProgress: (done, total) => progress.update(done, done / total) });
  progress.done();
  const part = (flags.part as SpectralPart | undefined) ?? 'total';
  if (figure === 'cut') {
    const energy = fermi + ((flags['cut-energy'] as number | undefined) ?? 0);
    return { svg: cutFigure(prepareCut(solution, { smearing, fermi, energy, part }), options), fermi };
  }
  const [low, high] = unfoldedRange(solution.along, 0.5);
  const data = prepareUnfolded(solution, { smearing, fermi, energyRange: [Math.floor(low), Math.ceil(high)], part, rows: 400 });
  return { svg: unfoldedFigure(data, options), fermi };
}
