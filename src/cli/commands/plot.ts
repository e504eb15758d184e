/**
 * `lacuna plot`: one figure of a sheet — the sheet, its bands, its DOS or its Brillouin zone, or the η–δ map of the
 * named sheets on the four metals with this sheet marked, or its simulated STM picture — drawn in the publication look by the same figure code
 * as the web view (src/figures), written as SVG and/or PNG.
 */
import { invalid } from '../../validate/invalid.ts';
import { bandsFigure } from '../../figures/bands.ts';
import { dosFigure } from '../../figures/dos.ts';
import { etaDeltaFigure } from '../../figures/etaDelta.ts';
import { prepareEtaDelta, prepareSheet, prepareSpectra } from '../../figures/prepare.ts';
import { svgText } from '../../figures/serialize.ts';
import { sheetFigure } from '../../figures/sheet.ts';
import { zoneFigure } from '../../figures/zone.ts';
import { prepareStmSimulation } from '../../figures/prepareStm.ts';
import { stmPictureFigure } from '../../figures/stmPicture.ts';
import { STM_DEFAULTS, type StmMode } from '../../stm/simulate.ts';
import { estimateHoleDensity } from '../../lattice/geometry.ts';
import { SHEET_PRESETS } from '../../lattice/presets.ts';
import { dopingMap } from '../../substrate/dopingMap.ts';
import { SUBSTRATES } from '../../substrate/substrates.ts';
import type { SpectraData } from '../../figures/types.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { DOPING_FLAG, JSON_FLAG, MESH_FLAG, MODEL_CAVEAT, OVERWRITE_FLAG, PARAMS_FLAG, SHEET_ARGUMENT, SMEARING_FLAG } from '../commonFlags.ts';
import { checkOutputPath, writeNamedFile, type Command, type CliIo } from '../io.ts';
import { buildModel, meshChoiceOf, meshWork, resolveParameters } from '../parameters.ts';
import { ProgressLine } from '../progress.ts';
import { rasterise } from '../raster.ts';
import { resolveSheet } from '../sheetArgument.ts';
import { ALIGNMENT_FLAGS, SUBSTRATE_CAVEAT, alignmentOf } from '../substrateFlags.ts';
import { BIAS_FLAG, HEIGHT_FLAG, MODE_FLAG, STM_CAVEAT } from '../stmFlags.ts';
import { checkBias } from './stm.ts';

export const FIGURES = ['sheet', 'bands', 'dos', 'zone', 'eta-delta', 'stm'] as const;
/** The STM figure's picture: 4 cells and 256 pixels per side, as `lacuna stm`'s defaults. */
const STM_PICTURE = { cells: 4, pixels: 256 };
const STM_ONLY = ['bias', 'height', 'mode'] as const;
/** Mesh of each spectrum of the η–δ map (the `metals` command's default). */
const MAP_MESH = 24;
export type FigureName = (typeof FIGURES)[number];

/** Pixels per SVG unit in the PNG (2: sharp on paper and on high-density screens). */
export const PNG_SCALE = 2;

const spec: CommandSpec = {
  name: 'plot',
  summary: 'draw one figure of a sheet (sheet, bands, dos, zone, eta-delta: the η–δ map with the sheet marked, or stm: its simulated STM picture) in the publication look, as SVG and/or PNG',
  positionals: [SHEET_ARGUMENT],
  flags: {
    figure: { kind: 'choice', values: FIGURES, placeholder: FIGURES.join('|'), help: 'which figure (required)' },
    svg: { kind: 'text', placeholder: 'FILE', help: 'write the figure as SVG' },
    png: { kind: 'text', placeholder: 'FILE', help: `write the figure as PNG (${PNG_SCALE} pixels per SVG unit; fonts shipped, none needed on the system)` },
    params: PARAMS_FLAG,
    doping: DOPING_FLAG,
    mesh: MESH_FLAG,
    smearing: SMEARING_FLAG,
    points: { kind: 'integer', min: 10, max: 5000, placeholder: 'P', help: 'points on the automatic k-path (default 300)' },
    repeats: { kind: 'integer', min: 1, max: 20, placeholder: 'n', help: 'copies of the cell along each cell vector in the sheet figure (default 3)' },
    ...ALIGNMENT_FLAGS,
    bias: { ...BIAS_FLAG, help: `${BIAS_FLAG.help}; only for --figure stm` },
    height: { ...HEIGHT_FLAG, help: `${HEIGHT_FLAG.help}; only for --figure stm` },
    mode: { ...MODE_FLAG, help: `${MODE_FLAG.help}; only for --figure stm` },
    overwrite: OVERWRITE_FLAG,
    json: JSON_FLAG,
  },
};

