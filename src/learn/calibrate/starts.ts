/**
 * The start sets of a calibration: the user's (or the default) set first, then the other named sets, then the
 * first one with its four integrals at 0.6 times their size — a start of weaker bonds, because the universal sets
 * are known to bind boron's σ states too strongly (the tight-binding note in README.md). Several starts guard
 * against the local minima of fitting sorted bands.
 */
import { DEFAULT_PARAMETERS, PARAMETER_PRESETS, findParameterPreset, type ParameterSet } from '../../tb/params.ts';

/** Factor on the integrals of the weak-bond start. */
export const WEAK_BOND_FACTOR = 0.6;

export function defaultStarts(first: ParameterSet = findParameterPreset(DEFAULT_PARAMETERS)!): ParameterSet[] {
  const others = PARAMETER_PRESETS.filter((p) => p.name !== first.name);
  const { ss_sigma, sp_sigma, pp_sigma, pp_pi } = first.hopping;
  const weak: ParameterSet = {
    ...first,
    name: `${first.name}×${WEAK_BOND_FACTOR}`,
    source: `${first.name} with every integral times ${WEAK_BOND_FACTOR}: a start of weaker bonds`,
    hopping: { ss_sigma: ss_sigma * WEAK_BOND_FACTOR, sp_sigma: sp_sigma * WEAK_BOND_FACTOR, pp_sigma: pp_sigma * WEAK_BOND_FACTOR, pp_pi: pp_pi * WEAK_BOND_FACTOR },
  };
  return [first, ...others, weak];
}
