/**
 * The substrate worker: the Metal panel's jobs off the page's thread — the electron transfer on the page's kept
 * mesh spectrum (no diagonalisation), coincidence fits of the sheet on a metal, and the η–δ map (one mesh
 * spectrum per candidate).
 */
import { prepareEtaDelta } from '../../figures/prepare.ts';
import type { EtaDeltaData } from '../../figures/types.ts';
import type { Pattern, Sheet } from '../../lattice/sheet.ts';
import { coincidenceFits, type CoincidenceFit } from '../../substrate/coincidence.ts';
import { dopingMap } from '../../substrate/dopingMap.ts';
import { requireSubstrate, SUBSTRATES } from '../../substrate/substrates.ts';
import { electronTransfer, type AlignmentParameters } from '../../substrate/transfer.ts';
import type { MeshSpectrum } from '../../tb/meshSpectrum.ts';
import type { ParameterSet } from '../../tb/params.ts';
import { serveJobs } from './protocol.ts';

export interface TransferInput {
  spectrum: MeshSpectrum;
  metal: string;
  holeDensity: number;
  cellArea: number;
  smearing: number;
  model: AlignmentParameters;
}

export interface FitsInput {
  sheet: Sheet;
  metal: string;
  /** Most fits sent back (best first). */
  keep: number;
}

export interface FitsOutput {
  fits: CoincidenceFit[];
  /** Fits found in all (before `keep`). */
  found: number;
}

export interface MapInput {
  patterns: { name?: string; pattern: Pattern }[];
  params: ParameterSet;
  smearing: number;
  mesh: number;
  model: AlignmentParameters;
  current?: { label: string; eta: number };
}

serveJobs(self as unknown as DedicatedWorkerGlobalScope, {
  transfer: (input: TransferInput) => ({
    value: electronTransfer(input.spectrum, {
      substrate: requireSubstrate(input.metal, 'metal'),
      holeDensity: input.holeDensity,
      cellArea: input.cellArea,
      smearing: input.smearing,
      ...input.model,
    }),
  }),
  fits: (input: FitsInput) => {
    const fits = coincidenceFits(input.sheet, requireSubstrate(input.metal, 'metal').nnDistance);
    return { value: { fits: fits.slice(0, input.keep), found: fits.length } satisfies FitsOutput };
  },
  map: (input: MapInput, progress) => {
    const map = dopingMap(input.patterns, {
      substrates: SUBSTRATES, parameters: input.params, mesh: input.mesh, smearing: input.smearing, ...input.model,
      onProgress: (done, total) => progress(done, total, 'patterns'),
    });
    return { value: prepareEtaDelta(map, input.current) satisfies EtaDeltaData };
  },
});
