/**
 * The electron-counting rule for boron sheets: σ bonding states are filled exactly when a sheet of hole density η
 * carries 8/(3(1 − η)) electrons per atom, i.e. δ = 8/(3(1 − η)) − 3 extra electrons per atom, or, solved for η,
 * η* = (1 + 3δ)/(9 + 3δ). Values: δ = −1/3 for δ6 (η = 0), 0 for α (η = 1/9), 1/5 for β12 (η = 1/6), 1/3 for χ3
 * (η = 1/5), 1 for the honeycomb (η = 1/3, the MgB2 count). Common practice in the field.
 */

/** Doping δ (electrons per atom beyond 3) that the counting rule asks of a sheet of hole density η (0 ≤ η < 1). */
export function countingRuleDoping(holeDensity: number): number {
  return 8 / (3 * (1 - holeDensity)) - 3;
}

/** Hole density η* that the counting rule prefers at doping δ (δ > −3). */
export function countingRuleHoleDensity(doping: number): number {
  return (1 + 3 * doping) / (9 + 3 * doping);
}
