/**
 * Fermi-level alignment of a sheet with a metal: the contact-doping model of Giovannetti et al., PRL 101,
 * 026803 (2008) and Khomyakov et al., PRB 79, 195425 (2009), generalised from graphene's linear DOS to any
 * computed spectrum (DESIGN.md, `transfer` contract). Written for electrons given to the sheet:
 *
 *   W_S + Δc − W_M = ΔE_F + α·q·(d − d0),   α = e²/(ε0·A),
 *
 * q the electrons per cell given to the sheet, ΔE_F the rise of its Fermi level that q causes, A the cell area.
 * q(ΔE_F) = (N(E_F0 + ΔE_F) − N(E_F0))·atoms with N the Gaussian-filled count per atom of `fill`
 * (src/tb/fermi.ts) and E_F0 the neutral Fermi level. For d ≥ d0 the right side is non-decreasing in ΔE_F
 * (q is), and it is 0 at ΔE_F = 0, so the root lies between 0 and the left side L: bracket and bisect.
 */
import { FermiSolver } from '../tb/fermi.ts';
import type { MeshSpectrum } from '../tb/meshSpectrum.ts';

/** e²/ε0 in eV·Å (CODATA: e/ε0 = 1.8095e-8 V·m = 180.95 V·Å). */
export const E2_OVER_EPS0 = 180.95;

/** The model's inputs besides the spectrum. Energies in eV, lengths in Å. */
export interface AlignmentOptions {
  /** Area A of the spectrum's cell (Å²). */
  cellArea: number;
  /** Work function of the metal surface W_M. */
  metalWorkFunction: number;
  /** Work function of the free-standing sheet W_S. */
  sheetWorkFunction: number;
  /** Interface dipole Δc from the chemical (Pauli-repulsion) interaction, lowering the metal's work function. */
  dipole: number;
  /** Sheet–metal distance d. */
  distance: number;
  /** Offset d0 of the effective capacitor (d − d0 its thickness); d ≥ d0. */
  d0: number;
  /** Gaussian width σ of the occupation (default 0.1). */
  smearing?: number;
  /** Electrons per atom of the neutral sheet (default 3, boron). */
  neutralElectrons?: number;
}

export interface AlignmentResult {
  /** ΔE_F (eV): rise of the sheet's Fermi level; positive when the sheet gains electrons. */
  fermiShift: number;
  /** Electrons per atom given to the sheet (the doping δ the metal gives). */
  electronsPerAtom: number;
  /** Electrons per cell q. */
  electronsPerCell: number;
  /** Neutral Fermi level E_F0 (eV, on the parameter set's scale). */
  neutralFermi: number;
  /** Left side W_S + Δc − W_M (eV). */
  drivingPotential: number;
  /** α·q·(d − d0) (eV): the potential step across the interface charge layer. */
  capacitorStep: number;
  /** α (eV/Å). */
  alpha: number;
}

const ITERATIONS = 200;

export function alignFermiLevel(spectrum: MeshSpectrum, options: AlignmentOptions): AlignmentResult {
  const smearing = options.smearing ?? 0.1;
  const solver = new FermiSolver(spectrum);
  const neutralFermi = solver.solve(options.neutralElectrons ?? 3, smearing).fermi;
  const neutralCount = solver.countAt(neutralFermi, smearing).count;
  const alpha = E2_OVER_EPS0 / options.cellArea;
  const thickness = options.distance - options.d0;
  const drive = options.sheetWorkFunction + options.dipole - options.metalWorkFunction;
  const electronsPerCell = (shift: number) => (solver.countAt(neutralFermi + shift, smearing).count - neutralCount) * spectrum.atoms;
  const residual = (shift: number) => shift + alpha * thickness * electronsPerCell(shift) - drive;
  // residual(0) = −L and residual(L) = α(d − d0)·q(L), of the sign of L: the root lies between 0 and L.
  let lo = Math.min(0, drive);
  let hi = Math.max(0, drive);
  for (let i = 0; i < ITERATIONS && hi - lo > 1e-13 * Math.max(1, Math.abs(drive)); i++) {
    const mid = 0.5 * (lo + hi);
    if (residual(mid) > 0) hi = mid;
    else lo = mid;
  }
  const fermiShift = 0.5 * (lo + hi);
  const q = electronsPerCell(fermiShift);
  return {
    fermiShift,
    electronsPerAtom: q / spectrum.atoms,
    electronsPerCell: q,
    neutralFermi,
    drivingPotential: drive,
    capacitorStep: alpha * thickness * q,
    alpha,
  };
}

/**
 * Giovannetti et al. (2008) closed form for a DOS D0·|E| per cell (graphene: D0 ≈ 0.09 eV⁻² per cell of two
 * atoms), in the electron form: ΔE_F = sign(L)·(√(1 + 2α·D0·(d − d0)·|L|) − 1)/(α·D0·(d − d0)), L = W_S + Δc − W_M.
 * For d = d0 it is ΔE_F = L.
 */
export function linearDosFermiShift(drive: number, alpha: number, dosSlope: number, thickness: number): number {
  const c = alpha * dosSlope * thickness;
  if (c === 0) return drive;
  return (Math.sign(drive) * (Math.sqrt(1 + 2 * c * Math.abs(drive)) - 1)) / c;
}
