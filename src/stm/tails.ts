/**
 * Vacuum tails of the s and pz orbitals. Slater-type (an exponential e^{−κd} times powers of the distance d), and
 * of the two such forms we take the ones that solve the vacuum Schrödinger equation (∇² − κ²)φ = 0 exactly — the
 * s- and p-wave decaying solutions that Tersoff & Hamann (PRB 31, 805 (1985)) use — so every Fourier component of
 * a Bloch sum of them decays exactly as exp(−√(κ² + q²)·z):
 *   s:  φ_s(d) = e^{−κd}/(κd)
 *   pz: φ_z(d) = −(1/κ)·∂φ_s/∂z = (z/d)·(1 + 1/(κd))·e^{−κd}/(κd)
 * Both tend to e^{−κd}/(κd) straight above the atom, so s and pz enter with equal weight far out.
 * Their 2D Fourier transforms over the plane at height z > 0 (∫ φ e^{−iq·ρ} d²ρ; the Weyl–Sommerfeld identity
 * ∫ e^{−κr}/r · e^{−iq·ρ} d²ρ = 2π·e^{−γz}/γ, γ = √(κ² + q²)):
 *   s:  (2π/κ)·e^{−γz}/γ        pz: (2π/κ²)·e^{−γz}
 * px and py tails vanish straight above the atom and are left out (only s and pz, as is common practice).
 */

/** φ_s at offset (dx, dy, dz) Å from the atom. */
export function sTail(kappa: number, dx: number, dy: number, dz: number): number {
  const d = Math.sqrt(dx * dx + dy * dy + dz * dz);
  return Math.exp(-kappa * d) / (kappa * d);
}

/** φ_z at offset (dx, dy, dz) Å from the atom (positive above it). */
export function pzTail(kappa: number, dx: number, dy: number, dz: number): number {
  const d = Math.sqrt(dx * dx + dy * dy + dz * dz);
  return (dz / d) * (1 + 1 / (kappa * d)) * (Math.exp(-kappa * d) / (kappa * d));
}

/** In-plane Fourier transform of φ_s at height z, as a function of γ = √(κ² + q²), without the factor e^{−γz}. */
export function sTransform(kappa: number, gamma: number): number {
  return (2 * Math.PI) / (kappa * gamma);
}

/** In-plane Fourier transform of φ_z at height z, without the factor e^{−γz}. */
export function pzTransform(kappa: number): number {
  return (2 * Math.PI) / (kappa * kappa);
}
