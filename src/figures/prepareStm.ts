/**
 * The data of the STM picture figure (src/figures/stmPicture.ts) from the core's pictures: pure and
 * structured-cloneable, so the web view's STM worker prepares it and posts it to the page.
 */
import { invalid } from '../validate/invalid.ts';
import { encodeGreyPng } from '../io/png.ts';
import { toGrey8 } from '../stm/grey.ts';
import { gaussReduce } from '../lattice/reduce.ts';
import type { Sheet, Vec2 } from '../lattice/sheet.ts';
import { STM_DEFAULTS, stmModel, type StmMode } from '../stm/simulate.ts';
import { renderStm, type Picture } from '../stm/stmImage.ts';
import { TightBindingModel } from '../tb/model.ts';
import type { ParameterSet } from '../tb/params.ts';
import type { StmPictureData } from './types.ts';

/** A PNG as a data URL (base64 by hand: the same in the page, its workers and Node). */
export function pngDataUrl(bytes: Uint8Array): string {
  const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
  const out: string[] = [];
  for (let i = 0; i < bytes.length; i += 3) {
    const n = (bytes[i] << 16) | ((bytes[i + 1] ?? 0) << 8) | (bytes[i + 2] ?? 0);
    out.push(alphabet[(n >> 18) & 63] + alphabet[(n >> 12) & 63] + (i + 1 < bytes.length ? alphabet[(n >> 6) & 63] : '=') + (i + 2 < bytes.length ? alphabet[n & 63] : '='));
  }
  return `data:image/png;base64,${out.join('')}`;
}

/** The picture's grey PNG as a data URL (minimum black, maximum white). */
function pictureUrl(picture: Picture): string {
  return pngDataUrl(encodeGreyPng(picture.width, picture.height, toGrey8(picture.values)));
}

/** Most lattice points marked; beyond that only the outlined cell is drawn (the points would hide the picture). */
export const MAX_MARKED_POINTS = 1500;

/** A lattice point near the picture's centre: `origin` moved by whole cell vectors. */
export function centredOrigin(origin: Vec2, vectors: [Vec2, Vec2], centre: Vec2): Vec2 {
  const [a, b] = vectors;
  const det = a[0] * b[1] - a[1] * b[0];
  const dx = centre[0] - origin[0], dy = centre[1] - origin[1];
  // Whole cells toward the centre: the cell from the returned point has its middle nearest the picture's centre.
  const n1 = Math.round((dx * b[1] - dy * b[0]) / det - 0.5), n2 = Math.round((a[0] * dy - a[1] * dx) / det - 0.5);
  return [origin[0] + n1 * a[0] + n2 * b[0], origin[1] + n1 * a[1] + n2 * b[1]];
}

/** The lattice points inside a w × h rectangle (Å), at most `limit` (undefined beyond). */
export function latticePoints(origin: Vec2, vectors: [Vec2, Vec2], w: number, h: number, limit = MAX_MARKED_POINTS): Vec2[] | undefined {
  const [a, b] = vectors;
  const det = a[0] * b[1] - a[1] * b[0];
  let lo1 = Infinity, hi1 = -Infinity, lo2 = Infinity, hi2 = -Infinity;
  for (const [x, y] of [[0, 0], [w, 0], [0, h], [w, h]]) {
    const n1 = ((x - origin[0]) * b[1] - (y - origin[1]) * b[0]) / det, n2 = (a[0] * (y - origin[1]) - a[1] * (x - origin[0])) / det;
    lo1 = Math.min(lo1, n1); hi1 = Math.max(hi1, n1); lo2 = Math.min(lo2, n2); hi2 = Math.max(hi2, n2);
  }
  if ((hi1 - lo1 + 1) * (hi2 - lo2 + 1) > 8 * limit) return undefined;
  const out: Vec2[] = [];
  for (let n1 = Math.floor(lo1); n1 <= Math.ceil(hi1); n1++) {
    for (let n2 = Math.floor(lo2); n2 <= Math.ceil(hi2); n2++) {
      const x = origin[0] + n1 * a[0] + n2 * b[0], y = origin[1] + n1 * a[1] + n2 * b[1];
      if (x >= 0 && x <= w && y >= 0 && y <= h) out.push([x, y]);
      if (out.length > limit) return undefined;
    }
  }
  return out;
}

/**
 * A simulated picture of `renderStm` (src/stm/stmImage.ts): x along the first cell vector, a lattice site at the
 * bottom-left corner; the cell (Å, the sheet's frame) is turned into the picture's frame, reduced to its shortest
 * vectors (a sheared cell hides the lattice it stands for) and outlined near the centre.
 */
