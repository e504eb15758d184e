/**
 * Benchmarks of unfolding (figures only; no test depends on them). Run: `npx tsx bench/unfold.ts`.
 * A mid-size cell, 20 atoms on 24 sites (a 6×4 supercell with 4 holes, invented for the benchmark): the primitive
 * path of 300 points (what `unfold SHEET --path auto` and the page solve), the page's 61×61 cut grid, the same
 * sheet buckled (full 80×80 block), and the broadening of the kept states (what the page redraws).
 */
import { pathToFileURL } from 'node:url';
import { makePattern, patternToSheet } from '../src/lattice/pattern.ts';
import { TightBindingModel } from '../src/tb/model.ts';
import { findParameterPreset, type ParameterSet } from '../src/tb/params.ts';
import { constantEnergyCut, gridSpread, pathSpread, spectralImage } from '../src/tb/spectral.ts';
import { unfoldBands } from '../src/tb/unfold.ts';
import { patternUnfolding } from '../src/tb/unfoldSheet.ts';
import { primitivePath, zoneGrid } from '../src/tb/unfoldZone.ts';
import { best } from './best.ts';

export async function benchUnfold(): Promise<void> {
  const params = findParameterPreset('harrison1980') as ParameterSet;
  const pattern = makePattern({ bond: 1.69, supercell: [[6, 0], [0, 4]], vacancies: [[0, 0], [3, 0], [1, 2], [4, 2]] });
  const unfolding = patternUnfolding(pattern);
  const model = new TightBindingModel(unfolding.sheet, params);
  const path = primitivePath(unfolding, 300);
  const grid = zoneGrid(unfolding, 61, 1);
  const atoms = model.atoms;
  console.log(`unfold, ${atoms} atoms on ${unfolding.sites} sites, 300-point primitive path (σ ${3 * atoms}² and π ${atoms}² blocks with eigenvectors): ${best(3, () => unfoldBands(model, unfolding.sites, path.kpoints)).toFixed(0)} ms`);
  console.log(`unfold, same cell, the page's 61×61 cut grid (${grid.kpoints.length / 2} k-points after k ↔ −k): ${best(2, () => unfoldBands(model, unfolding.sites, grid.kpoints)).toFixed(0)} ms`);
  const buckled = { ...unfolding.sheet, atoms: unfolding.sheet.atoms.map((a, i): [number, number, number] => [a[0], a[1], i % 2 ? 0.2 : -0.2]) };
  const buckledModel = new TightBindingModel(buckled, params);
  console.log(`unfold, same cell buckled, 300-point path (full ${4 * atoms}² block): ${best(2, () => unfoldBands(buckledModel, unfolding.sites, path.kpoints)).toFixed(0)} ms`);
  const along = unfoldBands(model, unfolding.sites, path.kpoints);
  const over = unfoldBands(model, unfolding.sites, grid.kpoints);
  console.log(`unfold redraw (no diagonalisation): path picture 300×300 ${best(5, () => spectralImage(along, -36, 14, 300, 0.1, pathSpread(along))).toFixed(1)} ms, cut ${best(5, () => constantEnergyCut(over, -9, 0.1, gridSpread(over, grid.pixel, grid.side))).toFixed(1)} ms`);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) await benchUnfold();
