/**
 * The η–δ map: for each candidate pattern, the doping it wants (counting rule; tight-binding σ filling) and the
 * doping each metal gives it (Fermi-level alignment, src/substrate/alignment.ts), with the counting-rule curve —
 * the data of a plot of δ against η with one row of points per metal. Pure: patterns in, numbers out.
 */
import { holeDensity, patternToSheet } from '../lattice/pattern.ts';
import { cellMetrics } from '../lattice/reducedCell.ts';
import type { Pattern } from '../lattice/sheet.ts';
import { countingRuleDoping, countingRuleHoleDensity } from '../tb/countingRule.ts';
import { meshSpectrum } from '../tb/meshSpectrum.ts';
import { TightBindingModel } from '../tb/model.ts';
import type { ParameterSet } from '../tb/params.ts';
import { sigmaBonding } from '../tb/sigmaBonding.ts';
import { alignFermiLevel } from './alignment.ts';
import { OBSERVED, type ObservedFact } from './observed.ts';
import type { Substrate } from './substrates.ts';
import { alignmentParameters, type AlignmentParameters } from './transfer.ts';

export interface DopingMapOptions extends AlignmentParameters {
  substrates: readonly Substrate[];
  parameters: ParameterSet;
  /** Mesh side M (default 24: the map runs many patterns). */
  mesh?: number;
  /** Gaussian width σ (eV, default 0.1). */
  smearing?: number;
  /** Called after each pattern with the number done and the total. */
  onProgress?: (done: number, total: number) => void;
}

/** One candidate on the map. Dopings in electrons per atom. */
export interface DopingMapPoint {
  /** Preset name when the pattern is one (e.g. `beta12`). */
  name?: string;
  pattern: Pattern;
  eta: number;
  atoms: number;
  /** What the counting rule asks: 8/(3(1 − η)) − 3. */
  countingRule: number;
  /** What the tight-binding σ bonding states ask. */
  sigmaFilling: number;
  /** What each metal gives, by substrate name: doping and the Fermi-level rise (eV). */
  alignment: Record<string, { doping: number; fermiShift: number }>;
}

export interface DopingMap {
  /** The counting-rule curve δ(η) sampled for plotting. */
  curve: { eta: number; doping: number }[];
  points: DopingMapPoint[];
  /** Per metal: its work function, the doping range it gives over the points, and the η* the rule picks at their mean. */
  metals: { name: string; title: string; workFunction: number; dopingRange: [number, number]; preferredEta: number }[];
  /** What is observed, to set beside the model (src/substrate/observed.ts). */
  observed: readonly ObservedFact[];
  parameters: string;
  mesh: number;
  smearing: number;
  model: Required<AlignmentParameters>;
}

/** δ(η) of the counting rule at `count` evenly spaced η in [from, to]. */
export function countingRuleCurve(from = 0, to = 0.4, count = 41): { eta: number; doping: number }[] {
  return Array.from({ length: count }, (_, i) => {
    const eta = from + ((to - from) * i) / Math.max(1, count - 1);
    return { eta, doping: countingRuleDoping(eta) };
  });
}

export function dopingMap(patterns: readonly { pattern: Pattern; name?: string }[], options: DopingMapOptions): DopingMap {
  const mesh = options.mesh ?? 24;
  const smearing = options.smearing ?? 0.1;
  const model = alignmentParameters(options);
  const points: DopingMapPoint[] = [];
  patterns.forEach(({ pattern, name }, index) => {
    const sheet = patternToSheet(pattern);
    const spectrum = meshSpectrum(new TightBindingModel(sheet, options.parameters), { mesh });
    const eta = holeDensity(pattern);
    const cellArea = cellMetrics(sheet.cell).area;
    const alignment: DopingMapPoint['alignment'] = {};
    for (const substrate of options.substrates) {
      const a = alignFermiLevel(spectrum, { cellArea, metalWorkFunction: substrate.workFunction, ...model, smearing });
      alignment[substrate.name] = { doping: a.electronsPerAtom, fermiShift: a.fermiShift };
    }
    points.push({
      ...(name !== undefined ? { name } : {}),
      pattern,
      eta,
      atoms: sheet.atoms.length,
      countingRule: countingRuleDoping(eta),
      sigmaFilling: sigmaBonding(spectrum, { holeDensity: eta, smearing }).fillingDoping,
      alignment,
    });
    options.onProgress?.(index + 1, patterns.length);
  });
  const metals = options.substrates.map((s) => {
    const dopings = points.map((p) => p.alignment[s.name].doping);
    const mean = dopings.reduce((sum, x) => sum + x, 0) / Math.max(1, dopings.length);
    return {
      name: s.name,
      title: s.title,
      workFunction: s.workFunction,
      dopingRange: [Math.min(...dopings), Math.max(...dopings)] as [number, number],
      preferredEta: countingRuleHoleDensity(mean),
    };
  });
  const etas = points.map((p) => p.eta);
  const top = Math.max(0.4, ...etas);
  return { curve: countingRuleCurve(0, top), points, metals, observed: OBSERVED, parameters: options.parameters.name, mesh, smearing, model };
}
