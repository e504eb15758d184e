/**
 * Benchmarks of simulated and measured STM pictures (figures only; no test depends on them). Run: `npx tsx bench/stm.ts`.
 * (1) a 256×256 constant-current picture of a 12-atom cell (14 sites, 2 holes), target ≤ 2 s, with its parts;
 * (2) `match` of a 512×512 picture (demo: the α sheet's model picture, rotated, tilted, noisy — made here) against all
 *     isolated-hole patterns with N ≤ 12, target ≤ 10 s.
 */
import { pathToFileURL } from 'node:url';
import { makePattern, patternToSheet } from '../src/lattice/pattern.ts';
import { findSheetPreset } from '../src/lattice/presets.ts';
import { fill } from '../src/tb/fill.ts';
import { TightBindingModel } from '../src/tb/model.ts';
import { findParameterPreset, type ParameterSet } from '../src/tb/params.ts';
import { analysePicture } from '../src/stm/analyse.ts';
import { matchPatterns } from '../src/stm/match.ts';
import { stmModel } from '../src/stm/simulate.ts';
import { renderStm, stmPicture } from '../src/stm/stmImage.ts';
import { syntheticPicture } from '../test/stm/helpers.ts';

function time<T>(task: () => T): [T, number] {
  const start = performance.now();
  const value = task();
  return [value, performance.now() - start];
}

export async function benchStm(): Promise<void> {
  const params = findParameterPreset('harrison1980') as ParameterSet;
  const sheet = patternToSheet(makePattern({ bond: 1.69, supercell: [[7, 0], [0, 2]], vacancies: [[0, 0], [3, 1]] }));
  const model = new TightBindingModel(sheet, params);
  stmPicture(model, { pixels: 32, mesh: 6 }); // warm-up
  for (const mode of ['constant-current', 'constant-height'] as const) {
    const [, total] = time(() => stmPicture(model, { pixels: 256, mode }));
    console.log(`stm picture 256×256, ${model.atoms} atoms, ${mode}, mesh 24: ${(total / 1000).toFixed(2)} s (target ≤ 2 s)`);
  }
  const [fermi, fillMs] = time(() => fill(model, { mesh: 24 }).fermi);
  const [stm, ldosMs] = time(() => stmModel(model, { fermi }));
  const [, renderMs] = time(() => renderStm(stm, sheet.cell, { pixels: 256, cells: 4 }));
  console.log(`stm   of which Fermi level ${fillMs.toFixed(0)} ms, LDOS series ${ldosMs.toFixed(0)} ms (${stm.fields[1].count} terms), 65,536 pixels × 3 heights ${renderMs.toFixed(0)} ms`);

  const picture = syntheticPicture(patternToSheet(findSheetPreset('alpha')!.pattern), { pixels: 512, pixelSize: 0.2, angleDeg: 17, tilt: 3, noise: 0.3, seed: 5 });
  const [analysis, analyseMs] = time(() => analysePicture({ ...picture, pixelSize: 0.2 }));
  if (!analysis.ok) throw new Error(analysis.why);
  const [result, matchMs] = time(() => matchPatterns(analysis, { parameters: params, sites: [2, 12] }));
  const best = result.candidates[0];
  console.log(`match 512×512 (demo α picture) vs isolated-hole patterns N ≤ 12: ${((analyseMs + matchMs) / 1000).toFixed(2)} s (target ≤ 10 s): lattice ${analyseMs.toFixed(0)} ms, ${result.examined} patterns, ${result.fitting} simulated ${matchMs.toFixed(0)} ms; best N=${best.structure.sites} k=${best.structure.holes}${best.structure.phase ? ` (${best.structure.phase})` : ''} score ${best.score.toFixed(3)}, next ${result.candidates[1]?.score.toFixed(3)}`);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) await benchStm();
