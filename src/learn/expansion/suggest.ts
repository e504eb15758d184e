/**
 * Which patterns to compute next, and why. The criterion, in order:
 *
 * 1. Ground-state check (van de Walle & Ceder, J. Phase Equilib. 23, 348 (2002)): the expansion's ground states
 *    should be the calculations' ones. A pattern not computed that is a vertex of the fit's hull (the hull of the
 *    expansion's own energies: fitted for the computed structures, predicted for the others — so that the noise
 *    of the calculations makes no ground states of its own) is a ground state the expansion claims and the
 *    calculations never saw: either one the training set misses, or a fault of the fit there; both need it
 *    computed. Deepest below the hull of the calculations first.
 * 2. Uncertain near the hull: of the other patterns not computed, those predicted at most `window` above the
 *    fit's hull (twice the CV score, or the fit rms when there is none: the fit's own estimate of its error per
 *    site, so within it a pattern may well be a ground state), least certain first — largest standard error
 *    s·√(x(XᵀX)⁻¹xᵀ): their correlations lie farthest from those already computed, so computing them teaches the fit
 *    most where it matters.
 *
 * Patterns outside the η range of the calculations are extrapolations and never suggested. Of patterns the
 * clusters cannot tell apart (equal η, prediction and uncertainty: equal correlations), one is suggested.
 */
import type { Pattern } from '../../lattice/sheet.ts';

/** The window above the hull is this many CV scores. */
export const WINDOW_CV_SCORES = 2;

export interface SuggestionCandidate {
  pattern: Pattern;
  eta: number;
  /** Predicted energy per site (eV). */
  energyPerSite: number;
  /** Predicted energy per site above the hull of the calculations (eV; negative below; NaN outside its η range). */
  aboveHull: number;
  /** Predicted energy per site above the fit's hull (eV, ≥ 0; NaN outside the calculations' η range). */
  aboveFitHull: number;
  /** A vertex of the fit's hull (a ground state of the expansion). */
  fitGroundState: boolean;
  /** Standard error of the prediction per site (eV). */
  uncertainty: number;
  /** True when the pattern is in the training set. */
  computed: boolean;
}

export interface Suggestion<C extends SuggestionCandidate = SuggestionCandidate> {
  candidate: C;
  reason: 'ground-state' | 'uncertain';
  why: string;
}

/** meV per site with one decimal; rounding never shows "−0.0". */
const meV = (eV: number) => `${(Math.abs(eV) < 5e-5 ? 0 : 1000 * eV).toFixed(1)} meV/site`;

/** Same η, prediction and uncertainty: patterns the clusters cannot tell apart. */
function alike(x: SuggestionCandidate, y: SuggestionCandidate): boolean {
  return x.eta === y.eta && Math.abs(x.energyPerSite - y.energyPerSite) < 1e-12 && Math.abs(x.uncertainty - y.uncertainty) < 1e-12;
}

/** Up to `count` suggestions (the criterion in the module comment); `window` in eV per site. */
export function suggestNext<C extends SuggestionCandidate>(candidates: readonly C[], options: { count: number; window: number }): Suggestion<C>[] {
  const fresh = candidates.filter((c) => !c.computed && Number.isFinite(c.aboveHull));
  const ground = fresh.filter((c) => c.fitGroundState).sort((x, y) => x.aboveHull - y.aboveHull);
  const window = Number.isFinite(options.window) ? options.window : 0;
  const near = fresh
    .filter((c) => !c.fitGroundState && c.aboveFitHull <= window)
    .sort((x, y) => y.uncertainty - x.uncertainty || x.aboveFitHull - y.aboveFitHull);
  const out: Suggestion<C>[] = [];
  const taken = (c: C) => out.some((s) => alike(s.candidate, c));
  for (const c of ground) {
    if (out.length >= options.count) break;
    if (taken(c)) continue;
    const where = c.aboveHull < 0 ? `${meV(-c.aboveHull)} below the hull of your calculations` : `on the hull of your calculations`;
    out.push({
      candidate: c,
      reason: 'ground-state',
      why: `a ground state of the fit that you have not computed: predicted ${where} (±${meV(c.uncertainty)}) — either one your set misses or a fault of the fit there; compute it to tell which`,
    });
  }
  for (const c of near) {
    if (out.length >= options.count) break;
    if (taken(c)) continue;
    out.push({
      candidate: c,
      reason: 'uncertain',
      why: `predicted ${meV(c.aboveFitHull)} above the fit's hull, within ${WINDOW_CV_SCORES} × CV (${meV(window)}) of it, and among those the least certain (±${meV(c.uncertainty)}): its correlations are the least like those of the structures you computed`,
    });
  }
  return out;
}
