/**
 * Benchmarks of the substrate core (figures only; no test depends on them). Run: `npx tsx bench/substrate.ts`.
 * (1) coincidence fits of δ6 (the densest lattice, the most candidates) on Ag(111) up to 120 atoms, strain 0.5 %,
 * target ≤ 5 s; (2) β12 on Cu(111) up to 60 atoms at 3 %; (3) the alignment of β12 on Ag(111) on a 36×36 mesh
 * spectrum (the solve only), target ≤ 50 ms; (4) the η–δ map of the five named sheets at M = 24, target ≤ 2 s.
 */
import { pathToFileURL } from 'node:url';
import { patternToSheet } from '../src/lattice/pattern.ts';
import { SHEET_PRESETS, findSheetPreset } from '../src/lattice/presets.ts';
import { cellMetrics } from '../src/lattice/reducedCell.ts';
import { alignFermiLevel } from '../src/substrate/alignment.ts';
import { coincidenceFits } from '../src/substrate/coincidence.ts';
import { dopingMap } from '../src/substrate/dopingMap.ts';
import { SUBSTRATES, findSubstrate } from '../src/substrate/substrates.ts';
import { meshSpectrum } from '../src/tb/meshSpectrum.ts';
import { TightBindingModel } from '../src/tb/model.ts';
import { findParameterPreset } from '../src/tb/params.ts';

function timed(label: string, task: () => string): void {
  const start = performance.now();
  const note = task();
  console.log(`${label.padEnd(58)} ${(performance.now() - start).toFixed(0).padStart(7)} ms   ${note}`);
}

export async function benchSubstrate(): Promise<void> {
  const sheet = (name: string) => patternToSheet(findSheetPreset(name)!.pattern);
  const ag = findSubstrate('ag111')!;
  timed('fit δ6 on Ag(111), ≤ 120 atoms, strain 0.5 % (target ≤ 5 s)', () => `${coincidenceFits(sheet('delta6'), ag.nnDistance, { maxSites: 120, maxStrain: 0.005 }).length} fits`);
  timed('fit β12 on Cu(111), ≤ 60 atoms, strain 3 %', () => `${coincidenceFits(sheet('beta12'), findSubstrate('cu111')!.nnDistance, { maxSites: 60 }).length} fits`);
  const params = findParameterPreset('harrison1980')!;
  const beta12 = sheet('beta12');
  const spectrum = meshSpectrum(new TightBindingModel(beta12, params), { mesh: 36 });
  timed('alignment β12 on Ag(111), 36×36 spectrum (target ≤ 50 ms)', () => {
    const r = alignFermiLevel(spectrum, { cellArea: cellMetrics(beta12.cell).area, metalWorkFunction: ag.workFunction, sheetWorkFunction: 4.8, dipole: 0.9, distance: 3.3, d0: 2.4 });
    return `${r.electronsPerAtom.toFixed(4)} e/atom`;
  });
  timed('η–δ map, five named sheets, four metals, M = 24 (target ≤ 2 s)', () => {
    const map = dopingMap(SHEET_PRESETS.map((p) => ({ name: p.name, pattern: p.pattern })), { substrates: SUBSTRATES, parameters: params, mesh: 24 });
    return `${map.points.length} points`;
  });
}

if (import.meta.url === pathToFileURL(process.argv[1]).href) await benchSubstrate();
