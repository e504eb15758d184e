/**
 * A simulated STM picture over n×n cells: a square of side n·max(|A1|, |A2|) on P×P pixels, x along the sheet's first
 * cell vector A1, y up (row 0 is the top row), the origin (a lattice site) at the bottom-left corner.
 * Layout: values[row·width + col], pixel centres at x = (col + ½)·s, y = (height − row − ½)·s, s the pixel size.
 */
import type { TightBindingModel } from '../tb/model.ts';
import { evaluateStm, stmModel, type StmModel, type StmOptions } from './simulate.ts';

/** A greyscale picture of real numbers, row 0 at the top. */
export interface Picture {
  width: number;
  height: number;
  /** Å per pixel. */
  pixelSize: number;
  values: Float64Array;
}

export interface StmPictureOptions extends StmOptions, PictureFrame {}

/** The picture's size: pixels per side and cells per side. */
export interface PictureFrame {
  /** Pixels per side (default 256). */
  pixels?: number;
  /** Cells per side (default 4). */
  cells?: number;
}

/** Evaluates an STM model on the picture's pixels (see the module comment for the frame). */
export function renderStm(stm: StmModel, cell: TightBindingModel['sheet']['cell'], frame: PictureFrame = {}): Picture {
  const pixels = frame.pixels ?? 256, cells = frame.cells ?? 4;
  const [[ax, ay], [bx, by]] = cell;
  const side = cells * Math.max(Math.hypot(ax, ay), Math.hypot(bx, by));
  const s = side / pixels;
  const angle = Math.atan2(ay, ax);
  const cos = Math.cos(angle), sin = Math.sin(angle);
  const x = new Float64Array(pixels * pixels), y = new Float64Array(pixels * pixels);
  for (let row = 0; row < pixels; row++) {
    for (let col = 0; col < pixels; col++) {
      const u = (col + 0.5) * s, v = (pixels - row - 0.5) * s;
      x[row * pixels + col] = cos * u - sin * v;
      y[row * pixels + col] = sin * u + cos * v;
    }
  }
  return { width: pixels, height: pixels, pixelSize: s, values: evaluateStm(stm, x, y, new Float64Array(pixels * pixels)) };
}

/** Simulates and renders in one call; returns the model too (its Fermi level, κ, states in the window). */
export function stmPicture(model: TightBindingModel, options: StmPictureOptions = {}): { stm: StmModel; picture: Picture } {
  const stm = stmModel(model, options);
  return { stm, picture: renderStm(stm, model.sheet.cell, options) };
}
