/**
 * Two-centre Slater–Koster energy integrals between s, px, py, pz orbitals (Slater & Koster, Phys. Rev. 94,
 * 1498 (1954), Table I, direction-cosine formulas).
 *
 * Layout: one 4×4 real block, row-major, orbital order s, px, py, pz: out[offset + 4·a + b] is the integral
 * between orbital a on the atom the bond starts from and orbital b on the atom it ends on, for the bond
 * direction cosines (l, m, n) pointing from the first atom to the second.
 */

/** Orbital indices within an atom's block. */
export const ORBITAL_S = 0;
export const ORBITAL_PX = 1;
export const ORBITAL_PY = 2;
export const ORBITAL_PZ = 3;
/** Orbitals per atom. */
export const ORBITALS = 4;

/**
 * Writes the 4×4 block for direction cosines (l, m, n) and the integrals V_ssσ, V_spσ, V_ppσ, V_ppπ at this
 * distance. E_s,x = l·V_spσ and E_x,s = −l·V_spσ; E_x,x = l²V_ppσ + (1 − l²)V_ppπ; E_x,y = l·m(V_ppσ − V_ppπ).
 */
export function slaterKosterBlock(
  l: number, m: number, n: number,
  ssSigma: number, spSigma: number, ppSigma: number, ppPi: number,
  out: Float64Array, offset: number,
): void {
  const cosines = [l, m, n];
  const difference = ppSigma - ppPi;
  out[offset] = ssSigma;
  for (let a = 0; a < 3; a++) {
    const ca = cosines[a];
    out[offset + 1 + a] = ca * spSigma;
    out[offset + 4 * (1 + a)] = -ca * spSigma;
    for (let b = 0; b < 3; b++) {
      const value = ca * cosines[b] * difference + (a === b ? ppPi : 0);
      out[offset + 4 * (1 + a) + 1 + b] = value;
    }
  }
}