async function run(argv: readonly string[], io: CliIo): Promise<number> {
  const { positionals, flags } = parseArgs(spec, argv);
  const figure = flags.figure as FigureName | undefined;
  if (figure === undefined) invalid('--figure', undefined, `required: one of ${FIGURES.join(', ')}`);
  const svgPath = flags.svg as string | undefined;
  const pngPath = flags.png as string | undefined;
  if (svgPath === undefined && pngPath === undefined) invalid('--svg', undefined, 'give --svg FILE, --png FILE or both');
  if (svgPath !== undefined && svgPath === pngPath) invalid('--png', pngPath, 'the same file as --svg');
  checkOutputPath(io, '--svg', svgPath, flags.overwrite === true);
  checkOutputPath(io, '--png', pngPath, flags.overwrite === true);
  if (figure === 'sheet') {
    for (const flag of ['doping', 'mesh', 'smearing', 'points'] as const) {
      if (flags[flag] !== undefined) invalid(`--${flag}`, flags[flag], 'not used by the sheet figure');
    }
  } else if (flags.repeats !== undefined) {
    invalid('--repeats', flags.repeats, 'only for --figure sheet');
  }
  if (figure !== 'stm') {
    for (const flag of STM_ONLY) if (flags[flag] !== undefined) invalid(`--${flag}`, flags[flag], 'only for --figure stm');
  } else if (flags.points !== undefined) {
    invalid('--points', flags.points, 'not used by the stm figure');
  }
  if (figure === 'eta-delta') {
    for (const flag of ['doping', 'points'] as const) {
      if (flags[flag] !== undefined) invalid(`--${flag}`, flags[flag], 'not used by the eta-delta figure');
    }
  } else {
    for (const flag of Object.keys(ALIGNMENT_FLAGS)) {
      if (flags[flag] !== undefined) invalid(`--${flag}`, flags[flag], 'only for --figure eta-delta');
    }
  }

  const source = resolveSheet(positionals.SHEET, io);
  const params = resolveParameters(flags.params as string | undefined, io);
  const repeats = (flags.repeats as number | undefined) ?? 3;
  const sheetData = prepareSheet({ label: source.label, sheet: source.sheet, pattern: source.pattern }, { bondCutoff: params.cutoff, repeats: [repeats, repeats] });
  // Loaded here, not at start-up: no other command pays for the DOM.
  const { headlessDocument } = await import('../../figures/headless.ts');
  const document = headlessDocument();
  const options = { document, style: 'publication' as const };
  let spectra: SpectraData | undefined;
  let svg: SVGSVGElement;
  if (figure === 'sheet') {
    svg = sheetFigure(sheetData, options);
  } else if (figure === 'eta-delta') {
    const model = alignmentOf(flags);
    const progress = new ProgressLine(io.err, 'patterns');
    const map = dopingMap(SHEET_PRESETS.map((p) => ({ name: p.name, pattern: p.pattern })), {
      substrates: SUBSTRATES, parameters: params, mesh: (flags.mesh as number | undefined) ?? MAP_MESH, smearing: flags.smearing as number | undefined, ...model,
      onProgress: (done, total) => progress.update(done, done / total),
    });
    progress.done();
    svg = etaDeltaFigure(prepareEtaDelta(map, { label: source.label, eta: estimateHoleDensity(sheetData.sheet).eta }), options);
  } else if (figure === 'stm') {
    const mesh = (flags.mesh as number | undefined) ?? STM_DEFAULTS.mesh;
    buildModel({ label: source.label, sheet: sheetData.sheet }, params, io, { flag: '--mesh', value: mesh, kpoints: (m) => m * m });
    svg = stmPictureFigure(prepareStmSimulation(sheetData.sheet, params, {
      label: source.label, biasField: '--bias', mesh, ...STM_PICTURE,
      bias: checkBias((flags.bias as number | undefined) ?? STM_DEFAULTS.bias),
      height: (flags.height as number | undefined) ?? STM_DEFAULTS.height,
      mode: (flags.mode as StmMode | undefined) ?? STM_DEFAULTS.mode,
      doping: flags.doping as number | undefined, smearing: flags.smearing as number | undefined,
    }).figure, options);
  } else {
    // The smallest cell of a pattern (what the sheet figure's states refer to), after the work guard.
    buildModel({ label: source.label, sheet: sheetData.sheet }, params, io, meshWork(flags)(sheetData.sheet));
    const progress = new ProgressLine(io.err, 'k-points');
    spectra = prepareSpectra(sheetData.sheet, params, {
      label: source.label,
      doping: flags.doping as number | undefined,
      mesh: meshChoiceOf(flags, sheetData.sheet).mesh,
      smearing: flags.smearing as number | undefined,
      pathPoints: flags.points as number | undefined,
      onProgress: (done, total) => progress.update(done, done / total),
    });
    progress.done();
    svg = figure === 'bands' ? bandsFigure(spectra, options) : figure === 'dos' ? dosFigure(spectra, options) : zoneFigure(spectra, options);
  }
  const text = svgText(svg);
  if (svgPath !== undefined) writeNamedFile(io, '--svg', svgPath, text);
  if (pngPath !== undefined) writeNamedFile(io, '--png', pngPath, await rasterise(text, PNG_SCALE));
  const fermi = spectra ? spectra.fermi : null;
  if (flags.json) {
    io.out(`${JSON.stringify({ svg: svgPath ?? null, png: pngPath ?? null, figure, fermi, sheet: source.label, parameters: params.name })}\n`);
    return 0;
  }
  for (const path of [svgPath, pngPath]) if (path !== undefined) io.out(`wrote ${path}\n`);
  if (spectra) {
    io.out(`${source.label}: ${figure} figure, parameters ${params.name}, δ = ${spectra.doping} e/atom, E_F ${spectra.fermi.toFixed(4)} eV (${spectra.mesh}×${spectra.mesh} mesh, Gaussian width ${spectra.smearing} eV)\n`);
    io.out(`${MODEL_CAVEAT}\n`);
  }
  if (figure === 'eta-delta') io.out(`${SUBSTRATE_CAVEAT}\n`);
  if (figure === 'stm') io.out(`${STM_CAVEAT}\n`);
  return 0;
}

export const plotCommand: Command = { spec, run };
