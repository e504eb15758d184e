/**
 * Benchmarks of the tight-binding engine, in process, best of several runs after a warm-up (figures only; no
 * test depends on them). Run: `npx tsx bench/tb.ts`.
 * (1) model set-up for the α sheet; (2) α sheet (8 atoms) on a 300-point path, target ≤ 50 ms;
 * (3) α fill on a 60×60 mesh with the σ/π split, target ≤ 0.3 s; then the parts of (3), a buckled α fill for
 * comparison (full 32×32 block with eigenvectors) and the triangle DOS.
 */
import { pathToFileURL } from 'node:url';
import { patternToSheet } from '../src/lattice/pattern.ts';
import { findSheetPreset } from '../src/lattice/presets.ts';
import type { Sheet } from '../src/lattice/sheet.ts';
import { autoPath } from '../src/tb/kspacePath.ts';
import { computeBands } from '../src/tb/bands.ts';
import { energyGrid } from '../src/tb/dos.ts';
import { triangleDos } from '../src/tb/dosTriangle.ts';
import { fill, fillSpectrum } from '../src/tb/fill.ts';
import { meshSpectrum } from '../src/tb/meshSpectrum.ts';
import { TightBindingModel } from '../src/tb/model.ts';
import { findParameterPreset, type ParameterSet } from '../src/tb/params.ts';
import { best } from './best.ts';

export async function benchTightBinding(): Promise<void> {
  const params = findParameterPreset('harrison1980') as ParameterSet;
  const preset = findSheetPreset('alpha');
  if (!preset) throw new Error('alpha preset missing');
  const alpha = patternToSheet(preset.pattern);
  const buckled: Sheet = { ...alpha, atoms: alpha.atoms.map((a, i) => [a[0], a[1], i % 2 ? 0.2 : -0.2]) };
  const model = new TightBindingModel(alpha, params);
  const path = autoPath(alpha.cell, 300);

  console.log(`tb model set-up, α (8 atoms, ${model.bondCount} bonds): ${best(20, () => new TightBindingModel(alpha, params)).toFixed(3)} ms`);
  console.log(`tb bands, α, 300-point path: ${best(10, () => computeBands(model, path.kpoints)).toFixed(1)} ms (target ≤ 50 ms)`);
  console.log(`tb fill, α, 60×60 mesh, σ/π split: ${best(5, () => fill(model, { mesh: 60 })).toFixed(1)} ms (target ≤ 300 ms)`);
  const spectrum = meshSpectrum(model, { mesh: 60 });
  console.log(`tb   of which mesh spectrum (1801 diagonalisations by k ↔ −k): ${best(5, () => meshSpectrum(model, { mesh: 60 })).toFixed(1)} ms`);
  console.log(`tb   of which Fermi level and observables: ${best(5, () => fillSpectrum(spectrum, {})).toFixed(1)} ms`);
  const buckledModel = new TightBindingModel(buckled, params);
  console.log(`tb fill, buckled α, 60×60 mesh, full 32×32 block with eigenvectors: ${best(3, () => fill(buckledModel, { mesh: 60 })).toFixed(1)} ms`);
  const grid = energyGrid(spectrum, { points: 4001 });
  console.log(`tb triangle DOS, α, 60×60 mesh, 4001 energies: ${best(5, () => triangleDos(spectrum, grid)).toFixed(1)} ms`);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) await benchTightBinding();
