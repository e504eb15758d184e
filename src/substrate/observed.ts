/**
 * Facts of the trade to set beside the η–δ map: what is seen on the metals. Not outputs of any model here.
 */

export interface ObservedFact {
  /** Substrate name (src/substrate/substrates.ts). */
  substrate: string;
  /** Hole densities of the sheets seen. */
  holeDensities: number[];
  /** Electrons per B atom from the metal, when reported. */
  doping?: number;
  /** The coupling as reported, in words. */
  coupling: string;
  source: string;
}

export const OBSERVED: readonly ObservedFact[] = [
  {
    substrate: 'al111',
    holeDensities: [1 / 3],
    doping: 1,
    coupling: 'strong: about one electron per B atom from the metal, the honeycomb (MgB2) count, which stabilises the flat honeycomb sheet',
    source: 'Li et al., Sci. Bull. 63, 282 (2018) (volume and page from memory)',
  },
  {
    substrate: 'ag111',
    holeDensities: [1 / 6, 1 / 5],
    coupling: 'weak: the β12 (η = 1/6) and χ3 (η = 1/5) sheets, nearly free-standing, little charge transfer',
    source: 'Feng et al., Nat. Chem. 8, 563 (2016)',
  },
];
