/**
 * The Energies panel's fields as typed text → values, each read on its own with its label in the error
 * (`invalid <label>: <text> (<why>)`), so a bad field is named and its text kept.
 */
import { MAX_PAIR_SHELLS, MAX_TRIPLET_SHELLS } from '../learn/expansion/clusters.ts';
import { integer, integerRange } from './stmFields.ts';

/** The labels the panel shows (and its errors and the core's refusals use; see ENERGIES_FIELDS). */
export const ENERGIES_FIELD_NAMES = { pairShells: 'pair shells', tripletShells: 'triplet shells', sites: 'sites', holes: 'holes' } as const;

/** Sites and holes per cell the page predicts (the enumerator streams them; the figure draws each). */
export const PREDICT_LIMITS = { sites: [1, 30] as const, holes: [0, 30] as const };

export const readPairShells = (text: string) => integer(ENERGIES_FIELD_NAMES.pairShells, text, [0, MAX_PAIR_SHELLS]);
export const readTripletShells = (text: string) => integer(ENERGIES_FIELD_NAMES.tripletShells, text, [0, MAX_TRIPLET_SHELLS]);
export const readPredictSites = (text: string) => integerRange(ENERGIES_FIELD_NAMES.sites, text, PREDICT_LIMITS.sites);
export const readPredictHoles = (text: string) => integerRange(ENERGIES_FIELD_NAMES.holes, text, PREDICT_LIMITS.holes);
