/**
 * Benchmarks of the figures (figures only; no test depends on them). Run: `npx tsx bench/figures.ts`.
 * In Node with linkedom's DOM, which is slower than a browser's for building elements and faster for nothing:
 * take these as upper bounds for the page. Targets: setFermi ≪ 16 ms (a doping-slider frame).
 * (1) prepareSpectra of α at mesh 36 (300-point path, 2001-point DOS); (2) a full bands render of α (8 atoms);
 * (3) the same for a 48-atom cell (a 7×7 cell with one vacancy: invented geometry, for size only);
 * (4) setFermi on the bands figure; (5) svgText of the α bands figure.
 */
import { pathToFileURL } from 'node:url';
import { bandsFigure } from '../src/figures/bands.ts';
import { setFermi } from '../src/figures/energyPlot.ts';
import { headlessDocument } from '../src/figures/headless.ts';
import { prepareSpectra } from '../src/figures/prepare.ts';
import { svgText } from '../src/figures/serialize.ts';
import { makePattern, patternToSheet } from '../src/lattice/pattern.ts';
import { findSheetPreset } from '../src/lattice/presets.ts';
import { findParameterPreset, type ParameterSet } from '../src/tb/params.ts';
import { best } from './best.ts';

export async function benchFigures(): Promise<void> {
  const params = findParameterPreset('harrison1980') as ParameterSet;
  const alpha = patternToSheet(findSheetPreset('alpha')!.pattern);
  const document = headlessDocument();
  console.log(`prepareSpectra α, mesh 36:           ${best(3, () => prepareSpectra(alpha, params, { label: 'alpha', mesh: 36 })).toFixed(0)} ms`);
  const data = prepareSpectra(alpha, params, { label: 'alpha', mesh: 36 });
  console.log(`bands figure α (32 bands × 300 k):   ${best(5, () => bandsFigure(data, { document })).toFixed(1)} ms`);
  const big = patternToSheet(makePattern({ bond: 1.69, supercell: [[7, 0], [0, 7]], vacancies: [[0, 0]] }));
  const bigData = prepareSpectra(big, params, { label: '7×7 − 1', mesh: 4 });
  console.log(`bands figure 48 atoms (192 bands):   ${best(3, () => bandsFigure(bigData, { document })).toFixed(1)} ms`);
  const svg = bandsFigure(data, { document });
  const calls = 2000;
  const start = performance.now();
  for (let i = 0; i < calls; i++) setFermi(svg, data.fermi + (i % 100) * 0.01);
  console.log(`setFermi (bands figure):             ${(((performance.now() - start) / calls) * 1000).toFixed(1)} µs per call (target ≪ 16 ms)`);
  console.log(`svgText of the α bands figure:       ${best(5, () => svgText(svg)).toFixed(1)} ms`);
}

if (import.meta.url === pathToFileURL(process.argv[1]).href) await benchFigures();
