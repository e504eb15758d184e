/**
 * The data of the energy–η figure (src/figures/energyHull.ts) from a cluster-expansion result: pure and
 * structured-cloneable, so the web view's expansion worker prepares it and the CLI (`expand --svg`) too.
 *
 * Energies are drawn relative to the straight line through the end points of the hull of the calculations: a
 * line a + bη added to every energy changes neither the hull nor any distance above it (src/learn/expansion/hull.ts),
 * and without it the few meV per site that decide stability would hide under the eV per site that η costs.
 */
import type { ExpansionResult } from '../learn/expansion/expand.ts';
import { hnfRows } from '../lattice/pattern.ts';
import type { Pattern } from '../lattice/sheet.ts';
import type { EnergyHullData, EnergyHullPoint } from './types.ts';

/** A short name of a pattern: N<sites>k<holes>, its supercell rows and vacancies. */
export function patternLabel(pattern: Pattern): string {
  const sites = pattern.supercell.a * pattern.supercell.c;
  return `N${sites}k${pattern.vacancies.length} ${JSON.stringify(hnfRows(pattern.supercell))} ${JSON.stringify(pattern.vacancies)}`;
}

export function prepareEnergyHull(result: ExpansionResult, file: { title?: string; demo?: boolean } = {}): EnergyHullData {
  const hull = result.hull;
  const first = hull[0];
  const last = hull[hull.length - 1];
  const slope = hull.length > 1 ? (last.energy - first.energy) / (last.eta - first.eta) : 0;
  const energy0 = first.energy - slope * first.eta;
  const relative = (eta: number, energy: number) => energy - energy0 - slope * eta;
  const rank = new Map(result.suggestions.map((s, k) => [s.candidate, k + 1]));

  const computed: EnergyHullPoint[] = result.computed.map((c) => ({
    kind: 'computed', index: c.index, eta: c.eta, relative: relative(c.eta, c.energyPerSite), label: c.name ?? patternLabel(c.pattern),
    fitted: relative(c.eta, c.fitted),
  }));
  const predicted: EnergyHullPoint[] = [];
  result.predictions.forEach((p, index) => {
    if (p.computed) return;
    const point: EnergyHullPoint = {
      kind: 'predicted', index, eta: p.eta, relative: relative(p.eta, p.energyPerSite), label: p.phase ?? patternLabel(p.pattern), uncertainty: p.uncertainty,
    };
    const suggested = rank.get(p);
    if (suggested !== undefined) point.suggested = suggested;
    predicted.push(point);
  });
  const set = result.fit.set;
  const clusters = `empty, point, pairs to shell ${set.pairShells}${set.tripletShells > 0 ? `, triplets within shell ${set.tripletShells}` : ''}`;
  const data: EnergyHullData = {
    demo: file.demo === true,
    reference: { energy0, slope },
    computed,
    predicted,
    hull: hull.map((v) => [v.eta, relative(v.eta, v.energy)]),
    fitHull: result.fitHull.map((v) => [v.eta, relative(v.eta, v.energy)]),
    fitRms: result.fit.fitRms,
    cvRms: result.fit.cvRms,
    clusters,
  };
  if (file.title !== undefined) data.title = file.title;
  return data;
}
