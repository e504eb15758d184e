/**
 * `lacuna match`: the lattice of a measured STM picture and the isolated-hole patterns whose simulated pictures
 * look most like it (DESIGN.md contract).
 */
import { readPicture } from '../../io/imageFile.ts';
import { invalid } from '../../validate/invalid.ts';
import { hnfRows } from '../../lattice/pattern.ts';
import { encodeGreyPng } from '../../io/png.ts';
import { analysePicture } from '../../stm/analyse.ts';
import { latticeOverlay } from '../../stm/overlay.ts';
import type { Background } from '../../stm/background.ts';
import { MATCH_DEFAULTS, matchPatterns } from '../../stm/match.ts';
import { parseArgs, type CommandSpec } from '../args.ts';
import { DOPING_FLAG, JSON_FLAG, OVERWRITE_FLAG, PARAMS_FLAG, SMEARING_FLAG } from '../commonFlags.ts';
import { checkOutputPath, writeNamedFile, type Command, type CliIo } from '../io.ts';
import { resolveParameters } from '../parameters.ts';
import { ProgressLine } from '../progress.ts';
import { BIAS_FLAG, HEIGHT_FLAG, MODE_FLAG, STM_CAVEAT, STM_MESH_FLAG, WORK_FUNCTION_FLAG } from '../stmFlags.ts';
import { checkBias } from './stm.ts';
import { requireSubstrate, SUBSTRATES } from '../../substrate/substrates.ts';
import { COINCIDENCE_MATCH_DEFAULTS } from '../../stm/coincidenceMatch.ts';
import type { CoincidenceFit } from '../../substrate/coincidence.ts';

const SIMILARITY = 'Pearson correlation of the picture averaged onto the candidate\'s cell (fitted from the picture) with the candidate\'s model picture on that cell, best over the fitting choices of cell vectors (mirror images included) and all translations';

const COINCIDENCE_SCORE = 'a coincidence cell is scored with the free sheet\'s model picture on the sheet supercell that forms it, in the fractional coordinates of the measured cell (the strain onto the metal is not drawn); the model has no metal, so the moiré contrast itself is not modelled and counts against every candidate alike: the score compares the sheet-periodic part of the picture only. The fit\'s angle is not checked against the picture. A lattice match is not a structure determination';

const spec: CommandSpec = {
  name: 'match',
  summary: 'lattice of a measured STM picture and the isolated-hole patterns whose model pictures resemble it most',
  positionals: [{ name: 'IMAGE', help: 'a PNG (8 or 16 bit), a JPEG, or a text matrix of heights or currents' }],
  flags: {
    'pixel-size': { kind: 'number', min: 0, max: 100, exclusiveMin: true, placeholder: 'Å', help: 'Å per pixel; required' },
    sites: { kind: 'integerRange', min: 1, max: 16, placeholder: 'N1-N2', help: 'lattice sites per cell of the candidates (default 2-12)' },
    top: { kind: 'integer', min: 1, max: 1000, placeholder: 'K', help: 'candidates listed (default 5)' },
    background: { kind: 'choice', values: ['plane', 'lines', 'none'], placeholder: 'plane|lines|none', help: 'background removed: one plane (default), a line fitted to each scan row (also removes row offsets; Fourier peaks on the kx = 0 axis are then ignored), or none' },
    bond: { kind: 'number', min: 1, max: 3, placeholder: 'd', help: 'B–B distance of the candidates in Å (default 1.69)' },
    bias: BIAS_FLAG,
    height: HEIGHT_FLAG,
    mode: MODE_FLAG,
    'work-function': WORK_FUNCTION_FLAG,
    params: PARAMS_FLAG,
    mesh: { ...STM_MESH_FLAG, help: 'Γ-centred M×M k-mesh of E_F and the LDOS of each candidate (default 24)' },
    smearing: SMEARING_FLAG,
    doping: DOPING_FLAG,
    substrate: { kind: 'text', placeholder: 'NAME', help: `also let a candidate fit through its coincidence (moiré) cells with this metal surface (${SUBSTRATES.map((x) => x.name).join(', ')}), the measured cell being the coincidence cell` },
    'max-strain': { kind: 'number', min: 0, max: 0.2, exclusiveMin: true, placeholder: 's', help: `with --substrate: largest strain of a coincidence, max |principal stretch − 1| (default ${COINCIDENCE_MATCH_DEFAULTS.maxStrain}; above 0 and at most 0.2)` },
    overlay: { kind: 'text', placeholder: 'FILE', help: 'also write the picture (background removed) with the fitted lattice points marked, as a PNG' },
    overwrite: OVERWRITE_FLAG,
    json: JSON_FLAG,
  },
};

