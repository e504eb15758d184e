/**
 * Roots of the secular equation f(λ) = 1 + Σ_j w_j/(d_j − λ) = 0 of a rank-one update D + ρ·z·zᵀ
 * (w_j = ρ·z_j² > 0, poles d_0 < d_1 < … < d_{k−1}), as the divide-and-conquer merge needs them (Cuppen,
 * Numer. Math. 36, 177 (1981); Golub, SIAM Rev. 15, 318 (1973) for the equation).
 *
 * Root i lies in (d_i, d_{i+1}) (the last in (d_{k−1}, d_{k−1} + Σw]). It is stored as an origin pole o and an
 * offset τ, λ_i = d_o + τ, with o the nearer pole, so that every difference d_j − λ_i is formed as
 * (d_j − d_o) − τ without cancellation (Gu & Eisenstat, SIAM J. Matrix Anal. Appl. 16, 172 (1995), §3 — the
 * accuracy their eigenvector formula needs).
 *
 * Iteration: the "middle way" of Li (Ren-Cang Li, "Solving secular equations stably and efficiently",
 * LAPACK Working Note 89, 1994): with ψ the sum over poles j ≤ i and φ over j > i, the model
 * c + s/(δ_i − η) + S/(δ_{i+1} − η) matches ψ, ψ′ at pole i and φ, φ′ at pole i+1 (s = δ_i²ψ′, S = δ_{i+1}²φ′,
 * c = f − δ_iψ′ − δ_{i+1}φ′, δ_j = d_j − λ), and its root in (δ_i, δ_{i+1}) is the step η. f increases on the
 * interval, so every evaluation also narrows a bracket; a step leaving the bracket is replaced by bisection.
 */

const EPS = 2 ** -52;
/** Iterations before the bracket alone decides (bisection halves it each time, so 100 is ample). */
const MAX_ITERATIONS = 100;

/**
 * Solves for root i of the secular equation with poles `poles[0…k−1]` (strictly ascending) and weights
 * `weights[0…k−1]` (w_j = ρ·z_j²). Writes the origin pole index to origin[i] and the offset to offset[i].
 */
export function secularRoot(
  i: number, k: number, poles: Float64Array, weights: Float64Array, origin: Int32Array, offset: Float64Array,
): void {
  let o: number;
  let lower: number;
  let upper: number;
  if (i + 1 < k) {
    const gap = poles[i + 1] - poles[i];
    // f at the midpoint decides which half holds the root and so which pole is nearer.
    const half = 0.5 * gap;
    let f = 1;
    const di = poles[i];
    for (let j = 0; j < k; j++) f += weights[j] / (poles[j] - di - half);
    if (f >= 0) {
      o = i;
      lower = 0;
      upper = half;
    } else {
      o = i + 1;
      lower = -half;
      upper = 0;
    }
  } else {
    o = i;
    lower = 0;
    let total = 0;
    for (let j = 0; j < k; j++) total += weights[j];
    upper = total;
  }
  const dOrigin = poles[o];
  let tau = 0.5 * (lower + upper);
  for (let iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
    // ψ, ψ′ over poles 0…i (δ_j < 0 there), φ, φ′ over poles i+1…k−1 (δ_j > 0).
    let psi = 0;
    let psiSlope = 0;
    for (let j = 0; j <= i; j++) {
      const inverse = 1 / (poles[j] - dOrigin - tau);
      const t = weights[j] * inverse;
      psi += t;
      psiSlope += t * inverse;
    }
    let phi = 0;
    let phiSlope = 0;
    for (let j = i + 1; j < k; j++) {
      const inverse = 1 / (poles[j] - dOrigin - tau);
      const t = weights[j] * inverse;
      phi += t;
      phiSlope += t * inverse;
    }
    const f = 1 + psi + phi;
    // Rounding bound of the sum (every term of ψ is negative, of φ positive), plus the effect of τ's own
    // rounding (|τ|·ε·f′): below it the sign of f says nothing more.
    const noise = 8 * EPS * (1 + phi - psi) + EPS * Math.abs(tau) * (psiSlope + phiSlope);
    if (Math.abs(f) <= noise) break;
    if (f < 0) lower = tau;
    else upper = tau;
    // τ is carried apart from d_o, so it can be resolved to its own relative precision.
    if (upper - lower <= 2 * EPS * Math.max(Math.abs(lower), Math.abs(upper))) break;
    const deltaI = poles[i] - dOrigin - tau;
    let eta: number;
    if (i + 1 < k) {
      const deltaNext = poles[i + 1] - dOrigin - tau;
      const s = deltaI * deltaI * psiSlope;
      const big = deltaNext * deltaNext * phiSlope;
      const c = f - deltaI * psiSlope - deltaNext * phiSlope;
      // c·η² − a·η + b = 0, the model's root; the one inside (δ_i, δ_{i+1}) is the step.
      const a = c * (deltaI + deltaNext) + s + big;
      const b = c * deltaI * deltaNext + s * deltaNext + big * deltaI;
      eta = NaN;
      if (c === 0) {
        eta = b / a;
      } else {
        const root = Math.sqrt(Math.max(0, a * a - 4 * b * c));
        const q = a >= 0 ? a + root : a - root;
        const first = q / (2 * c);
        const second = (2 * b) / q;
        eta = first > deltaI && first < deltaNext ? first : second;
      }
    } else {
      // Last root: one pole, c + s/(δ − η), root η = δ + s/c.
      const s = deltaI * deltaI * psiSlope;
      const c = f - deltaI * psiSlope;
      eta = deltaI + s / c;
    }
    let next = tau + eta;
    if (!(next > lower && next < upper)) next = 0.5 * (lower + upper);
    if (next === tau) break;
    tau = next;
  }
  origin[i] = o;
  offset[i] = tau;
}
