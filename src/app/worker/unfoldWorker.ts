/**
 * The unfolding worker: the bands of the page's sheet unfolded onto the triangular lattice, on the primitive path
 * and over the zone (`solve`: diagonalisation with eigenvectors, the slow part, kept here), and the two figures'
 * data for a Gaussian width, E_F, energy window and cut energy (`draw`: broadening and colouring the kept states,
 * no diagonalisation). A stop ends the worker and what it kept; `draw` then answers NO_UNFOLDING and the page
 * solves anew.
 */
import { prepareCut, prepareUnfolded, solveUnfolding, type UnfoldSolution } from '../../figures/prepareUnfold.ts';
import type { CutData, SpectralPart, UnfoldedData } from '../../figures/types.ts';
import type { ParameterSet } from '../../tb/params.ts';
import type { UnfoldingSheet } from '../../tb/unfoldSheet.ts';
import { serveJobs } from './protocol.ts';

/** The answer of `draw` when nothing is kept. */
export const NO_UNFOLDING = 'the unfolding worker holds no solved sheet';

export interface SolveInput {
  label: string;
  unfolding: UnfoldingSheet;
  params: ParameterSet;
  pathPoints: number;
  cutPixels: number;
}

export interface DrawInput {
  smearing: number;
  fermi: number;
  energyRange: [number, number];
  rows: number;
  /** E0 of the cut (eV, absolute). */
  cutEnergy: number;
  part: SpectralPart;
}

export interface DrawOutput {
  unfolded: UnfoldedData;
  cut: CutData;
}

let kept: UnfoldSolution | undefined;

serveJobs(self as unknown as DedicatedWorkerGlobalScope, {
  solve: (input: SolveInput, progress) => {
    kept = undefined;
    kept = solveUnfolding(input.unfolding, input.params, {
      label: input.label, pathPoints: input.pathPoints, cutPixels: input.cutPixels,
      onProgress: (done, total) => progress(done, total, 'k-points'),
    });
    return { value: { atoms: kept.atoms, sites: kept.sites, bond: kept.bond } };
  },
  draw: (input: DrawInput) => {
    if (!kept) throw new Error(NO_UNFOLDING);
    const unfolded = prepareUnfolded(kept, { smearing: input.smearing, fermi: input.fermi, energyRange: input.energyRange, rows: input.rows, part: input.part });
    const cut = prepareCut(kept, { smearing: input.smearing, fermi: input.fermi, energy: input.cutEnergy, part: input.part });
    return { value: { unfolded, cut } satisfies DrawOutput };
  },
});