function run(argv: readonly string[], io: CliIo): number {
  const { positionals, flags } = parseArgs(spec, argv);
  const file = positionals.IMAGE;
  const pixelSize = flags['pixel-size'] as number | undefined;
  if (pixelSize === undefined) invalid('--pixel-size', undefined, 'required: Å per pixel of the picture');
  const overlay = flags.overlay as string | undefined;
  checkOutputPath(io, '--overlay', overlay, flags.overwrite === true);
  const maxStrain = flags['max-strain'] as number | undefined;
  if (maxStrain !== undefined && flags.substrate === undefined) invalid('--max-strain', typedValue(argv, '--max-strain'), 'only with --substrate: the strain of a coincidence with a metal');
  const substrate = flags.substrate === undefined ? undefined : requireSubstrate(flags.substrate as string, '--substrate');
  const bias = checkBias((flags.bias as number | undefined) ?? 1);
  const parameters = resolveParameters(flags.params as string | undefined, io);
  let bytes: Uint8Array;
  try {
    bytes = io.readBytes(file);
  } catch (error) {
    invalid('IMAGE', file, (error as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : 'cannot read the file');
  }
  const decoded = readPicture(file, bytes);
  const analysis = analysePicture({ ...decoded, pixelSize }, { background: flags.background as Background | undefined });
  if (!analysis.ok) invalid(file, `${decoded.width}×${decoded.height} pixels`, analysis.why);
  if (overlay !== undefined) writeNamedFile(io, '--overlay', overlay, encodeGreyPng(analysis.width, analysis.height, latticeOverlay(analysis)));
  const progress = new ProgressLine(io.err, 'patterns');
  const result = matchPatterns(analysis, {
    parameters,
    sites: flags.sites as [number, number] | undefined,
    top: flags.top as number | undefined,
    bond: flags.bond as number | undefined,
    stm: {
      bias,
      mesh: (flags.mesh as number | undefined) ?? MATCH_DEFAULTS.mesh,
      height: flags.height as number | undefined,
      mode: flags.mode as 'constant-current' | 'constant-height' | undefined,
      workFunction: flags['work-function'] as number | undefined,
      smearing: flags.smearing as number | undefined,
      doping: flags.doping as number | undefined,
    },
    ...(substrate ? { coincidence: { nnDistance: substrate.nnDistance, maxStrain } } : {}),
    onProgress: (done) => progress.update(done, NaN),
  });
  progress.done();
  const { lattice } = analysis;
  if (flags.json) {
    io.out(`${JSON.stringify({
      lattice: {
        a: lattice.a, b: lattice.b, gamma_deg: lattice.gammaDeg,
        a_error: lattice.aError, b_error: lattice.bError, gamma_deg_error: lattice.gammaDegError,
        vectors: lattice.vectors, peaks: lattice.peaks, cells_in_picture: analysis.cells,
      },
      candidates: result.candidates.map((c) => {
        const out: Record<string, unknown> = {
          sites: c.structure.sites, holes: c.structure.holes, supercell: hnfRows(c.structure.pattern.supercell),
          vacancies: c.structure.pattern.vacancies, score: c.score, eta: c.structure.eta, scale: c.scale, index: c.index, shift: c.shift,
        };
        if (c.structure.phase) out.phase = c.structure.phase;
        if (substrate) out.fit = fitJson(c.coincidence);
        return out;
      }),
      image: { file, format: decoded.format, width: decoded.width, height: decoded.height, pixel_size: pixelSize },
      examined: result.examined, fitting: result.fitting, parameters: parameters.name,
      unscored: result.emptyWindow.map((st) => ({ sites: st.sites, holes: st.holes, supercell: hnfRows(st.pattern.supercell), vacancies: st.pattern.vacancies, why: 'no state in the bias window: E_F lies in a gap of the model wider than the bias' })),
      similarity: SIMILARITY,
      ...(substrate ? {
        substrate: { name: substrate.name, nn_distance: substrate.nnDistance, max_strain: maxStrain ?? COINCIDENCE_MATCH_DEFAULTS.maxStrain },
        fitting_by_coincidence: result.fittingByCoincidence,
        coincidence_score: COINCIDENCE_SCORE,
      } : {}),
      model: 'Tersoff–Hamann on tight binding (model pictures, not predictions)',
    })}\n`);
    return 0;
  }
  const lines = [
    `${file}: ${decoded.width}×${decoded.height} ${decoded.format} pixels of ${pixelSize} Å, about ${analysis.cells.toFixed(0)} cells`,
    `lattice  a = ${lattice.a.toFixed(3)} ± ${lattice.aError.toFixed(3)} Å, b = ${lattice.b.toFixed(3)} ± ${lattice.bError.toFixed(3)} Å, γ = ${lattice.gammaDeg.toFixed(2)} ± ${lattice.gammaDegError.toFixed(2)}° (${lattice.peaks} Fourier peaks)`,
    `${result.examined} isolated-hole patterns examined, ${result.fitting} with a fitting cell${substrate ? ` (${result.fittingByCoincidence} only through a coincidence cell with ${substrate.title}, strain up to ${maxStrain ?? COINCIDENCE_MATCH_DEFAULTS.maxStrain})` : ''}`,
  ];
  if (result.emptyWindow.length > 0) {
    lines.push(`${result.emptyWindow.length} fitting pattern(s) not scored: no state in the bias window (E_F in a gap of the model); a larger |--bias| reaches them: ${result.emptyWindow.map((st) => `N=${st.sites} k=${st.holes}${st.phase ? ` (${st.phase})` : ''}`).join(', ')}`);
  }
  if (result.candidates.length === 0) lines.push('no candidate: widen --sites, or check --pixel-size and --bond');
  for (const c of result.candidates) {
    const holes = c.structure.pattern.vacancies.map(([i, j]) => `(${i},${j})`).join(' ');
    lines.push(`  score ${c.score.toFixed(3)}${c.index > 1 ? ` (cell ${c.index}× the fitted one)` : ''}  N=${c.structure.sites} k=${c.structure.holes} η=${c.structure.eta.toFixed(4)}  supercell ${JSON.stringify(hnfRows(c.structure.pattern.supercell))} holes ${holes}${c.structure.phase ? `  (${c.structure.phase})` : ''}`);
    if (substrate) lines.push(`      ${fitText(c.coincidence)}`);
  }
  lines.push(`score: ${SIMILARITY}.`);
  if (substrate) lines.push(`On a metal: ${COINCIDENCE_SCORE}.`);
  lines.push(STM_CAVEAT);
  io.out(`${lines.join('\n')}\n`);
  return 0;
}

/** The text typed for a flag (`--flag value` or `--flag=value`), for the refusal. */
function typedValue(argv: readonly string[], flag: string): string {
  const i = argv.findIndex((a) => a === flag || a.startsWith(`${flag}=`));
  return argv[i] === flag ? argv[i + 1] : argv[i].slice(flag.length + 1);
}

/** How a candidate fits: its own cell, or a coincidence cell with the metal (rows as in the `fit` contract). */
function fitJson(fit: CoincidenceFit | undefined): Record<string, unknown> {
  if (!fit) return { kind: 'cell' };
  return {
    kind: 'coincidence', angle_deg: fit.angleDeg, strain: fit.strain, sheet_supercell: fit.sheetSupercell,
    substrate_supercell: fit.substrateSupercell, sites: fit.sites, sheet_cells: fit.sheetCells,
    moire: { a: fit.moire.a, b: fit.moire.b, gamma_deg: fit.moire.gammaDeg }, ...(fit.wood ? { wood: fit.wood } : {}),
  };
}

function fitText(fit: CoincidenceFit | undefined): string {
  if (!fit) return 'fits by its own cell';
  const rows = (r: number[][]) => `[${r.map((x) => `[${x.join(',')}]`).join(',')}]`;
  return `fits by a coincidence cell: ${fit.sheetCells} sheet cells on ${fit.sites} metal atoms${fit.wood ? ` ${fit.wood}` : ''}, turned ${fit.angleDeg.toFixed(2)}°, strain ${(100 * fit.strain).toFixed(2)} %, sheet rows ${rows(fit.sheetSupercell)} → metal rows ${rows(fit.substrateSupercell)}`;
}

export const matchCommand: Command = { spec, run };