export function prepareSimulatedPicture(picture: Picture, cell: [Vec2, Vec2], text: { label: string; lines: string[] }): StmPictureData {
  const angle = Math.atan2(cell[0][1], cell[0][0]);
  const c = Math.cos(-angle), s = Math.sin(-angle);
  const turn = ([x, y]: Vec2): Vec2 => [c * x - s * y, s * x + c * y];
  const reduced = gaussReduce(turn(cell[0]), turn(cell[1]));
  const vectors: [Vec2, Vec2] = [reduced.u, reduced.v];
  const w = picture.width * picture.pixelSize, h = picture.height * picture.pixelSize;
  return {
    kind: 'simulated', label: text.label, lines: text.lines,
    width: picture.width, height: picture.height, pixelSize: picture.pixelSize, png: pictureUrl(picture),
    cell: { origin: centredOrigin([0, 0], vectors, [w / 2, h / 2]), vectors },
  };
}

/**
 * A measured picture with its fitted lattice: `values` the picture as shown (background removed), `vectors` the
 * fitted cell (Å) and `origin` one lattice point (Å), both in the picture's frame.
 */
export function prepareMeasuredPicture(
  picture: Picture,
  lattice: { vectors: [Vec2, Vec2]; origin: Vec2 } | undefined,
  text: { label: string; lines: string[]; demo?: string },
): StmPictureData {
  const w = picture.width * picture.pixelSize, h = picture.height * picture.pixelSize;
  const out: StmPictureData = {
    kind: 'measured', label: text.label, lines: text.lines,
    width: picture.width, height: picture.height, pixelSize: picture.pixelSize, png: pictureUrl(picture),
  };
  if (text.demo) out.demo = text.demo;
  if (lattice) {
    const origin = centredOrigin(lattice.origin, lattice.vectors, [w / 2, h / 2]);
    out.cell = { origin, vectors: lattice.vectors };
    const points = latticePoints(origin, lattice.vectors, w, h);
    if (points) out.points = points;
  }
  return out;
}

/** The tip: sample bias V (V > 0 images empty states), height above the highest atom (Å), mode. */
export interface TipSettings {
  bias: number;
  height: number;
  mode: StmMode;
}

export interface StmSimulationOptions extends TipSettings {
  label: string;
  doping?: number;
  smearing?: number;
  /** Mesh of E_F and the LDOS (default STM_DEFAULTS.mesh). */
  mesh?: number;
  cells: number;
  pixels: number;
  /** The bias field's name in errors (`--bias`, `bias V`). */
  biasField: string;
}

const MODE_WORDS: Record<StmMode, string> = { 'constant-current': 'constant current', 'constant-height': 'constant height' };

/** The tip's settings as one line of text (the pictures and the STM panel's table). */
export function tipLine(tip: TipSettings): string {
  return `V = ${tip.bias > 0 ? '+' : '−'}${Math.abs(tip.bias)} V (${tip.bias > 0 ? 'empty' : 'filled'} states), tip ${tip.height} Å, ${MODE_WORDS[tip.mode]}`;
}

/**
 * A sheet's simulated picture, ready to draw; refuses a bias whose window holds no state (E_F in a gap of the model
 * wider than |V|), naming the bias field.
 */
export function prepareStmSimulation(sheet: Sheet, params: ParameterSet, o: StmSimulationOptions): { figure: StmPictureData; fermi: number; states: number } {
  const model = new TightBindingModel(sheet, params);
  const stm = stmModel(model, { bias: o.bias, height: o.height, mode: o.mode, doping: o.doping, smearing: o.smearing, mesh: o.mesh ?? STM_DEFAULTS.mesh });
  if (!(stm.states > 1e-6)) {
    const gap = stm.gap ? `: E_F = ${stm.fermi.toFixed(3)} eV lies in a gap of the model from ${stm.gap.lower.toFixed(3)} to ${stm.gap.upper.toFixed(3)} eV, so |V| must exceed ${Math.min(stm.fermi - stm.gap.lower, stm.gap.upper - stm.fermi).toFixed(2)} V` : '';
    invalid(o.biasField, String(o.bias), `no states of ${o.label} lie in the window E_F … E_F + eV${gap}`);
  }
  const picture = renderStm(stm, model.sheet.cell, { cells: o.cells, pixels: o.pixels });
  const brightness = o.mode === 'constant-height' ? 'brighter: more current at this height' : 'brighter: the tip higher at equal current';
  const figure = prepareSimulatedPicture(picture, model.sheet.cell, {
    label: o.label,
    lines: [`${tipLine(o)}; ${brightness}`, `Tersoff–Hamann on tight binding (${params.name}), E_F ${stm.fermi < 0 ? '−' : ''}${Math.abs(stm.fermi).toFixed(3)} eV: a model, not a prediction`],
  });
  return { figure, fermi: stm.fermi, states: stm.states };
}
