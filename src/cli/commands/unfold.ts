/**
 * `lacuna unfold`: a sheet's bands unfolded onto the primitive triangular lattice (DESIGN.md contract): the weight
 * of every supercell state on the primitive Bloch states at each k, on the primitive path Γ–M–K–Γ or on given
 * k-points; optionally the broadened spectral function A(k, E) along them and a constant-energy cut over the zone.
 */
import { invalid } from '../../validate/invalid.ts';
import { cutCsv, spectralCsv } from '../../io/csv.ts';
import { fill } from '../../tb/fill.ts';
import { TightBindingModel } from '../../tb/model.ts';
import { constantEnergyCut, spectralEnergies, spectralFunction, unfoldedRange } from '../../tb/spectral.ts';
import { unfoldBands, type UnfoldResult } from '../../tb/unfold.ts';
import { NOT_TRIANGULAR, patternUnfolding, primitiveVectors, sheetUnfolding, type UnfoldingSheet } from '../../tb/unfoldSheet.ts';
import { primitivePath, zoneGrid } from '../../tb/unfoldZone.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { DOPING_FLAG, JSON_FLAG, KSPACING_FLAG, MESH_FLAG, MODEL_CAVEAT, OVERWRITE_FLAG, PARAMS_FLAG, PROGRESS_FLAG, SHEET_ARGUMENT, SMEARING_FLAG } from '../commonFlags.ts';
import { checkOutputPath, writeNamedFile, type Command, type CliIo } from '../io.ts';
import { checkKpointFlags, KPOINTS_FLAGS, labelPlaces, pathJson, readKpoints, rows } from '../kpointsFlags.ts';
import { buildModel, meshChoiceOf, meshJson, meshWork, resolveParameters } from '../parameters.ts';
import { ProgressLine } from '../progress.ts';
import { resolveSheet, type SheetArgument } from '../sheetArgument.ts';
import { estimatedSeconds, guardSolve, vectorsFactor } from '../workEstimate.ts';

/** Energies on the spectral grid, pixels per side of the cut, and the Gaussian width, by default. */
const DEFAULT_ENERGY_GRID = 401;
const DEFAULT_CUT_POINTS = 101;
const DEFAULT_WIDTH = 0.1;
/** States listed per special point in the text output: those with at least this weight. */
const LISTED_WEIGHT = 0.25;

const CUT_ONLY = ['cut-energy', 'cut-points', 'doping', 'mesh', 'kspacing'] as const;

const spec: CommandSpec = {
  name: 'unfold',
  summary: 'bands unfolded onto the primitive triangular lattice: the weight of each state at primitive k (for comparison with ARPES)',
  positionals: [SHEET_ARGUMENT],
  flags: {
    params: PARAMS_FLAG,
    ...KPOINTS_FLAGS,
    path: { ...KPOINTS_FLAGS.path, help: 'the path Γ–M–K–Γ of the primitive triangular lattice (a1 along the sheet\'s lattice direction nearest +x)' },
    spectral: { kind: 'text', placeholder: 'FILE', help: 'also write the spectral function A(k, E) at the k-points as CSV' },
    'energy-grid': { kind: 'integer', min: 2, max: 20_000, placeholder: 'P', help: `energies of the --spectral grid, from the lowest state − 1 eV to the highest + 1 eV (default ${DEFAULT_ENERGY_GRID})` },
    smearing: { ...SMEARING_FLAG, help: `Gaussian width of A(k, E) in eV, and of the occupation that places E_F for --cut (default ${DEFAULT_WIDTH})` },
    cut: { kind: 'text', placeholder: 'FILE', help: 'also write a constant-energy cut A(k, E_F + ΔE) over the primitive zone as CSV' },
    'cut-energy': { kind: 'number', min: -50, max: 50, placeholder: 'ΔE', help: 'energy of the cut relative to E_F, in eV (default 0: the Fermi surface)' },
    'cut-points': { kind: 'integer', min: 5, max: 801, placeholder: 'N', help: `pixels per side of the square k grid over the zone (default ${DEFAULT_CUT_POINTS})` },
    doping: { ...DOPING_FLAG, help: `${DOPING_FLAG.help}; sets E_F of the cut` },
    mesh: { ...MESH_FLAG, help: `${MESH_FLAG.help}; for E_F of the cut` },
    kspacing: { ...KSPACING_FLAG, help: `${KSPACING_FLAG.help}; for E_F of the cut` },
    overwrite: OVERWRITE_FLAG,
    json: JSON_FLAG,
    progress: PROGRESS_FLAG,
  },
};

