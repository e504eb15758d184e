/**
 * Electrons a sheet wants and electrons a metal gives, side by side (DESIGN.md, `transfer` contract):
 * - the electron-counting rule at the sheet's η (src/tb/countingRule.ts),
 * - the doping that fills the σ bonding states of the tight-binding spectrum (src/tb/sigmaBonding.ts),
 * - the Fermi-level alignment with the metal (src/substrate/alignment.ts).
 * The first two are what the sheet wants; the third is what a weakly coupled metal gives. All three are model
 * estimates, not predictions of which pattern grows.
 */
import { invalid } from '../validate/invalid.ts';
import { countingRuleDoping, countingRuleHoleDensity } from '../tb/countingRule.ts';
import type { MeshSpectrum } from '../tb/meshSpectrum.ts';
import { sigmaBonding } from '../tb/sigmaBonding.ts';
import { alignFermiLevel, type AlignmentResult } from './alignment.ts';
import { ALIGNMENT_DEFAULTS } from './defaults.ts';
import type { Substrate } from './substrates.ts';

/** Parameters of the alignment model; every one defaults to ALIGNMENT_DEFAULTS. Energies eV, lengths Å. */
export interface AlignmentParameters {
  sheetWorkFunction?: number;
  dipole?: number;
  distance?: number;
  d0?: number;
}

export interface TransferOptions extends AlignmentParameters {
  substrate: Substrate;
  /** η of the sheet (exact from a pattern, or an estimate). */
  holeDensity: number;
  /** Area of the spectrum's cell (Å²). */
  cellArea: number;
  /** Gaussian width σ (eV, default 0.1). */
  smearing?: number;
}

export interface TransferResult {
  holeDensity: number;
  /** What the counting rule asks: δ(η) = 8/(3(1 − η)) − 3. */
  countingRule: { doping: number };
  /** What the tight-binding σ bonding states ask: the doping that fills them. */
  sigmaFilling: { doping: number; kind: 'gap' | 'pseudogap'; energy: number };
  /** What the metal gives in the alignment model. */
  alignment: AlignmentResult;
  /** η the counting rule would prefer at the doping the metal gives: η*(δ) = (1 + 3δ)/(9 + 3δ). */
  preferredHoleDensity: number;
  /** The model parameters used (defaults filled in). */
  parameters: Required<AlignmentParameters>;
  substrate: Substrate;
}

/** Fills in the defaults and refuses d < d0 (the capacitor thickness cannot be negative); `fields` names the inputs. */
export function alignmentParameters(
  given: AlignmentParameters,
  fields: { distance: string; d0: string } = { distance: 'distance', d0: 'd0' },
): Required<AlignmentParameters> {
  const parameters = {
    sheetWorkFunction: given.sheetWorkFunction ?? ALIGNMENT_DEFAULTS.sheetWorkFunction.value,
    dipole: given.dipole ?? ALIGNMENT_DEFAULTS.dipole.value,
    distance: given.distance ?? ALIGNMENT_DEFAULTS.distance.value,
    d0: given.d0 ?? ALIGNMENT_DEFAULTS.d0.value,
  };
  if (!(parameters.distance >= parameters.d0)) {
    const field = given.distance !== undefined || given.d0 === undefined ? fields.distance : fields.d0;
    const value = field === fields.distance ? parameters.distance : parameters.d0;
    invalid(field, value, `the distance d = ${parameters.distance} Å must be at least d0 = ${parameters.d0} Å (d − d0 is the thickness of the interface charge layer)`);
  }
  return parameters;
}

export function electronTransfer(spectrum: MeshSpectrum, options: TransferOptions): TransferResult {
  const smearing = options.smearing ?? 0.1;
  const parameters = alignmentParameters(options);
  const sigma = sigmaBonding(spectrum, { holeDensity: options.holeDensity, smearing });
  const alignment = alignFermiLevel(spectrum, {
    cellArea: options.cellArea,
    metalWorkFunction: options.substrate.workFunction,
    ...parameters,
    smearing,
  });
  return {
    holeDensity: options.holeDensity,
    countingRule: { doping: countingRuleDoping(options.holeDensity) },
    sigmaFilling: { doping: sigma.fillingDoping, kind: sigma.kind, energy: sigma.energy },
    alignment,
    preferredHoleDensity: countingRuleHoleDensity(alignment.electronsPerAtom),
    parameters,
    substrate: options.substrate,
  };
}
