/**
 * Damped least squares (Levenberg, Q. Appl. Math. 2, 164 (1944); Marquardt, J. SIAM 11, 431 (1963)): minimise
 * S(x) = Σ r_i(x)² by steps δ that solve (JᵀJ + λ·diag(JᵀJ))·δ = −Jᵀr, with λ divided by 10 after a step that
 * lowers S and multiplied by 10 after one that does not (Marquardt's scaling by diag(JᵀJ) and his factor 10).
 * Small λ is the Gauss–Newton step, large λ a short step down the scaled gradient.
 *
 * Layout: the Jacobian is row-major, residuals × parameters: J[i·P + j] = ∂r_i/∂x_j. The parameter count is small
 * (a dozen at most here), so the normal equations are formed and solved by Cholesky in place.
 *
 * Stops when the scaled gradient max_j |(Jᵀr)_j| / √((JᵀJ)_jj·S) (the cosine between r and a column of J) is below
 * `gradientTolerance`, when an accepted step changes no x_j by more than `stepTolerance` relative, when λ grows past
 * 1e16 (no descent left at rounding level), or after `maxIterations` steps.
 */

/** A least-squares problem: residuals and their Jacobian at any x. */
export interface LeastSquaresProblem {
  readonly parameters: number;
  readonly residuals: number;
  /** Writes r(x) into `residuals` and, when given, J(x) into `jacobian` (row-major, residuals × parameters). */
  evaluate(x: Float64Array, residuals: Float64Array, jacobian: Float64Array | null): void;
}

export interface LeastSquaresOptions {
  /** Largest number of trial steps (accepted or not); default 200. */
  maxIterations?: number;
  /** Scaled-gradient tolerance (default 1e-9). */
  gradientTolerance?: number;
  /** Relative step tolerance (default 1e-10). */
  stepTolerance?: number;
  /** Starting λ (default 1e-3). */
  damping?: number;
  /** Called after every trial step with its number and the current S. */
  onIteration?: (iteration: number, cost: number) => void;
}

/** Why the iteration stopped; 'not-finite': S(x0) is not a finite number (the documented sentinel, x0 returned). */
export type StopReason = 'gradient' | 'step' | 'damping' | 'iterations' | 'exact' | 'not-finite';

export interface LeastSquaresResult {
  x: Float64Array;
  /** S = Σ r² at x. */
  cost: number;
  /** Trial steps taken. */
  iterations: number;
  /** True unless stopped by the iteration limit or a start that cannot be evaluated. */
  converged: boolean;
  reason: StopReason;
  residuals: Float64Array;
  jacobian: Float64Array;
}

const MAX_DAMPING = 1e16;

function sumOfSquares(r: Float64Array): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i] * r[i];
  return s;
}

/** JᵀJ (P×P, full) and Jᵀr. */
function normalEquations(j: Float64Array, r: Float64Array, n: number, p: number, a: Float64Array, g: Float64Array): void {
  a.fill(0);
  g.fill(0);
  for (let i = 0; i < n; i++) {
    const row = i * p;
    const ri = r[i];
    for (let c = 0; c < p; c++) {
      const jc = j[row + c];
      if (jc === 0) continue;
      g[c] += jc * ri;
      for (let d = 0; d <= c; d++) a[c * p + d] += jc * j[row + d];
    }
  }
  for (let c = 0; c < p; c++) for (let d = 0; d < c; d++) a[d * p + c] = a[c * p + d];
}

/**
 * Solves M·x = b for symmetric positive definite M (P×P) by Cholesky, in place in `m` (lower factor) and `b`
 * (solution). Returns false when M is not positive definite to rounding.
 */
