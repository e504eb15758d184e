/**
 * The Energies panel's job as a pure function of the core (the expansion worker serves it; the tests call it
 * directly): read the user's energies file, fit the cluster expansion, predict the patterns of the range, and
 * return what the panel shows — the figure's data, the ECIs, the hull with its chemical potentials, the
 * suggestions with their reasons, and each point's pattern, so that a click can show it on the sheet.
 */
import { EXPANSION_CAVEAT, expandEnergies, type ClusterResult, type ExpansionFields } from '../learn/expansion/expand.ts';
import { patternLabel, prepareEnergyHull } from '../figures/prepareEnergyHull.ts';
import type { EnergyHullData } from '../figures/types.ts';
import { parseEnergiesText } from '../io/energiesFile.ts';
import { namingSource } from '../validate/invalid.ts';
import { ENERGIES_FIELD_NAMES } from './energiesFields.ts';
import type { Pattern } from '../lattice/sheet.ts';

/** Most patterns the page predicts in one go (the figure draws each). */
export const VIEW_MAX_PREDICTIONS = 20_000;

/** The panel's fields, as its refusals name them. */
export const ENERGIES_FIELDS: ExpansionFields = {
  structures: 'structures', pairShells: ENERGIES_FIELD_NAMES.pairShells, tripletShells: ENERGIES_FIELD_NAMES.tripletShells, predictSites: ENERGIES_FIELD_NAMES.sites,
};

export interface ExpansionInput {
  /** The energies file's text and its name (named in refusals). */
  text: string;
  name: string;
  pairShells: number;
  tripletShells: number;
  predict: { sites: [number, number]; holes: [number, number]; isolated: boolean };
  suggestions?: number;
}

/** A point of the figure: its label and pattern. */
export interface ShownPattern {
  label: string;
  pattern: Pattern;
}

export interface ExpansionView {
  name: string;
  title?: string;
  demo: boolean;
  structures: number;
  figure: EnergyHullData;
  clusters: ClusterResult[];
  fitRms: number;
  cvRms: number;
  /** By the figure's indices: the user's structures, and every prediction. */
  computed: ShownPattern[];
  predicted: ShownPattern[];
  hull: { eta: number; label: string; energy: number; muLow: number; muHigh: number }[];
  suggestions: { index: number; label: string; eta: number; why: string }[];
  notes: string[];
  caveat: string;
}

export function runExpansion(input: ExpansionInput, onProgress?: (fraction: number, done: number) => void): ExpansionView {
  const file = namingSource('the energies file', input.name, () => parseEnergiesText(input.text, input.name));
  const result = expandEnergies(file.structures, {
    pairShells: input.pairShells,
    tripletShells: input.tripletShells,
    predict: input.predict,
    suggestions: input.suggestions,
    maxPredictions: VIEW_MAX_PREDICTIONS,
    fields: ENERGIES_FIELDS,
    onProgress,
  });
  const computed = result.computed.map((c) => ({ label: c.name ?? patternLabel(c.pattern), pattern: c.pattern }));
  const predicted = result.predictions.map((p) => ({ label: p.phase ?? patternLabel(p.pattern), pattern: p.pattern }));
  const index = new Map(result.predictions.map((p, k) => [p, k]));
  const view: ExpansionView = {
    name: input.name,
    demo: file.demo,
    structures: file.structures.length,
    figure: prepareEnergyHull(result, file),
    clusters: result.clusters,
    fitRms: result.fit.fitRms,
    cvRms: result.fit.cvRms,
    computed,
    predicted,
    hull: result.hull.map((h) => ({ eta: h.eta, label: h.name ?? patternLabel(h.pattern), energy: h.energy, muLow: h.muLow, muHigh: h.muHigh })),
    suggestions: result.suggestions.map((s) => {
      const k = index.get(s.candidate)!;
      return { index: k, label: predicted[k].label, eta: s.candidate.eta, why: s.why };
    }),
    notes: result.notes,
    caveat: EXPANSION_CAVEAT,
  };
  if (file.title !== undefined) view.title = file.title;
  return view;
}