/** The unfolding of a SHEET argument: a pattern as given, an explicit sheet recognised in its own frame. */
export function unfoldingOf(sheet: SheetArgument, field = 'SHEET'): UnfoldingSheet {
  if (sheet.pattern && sheet.form !== 'explicit') return patternUnfolding(sheet.pattern);
  const found = sheetUnfolding(sheet.sheet);
  if (!found) invalid(field, sheet.label, NOT_TRIANGULAR);
  return found;
}

/** The largest |Σ_n W_n(k) − 4·atoms/sites| over the k-points (rounding only). */
function sumRuleError(result: UnfoldResult): number {
  const expected = (4 * result.atoms) / result.sites;
  let worst = 0;
  for (let k = 0; k < result.count; k++) {
    let sum = 0;
    for (let n = 0; n < result.bands; n++) sum += result.weights[k * result.bands + n];
    worst = Math.max(worst, Math.abs(sum - expected));
  }
  return worst;
}

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  const spectralPath = flags.spectral as string | undefined;
  const cutPath = flags.cut as string | undefined;
  if (spectralPath !== undefined && spectralPath === cutPath) invalid('--cut', cutPath, 'the same file as --spectral');
  checkOutputPath(io, '--spectral', spectralPath, flags.overwrite === true);
  checkOutputPath(io, '--cut', cutPath, flags.overwrite === true);
  checkKpointFlags(flags);
  if (flags['energy-grid'] !== undefined && spectralPath === undefined) invalid('--energy-grid', String(flags['energy-grid']), 'only with --spectral');
  if (flags.smearing !== undefined && spectralPath === undefined && cutPath === undefined) invalid('--smearing', String(flags.smearing), 'only with --spectral or --cut');
  if (cutPath === undefined) for (const flag of CUT_ONLY) if (flags[flag] !== undefined) invalid(`--${flag}`, String(flags[flag]), 'only with --cut');
  const width = (flags.smearing as number | undefined) ?? DEFAULT_WIDTH;

  const sheet = resolveSheet(positionals.SHEET, io);
  const params = resolveParameters(flags.params as string | undefined, io);
  const unfolding = unfoldingOf(sheet);
  const { kpoints, path } = readKpoints(flags, io, (points) => primitivePath(unfolding, points));
  const count = kpoints.length / 2;
  const factor = vectorsFactor(unfolding.sheet);
  const model = buildModel({ label: sheet.label, sheet: unfolding.sheet }, params, io, {
    flag: path ? '--points' : '--kpoints', value: count, kpoints: (p) => factor * p,
  });
  const cutSide = (flags['cut-points'] as number | undefined) ?? DEFAULT_CUT_POINTS;
  // About half the square's pixels are solved: the zone is ¾ of it, and ±k share one solution.
  if (cutPath !== undefined) guardSolve(unfolding.sheet, '--cut-points', cutSide, (side) => 0.38 * side * side * factor);

  const progress = new ProgressLine(io.err, 'k-points', { machine: flags.progress === true, job: 'unfold' });
  progress.estimate(factor * estimatedSeconds(unfolding.sheet, count), `${model.atoms} atoms at ${count} k-points`, { atoms: model.atoms, kpoints: count });
  const result = unfoldBands(model, unfolding.sites, kpoints, { onProgress: (done, total) => progress.update(done, done / total) });
  progress.done();

  let spectralInfo: Record<string, unknown> | undefined;
  if (spectralPath !== undefined) {
    const [low, high] = unfoldedRange(result);
    const energies = spectralEnergies(low, high, (flags['energy-grid'] as number | undefined) ?? DEFAULT_ENERGY_GRID);
    const a = spectralFunction(result, energies, width);
    writeNamedFile(io, '--spectral', spectralPath, spectralCsv({ count, kpoints, distance: path?.distance, energies, total: a.total, sigma: a.sigma }));
    spectralInfo = { csv: spectralPath, energy_range: [low, high], energy_grid: energies.length, smearing: width };
  }

  let cutInfo: Record<string, unknown> | undefined;
  if (cutPath !== undefined) {
    const meshFlags = { mesh: flags.mesh, kspacing: flags.kspacing };
    const meshJob = meshWork(meshFlags)(unfolding.sheet);
    guardSolve(unfolding.sheet, meshJob.flag, meshJob.value, meshJob.kpoints, meshJob.cheaper);
    const meshChoice = meshChoiceOf(meshFlags, unfolding.sheet);
    const filled = fill(model, { doping: flags.doping as number | undefined, mesh: meshChoice.mesh, smearing: width });
    const relative = (flags['cut-energy'] as number | undefined) ?? 0;
    const grid = zoneGrid(unfolding, cutSide);
    const cutProgress = new ProgressLine(io.err, 'k-points', { machine: flags.progress === true, job: 'unfold-cut' });
    const solved = unfoldBands(model, unfolding.sites, grid.kpoints, { onProgress: (done, total) => cutProgress.update(done, done / total) });
    cutProgress.done();
    const cut = constantEnergyCut(solved, filled.fermi + relative, width);
    // Every pixel inside the zone, ±k each with its own coordinates.
    const inside: number[] = [];
    for (let p = 0; p < grid.pixel.length; p++) if (grid.pixel[p] >= 0) inside.push(p);
    const h = (2 * grid.reach) / cutSide;
    const points = new Float64Array(2 * inside.length);
    const total = new Float64Array(inside.length);
    const sigma = new Float64Array(inside.length);
    inside.forEach((p, i) => {
      points[2 * i] = -grid.reach + ((p % cutSide) + 0.5) * h;
      points[2 * i + 1] = grid.reach - (Math.floor(p / cutSide) + 0.5) * h;
      total[i] = cut.total[grid.pixel[p]];
      sigma[i] = cut.sigma[grid.pixel[p]];
    });
    writeNamedFile(io, '--cut', cutPath, cutCsv({ kpoints: points, total, sigma }));
    cutInfo = {
      csv: cutPath, energy: filled.fermi + relative, relative, fermi: filled.fermi, doping: filled.doping, smearing: width,
      ...meshJson(meshChoice), points: inside.length, pixels: cutSide,
    };
  }

  const [a1, a2] = primitiveVectors(unfolding);
  const sumRule = (4 * result.atoms) / result.sites;
  if (flags.json) {
    const document: Record<string, unknown> = {
      kpoints: rows(kpoints, count, 2),
      energies: rows(result.energies, count, result.bands),
      weights: rows(result.weights, count, result.bands),
      weights_sigma: rows(result.sigmaWeights, count, result.bands),
      atoms: result.atoms,
      sites: result.sites,
      eta: 1 - result.atoms / result.sites,
      sum_rule: sumRule,
      lattice: { bond: unfolding.bond, a1, a2 },
    };
    if (path) document.path = pathJson(path);
    if (spectralInfo) document.spectral = spectralInfo;
    if (cutInfo) document.cut = cutInfo;
    document.parameters = params.name;
    document.sheet = sheet.label;
    io.out(`${JSON.stringify(document)}\n`);
    return 0;
  }
  const lines = [
    `${sheet.label}: ${result.atoms} atoms on ${result.sites} sites of the triangular lattice (d = ${unfolding.bond} Å, η = ${(1 - result.atoms / result.sites).toFixed(6)}), ${result.bands} states unfolded at ${count} k-points, parameters ${params.name}`,
    `sum rule: Σ_n W_n(k) = 4(1 − η) = ${sumRule.toFixed(6)} at every k (largest deviation ${sumRuleError(result).toExponential(1)})`,
  ];
  if (path) {
    lines.push(`path ${path.labels.map((l) => l.label).join('–')} of the primitive zone, Cartesian Å⁻¹: ${labelPlaces(path)}`);
    const seen = new Set<string>();
    for (const label of path.labels) {
      if (seen.has(label.label)) continue;
      seen.add(label.label);
      const strong: string[] = [];
      for (let n = 0; n < result.bands; n++) {
        const row = label.index * result.bands + n;
        if (result.weights[row] >= LISTED_WEIGHT) strong.push(`${result.energies[row].toFixed(3)} (${result.weights[row].toFixed(2)}${result.sigmaWeights[row] < 0.5 * result.weights[row] ? ' π' : ''})`);
      }
      lines.push(`  at ${label.label}, states of weight ≥ ${LISTED_WEIGHT} (E in eV, W): ${strong.join(', ') || 'none'}`);
    }
  }
  if (spectralPath !== undefined) lines.push(`wrote ${spectralPath} (A(k, E), Gaussian width ${width} eV, states per eV per site)`);
  if (cutInfo) lines.push(`wrote ${cutPath} (cut at E_F ${(cutInfo.relative as number) >= 0 ? '+' : '−'} ${Math.abs(cutInfo.relative as number)} eV = ${(cutInfo.energy as number).toFixed(4)} eV; E_F ${(cutInfo.fermi as number).toFixed(4)} eV on a ${cutInfo.mesh}×${cutInfo.mesh} mesh)`);
  lines.push(MODEL_CAVEAT);
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

export const unfoldCommand: Command = { spec, run };
