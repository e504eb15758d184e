/**
 * The figures of a sheet — `sheet`, `bands`, `dos`, `zone` — as data in, one `<svg data-figure="…">` out.
 *
 * Figure code is pure: it takes computed results and a `document` (the page's, or a headless one in Node), never
 * computes physics and never touches globals, so the web view and `lacuna plot` draw identical SVG from the same
 * code. The data types here are what the web view's worker and the CLI both produce with `prepareSpectra` and
 * `prepareSheet` (src/figures/prepare.ts), from the core.
 */
import type { Pattern, Sheet, Vec2 } from '../lattice/sheet.ts';
import type { DosResult } from '../tb/dos.ts';
import type { MeshSpectrum } from '../tb/meshSpectrum.ts';

/** 'screen': compact, for the page. 'publication': white background, axis titles with units, no UI chrome. */
export type FigureStyle = 'screen' | 'publication';

/** Options every figure takes. */
export interface FigureOptions {
  /** Creates the elements: the page's document, or a headless one (Node). */
  document: Document;
  /** Default 'screen'. */
  style?: FigureStyle;
  /** Outer size in CSS pixels (defaults per figure and style). */
  width?: number;
  height?: number;
  /** Prefix of the figure's element ids (default `lacuna-<figure>-<n>`, unique within one module instance). */
  idPrefix?: string;
}

/** A Bloch state picked on the bands figure, as drawn on the sheet and the zone. */
export interface SelectedState {
  /** Index of the k-point on the path. */
  kIndex: number;
  /** Index of the band in the figure's band order (BandsData.energies columns). */
  band: number;
  /** Cartesian k (Å⁻¹). */
  k: Vec2;
  /** E (eV). */
  energy: number;
  /** Per atom of the sheet: |c|² summed over orbitals (sums to 1). */
  weight: Float64Array;
  /**
   * Per atom: the phase (radians) of the state's amplitude on that atom in the home cell, including the Bloch
   * factor exp(i k·τ); in the cell translated by R it is phase + k·R. Global phase fixed by the largest amplitude.
   */
  phase: Float64Array;
  /** σ share of the state. */
  sigma: number;
  /** Name of the parameter set the state was computed with (shown on the sheet figure). */
  parameters?: string;
}

/** The bands on the automatic path, in an order where each band is one continuous curve when possible. */
export interface PathBands {
  /** Cartesian k (Å⁻¹), interleaved; path distance (Å⁻¹) per point; special points. */
  kpoints: Float64Array;
  distance: Float64Array;
  labels: { label: string; index: number }[];
  cellType: string;
  count: number;
  bands: number;
  /** k-major count × bands (eV). Planar sheets: σ block (ascending) then π block (ascending) in every row. */
  energies: Float64Array;
  /** σ share of every state, same layout. */
  sigmaWeight: Float64Array;
  /** Band ranges [first, end) that are each ascending within a row (σ then π for planar sheets). */
  groups: [number, number][];
}

/** Everything the bands, DOS and zone figures show of one sheet with one parameter set at one doping. */
export interface SpectraData {
  sheetLabel: string;
  parameters: string;
  atoms: number;
  planar: boolean;
  path: PathBands;
  /** The mesh spectrum (kept so that a doping change refills without diagonalising). */
  spectrum: MeshSpectrum;
  /** Gaussian DOS of the mesh spectrum at `smearing`, total/σ/π. */
  dos: DosResult;
  doping: number;
  smearing: number;
  mesh: number;
  /** E_F (eV) at `doping`, exactly `fill`'s value for the same sheet, parameters, mesh, width and doping. */
  fermi: number;
  /** The Wigner–Seitz cell of the reciprocal lattice (Å⁻¹), counter-clockwise corners, and b1, b2. */
  zone: { corners: Vec2[]; reciprocal: [Vec2, Vec2] };
}

