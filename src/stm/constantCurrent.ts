/**
 * Constant-current mode: the tip height z at which the current equals the set-point I0, from the current at three
 * heights h − Δ, h, h + Δ. ln I is close to linear in z (slope −2κ for one decaying wave, Tersoff & Hamann 1985), so
 * a quadratic in z through the three values of ln I is solved for ln I0 (root nearest the linear estimate).
 * The result is clamped to [h − 2Δ, h + 2Δ]; a non-positive current (truncation noise) counts as 1e-300.
 */

/** Height offset t (Å, relative to h) where ln I(t) = lnTarget, given I at t = −Δ, 0, +Δ. */
export function heightForCurrent(below: number, middle: number, above: number, lnTarget: number, step: number): number {
  const lb = Math.log(Math.max(below, 1e-300));
  const l0 = Math.log(Math.max(middle, 1e-300));
  const la = Math.log(Math.max(above, 1e-300));
  // ln I(u) = c0 + c1·u + c2·u², u = t/Δ.
  const c0 = l0 - lnTarget;
  const c1 = (la - lb) / 2;
  const c2 = (la + lb - 2 * l0) / 2;
  let u = c1 !== 0 ? -c0 / c1 : 0;
  if (Math.abs(c2) > 1e-12 * Math.abs(c1)) {
    const disc = c1 * c1 - 4 * c2 * c0;
    if (disc >= 0) {
      const root = Math.sqrt(disc);
      const r1 = (-c1 + root) / (2 * c2), r2 = (-c1 - root) / (2 * c2);
      u = Math.abs(r1 - u) < Math.abs(r2 - u) ? r1 : r2;
    }
  }
  if (!Number.isFinite(u)) u = 0;
  return Math.min(2, Math.max(-2, u)) * step;
}
