/**
 * How the DEMO reference bands (presets/demo/hsl-beta12-reference-bands.json) are made: lacuna's own model with
 * invented parameters that also couple second neighbours (so the nearest-neighbour fit cannot match it exactly, as
 * it could not match a density-functional calculation), its E_F put at 0 (the zero such files often use), the
 * lowest 16 of 20 bands kept, 0.02 eV of seeded Gaussian noise, rounded to 0.1 meV. Invented: not a calculation.
 */
import { findSheetPreset } from '../../../src/lattice/presets.ts';
import { patternToSheet } from '../../../src/lattice/pattern.ts';
import { computeBands } from '../../../src/tb/bands.ts';
import { xorshift32 } from '../../../src/linalg/eighRandom.ts';
import { fill } from '../../../src/tb/fill.ts';
import { autoPath } from '../../../src/tb/kspacePath.ts';
import { TightBindingModel } from '../../../src/tb/model.ts';
import type { ParameterSet } from '../../../src/tb/params.ts';

export const DEMO_REFERENCE_FILE = 'presets/demo/hsl-beta12-reference-bands.json';

/** The invented set that makes the DEMO bands (not a fit to anything). */
export const DEMO_MAKER: ParameterSet = {
  name: 'demo-reference-maker',
  source: 'DEMO — invented numbers',
  onsite: { s: -6.1, p: -2.4 },
  hopping: { ss_sigma: -2.1, sp_sigma: 2.7, pp_sigma: 3.5, pp_pi: -1.3 },
  d0: 1.69,
  exponent: 5,
  cutoff: 3.0,
};

const KEPT_BANDS = 16;
const NOISE = 0.02;
const SEED = 20240427;

export function makeDemoReference(): Record<string, unknown> {
  const sheet = patternToSheet(findSheetPreset('beta12')!.pattern);
  const model = new TightBindingModel(sheet, DEMO_MAKER);
  const fermi = fill(model, { mesh: 36 }).fermi;
  const path = autoPath(sheet.cell, 90);
  const bands = computeBands(model, path.kpoints);
  const uniform = xorshift32(SEED);
  // Box–Muller: two uniforms → one standard normal.
  const normal = () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
  const energies: number[][] = [];
  const kpoints: number[][] = [];
  for (let k = 0; k < bands.count; k++) {
    const row = Array.from(bands.energies.subarray(k * bands.bands, k * bands.bands + KEPT_BANDS), (e) => e - fermi + NOISE * normal());
    energies.push(row.sort((a, b) => a - b).map((e) => Math.round(e * 1e4) / 1e4));
    kpoints.push([Number(path.kpoints[2 * k].toFixed(6)), Number(path.kpoints[2 * k + 1].toFixed(6))]);
  }
  return {
    title: 'DEMO — invented reference bands of the β12 sheet, as the Harbour Street Surface Lab (imaginary) might export them from its own calculation; not from any calculation',
    note: 'Made by lacuna\'s own tight-binding model with invented parameters that also couple second neighbours (cutoff 3.0 Å, exponent 3), E_F moved to 0, the lowest 16 of 20 bands kept, 0.02 eV Gaussian noise (test/learn/calibrate/demoReference.ts). For trying calibrate only.',
    demo: true,
    sheet: 'beta12',
    fermi: 0,
    path: { labels: path.labels.map((l) => ({ label: l.label, index: l.index })) },
    kpoints,
    energies,
  };
}
