/**
 * `lacuna expand`: a vacancy cluster expansion fitted to the user's total energies (DESIGN.md contract) — the
 * ECIs, fit and cross-validation errors, predictions for the enumerated patterns of a range, the hull of the
 * calculations with the boron chemical potential where each hull pattern is stable, and what to compute next.
 */
import {
  EXPANSION_CAVEAT, EXPANSION_DEFAULTS, expandEnergies, MAX_PAIR_SHELLS, MAX_TRIPLET_SHELLS, WINDOW_CV_SCORES,
  type ExpansionResult, type HullPoint,
} from '../../learn/expansion/index.ts';
import { parseEnergiesText, type EnergiesFile } from '../../io/energiesFile.ts';
import { invalid, namingSource } from '../../validate/invalid.ts';
import { hnfRows } from '../../lattice/pattern.ts';
import type { Pattern } from '../../lattice/sheet.ts';
import { parseArgs, rangeText, type CommandSpec } from '../args.ts';
import { JSON_FLAG, OVERWRITE_FLAG, PROGRESS_FLAG } from '../commonFlags.ts';
import { estimateEnumerate } from '../enumerateEstimate.ts';
import { checkOutputPath, writeNamedFile, type Command, type CliIo } from '../io.ts';
import { ProgressLine, readableSeconds } from '../progress.ts';

/** Most patterns one run predicts (estimated before it starts): about 150 bytes of JSON each. */
export const MAX_PREDICTIONS = 1e6;
/** Largest cell predicted (the enumerator's own limit). */
const MAX_PREDICT_SITES = 64;
/** Predictions listed in the text output (all go to --json). */
const TEXT_PREDICTIONS = 12;

const spec: CommandSpec = {
  name: 'expand',
  summary: 'fit a vacancy cluster expansion to your own total energies; predict enumerated patterns, the hull, and what to compute next',
  positionals: [],
  flags: {
    energies: { kind: 'text', placeholder: 'FILE', help: 'your structures and their total energies per cell in eV: { "structures": [{ "supercell", "vacancies", "energy", "bond"?, "name"? }] }; required' },
    'pair-shells': { kind: 'integer', min: 0, max: MAX_PAIR_SHELLS, placeholder: 'S', help: `pairs up to the S-th neighbour shell (1, √3, 2, √7, 3 … spacings; default ${EXPANSION_DEFAULTS.pairShells})` },
    'triplet-shells': { kind: 'integer', min: 0, max: MAX_TRIPLET_SHELLS, placeholder: 'T', help: `triplets whose three edges lie within the T-th shell (default ${EXPANSION_DEFAULTS.tripletShells}: none)` },
    'predict-sites': { kind: 'integerRange', min: 1, max: MAX_PREDICT_SITES, placeholder: 'N1-N2', help: 'predict every enumerated pattern with this many lattice sites per cell (with --predict-holes)' },
    'predict-holes': { kind: 'integerRange', min: 0, max: MAX_PREDICT_SITES, placeholder: 'K1-K2', help: 'and this many vacancies per cell' },
    isolated: { kind: 'switch', help: 'predict only patterns where no two vacancies are nearest neighbours' },
    suggest: { kind: 'integer', min: 0, max: 100, placeholder: 'K', help: `patterns suggested for computing next (default ${EXPANSION_DEFAULTS.suggestions})` },
    svg: { kind: 'text', placeholder: 'FILE', help: 'also write the energy–η figure (hull, your points, predictions, suggestions) as SVG' },
    png: { kind: 'text', placeholder: 'FILE', help: 'also write the figure as PNG' },
    overwrite: OVERWRITE_FLAG,
    json: JSON_FLAG,
    progress: PROGRESS_FLAG,
  },
};

const finite = (x: number) => (Number.isFinite(x) ? x : null);
const form = (pattern: Pattern) => ({ supercell: hnfRows(pattern.supercell), vacancies: pattern.vacancies });

