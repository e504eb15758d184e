/**
 * `lacuna calibrate`: Slater–Koster parameters fitted to the user's own reference bands (DESIGN.md contract:
 * `calibrate SHEET --bands FILE [--params START] [--shift] --json` → `{ "parameters", "rms", "max_error", "points" }`,
 * `parameters` being the parameter file itself). Several sheets: `calibrate A B --bands a.json --bands b.json`, the
 * i-th --bands belonging to the i-th SHEET. The core is src/learn/calibrate.
 */
import { invalid, namingSource, ValidationError } from '../../validate/invalid.ts';
import { validateParameterObject } from '../../tb/paramsCheck.ts';
import { parseReferenceBandsText } from '../../io/referenceBandsFile.ts';
import {
  calibrate, checkBlock, cutoffCandidates, checkKpointsFitSheet, defaultStarts, matchBands, MODEL_PARAMETERS, oneBondLength,
  type BandBlock, type CalibrationResult, type CalibrationSheet, type ModelParameter,
} from '../../learn/calibrate/index.ts';
import type { ParameterSet } from '../../tb/params.ts';
import { parseArgs, rangeText, type CommandSpec, type FlagValue } from '../args.ts';
import { checkOutputPath, writeNamedFile, type Command, type CliIo } from '../io.ts';
import { JSON_FLAG, OVERWRITE_FLAG, PROGRESS_FLAG } from '../commonFlags.ts';
import { resolveParameters } from '../parameters.ts';
import { ProgressLine, readableSeconds } from '../progress.ts';
import { resolveSheet } from '../sheetArgument.ts';
import { calibrationFigure } from '../../figures/calibration.ts';
import { prepareCalibration } from '../../figures/prepareCalibration.ts';
import { svgText } from '../../figures/serialize.ts';
import { rasterise } from '../raster.ts';
import { PNG_SCALE } from './plot.ts';
import { estimatedSeconds, MAX_ESTIMATED_SECONDS, MAX_MODEL_ATOMS } from '../workEstimate.ts';

/** What every human-readable calibration says about itself. */
export const CALIBRATE_CAVEAT =
  'A fit is an interpolation of your own reference calculation: it is as good as that calculation and the tight-binding model allow, not a prediction. Check it on bands it was not fitted to, and defer to experiment and higher-level calculations.';

const HOLDABLE = ['s', 'p', 'ss_sigma', 'sp_sigma', 'pp_sigma', 'pp_pi'] as const;

const spec: CommandSpec = {
  name: 'calibrate',
  summary: 'Slater–Koster parameters fitted to your own reference bands (damped least squares, several starts)',
  positionals: [{ name: 'SHEET', help: 'a preset name, a sheet file, or sheet JSON text; several sheets pair in order with several --bands', repeatable: true }],
  flags: {
    bands: { kind: 'text', placeholder: 'FILE', repeatable: true, help: 'reference bands {"kpoints": [[kx, ky]], "energies": [[e1 ≤ e2 ≤ …]]} (Cartesian Å⁻¹, eV; the bands --json form), optional "fermi" (eV); one per SHEET' },
    params: { kind: 'text', placeholder: 'FILE|NAME', help: 'the first start set; its d0, exponent and cutoff are held (default harrison1980); the other named sets and a weak-bond start follow' },
    shift: { kind: 'switch', help: 'fit one rigid shift per reference file (its arbitrary zero); εp then stays at the first start\'s value' },
    'model-bands': { kind: 'integerRange', min: 1, max: 4000, placeholder: 'A-B', repeatable: true, help: 'the model bands matched (1-based, ascending at each k; default the lowest); once for all sheets or once per SHEET' },
    'reference-bands': { kind: 'integerRange', min: 1, max: 4000, placeholder: 'A-B', repeatable: true, help: 'the reference bands matched to them (default the lowest); once for all sheets or once per SHEET' },
    block: { kind: 'choice', values: ['full', 'sigma', 'pi'], placeholder: 'full|sigma|pi', repeatable: true, help: 'match every band (default), or only the σ or π block of a planar sheet; once for all or once per SHEET' },
    'weight-width': { kind: 'number', min: 0, max: 100, exclusiveMin: true, placeholder: 'W', help: 'half-width (eV) of the weights w = 1/(1 + ((E − E_F)/W)²) that favour bands near E_F (default 4)' },
    'equal-weights': { kind: 'switch', help: 'weigh every matched energy alike' },
    free: { kind: 'text', placeholder: 'LIST', help: 'also fit: exponent (the distance law), cutoff (scanned over the neighbour shells); comma-separated' },
    hold: { kind: 'text', placeholder: 'LIST', help: `keep at the first start's value: any of ${HOLDABLE.join(', ')}; comma-separated` },
    name: { kind: 'text', placeholder: 'NAME', help: 'name of the fitted set (default calibrated-<sheets>)' },
    out: { kind: 'text', placeholder: 'FILE', help: 'write the fitted parameter file' },
    svg: { kind: 'text', placeholder: 'FILE', repeatable: true, help: 'draw the fitted bands against the reference as SVG (publication look); the i-th for the i-th SHEET' },
    png: { kind: 'text', placeholder: 'FILE', repeatable: true, help: 'the same figure as PNG; the i-th for the i-th SHEET' },
    overwrite: OVERWRITE_FLAG,
    json: JSON_FLAG,
    progress: PROGRESS_FLAG,
  },
};

