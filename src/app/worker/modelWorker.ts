/**
 * The model worker: everything that diagonalises H(k) — path bands, the mesh spectrum, DOS and filling, the
 * σ-bonding analysis, and single Bloch states — off the page's thread. It keeps the last mesh spectrum, so a
 * new Gaussian width needs no new diagonalisation.
 */
import type { Sheet } from '../../lattice/sheet.ts';
import { prepareSpectra, prepareState } from '../../figures/prepare.ts';
import type { SpectraData } from '../../figures/types.ts';
import { energyGrid, gaussianDos } from '../../tb/dos.ts';
import { fillSpectrum } from '../../tb/fill.ts';
import { TightBindingModel } from '../../tb/model.ts';
import type { MeshSpectrum } from '../../tb/meshSpectrum.ts';
import type { ParameterSet } from '../../tb/params.ts';
import { sigmaBonding } from '../../tb/sigmaBonding.ts';
import { NO_SPECTRUM, serveJobs } from './protocol.ts';

export interface SpectraInput {
  label: string;
  sheet: Sheet;
  params: ParameterSet;
  doping: number;
  smearing: number;
  mesh: number;
  pathPoints: number;
}

export interface SpectraOutput {
  data: SpectraData;
}

export interface BondingInput {
  sheet: Sheet;
  params: ParameterSet;
  spectrum: MeshSpectrum;
  eta: number;
  etaEstimated: boolean;
  smearing: number;
}

export interface WidthInput {
  smearing: number;
  doping: number;
}

export interface StateInput {
  sheet: Sheet;
  params: ParameterSet;
  kIndex: number;
  band: number;
}

let last: SpectraData | undefined;

serveJobs(self as unknown as DedicatedWorkerGlobalScope, {
  spectra: (input: SpectraInput, progress) => {
    const data = prepareSpectra(input.sheet, input.params, {
      label: input.label,
      doping: input.doping,
      smearing: input.smearing,
      mesh: input.mesh,
      pathPoints: input.pathPoints,
      onProgress: (done: number, total: number) => progress(done, total, 'k-points'),
    });
    last = data;
    return { value: { data } satisfies SpectraOutput };
  },
  /**
   * The σ-bonding analysis of a spectrum, its gaps checked off the mesh with the sheet's model: self-contained, so
   * the page runs it in a second instance of this worker after the figures are drawn — it never delays the bands
   * nor blocks a picked state.
   */
  bonding: (input: BondingInput) => {
    const model = new TightBindingModel(input.sheet, input.params);
    return { value: sigmaBonding(input.spectrum, { holeDensity: input.eta, holeDensityEstimated: input.etaEstimated, smearing: input.smearing, model }) };
  },
  /** A new Gaussian width on the kept spectrum: DOS, E_F and the σ-bonding analysis again, no diagonalisation. */
  width: (input: WidthInput) => {
    if (!last) throw new Error(NO_SPECTRUM);
    const spectrum = last.spectrum;
    const dos = gaussianDos(spectrum, energyGrid(spectrum), input.smearing);
    const fermi = fillSpectrum(spectrum, { doping: input.doping, smearing: input.smearing }).fermi;
    return { value: { dos, fermi } };
  },
  /** One Bloch state on the kept path (the sheet and parameters are those of the last spectra). */
  state: (input: StateInput) => {
    if (!last) throw new Error(NO_SPECTRUM);
    return { value: prepareState(input.sheet, input.params, last.path, input.kIndex, input.band) };
  },
});
