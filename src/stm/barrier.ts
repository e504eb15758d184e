/**
 * The vacuum barrier of Tersoff & Hamann (PRB 31, 805 (1985)): a state at the Fermi level decays into the vacuum
 * as exp(−κz) with κ = √(2mφ)/ħ. With ħ²/2m = 3.80998 eV·Å² (CODATA), κ = 0.5123·√φ Å⁻¹ for φ in eV.
 */

/** √(2m)/ħ in Å⁻¹·eV^−½. */
export const KAPPA_PER_ROOT_EV = 0.5123;

/** Default barrier height φ (eV): an estimate typical of metal tips and surfaces (common practice, from memory). */
export const DEFAULT_WORK_FUNCTION = 4.5;

/** κ (Å⁻¹) for a barrier φ (eV). */
export function decayConstant(workFunction: number): number {
  return KAPPA_PER_ROOT_EV * Math.sqrt(workFunction);
}