function readEnergies(path: string, io: CliIo): EnergiesFile {
  let text: string;
  try {
    text = io.readText(path);
  } catch (error) {
    invalid('--energies', path, (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : 'cannot read the file');
  }
  return namingSource('the energies file', path, () => parseEnergiesText(text, path));
}

function hullJson(point: HullPoint): Record<string, unknown> {
  return {
    eta: point.eta, energy_per_site: point.energy, ...form(point.pattern), energy: point.cellEnergy,
    ...(point.name !== undefined ? { name: point.name } : {}),
    source: point.source,
    boron_chemical_potential: { min: finite(point.muLow), max: finite(point.muHigh) },
  };
}

function resultJson(result: ExpansionResult, file: EnergiesFile): Record<string, unknown> {
  return {
    clusters: result.clusters.map((c) => ({
      kind: c.kind, shell: c.shell, eci: c.eci, name: c.name, per_site: c.perSite, uncertainty: finite(c.error),
      ...(c.edges ? { edges: c.edges } : {}), ...(c.distance !== undefined ? { distance: c.distance } : {}),
    })),
    fit_rms: result.fit.fitRms,
    cv_rms: finite(result.fit.cvRms),
    predictions: result.predictions.map((p) => ({
      sites: p.sites, holes: p.holes, ...form(p.pattern), energy: p.energy, above_hull: finite(p.aboveHull),
      eta: p.eta, energy_per_site: p.energyPerSite, uncertainty: finite(p.uncertainty), above_fit_hull: finite(p.aboveFitHull),
      computed: p.computed, ...(p.phase !== undefined ? { phase: p.phase } : {}),
    })),
    hull: result.hull.map(hullJson),
    suggest: result.suggestions.map((s) => ({
      ...form(s.candidate.pattern), why: s.why, reason: s.reason, sites: s.candidate.sites, holes: s.candidate.holes, eta: s.candidate.eta,
      energy: s.candidate.energy, energy_per_site: s.candidate.energyPerSite, above_hull: finite(s.candidate.aboveHull), uncertainty: finite(s.candidate.uncertainty),
    })),
    computed: result.computed.map((c) => ({
      ...(c.name !== undefined ? { name: c.name } : {}), ...form(c.pattern), sites: c.sites, eta: c.eta, energy: c.energy,
      energy_per_site: c.energyPerSite, fitted: c.fitted, above_hull: c.aboveHull,
    })),
    fit_hull: result.fitHull.map(hullJson),
    window: result.window,
    units: 'energy: eV per cell; energy_per_site, fit_rms, cv_rms, above_hull, uncertainty, window: eV per lattice site (vacant sites counted); eci: eV per cluster; boron_chemical_potential: eV per B atom on the scale of your energies',
    ...(file.title !== undefined ? { title: file.title } : {}),
    notes: result.notes,
    caveat: EXPANSION_CAVEAT,
  };
}

/** meV with two decimals; rounding never shows "-0.00". */
const meV = (eV: number) => (Number.isFinite(eV) ? `${(Math.abs(eV) < 5e-6 ? 0 : 1000 * eV).toFixed(2)} meV` : 'none');
const patternText = (pattern: Pattern) => `${JSON.stringify(hnfRows(pattern.supercell))} holes ${pattern.vacancies.map(([i, j]) => `(${i},${j})`).join(' ') || 'none'}`;

function muText(point: HullPoint): string {
  if (!Number.isFinite(point.muLow)) return `μ_B ≤ ${point.muHigh.toFixed(4)} eV`;
  if (!Number.isFinite(point.muHigh)) return `μ_B ≥ ${point.muLow.toFixed(4)} eV`;
  return `${point.muLow.toFixed(4)} ≤ μ_B ≤ ${point.muHigh.toFixed(4)} eV`;
}

function resultText(result: ExpansionResult, file: EnergiesFile, range: string | undefined): string {
  const fit = result.fit;
  const lines = [`cluster expansion of ${result.computed.length} structures${file.title ? ` (${file.title})` : ''}; energies per lattice site, vacant sites counted`];
  lines.push('clusters (ECI per cluster, eV; m clusters per site):');
  for (const c of result.clusters) lines.push(`  ${c.name.padEnd(16)} m ${String(c.perSite).padStart(2)}   ${c.eci.toFixed(5).padStart(9)} ± ${c.error.toFixed(5)}`);
  lines.push(`fit rms ${meV(fit.fitRms)}/site, leave-one-out CV ${meV(fit.cvRms)}/site`);
  lines.push('hull of your calculations (where each is the stable pattern: boron chemical potential μ_B, eV per atom on your energies\' scale):');
  for (const h of result.hull) lines.push(`  η ${h.eta.toFixed(4)}  ${h.energy.toFixed(5)} eV/site  ${h.name ?? patternText(h.pattern)}   ${muText(h)}`);
  if (range !== undefined) {
    const ranked = result.predictions.filter((p) => !p.computed && Number.isFinite(p.aboveFitHull)).sort((x, y) => x.aboveFitHull - y.aboveFitHull);
    lines.push(`predictions: ${result.predictions.length} patterns (${range}); the ${Math.min(TEXT_PREDICTIONS, ranked.length)} not computed closest to the fit's hull (all with --json):`);
    for (const p of ranked.slice(0, TEXT_PREDICTIONS)) {
      lines.push(`  η ${p.eta.toFixed(4)}  ${p.energyPerSite.toFixed(5)} ± ${(1000 * p.uncertainty).toFixed(2)} meV/site; above the fit's hull ${meV(p.aboveFitHull)}, above yours ${meV(p.aboveHull)}/site  N=${p.sites} ${p.phase ?? patternText(p.pattern)}`);
    }
    lines.push(`compute next (ground states of the fit first, then the least certain within ${WINDOW_CV_SCORES} × CV = ${meV(result.window)}/site of the fit's hull):`);
    if (result.suggestions.length === 0) lines.push('  nothing: no pattern of the range is a ground state of the fit or near the hull');
    result.suggestions.forEach((s, k) => lines.push(`  ${k + 1}. N=${s.candidate.sites} k=${s.candidate.holes} η ${s.candidate.eta.toFixed(4)} ${patternText(s.candidate.pattern)} — ${s.why}`));
  } else {
    lines.push('no predictions: give --predict-sites and --predict-holes to predict enumerated patterns and have the next ones to compute suggested');
  }
  for (const note of result.notes) lines.push(`note: ${note}`);
  lines.push(EXPANSION_CAVEAT);
  return `${lines.join('\n')}\n`;
}

async function run(argv: readonly string[], io: CliIo): Promise<number> {
  const { flags } = parseArgs(spec, argv);
  const path = flags.energies as string | undefined;
  if (path === undefined) invalid('--energies', undefined, 'required: the file of your structures and their energies');
  const sites = flags['predict-sites'] as [number, number] | undefined;
  const holes = flags['predict-holes'] as [number, number] | undefined;
  if (sites !== undefined && holes === undefined) invalid('--predict-holes', undefined, 'required with --predict-sites, e.g. --predict-holes 1-4');
  if (holes !== undefined && sites === undefined) invalid('--predict-sites', undefined, 'required with --predict-holes, e.g. --predict-sites 1-12');
  if (flags.isolated === true && sites === undefined) invalid('--isolated', '--isolated', 'only with --predict-sites and --predict-holes');
  const svgPath = flags.svg as string | undefined;
  const pngPath = flags.png as string | undefined;
  if (svgPath !== undefined && svgPath === pngPath) invalid('--png', pngPath, 'the same file as --svg');
  checkOutputPath(io, '--svg', svgPath, flags.overwrite === true);
  checkOutputPath(io, '--png', pngPath, flags.overwrite === true);
  const file = readEnergies(path, io);
  const predict = sites && holes ? { sites, holes, isolated: flags.isolated === true } : undefined;
  const range = predict ? `sites ${rangeText(predict.sites)}, holes ${rangeText(predict.holes)}${predict.isolated ? ', isolated' : ''}` : undefined;
  const progress = new ProgressLine(io.err, 'patterns', { machine: flags.progress === true, job: 'expand' });
  if (predict) {
    const estimate = estimateEnumerate(predict, 'json');
    if (estimate.structures > MAX_PREDICTIONS) {
      invalid('--predict-sites', rangeText(predict.sites), `about ${estimate.structures.toExponential(1)} patterns to predict with these --predict-holes (${readableSeconds(estimate.seconds)}), more than ${MAX_PREDICTIONS.toExponential(0)}; narrow the ranges or add --isolated`);
    }
    progress.estimate(estimate.seconds, `about ${Math.round(estimate.structures)} patterns to predict`, { structures: Math.round(estimate.structures) });
  }
  const result = expandEnergies(file.structures, {
    pairShells: flags['pair-shells'] as number | undefined,
    tripletShells: flags['triplet-shells'] as number | undefined,
    suggestions: flags.suggest as number | undefined,
    predict,
    maxPredictions: MAX_PREDICTIONS,
    onProgress: (fraction, done) => progress.update(done, fraction),
  });
  if (predict) progress.done();
  if (svgPath !== undefined || pngPath !== undefined) await writeFigure(result, file, io, svgPath, pngPath);
  io.out(flags.json ? `${JSON.stringify(resultJson(result, file))}\n` : resultText(result, file, range));
  return 0;
}

async function writeFigure(result: ExpansionResult, file: EnergiesFile, io: CliIo, svgPath: string | undefined, pngPath: string | undefined): Promise<void> {
  // Loaded here: no other use of expand pays for the DOM or the rasteriser.
  const { headlessDocument } = await import('../../figures/headless.ts');
  const { energyHullFigure } = await import('../../figures/energyHull.ts');
  const { prepareEnergyHull } = await import('../../figures/prepareEnergyHull.ts');
  const { svgText } = await import('../../figures/serialize.ts');
  const text = svgText(energyHullFigure(prepareEnergyHull(result, { title: file.title, demo: file.demo }), { document: headlessDocument(), style: 'publication' }));
  if (svgPath !== undefined) writeNamedFile(io, '--svg', svgPath, text);
  if (pngPath !== undefined) {
    const { rasterise } = await import('../raster.ts');
    const { PNG_SCALE } = await import('./plot.ts');
    writeNamedFile(io, '--png', pngPath, await rasterise(text, PNG_SCALE));
  }
}

export const expandCommand: Command = { spec, run };
