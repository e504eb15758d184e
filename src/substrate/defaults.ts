/**
 * Defaults of the alignment model, each an estimate with its origin. The numbers for graphene are the only
 * published set of this model; no boron values are known to us, so they are placeholders to be replaced by the
 * user's own (from a calculation of the sheet on the metal, or a measured work function).
 */

/** A default value and where it comes from. */
export interface Estimate {
  readonly value: number;
  readonly origin: string;
}

export const ALIGNMENT_DEFAULTS: {
  readonly sheetWorkFunction: Estimate;
  readonly dipole: Estimate;
  readonly distance: Estimate;
  readonly d0: Estimate;
} = {
  sheetWorkFunction: {
    value: 4.8,
    origin: 'estimate (from memory): DFT work functions of free-standing borophene sheets lie roughly between 4.3 and 5.0 eV; 4.8 eV is a round value inside that range, not a result for this sheet',
  },
  dipole: {
    value: 0.9,
    origin: "graphene's value at its equilibrium distance of 3.3 Å, Giovannetti et al., PRL 101, 026803 (2008) (from memory); no boron value known",
  },
  distance: {
    value: 3.3,
    origin: 'the distance at which graphene\'s Δc = 0.9 eV and d0 = 2.4 Å hold, Giovannetti et al. (2008) (from memory); boron sheets sit closer (see the substrate\'s adsorption height), where Δc is not known',
  },
  d0: {
    value: 2.4,
    origin: 'graphene fit of Giovannetti et al. (2008) (from memory): d − d0 is the thickness of the interface charge layer',
  },
};
