/**
 * Which model bands are fitted to which reference bands: a run of consecutive bands on each side, ascending at
 * every k (model band modelFirst + j ↔ reference band referenceFirst + j, j < count). By default the lowest ones of
 * both: reference files often hold fewer bands than the model (only the valence bands) or more (empty bands the
 * model has no orbitals for).
 */
import { invalid } from '../../validate/invalid.ts';

/** A resolved match, 0-based. */
export interface BandMatch {
  modelFirst: number;
  referenceFirst: number;
  count: number;
}

/** What the user asked for: 1-based inclusive ranges, as typed (`--model-bands 3-14`). */
export interface MatchRequest {
  model?: readonly [number, number];
  reference?: readonly [number, number];
}

/** The names of the fields a refusal names (CLI flags, or the page's fields). */
export interface MatchFields {
  model: string;
  reference: string;
  /** The reference file, for counts the file itself sets. */
  file: string;
}

const range = (r: readonly [number, number]) => (r[0] === r[1] ? `${r[0]}` : `${r[0]}-${r[1]}`);

/**
 * Resolves a request against `modelBands` bands of the model (`what` says which: "20 bands (4 per atom)") and
 * `referenceBands` of the file; refuses ranges beyond either, or of unequal lengths, naming the field.
 */
export function matchBands(modelBands: number, referenceBands: number, request: MatchRequest, fields: MatchFields, what = `${modelBands} bands`): BandMatch {
  const { model, reference } = request;
  if (model && model[1] > modelBands) invalid(fields.model, range(model), `the sheet's model has ${what}`);
  if (reference && reference[1] > referenceBands) invalid(fields.reference, range(reference), `the reference file has ${referenceBands} bands per k-point`);
  if (model && reference) {
    const m = model[1] - model[0] + 1;
    const r = reference[1] - reference[0] + 1;
    if (m !== r) invalid(fields.reference, range(reference), `${r} bands, but ${fields.model} ${range(model)} has ${m}: give runs of equal length`);
    return { modelFirst: model[0] - 1, referenceFirst: reference[0] - 1, count: m };
  }
  if (model) {
    const m = model[1] - model[0] + 1;
    if (m > referenceBands) invalid(fields.model, range(model), `${m} bands, but the reference file has ${referenceBands} per k-point`);
    return { modelFirst: model[0] - 1, referenceFirst: 0, count: m };
  }
  if (reference) {
    const r = reference[1] - reference[0] + 1;
    if (r > modelBands) invalid(fields.reference, range(reference), `${r} bands, but the sheet's model has ${what}`);
    return { modelFirst: 0, referenceFirst: reference[0] - 1, count: r };
  }
  return { modelFirst: 0, referenceFirst: 0, count: Math.min(modelBands, referenceBands) };
}

/** The match as 1-based inclusive ranges, for output. */
export function matchRanges(match: BandMatch): { model: [number, number]; reference: [number, number] } {
  return {
    model: [match.modelFirst + 1, match.modelFirst + match.count],
    reference: [match.referenceFirst + 1, match.referenceFirst + match.count],
  };
}
