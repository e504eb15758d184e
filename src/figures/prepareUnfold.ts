/**
 * The data of the unfolded-bands and constant-energy-cut figures from the core: `solveUnfolding` diagonalises (the
 * path and the zone grid, with eigenvectors: the slow part, kept by the page's worker), `prepareUnfolded` and
 * `prepareCut` broaden and colour it for one Gaussian width, E_F, energy window and cut energy (fast, no
 * diagonalisation). Pure and structured-cloneable.
 */
import { encodeRgbaPng } from '../io/png.ts';
import type { Vec2 } from '../lattice/sheet.ts';
import type { KPath } from '../tb/kspacePath.ts';
import { TightBindingModel } from '../tb/model.ts';
import type { ParameterSet } from '../tb/params.ts';
import { constantEnergyCut, gridSpread, pathSpread, spectralImage } from '../tb/spectral.ts';
import { unfoldBands, type UnfoldResult } from '../tb/unfold.ts';
import type { UnfoldingSheet } from '../tb/unfoldSheet.ts';
import { primitivePath, primitiveZone, zoneGrid, type ZoneGrid } from '../tb/unfoldZone.ts';
import { brillouinZone } from '../tb/zone.ts';
import { densityTable } from './palette.ts';
import { pngDataUrl } from './prepareStm.ts';
import type { CutData, SpectralPart, UnfoldedData } from './types.ts';

/** Points on the primitive path and pixels per side of the cut, by default (the page's choices). */
export const UNFOLD_PATH_POINTS = 300;
export const CUT_PIXELS = 61;
/** Energies (image rows) of the unfolded-bands image by default. */
export const UNFOLD_ROWS = 240;

/** The unfolded states on the path and over the zone grid: what the worker keeps between redraws. */
export interface UnfoldSolution {
  label: string;
  parameters: string;
  atoms: number;
  sites: number;
  bond: number;
  path: KPath;
  along: UnfoldResult;
  grid: ZoneGrid;
  over: UnfoldResult;
  zone: { corners: Vec2[]; points: { label: string; k: Vec2 }[] };
  cellZone: Vec2[];
}

export interface SolveOptions {
  label: string;
  pathPoints?: number;
  cutPixels?: number;
  /** k-points done and total, over the path and the grid together. */
  onProgress?: (done: number, total: number) => void;
}

/** Diagonalises `unfolding` with `params` on the primitive path and over the primitive zone. */
export function solveUnfolding(unfolding: UnfoldingSheet, params: ParameterSet, options: SolveOptions): UnfoldSolution {
  const model = new TightBindingModel(unfolding.sheet, params);
  const path = primitivePath(unfolding, options.pathPoints ?? UNFOLD_PATH_POINTS);
  // One pixel beyond the zone, so that the picture clipped to the zone has no empty rim.
  const grid = zoneGrid(unfolding, options.cutPixels ?? CUT_PIXELS, 1);
  const total = path.count + grid.kpoints.length / 2;
  const along = unfoldBands(model, unfolding.sites, path.kpoints, { onProgress: (done) => options.onProgress?.(done, total) });
  const over = unfoldBands(model, unfolding.sites, grid.kpoints, { onProgress: (done) => options.onProgress?.(path.count + done, total) });
  const zone = primitiveZone(unfolding);
  return {
    label: options.label, parameters: params.name, atoms: model.atoms, sites: unfolding.sites, bond: unfolding.bond,
    path, along, grid, over, zone: { corners: zone.corners, points: zone.points }, cellZone: brillouinZone(unfolding.sheet.cell).corners,
  };
}

/** The part of a spectral value: total, its σ part, or its π part (total − σ). */
function partOf(part: SpectralPart, total: number, sigma: number): number {
  return part === 'total' ? total : part === 'sigma' ? sigma : total - sigma;
}

/** RGBA pixels of values on the density scale (0 … scaleMax); NaN transparent. */
function densityPng(width: number, height: number, values: Float64Array, scaleMax: number): string {
  const table = densityTable();
  const rgba = new Uint8Array(4 * width * height);
  for (let p = 0; p < width * height; p++) {
    const v = values[p];
    if (Number.isNaN(v)) continue;
    const index = 3 * Math.round(255 * Math.min(1, Math.max(0, v / scaleMax)));
    rgba[4 * p] = table[index];
    rgba[4 * p + 1] = table[index + 1];
    rgba[4 * p + 2] = table[index + 2];
    rgba[4 * p + 3] = 255;
  }
  return pngDataUrl(encodeRgbaPng(width, height, rgba));
}

export interface UnfoldedOptions {
  /** Gaussian width of A(k, E) (eV). */
  smearing: number;
  fermi: number;
  /** Energy window of the image (eV). */
  energyRange: [number, number];
  rows?: number;
  part?: SpectralPart;
}

/** The unfolded-bands figure's data: A(k, E) on the path over the energy window, each pixel's mean, coloured. */
export function prepareUnfolded(solution: UnfoldSolution, options: UnfoldedOptions): UnfoldedData {
  const rows = options.rows ?? UNFOLD_ROWS;
  const part = options.part ?? 'total';
  const [low, high] = options.energyRange;
  const a = spectralImage(solution.along, low, high, rows, options.smearing, pathSpread(solution.along));
  const count = solution.path.count;
  let scaleMax = 0;
  for (const v of a.total) if (v > scaleMax) scaleMax = v;
  if (!(scaleMax > 0)) scaleMax = 1;
  // Image row r is the energy bin r from the top: the bins (ascending) read backwards; column = path point.
  const values = new Float64Array(count * rows);
  for (let k = 0; k < count; k++) {
    for (let e = 0; e < rows; e++) values[(rows - 1 - e) * count + k] = partOf(part, a.total[k * rows + e], a.sigma[k * rows + e]);
  }
  return {
    sheetLabel: solution.label, parameters: solution.parameters, atoms: solution.atoms, sites: solution.sites, bond: solution.bond,
    path: { count, distance: solution.path.distance, labels: solution.path.labels },
    energyRange: [low, high], rows, part, smearing: options.smearing, fermi: options.fermi, scaleMax,
    png: densityPng(count, rows, values, scaleMax),
  };
}

export interface CutOptions {
  smearing: number;
  fermi: number;
  /** E0 (eV), absolute. */
  energy: number;
  part?: SpectralPart;
}

/** The constant-energy cut figure's data: A(k, E0) over the zone grid, each pixel's mean, coloured. */
export function prepareCut(solution: UnfoldSolution, options: CutOptions): CutData {
  const part = options.part ?? 'total';
  const { side, pixel } = solution.grid;
  const cut = constantEnergyCut(solution.over, options.energy, options.smearing, gridSpread(solution.over, pixel, side));
  let scaleMax = 0;
  for (const v of cut.total) if (v > scaleMax) scaleMax = v;
  if (!(scaleMax > 0)) scaleMax = 1;
  const values = new Float64Array(side * side).fill(NaN);
  for (let p = 0; p < side * side; p++) {
    const k = pixel[p];
    if (k >= 0) values[p] = partOf(part, cut.total[k], cut.sigma[k]);
  }
  return {
    sheetLabel: solution.label, parameters: solution.parameters, part, smearing: options.smearing, fermi: options.fermi,
    energy: options.energy, zone: solution.zone, cellZone: solution.cellZone, reach: solution.grid.reach, side, scaleMax,
    png: densityPng(side, side, values, scaleMax),
  };
}
