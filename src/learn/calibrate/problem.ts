/**
 * The least-squares problem of a calibration: residuals √w·(E_model + shift − E_reference) over every matched
 * (sheet, k-point, band), as a function of the free model parameters and, with --shift, one rigid shift per
 * reference file (its arbitrary zero).
 *
 * Layout of x: the free model parameters in MODEL_PARAMETERS order (indices in `free`), then the shifts, one per
 * sheet. Residuals: sheet-major, then k-major, then matched band.
 */
import type { LeastSquaresProblem } from './levenbergMarquardt.ts';
import type { BandMatch } from './bandMatch.ts';
import { MODEL_PARAMETERS } from './modelParameters.ts';
import type { ParametricBands } from './parametricBands.ts';
import type { ReferenceBands } from './referenceBands.ts';

const PARAMETERS = MODEL_PARAMETERS.length;

/** One sheet of the fit: its parametric bands, its reference, the match and √w per matched point. */
export interface FitSheet {
  bands: ParametricBands;
  reference: ReferenceBands;
  match: BandMatch;
  /** √w, k-major × match.count. */
  rootWeight: Float64Array;
}

export class CalibrationProblem implements LeastSquaresProblem {
  readonly parameters: number;
  readonly residuals: number;
  /** The full parameter vector, held values included; free ones overwritten from x by `expand`. */
  readonly values: Float64Array;
  private readonly energies: Float64Array[];
  private readonly slopes: Float64Array[];

  constructor(
    readonly sheets: readonly FitSheet[],
    /** Indices (MODEL_PARAMETERS) of the fitted model parameters, ascending. */
    readonly free: readonly number[],
    /** One rigid shift per sheet. */
    readonly shift: boolean,
    held: Float64Array,
  ) {
    this.values = Float64Array.from(held);
    this.parameters = free.length + (shift ? sheets.length : 0);
    this.residuals = sheets.reduce((sum, s) => sum + s.reference.count * s.match.count, 0);
    this.energies = sheets.map((s) => new Float64Array(s.bands.count * s.bands.bands));
    this.slopes = sheets.map((s) => new Float64Array(s.bands.count * s.bands.bands * PARAMETERS));
  }

  /** The full parameter vector of x (a view on `values`, overwritten by the next call). */
  expand(x: Float64Array): Float64Array {
    this.free.forEach((index, at) => (this.values[index] = x[at]));
    return this.values;
  }

  /** The shift of sheet s in x (0 without shifts). */
  shiftOf(x: Float64Array, s: number): number {
    return this.shift ? x[this.free.length + s] : 0;
  }

  /** The model bands of sheet s at the last evaluation (count × bands, without the shift). */
  modelEnergies(s: number): Float64Array {
    return this.energies[s];
  }

  evaluate(x: Float64Array, residuals: Float64Array, jacobian: Float64Array | null): void {
    const values = this.expand(x);
    const p = this.parameters;
    const free = this.free;
    let i = 0;
    this.sheets.forEach((sheet, s) => {
      const { bands, reference, match, rootWeight } = sheet;
      const energies = this.energies[s];
      const slopes = this.slopes[s];
      bands.evaluate(values, energies, jacobian ? slopes : null);
      const shift = this.shiftOf(x, s);
      for (let k = 0; k < reference.count; k++) {
        for (let j = 0; j < match.count; j++, i++) {
          const state = k * bands.bands + match.modelFirst + j;
          const w = rootWeight[k * match.count + j];
          residuals[i] = w * (energies[state] + shift - reference.energies[k * reference.bands + match.referenceFirst + j]);
          if (!jacobian) continue;
          const row = i * p;
          for (let c = 0; c < free.length; c++) jacobian[row + c] = w * slopes[state * PARAMETERS + free[c]];
          if (this.shift) {
            for (let t = 0; t < this.sheets.length; t++) jacobian[row + free.length + t] = t === s ? w : 0;
          }
        }
      }
    });
  }
}
