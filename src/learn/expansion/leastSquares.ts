/**
 * Linear least squares by Householder QR (Golub & Van Loan, Matrix Computations, §5.2 and §5.3), with what a
 * cluster-expansion fit needs besides the coefficients: the diagonal of the hat matrix H = X(XᵀX)⁻¹Xᵀ (for the
 * leave-one-out shortcut) and the quadratic form x(XᵀX)⁻¹xᵀ (for the variance of a prediction).
 *
 * Layout: X is n × p column-major in a Float64Array, X[i + n·k]; it is copied, never changed. With X = QR
 * (Q n × p with orthonormal columns, R p × p upper triangular): β = R⁻¹Qᵀy, H_ii = Σ_k Q_ik², and
 * x(XᵀX)⁻¹xᵀ = |R⁻ᵀxᵀ|².
 */

/** Relative size below which a column counts as a combination of the columns before it. */
export const DEPENDENCE_TOLERANCE = 1e-9;

export interface LeastSquares {
  readonly rows: number;
  readonly columns: number;
  /** The first column (0-based) that is a combination of the columns before it, or −1 when X has full column rank. */
  readonly dependentColumn: number;
  /** Coefficients β (NaN when dependent). */
  readonly coefficients: Float64Array;
  /** Residuals y − Xβ. */
  readonly residuals: Float64Array;
  /** Diagonal of the hat matrix. */
  readonly leverage: Float64Array;
  /** R, p × p upper triangular, column-major R[i + p·k]. */
  readonly r: Float64Array;
}

/** Solves min |Xβ − y|² (layout in the module comment). Never throws: a dependent column gives NaN coefficients. */
export function leastSquares(x: Float64Array, y: Float64Array, rows: number, columns: number): LeastSquares {
  const n = rows;
  const p = columns;
  const a = Float64Array.from(x);
  const qty = Float64Array.from(y);
  // Thin Q, built by applying the reflectors to the first p columns of the identity.
  const q = new Float64Array(n * p);
  const reflectors = new Float64Array(n * p);
  const betas = new Float64Array(p);
  let dependentColumn = -1;
  for (let k = 0; k < p; k++) {
    let original = 0;
    for (let i = 0; i < n; i++) original += x[i + n * k] ** 2;
    let norm = 0;
    for (let i = k; i < n; i++) norm += a[i + n * k] ** 2;
    norm = Math.sqrt(norm);
    if (dependentColumn < 0 && !(norm > DEPENDENCE_TOLERANCE * Math.sqrt(original) && norm > 0)) dependentColumn = k;
    if (k >= n || norm === 0) continue;
    // v = a_k − α e_k with α = −sign(a_kk)·|a_k|, so no cancellation; H = I − β v vᵀ, β = 2/(vᵀv).
    const alpha = a[k + n * k] >= 0 ? -norm : norm;
    for (let i = k; i < n; i++) reflectors[i + n * k] = a[i + n * k];
    reflectors[k + n * k] -= alpha;
    let vv = 0;
    for (let i = k; i < n; i++) vv += reflectors[i + n * k] ** 2;
    const beta = vv > 0 ? 2 / vv : 0;
    betas[k] = beta;
    for (let c = k; c < p; c++) reflect(a, reflectors, n, k, beta, c * n);
    reflect(qty, reflectors, n, k, beta, 0);
  }
  const r = new Float64Array(p * p);
  for (let k = 0; k < p; k++) for (let i = 0; i <= k && i < n; i++) r[i + p * k] = a[i + n * k];
  for (let c = 0; c < p && c < n; c++) q[c + n * c] = 1;
  for (let k = Math.min(p, n) - 1; k >= 0; k--) for (let c = 0; c < p; c++) reflect(q, reflectors, n, k, betas[k], c * n);

  const coefficients = new Float64Array(p).fill(NaN);
  const residuals = new Float64Array(n);
  const leverage = new Float64Array(n);
  if (dependentColumn < 0 && n >= p) {
    for (let k = p - 1; k >= 0; k--) {
      let s = qty[k];
      for (let c = k + 1; c < p; c++) s -= r[k + p * c] * coefficients[c];
      coefficients[k] = s / r[k + p * k];
    }
    for (let i = 0; i < n; i++) {
      let fitted = 0;
      for (let k = 0; k < p; k++) fitted += x[i + n * k] * coefficients[k];
      residuals[i] = y[i] - fitted;
      let h = 0;
      for (let k = 0; k < p; k++) h += q[i + n * k] ** 2;
      leverage[i] = h;
    }
  } else {
    residuals.fill(NaN);
    leverage.fill(NaN);
  }
  return { rows: n, columns: p, dependentColumn, coefficients, residuals, leverage, r };
}

/** Applies I − β v vᵀ (v the k-th reflector, entries k…n−1) to the column of `target` starting at `start`. */
function reflect(target: Float64Array, reflectors: Float64Array, n: number, k: number, beta: number, start: number): void {
  if (beta === 0) return;
  let dot = 0;
  for (let i = k; i < n; i++) dot += reflectors[i + n * k] * target[start + i];
  const scale = beta * dot;
  for (let i = k; i < n; i++) target[start + i] -= scale * reflectors[i + n * k];
}

/**
 * x(XᵀX)⁻¹xᵀ = |R⁻ᵀxᵀ|² for the row x (length p), using `work` (length p) as scratch. Forward substitution on Rᵀ.
 */
export function quadraticForm(r: Float64Array, p: number, x: ArrayLike<number>, work: Float64Array): number {
  let sum = 0;
  for (let k = 0; k < p; k++) {
    let s = x[k];
    for (let c = 0; c < k; c++) s -= r[c + p * k] * work[c];
    const z = s / r[k + p * k];
    work[k] = z;
    sum += z * z;
  }
  return sum;
}
