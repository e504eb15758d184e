/**
 * The model parameters calibrate can fit, as one vector, and back to a parameter set of the contract.
 *
 * Layout: Float64Array(7) in MODEL_PARAMETERS order — εs, εp (eV), V_ssσ, V_spσ, V_ppσ, V_ppπ at d0 (eV), and the
 * exponent of the distance law V(d) = V(d0)·(d0/d)^exponent. d0 and the cutoff are not in the vector: d0 only
 * says where the four V are stated (any d0 with the V rescaled gives the same bands), and the cutoff changes
 * which bonds exist, a discrete choice (calibrate scans it on request).
 */
import type { ParameterSet } from '../../tb/params.ts';

export const MODEL_PARAMETERS = ['s', 'p', 'ss_sigma', 'sp_sigma', 'pp_sigma', 'pp_pi', 'exponent'] as const;
export type ModelParameter = (typeof MODEL_PARAMETERS)[number];

export const PARAMETER_INDEX: Readonly<Record<ModelParameter, number>> = {
  s: 0, p: 1, ss_sigma: 2, sp_sigma: 3, pp_sigma: 4, pp_pi: 5, exponent: 6,
};

/** Index of the first hopping in the vector; the four follow in Slater–Koster order. */
export const FIRST_HOPPING = 2;

/**
 * The vector of `set` with its hoppings stated at `d0` instead of its own: V(d0) = V(d0')·(d0'/d0)^exponent, which
 * leaves every bond's integral unchanged.
 */
export function parameterVector(set: ParameterSet, d0: number): Float64Array {
  const rescale = (set.d0 / d0) ** set.exponent;
  const { ss_sigma, sp_sigma, pp_sigma, pp_pi } = set.hopping;
  return Float64Array.of(set.onsite.s, set.onsite.p, ss_sigma * rescale, sp_sigma * rescale, pp_sigma * rescale, pp_pi * rescale, set.exponent);
}

/** The parameter set of a vector, with d0 and cutoff given and the name, source and provenance to carry. */
export function parameterSetOf(
  values: Float64Array,
  frame: { d0: number; cutoff: number },
  text: { name: string; source: string; provenance?: string },
): ParameterSet {
  const set: ParameterSet = {
    name: text.name,
    source: text.source,
    onsite: { s: values[0], p: values[1] },
    hopping: { ss_sigma: values[2], sp_sigma: values[3], pp_sigma: values[4], pp_pi: values[5] },
    d0: frame.d0,
    exponent: values[6],
    cutoff: frame.cutoff,
  };
  if (text.provenance !== undefined) set.provenance = text.provenance;
  return set;
}
