/**
 * A two-centre Slater–Koster parameter set for s, px, py, pz orbitals on boron (DESIGN.md, parameter-file contract).
 * Energies in eV on the set's own scale, lengths in Å.
 */
export interface ParameterSet {
  /** Name carried by every result computed with this set, so outputs always say which set was used. */
  name: string;
  /** Where the values come from (publication, and which values are from memory). */
  source: string;
  /** Optional notes on individual values (rounding, choices, what is from memory). */
  provenance?: string;
  /** On-site energies εs, εp (eV). */
  onsite: { s: number; p: number };
  /** Two-centre integrals V(d0) (eV), Slater & Koster, Phys. Rev. 94, 1498 (1954). */
  hopping: { ss_sigma: number; sp_sigma: number; pp_sigma: number; pp_pi: number };
  /** Reference distance d0 (Å) at which `hopping` holds. */
  d0: number;
  /** Distance law V(d) = V(d0)·(d0/d)^exponent. */
  exponent: number;
  /** Pairs closer than this (Å) are coupled; farther ones are not. */
  cutoff: number;
}