/** One value per sheet from a flag given once (for all) or once per sheet. */
function perSheet<T extends FlagValue>(values: FlagValue[] | undefined, sheets: number, flag: string): (T | undefined)[] {
  if (!values) return Array.from({ length: sheets }, () => undefined);
  if (values.length === 1) return Array.from({ length: sheets }, () => values[0] as T);
  if (values.length === sheets) return values as T[];
  invalid(flag, values.map((v) => (Array.isArray(v) ? rangeText(v as number[]) : String(v))).join(' '), `given ${values.length} times for ${sheets} sheets: give it once for all or once per SHEET, in order`);
}

function commaList(flag: string, text: string | undefined, allowed: readonly string[], refuse: Record<string, string> = {}): string[] {
  if (text === undefined) return [];
  const names = text.split(',').map((s) => s.trim());
  for (const name of names) {
    if (Object.hasOwn(refuse, name)) invalid(flag, text, `${name}: ${refuse[name]}`);
    if (!allowed.includes(name)) invalid(flag, text, `${name === '' ? 'an empty name' : name}: not one of ${allowed.join(', ')}`);
  }
  return names;
}

/** The sheets with their reference bands, read and checked against each other. */
function readSheets(positionals: string[], files: string[], blocks: (string | undefined)[], models: ([number, number] | undefined)[], references: ([number, number] | undefined)[], io: CliIo): CalibrationSheet[] {
  return positionals.map((text, index) => {
    const sheet = resolveSheet(text, io, positionals.length > 1 ? `SHEET[${index + 1}]` : 'SHEET');
    const atoms = sheet.sheet.atoms.length;
    if (atoms > MAX_MODEL_ATOMS) invalid('SHEET', `${atoms} atoms`, `calibrate takes at most ${MAX_MODEL_ATOMS} atoms per cell`);
    const file = files[index];
    let content: string;
    try {
      content = io.readText(file);
    } catch (error) {
      invalid('--bands', file, (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : 'cannot read the file');
    }
    const reference = namingSource('the reference bands file', file, () => parseReferenceBandsText(content, file));
    namingSource('the reference bands file', file, () => checkKpointsFitSheet(sheet.sheet, reference));
    const block = (blocks[index] ?? 'full') as BandBlock;
    checkBlock(sheet.sheet, block, '--block');
    const modelBands = block === 'full' ? 4 * atoms : block === 'sigma' ? 3 * atoms : atoms;
    const what = `${modelBands} ${block === 'full' ? 'bands (4 per atom)' : `${block} bands`}`;
    const match = matchBands(modelBands, reference.bands, { model: models[index], reference: references[index] }, { model: '--model-bands', reference: '--reference-bands', file }, what);
    return { sheet: sheet.sheet, label: sheet.label, reference, referenceLabel: file, block, match };
  });
}

function number(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}

/** The parameter set as a parameter file of the contract (its keys in the contract's order). */
function parameterFile(set: ParameterSet): Record<string, unknown> {
  return {
    name: set.name,
    source: set.source,
    ...(set.provenance !== undefined ? { provenance: set.provenance } : {}),
    onsite: { s: set.onsite.s, p: set.onsite.p },
    hopping: { ...set.hopping },
    d0: set.d0,
    exponent: set.exponent,
    cutoff: set.cutoff,
  };
}

function jsonDocument(result: CalibrationResult, out: string | undefined): Record<string, unknown> {
  return {
    parameters: parameterFile(result.parameters),
    rms: result.rms,
    max_error: result.maxError,
    points: result.points,
    weighted_rms: result.weightedRms,
    uncertainties: Object.fromEntries(result.fitted.map((name) => [name, number(result.uncertainties[name]!)])),
    correlation: { names: result.correlationNames, matrix: result.correlation.map((row) => row.map(number)) },
    held: result.held,
    sheets: result.sheets.map((s) => ({
      sheet: s.label,
      bands_file: s.referenceLabel,
      block: s.block,
      model_bands: s.modelBands,
      reference_bands: s.referenceBands,
      points: s.points,
      rms: s.rms,
      max_error: s.maxError,
      shift: s.shift,
      shift_uncertainty: number(s.shiftUncertainty),
      fermi: s.fermi,
      fermi_from: s.fermiFrom,
    })),
    start: result.start,
    starts: result.starts.map((s) => ({ name: s.name, rms: s.rms, weighted_rms: s.weightedRms, iterations: s.iterations, converged: s.converged })),
    ...(result.cutoffScan ? { cutoff_scan: result.cutoffScan.map((c) => ({ cutoff: c.cutoff, rms: c.rms, weighted_rms: c.weightedRms })) } : {}),
    weights: result.weights,
    sign_convention: result.signConvention,
    converged: result.converged,
    ...(out !== undefined ? { out } : {}),
    note: CALIBRATE_CAVEAT,
  };
}

const LABELS: Record<ModelParameter, string> = {
  s: 'εs', p: 'εp', ss_sigma: 'V_ssσ', sp_sigma: 'V_spσ', pp_sigma: 'V_ppσ', pp_pi: 'V_ppπ', exponent: 'exponent',
};

function textReport(result: CalibrationResult, written: string[]): string {
  const lines: string[] = [];
  for (const s of result.sheets) {
    const fermi = s.fermi === null ? 'no E_F (equal weights)' : `E_F ${s.fermi.toFixed(3)} eV (${s.fermiFrom === 'file' ? 'from the file' : 'estimated by the electron count'})`;
    const shift = s.shiftUncertainty === s.shiftUncertainty ? `, shift ${s.shift.toFixed(4)} ± ${s.shiftUncertainty.toPrecision(2)} eV (E_reference ≈ E_model + shift)` : '';
    lines.push(`${s.label} ← ${s.referenceLabel}: reference bands ${s.referenceBands.join('–')} ↔ model bands ${s.modelBands.join('–')}${s.block !== 'full' ? ` of the ${s.block} block` : ''}, ${s.points} points, rms ${s.rms.toFixed(4)} eV, largest error ${s.maxError.toFixed(4)} eV; ${fermi}${shift}`);
  }
  lines.push(`fitted set ${result.parameters.name} (best of ${result.starts.length} starts: ${result.start}; ${result.starts.map((s) => `${s.name} rms ${s.rms.toFixed(4)}`).join(', ')})`);
  for (const name of MODEL_PARAMETERS) {
    const value = name === 's' || name === 'p' ? result.parameters.onsite[name] : name === 'exponent' ? result.parameters.exponent : result.parameters.hopping[name];
    const sigma = result.uncertainties[name];
    const note = sigma === undefined ? `held: ${result.held.find((h) => h.name === name)?.why ?? ''}` : Number.isNaN(sigma) ? '± undetermined by these bands' : `± ${sigma.toPrecision(2)}`;
    lines.push(`  ${LABELS[name].padEnd(9)} ${value.toFixed(4).padStart(10)}${name === 'exponent' ? '   ' : ' eV'}  ${note}`);
  }
  lines.push(`  d0 ${result.parameters.d0} Å, cutoff ${result.parameters.cutoff} Å${result.cutoffScan ? ` (scanned: ${result.cutoffScan.map((c) => `${c.cutoff} Å rms ${c.rms.toFixed(4)}`).join(', ')})` : ' (held)'}`);
  lines.push(`rms ${result.rms.toFixed(4)} eV, largest error ${result.maxError.toFixed(4)} eV over ${result.points} points; weighted rms ${result.weightedRms.toFixed(4)} eV (${result.weights.formula})`);
  lines.push(`uncertainties: standard, from the Jacobian at the minimum (s²(JᵀWJ)⁻¹)${result.converged ? '' : '; NOT CONVERGED: the iteration limit was reached'}`);
  lines.push(result.signConvention);
  for (const path of written) lines.push(`wrote ${path}`);
  lines.push(CALIBRATE_CAVEAT);
  return `${lines.join('\n')}\n`;
}

/** The calibration figure of sheet i into the i-th --svg and --png files. */
async function drawFigures(result: CalibrationResult, sheets: CalibrationSheet[], svgs: string[], pngs: string[], io: CliIo): Promise<void> {
  // Loaded here: no other use of calibrate pays for the DOM.
  const { headlessDocument } = await import('../../figures/headless.ts');
  const document = headlessDocument();
  for (let i = 0; i < sheets.length; i++) {
    if (svgs[i] === undefined && pngs[i] === undefined) continue;
    const text = svgText(calibrationFigure(prepareCalibration(result, i, sheets[i].reference), { document, style: 'publication' }));
    if (svgs[i] !== undefined) writeNamedFile(io, '--svg', svgs[i], text);
    if (pngs[i] !== undefined) writeNamedFile(io, '--png', pngs[i], await rasterise(text, PNG_SCALE));
  }
}

async function run(argv: readonly string[], io: CliIo): Promise<number> {
  const { positionals, flags, repeated } = parseArgs(spec, argv);
  const sheetTexts = (repeated.SHEET ?? [positionals.SHEET]) as string[];
  const files = (repeated.bands ?? []) as string[];
  if (files.length === 0) invalid('--bands', undefined, 'give the reference bands file of the sheet: --bands FILE');
  if (files.length !== sheetTexts.length) {
    invalid('--bands', files.join(' '), `${files.length} file${files.length > 1 ? 's' : ''} for ${sheetTexts.length} sheet${sheetTexts.length > 1 ? 's' : ''}: give one --bands per SHEET, in the same order`);
  }
  const out = flags.out as string | undefined;
  checkOutputPath(io, '--out', out, flags.overwrite === true);
  const svgs = (repeated.svg ?? []) as string[];
  const pngs = (repeated.png ?? []) as string[];
  for (const [flag, list] of [['--svg', svgs], ['--png', pngs]] as const) {
    if (list.length > sheetTexts.length) invalid(flag, list.join(' '), `${list.length} files for ${sheetTexts.length} sheet${sheetTexts.length > 1 ? 's' : ''}: at most one per SHEET`);
    for (const path of list) checkOutputPath(io, flag, path, flags.overwrite === true);
  }
  if (flags['equal-weights'] && flags['weight-width'] !== undefined) invalid('--weight-width', String(flags['weight-width']), 'give --weight-width or --equal-weights, not both');
  const free = commaList('--free', flags.free as string | undefined, ['exponent', 'cutoff'], {
    d0: 'd0 only says where the integrals are stated (any d0 with the V rescaled gives the same bands); set it in the start file (--params)',
  });
  const name = flags.name as string | undefined;
  // eslint-disable-next-line no-control-regex
  if (name !== undefined && (name.trim() === '' || name.length > 100 || /[\u0000-\u001f\u007f]/.test(name))) invalid('--name', name, 'expected 1 to 100 characters, no control characters');
  const hold = commaList('--hold', flags.hold as string | undefined, HOLDABLE) as ModelParameter[];
  const count = sheetTexts.length;
  const blocks = perSheet<string>(repeated.block, count, '--block');
  const models = perSheet<[number, number]>(repeated['model-bands'], count, '--model-bands');
  const references = perSheet<[number, number]>(repeated['reference-bands'], count, '--reference-bands');
  const sheets = readSheets(sheetTexts, files, blocks, models, references, io);
  const first = resolveParameters(flags.params as string | undefined, io);
  const starts = defaultStarts(first);
  // With the cutoff scanned, the longest cutoff tried decides whether bonds of several lengths are seen.
  const reach = free.includes('cutoff') ? Math.max(first.cutoff, ...cutoffCandidates(sheets)) : first.cutoff;
  if (free.includes('exponent') && oneBondLength(sheets, reach)) {
    invalid('--free', flags.free as string, `exponent: every bond of ${count > 1 ? 'these sheets' : 'this sheet'} within the cutoff ${reach} Å has one length, so the distance law cannot be seen in the bands${free.includes('cutoff') ? '' : ' (add cutoff to --free to try longer bonds)'}`);
  }
  const points = sheets.reduce((sum, s) => sum + s.reference.count * s.match.count, 0);
  const unknowns = MODEL_PARAMETERS.length + (flags.shift ? count : 0);
  if (points <= unknowns) invalid('--bands', files.join(' '), `${points} matched energies for up to ${unknowns} unknowns: give more k-points or bands`);

  // Work: every start takes some tens of solves with eigenvectors at every k-point.
  // (estimatedSeconds is for eigenvalues of planar sheets; eigenvectors cost about three times as much.)
  const solves = sheets.reduce((sum, s) => sum + 3 * estimatedSeconds(s.sheet, s.reference.count), 0);
  const seconds = 40 * starts.length * (free.includes('cutoff') ? 4 : 1) * solves;
  if (seconds > MAX_ESTIMATED_SECONDS) invalid('--bands', files.join(' '), `about ${readableSeconds(seconds)} of fitting: give fewer k-points`);
  const progress = new ProgressLine(io.err, 'starts', { machine: flags.progress === true, job: 'calibrate' });
  progress.estimate(seconds, `${points} energies from ${starts.length} starts`, { points, starts: starts.length });
  const result = calibrate({
    sheets,
    starts,
    shift: flags.shift === true,
    weightWidth: flags['equal-weights'] ? null : (flags['weight-width'] as number | undefined),
    freeExponent: free.includes('exponent'),
    scanCutoff: free.includes('cutoff'),
    hold,
    name,
    fittedAt: new Date().toISOString().slice(0, 10),
    onProgress: (done, total) => progress.update(done, done / total),
  });
  progress.done();
  try {
    validateParameterObject(parameterFile(result.parameters));
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    invalid('--bands', files.join(' '), `the fit left the limits of a parameter file (${error.message}): check which bands are matched (--model-bands, --reference-bands, --block) and --shift`);
  }
  if (out !== undefined) writeNamedFile(io, '--out', out, `${JSON.stringify(parameterFile(result.parameters), null, 2)}\n`);
  if (svgs.length > 0 || pngs.length > 0) await drawFigures(result, sheets, svgs, pngs, io);
  io.out(flags.json ? `${JSON.stringify(jsonDocument(result, out))}\n` : textReport(result, [out, ...svgs, ...pngs].filter((p): p is string => p !== undefined)));
  return 0;
}

export const calibrateCommand: Command = { spec, run };
