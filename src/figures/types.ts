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