export function choleskySolve(m: Float64Array, b: Float64Array, p: number): boolean {
  for (let c = 0; c < p; c++) {
    let diagonal = m[c * p + c];
    for (let k = 0; k < c; k++) diagonal -= m[c * p + k] ** 2;
    if (!(diagonal > 0)) return false;
    const root = Math.sqrt(diagonal);
    m[c * p + c] = root;
    for (let r = c + 1; r < p; r++) {
      let sum = m[r * p + c];
      for (let k = 0; k < c; k++) sum -= m[r * p + k] * m[c * p + k];
      m[r * p + c] = sum / root;
    }
  }
  for (let r = 0; r < p; r++) {
    let sum = b[r];
    for (let k = 0; k < r; k++) sum -= m[r * p + k] * b[k];
    b[r] = sum / m[r * p + r];
  }
  for (let r = p - 1; r >= 0; r--) {
    let sum = b[r];
    for (let k = r + 1; k < p; k++) sum -= m[k * p + r] * b[k];
    b[r] = sum / m[r * p + r];
  }
  return true;
}

/** Minimises Σ r² from x0 (not modified). */
export function levenbergMarquardt(problem: LeastSquaresProblem, x0: Float64Array, options: LeastSquaresOptions = {}): LeastSquaresResult {
  const n = problem.residuals;
  const p = problem.parameters;
  const maxIterations = options.maxIterations ?? 200;
  const gradientTolerance = options.gradientTolerance ?? 1e-9;
  const stepTolerance = options.stepTolerance ?? 1e-10;
  let lambda = options.damping ?? 1e-3;

  let x = Float64Array.from(x0);
  let r = new Float64Array(n);
  let j = new Float64Array(n * p);
  let trialR = new Float64Array(n);
  let trialJ = new Float64Array(n * p);
  let trialX = new Float64Array(p);
  const a = new Float64Array(p * p);
  const g = new Float64Array(p);
  const m = new Float64Array(p * p);
  const step = new Float64Array(p);

  problem.evaluate(x, r, j);
  let cost = sumOfSquares(r);
  let iterations = 0;
  let reason: StopReason = 'iterations';
  normalEquations(j, r, n, p, a, g);

  if (!Number.isFinite(cost)) return { x, cost, iterations, converged: false, reason: 'not-finite', residuals: r, jacobian: j };
  while (iterations < maxIterations) {
    if (cost === 0) {
      reason = 'exact';
      break;
    }
    let gradient = 0;
    for (let c = 0; c < p; c++) {
      const scale = Math.sqrt(a[c * p + c] * cost);
      if (scale > 0) gradient = Math.max(gradient, Math.abs(g[c]) / scale);
    }
    if (gradient < gradientTolerance) {
      reason = 'gradient';
      break;
    }
    m.set(a);
    for (let c = 0; c < p; c++) {
      // Marquardt's scaling; a column of zeros (a parameter nothing depends on) still gets a positive diagonal.
      m[c * p + c] += lambda * (a[c * p + c] > 0 ? a[c * p + c] : 1);
      step[c] = -g[c];
    }
    iterations++;
    if (!choleskySolve(m, step, p)) {
      lambda *= 10;
      if (lambda > MAX_DAMPING) {
        reason = 'damping';
        break;
      }
      continue;
    }
    for (let c = 0; c < p; c++) trialX[c] = x[c] + step[c];
    problem.evaluate(trialX, trialR, trialJ);
    const trialCost = sumOfSquares(trialR);
    options.onIteration?.(iterations, Math.min(cost, trialCost));
    if (trialCost < cost) {
      let relativeStep = 0;
      for (let c = 0; c < p; c++) relativeStep = Math.max(relativeStep, Math.abs(step[c]) / (Math.abs(x[c]) + 1e-8));
      [x, trialX, r, trialR, j, trialJ] = [trialX, x, trialR, r, trialJ, j];
      cost = trialCost;
      normalEquations(j, r, n, p, a, g);
      lambda = Math.max(lambda / 10, 1e-12);
      if (relativeStep < stepTolerance) {
        reason = 'step';
        break;
      }
    } else {
      lambda *= 10;
      if (lambda > MAX_DAMPING) {
        reason = 'damping';
        break;
      }
    }
  }
  return { x, cost, iterations, converged: reason !== 'iterations', reason, residuals: r, jacobian: j };
}
