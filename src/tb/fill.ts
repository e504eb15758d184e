/**
 * Filling a sheet with 3 + δ electrons per atom on the Γ-centred mesh (DESIGN.md, `fill` contract): the Fermi
 * level, σ and π electrons per atom (each state weighted by its s + px + py, resp. pz, share) and the band energy
 * per atom 2·Σ_k w_k Σ_b f·E / atoms, with w_k = 1/M². When the count falls in an interval that the mesh leaves
 * empty, E_F is its midpoint; whether the sheet has a gap there is decided with the model (src/tb/gapCheck.ts).
 */
import { invalid } from '../validate/invalid.ts';
import { FermiSolver, occupation } from './fermi.ts';
import { checkGap, type GapVerdict, type GapWitness } from './gapCheck.ts';
import { DEFAULT_MESH, meshSpectrum, type MeshSpectrum } from './meshSpectrum.ts';
import type { TightBindingModel } from './model.ts';

/** Default Gaussian occupation width σ (eV). */
export const DEFAULT_SMEARING = 0.1;
/** Largest accepted mesh side. */
export const MAX_FILL_MESH = 1000;

/** Options of fill. */
export interface FillOptions {
  /** Extra electrons per atom δ beyond the 3 of boron (default 0); 3 + δ must lie strictly between 0 and 8. */
  doping?: number;
  /** Mesh side M of the Γ-centred M×M mesh (default 36). */
  mesh?: number;
  /** Width σ (eV) of the occupation ½·erfc((E − E_F)/σ) (default 0.1). */
  smearing?: number;
  /** Called now and then with the k-points done so far and the total. */
  onProgress?: (done: number, total: number) => void;
}

/** What filling a sheet gives. */
export interface FillResult {
  /** Name of the parameter set used. */
  parameters: string;
  /** Fermi level E_F (eV, on the parameter set's scale). */
  fermi: number;
  /** Electrons per atom counted at E_F (3 + δ to 1e-10). */
  electronsPerAtom: number;
  sigmaElectronsPerAtom: number;
  piElectronsPerAtom: number;
  /** 2·Σ f·E per atom (eV). */
  bandEnergyPerAtom: number;
  /**
   * Present only when the count falls in an interval empty on the mesh AND the bands have a gap there, checked
   * with the model on the path through the special points (src/tb/gapCheck.ts): the gap's edges over every
   * checked k. E_F is the midpoint of the mesh's empty interval, which contains the gap.
   */
  inGap?: { lower: number; upper: number };
  /**
   * Present when the count falls in an interval empty on the mesh that is not a checked gap: the bands cross it
   * (a hole between mesh points, e.g. K off the mesh), or no model was given to check it (`checked` false).
   * E_F is then the interval's midpoint, a choice and not a gap of the sheet.
   */
  meshGap?: { lower: number; upper: number; checked: boolean; crossing?: GapWitness };
  /** The full verdict on the mesh's empty interval, when one was checked. */
  gapVerdict?: GapVerdict;
  mesh: number;
  smearing: number;
  doping: number;
}

/** The spectrum-level options of a fill (mesh already chosen). */
export interface FillSpectrumOptions {
  doping?: number;
  smearing?: number;
  /** The model of the spectrum: with it, an interval empty on the mesh is checked for a gap of the bands. */
  model?: TightBindingModel;
}

/** Verdicts already reached per spectrum and interval (a scan meets the same interval at many dopings). */
const verdicts = new WeakMap<MeshSpectrum, Map<string, GapVerdict>>();

function verdictFor(model: TightBindingModel, spectrum: MeshSpectrum, interval: { lower: number; upper: number }): GapVerdict {
  let known = verdicts.get(spectrum);
  if (!known) verdicts.set(spectrum, (known = new Map()));
  const key = `${interval.lower},${interval.upper}`;
  let verdict = known.get(key);
  if (!verdict) known.set(key, (verdict = checkGap(model, spectrum, interval)));
  return verdict;
}

function checkDoping(doping: number): number {
  if (!Number.isFinite(doping)) invalid('doping', doping, 'must be a finite number');
  if (!(3 + doping > 0 && 3 + doping < 8)) invalid('doping', doping, '3 + δ electrons per atom must lie strictly between 0 and 8');
  return doping;
}

function checkSmearing(smearing: number): number {
  if (!(Number.isFinite(smearing) && smearing > 0 && smearing <= 10)) invalid('smearing', smearing, 'must lie in (0, 10] eV');
  return smearing;
}

function checkMesh(mesh: number): number {
  if (!(Number.isInteger(mesh) && mesh >= 1 && mesh <= MAX_FILL_MESH)) invalid('mesh', mesh, `must be an integer in [1, ${MAX_FILL_MESH}]`);
  return mesh;
}

/** Observables at E_F: σ, π electrons and band energy per atom. */
export function observablesAt(spectrum: MeshSpectrum, fermi: number, smearing: number): { sigma: number; pi: number; bandEnergy: number } {
  const perState = 2 / (spectrum.count * spectrum.atoms);
  const { energies, sigmaWeight } = spectrum;
  let sigma = 0;
  let pi = 0;
  let band = 0;
  for (let i = 0; i < energies.length; i++) {
    const f = occupation((energies[i] - fermi) / smearing);
    if (f === 0) continue;
    const w = sigmaWeight[i];
    sigma += f * w;
    pi += f * (1 - w);
    band += f * energies[i];
  }
  // Weights are clamped to [0, 1]; a π count of −1e-17 would still be rounding, so clamp the sums at 0 too.
  return { sigma: Math.max(0, sigma * perState), pi: Math.max(0, pi * perState), bandEnergy: band * perState };
}

/** Fills an already computed mesh spectrum. */
export function fillSpectrum(spectrum: MeshSpectrum, options: FillSpectrumOptions = {}, solver = new FermiSolver(spectrum)): FillResult {
  const doping = checkDoping(options.doping ?? 0);
  const smearing = checkSmearing(options.smearing ?? DEFAULT_SMEARING);
  const level = solver.solve(3 + doping, smearing);
  const { sigma, pi, bandEnergy } = observablesAt(spectrum, level.fermi, smearing);
  const result: FillResult = {
    parameters: spectrum.parameters,
    fermi: level.fermi,
    electronsPerAtom: level.electronsPerAtom,
    sigmaElectronsPerAtom: sigma,
    piElectronsPerAtom: pi,
    bandEnergyPerAtom: bandEnergy,
    mesh: spectrum.mesh,
    smearing,
    doping,
  };
  if (level.inGap) {
    const verdict = options.model && verdictFor(options.model, spectrum, level.inGap);
    if (verdict?.gap) result.inGap = { ...verdict.gap };
    else result.meshGap = { ...level.inGap, checked: verdict !== undefined, ...(verdict?.crossing ? { crossing: verdict.crossing } : {}) };
    if (verdict) result.gapVerdict = verdict;
  }
  return result;
}

/** Computes the mesh spectrum of `model` and fills it with 3 + δ electrons per atom. */
export function fill(model: TightBindingModel, options: FillOptions = {}): FillResult {
  const mesh = checkMesh(options.mesh ?? DEFAULT_MESH);
  checkDoping(options.doping ?? 0);
  checkSmearing(options.smearing ?? DEFAULT_SMEARING);
  const spectrum = meshSpectrum(model, { mesh, onProgress: options.onProgress });
  return fillSpectrum(spectrum, { doping: options.doping, smearing: options.smearing, model });
}