/** What the sheet figure shows. */
export interface SheetData {
  label: string;
  /** The computational cell (explicit form, Å): atom indices of `state` refer to it. */
  sheet: Sheet;
  /**
   * Present when the sheet is a vacancy pattern of the triangular lattice: the pattern as the user edits it (its
   * supercell outlined, every lattice site drawn and clickable, `data-site="i,j"`).
   */
  pattern?: Pattern;
  /**
   * With `pattern`: the same pattern at its smallest cell (same origin, vacancies taken modulo its supercell);
   * `sheet` is patternToSheet(cellPattern), so site (i, j) is atom `index of reduceSite(cellPattern.supercell, i, j)`
   * translated by the lattice vector (i, j) − reduced site.
   */
  cellPattern?: Pattern;
  /** Copies of the edited cell (or of `sheet`'s cell without a pattern) drawn along each cell vector. */
  repeats: [number, number];
  /** Bonds shorter than this (Å) are drawn (the parameter set's cutoff). */
  bondCutoff: number;
  /** Nearest neighbours per atom (within bondCutoff). */
  coordination: Int32Array;
  /** Hexagonal holes (lattice points), drawn marked. */
  hexagonalHoles: [number, number][];
  /** The reduced (Gauss) cell of the sheet's lattice, drawn dashed when it differs from the cell. */
  reducedCell: [Vec2, Vec2];
  /** A selected Bloch state drawn on the atoms. */
  state?: SelectedState;
}

/** One metal on the η–δ map. */
export interface EtaDeltaMetal {
  name: string;
  title: string;
  /** W_M (eV). */
  workFunction: number;
}

/** One candidate on the η–δ map. Dopings in electrons per B atom. */
export interface EtaDeltaPoint {
  label: string;
  eta: number;
  /** What the model's σ bonding states ask. */
  sigmaFilling: number;
  /** What each metal gives (Fermi-level alignment), by metal name. */
  dopings: Record<string, number>;
}

/** A fact seen in experiment, drawn beside the model (never model output). */
export interface EtaDeltaObserved {
  /** Metal name and its display title. */
  metal: string;
  title: string;
  holeDensities: number[];
  /** Electrons per B atom from the metal, when reported. */
  doping?: number;
  /** Short label drawn at the mark, e.g. "Al(111): ≈1 e/B (Li et al. 2018)". */
  label: string;
  source: string;
}

/** What the η–δ figure draws: the counting-rule curve, candidates against each metal, and observations. */
export interface EtaDeltaData {
  /** The counting rule δ(η) = 8/(3(1 − η)) − 3, sampled. */
  curve: { eta: number; doping: number }[];
  points: EtaDeltaPoint[];
  metals: EtaDeltaMetal[];
  observed: EtaDeltaObserved[];
  /** The model named in the caption: parameter set, mesh, Gaussian width, alignment fields. */
  parameters: string;
  mesh: number;
  smearing: number;
  model: { sheetWorkFunction: number; dipole: number; distance: number; d0: number };
  /** The sheet on the page, marked by its η. */
  current?: { label: string; eta: number };
}

/**
 * A calibration drawn: the fitted model's bands against the reference bands, along the reference's own k-points
 * (prepareCalibration in src/figures/prepareCalibration.ts). Energies on the reference's scale (eV), k-major.
 */
export interface CalibrationFigureData {
  sheetLabel: string;
  referenceLabel: string;
  /** Name of the fitted set. */
  parameters: string;
  /** A warning line when the reference is DEMO data. */
  demo?: string;
  count: number;
  /** Distance along the reference's k-points (Å⁻¹); a jump (another branch of the path) does not advance it. */
  distance: Float64Array;
  /** Special points, and the indices where the path jumps. */
  labels: { label: string; index: number }[];
  breaks: number[];
  referenceBands: number;
  referenceEnergies: Float64Array;
  modelBands: number;
  modelEnergies: Float64Array;
  /** The matched runs, 0-based: model band modelFirst + j ↔ reference band referenceFirst + j. */
  match: { modelFirst: number; referenceFirst: number; count: number };
  /** The weight of every matched reference energy (count × match.count). */
  weights: Float64Array;
  /** E_F of the reference (eV, its scale), when known. */
  fermi: number | null;
  rms: number;
  maxError: number;
  points: number;
  /** 'full', or the σ or π block of a planar sheet. */
  block: string;
}

/**
 * An STM picture, simulated or measured, ready to draw: its 8-bit grey PNG (row 0 at the top) and what to draw over
 * them, in Å in the picture's frame (x to the right, y up, from the bottom-left corner of the picture).
 */
