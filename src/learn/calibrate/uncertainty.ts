/**
 * Parameter uncertainties of a least-squares fit from its Jacobian at the minimum: Cov = s²·(JᵀJ)⁻¹ with
 * s² = Σ r²/(N − P), the usual linearised estimate (e.g. Press et al., Numerical Recipes, 3rd ed., §15.4 and §15.5).
 * With weighted residuals r_i = √w_i·(model − reference) it treats the misfit of point i as independent noise of
 * variance s²/w_i. It is a statement about how well these bands fix the parameters, not about how well the model
 * describes boron.
 *
 * JᵀJ is diagonalised after scaling to unit diagonal (its correlation form C = D⁻¹·JᵀJ·D⁻¹, D = √diag): a direction
 * with eigenvalue below NULL_RATIO times the largest is a combination the bands cannot see; every parameter with a
 * weight in it is reported undetermined (NaN) and the others come from the pseudo-inverse over the rest.
 *
 * Layout: Jacobian row-major, N × P (levenbergMarquardt.ts); correlation P × P row-major.
 */
import { RealSymmetricEigensolver } from '../../linalg/eighReal.ts';

/** Eigenvalues of the unit-diagonal JᵀJ below this fraction of the largest count as zero. */
export const NULL_RATIO = 1e-10;
/** A parameter whose weight in a null direction exceeds this is undetermined. */
const NULL_WEIGHT = 1e-4;

export interface ParameterCovariance {
  /** s² = Σ r²/(N − P); NaN when N ≤ P. */
  variance: number;
  /** Standard uncertainty of each parameter; NaN when the data do not determine it. */
  sigma: Float64Array;
  /** Correlation coefficients, P × P row-major; NaN in the rows and columns of undetermined parameters. */
  correlation: Float64Array;
}

export function parameterCovariance(jacobian: Float64Array, residuals: Float64Array, n: number, p: number): ParameterCovariance {
  let cost = 0;
  for (let i = 0; i < n; i++) cost += residuals[i] * residuals[i];
  const variance = n > p ? cost / (n - p) : NaN;
  const a = new Float64Array(p * p);
  for (let i = 0; i < n; i++) {
    for (let c = 0; c < p; c++) {
      const jc = jacobian[i * p + c];
      if (jc === 0) continue;
      for (let d = 0; d < p; d++) a[c * p + d] += jc * jacobian[i * p + d];
    }
  }
  const scale = new Float64Array(p);
  for (let c = 0; c < p; c++) scale[c] = Math.sqrt(a[c * p + c]);
  const unitDiagonal = new Float64Array(p * p);
  for (let c = 0; c < p; c++) {
    // A column of zeros keeps a unit diagonal, its own direction: it is reported undetermined below anyway.
    for (let d = 0; d < p; d++) unitDiagonal[c * p + d] = scale[c] > 0 && scale[d] > 0 ? a[c * p + d] / (scale[c] * scale[d]) : c === d ? 1 : 0;
  }
  const values = new Float64Array(p);
  const vectors = new Float64Array(p * p);
  new RealSymmetricEigensolver(p).eigensystem(unitDiagonal, values, vectors);
  const largest = values[p - 1];
  const determined = new Array<boolean>(p).fill(true);
  for (let c = 0; c < p; c++) if (!(scale[c] > 0)) determined[c] = false;
  const kept: number[] = [];
  for (let m = 0; m < p; m++) {
    if (values[m] > NULL_RATIO * largest) {
      kept.push(m);
      continue;
    }
    for (let c = 0; c < p; c++) if (Math.abs(vectors[c * p + m]) > NULL_WEIGHT) determined[c] = false;
  }
  // Pseudo-inverse of the unit-diagonal form over the directions kept.
  const inverse = new Float64Array(p * p);
  for (const m of kept) {
    for (let c = 0; c < p; c++) {
      for (let d = 0; d < p; d++) inverse[c * p + d] += (vectors[c * p + m] * vectors[d * p + m]) / values[m];
    }
  }
  const sigma = new Float64Array(p);
  const correlation = new Float64Array(p * p);
  for (let c = 0; c < p; c++) {
    sigma[c] = determined[c] ? Math.sqrt(variance * inverse[c * p + c]) / scale[c] : NaN;
  }
  for (let c = 0; c < p; c++) {
    for (let d = 0; d < p; d++) {
      correlation[c * p + d] = determined[c] && determined[d]
        ? inverse[c * p + d] / Math.sqrt(inverse[c * p + c] * inverse[d * p + d])
        : NaN;
    }
  }
  return { variance, sigma, correlation };
}
