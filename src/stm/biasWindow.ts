/**
 * The Tersoff–Hamann bias window (Tersoff & Hamann, PRB 31, 805 (1985), extended to finite bias as is common
 * practice): the current counts the states between E_F and E_F + eV, V the sample bias against the tip.
 * Sign convention: V > 0 images the empty states of the sheet (E_F < E < E_F + eV, electrons tunnel from the tip
 * into the sheet); V < 0 images the filled states (E_F + eV < E < E_F).
 * The window edges are smoothed with the occupation of `fill`: w(E) = sign(V)·[f((E − E_F − eV)/σ) − f((E − E_F)/σ)],
 * f(x) = ½·erfc(x), so w → 1 inside, → 0 outside, and the image does not flicker with the mesh.
 */
import { occupation } from '../tb/fermi.ts';

export interface BiasWindow {
  /** Fermi level E_F (eV). */
  fermi: number;
  /** Sample bias V (volts, non-zero); eV is the window width in eV. */
  bias: number;
  /** Edge width σ (eV). */
  smearing: number;
}

/** Weight of a state at energy E (eV) in the window, in [0, 1]. */
export function windowWeight(window: BiasWindow, energy: number): number {
  const { fermi, bias, smearing } = window;
  const w = occupation((energy - fermi - bias) / smearing) - occupation((energy - fermi) / smearing);
  return bias > 0 ? w : -w;
}

/** Smallest |bias| (V) any front end accepts: at zero bias the window E_F … E_F + eV is empty. */
export const MIN_BIAS = 0.01;