export interface StmPictureData {
  kind: 'simulated' | 'measured';
  /** What the picture is of: a sheet's label, or a file's name. */
  label: string;
  /** Lines of text under the picture (the model, the bias, the fitted lattice…). */
  lines: string[];
  width: number;
  height: number;
  /** Å per pixel. */
  pixelSize: number;
  /** The 8-bit grey PNG of the picture as a data URL, made where the picture is computed (the page's worker). */
  png: string;
  /** One cell outlined: a lattice point and the two cell vectors (Å). */
  cell?: { origin: Vec2; vectors: [Vec2, Vec2] };
  /** Lattice points marked over the picture (Å). */
  points?: Vec2[];
  /** A label in warning colour (DEMO pictures). */
  demo?: string;
}

/**
 * One point of the energy–η figure. Energies are per lattice site relative to the reference line, in eV.
 * `kind` and `index` say where it comes from (the user's structure, or the prediction), so the view finds its pattern.
 */
export interface EnergyHullPoint {
  kind: 'computed' | 'predicted';
  index: number;
  eta: number;
  relative: number;
  label: string;
  /** Predictions: standard error per site (eV). */
  uncertainty?: number;
  /** Rank (1 = first) among the suggestions, when suggested. */
  suggested?: number;
  /** Computed: the fit's value (relative, eV per site), drawn as a tick beside the point. */
  fitted?: number;
}

/** What the energy–η figure (src/figures/energyHull.ts) shows of a cluster-expansion result. */
export interface EnergyHullData {
  /** The energies file's title, if any (a DEMO file says so there). */
  title?: string;
  demo: boolean;
  /** The line subtracted from every energy per site: e0 + slope·η (eV), through the hull's end points. */
  reference: { energy0: number; slope: number };
  computed: EnergyHullPoint[];
  /** Predictions of patterns not computed (computed ones are shown as the user's points). */
  predicted: EnergyHullPoint[];
  /** Vertices (η, relative energy) of the hull of the calculations, and of the hull with the predictions. */
  hull: [number, number][];
  fitHull: [number, number][];
  /** Fit errors per site (eV) and the cluster set in words. */
  fitRms: number;
  cvRms: number;
  clusters: string;
}

/** Which part of an unfolded spectral function a figure shows: all orbitals, σ (s, px, py) or π (pz). */
export type SpectralPart = 'total' | 'sigma' | 'pi';

/**
 * The unfolded bands along the primitive path Γ–M–K–Γ as a density image of A(k, E) (src/tb/spectral.ts), made in
 * src/figures/prepareUnfold.ts (the page's worker, or the CLI).
 */
export interface UnfoldedData {
  sheetLabel: string;
  parameters: string;
  atoms: number;
  /** Lattice sites per cell and the lattice spacing (Å) of the triangular lattice unfolded onto. */
  sites: number;
  bond: number;
  /** The primitive path: cumulative distance (Å⁻¹) per point, the special points. */
  path: { count: number; distance: Float64Array; labels: { label: string; index: number }[] };
  /** The image spans these energies (eV) in `rows` equal bins, the top row ending at `energyRange[1]`. */
  energyRange: [number, number];
  rows: number;
  part: SpectralPart;
  /** Gaussian width of A(k, E) (eV). */
  smearing: number;
  /** E_F (eV) of the sheet's spectrum, drawn as a line. */
  fermi: number;
  /** The A(k, E) at the top of the colour scale (states per eV per site): the largest of the total. */
  scaleMax: number;
  /** The image, an RGBA PNG data URL: one column per path point, one row per energy. */
  png: string;
}

/** A constant-energy cut A(k, E0) over the primitive zone, as a density image (src/figures/prepareUnfold.ts). */
export interface CutData {
  sheetLabel: string;
  parameters: string;
  part: SpectralPart;
  smearing: number;
  fermi: number;
  /** E0 (eV). */
  energy: number;
  /** The primitive zone (Å⁻¹, the sheet's frame): corners counter-clockwise and Γ, M, K. */
  zone: { corners: Vec2[]; points: { label: string; k: Vec2 }[] };
  /** The sheet's own (supercell) zone, drawn inside: the zone the bands fold into. */
  cellZone: Vec2[];
  /** The image covers kx, ky ∈ [−reach, reach] (Å⁻¹) in side × side pixels; outside the zone it is transparent. */
  reach: number;
  side: number;
  scaleMax: number;
  png: string;
}
