/**
 * Benchmark of calibrate (figures only; no test depends on them). Run: `npx tsx bench/calibrate.ts`.
 * An 8-atom sheet (α) on a 100-point path, reference bands made by the model with invented parameters plus
 * 0.02 eV noise, fitted from the three default starts with a shift, target ≤ 2 s; the same on a buckled α (the
 * full 32×32 block with eigenvectors at every k) for comparison.
 */
import { pathToFileURL } from 'node:url';
import { calibrate, defaultStarts, matchBands, ParametricBands, parameterVector } from '../src/learn/calibrate/index.ts';
import { patternToSheet } from '../src/lattice/pattern.ts';
import { findSheetPreset } from '../src/lattice/presets.ts';
import type { Sheet } from '../src/lattice/sheet.ts';
import { xorshift32 } from '../src/linalg/eighRandom.ts';
import { autoPath } from '../src/tb/kspacePath.ts';
import type { ParameterSet } from '../src/tb/params.ts';
import { best } from './best.ts';

const INVENTED: ParameterSet = {
  name: 'bench-invented', source: 'invented for the benchmark',
  onsite: { s: -10.2, p: -5.1 }, hopping: { ss_sigma: -4.4, sp_sigma: 5.6, pp_sigma: 6.9, pp_pi: -2.5 },
  d0: 1.69, exponent: 2, cutoff: 2.1,
};

function fitOnce(sheet: Sheet, points: number): { seconds: number; rms: number; iterations: number[] } {
  const path = autoPath(sheet.cell, points);
  const bands = new ParametricBands(sheet, path.kpoints, { cutoff: 2.1, d0: 1.69, block: 'full' });
  const energies = new Float64Array(bands.count * bands.bands);
  bands.evaluate(parameterVector(INVENTED, 1.69), energies, null);
  const uniform = xorshift32(3);
  for (let i = 0; i < energies.length; i++) energies[i] += 1.5 + 0.02 * (Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform()));
  for (let k = 0; k < bands.count; k++) energies.subarray(k * bands.bands, (k + 1) * bands.bands).sort();
  const reference = { count: bands.count, bands: bands.bands, kpoints: path.kpoints, energies };
  const match = matchBands(bands.bands, bands.bands, {}, { model: 'model', reference: 'reference', file: 'bench' });
  let result: ReturnType<typeof calibrate> | undefined;
  const ms = best(3, () => {
    result = calibrate({ sheets: [{ sheet, label: 'bench', reference, referenceLabel: 'bench', match }], starts: defaultStarts(), shift: true });
  });
  return { seconds: ms / 1000, rms: result!.rms, iterations: result!.starts.map((s) => s.iterations) };
}

export async function benchCalibrate(): Promise<void> {
  const alpha = patternToSheet(findSheetPreset('alpha')!.pattern);
  const buckled: Sheet = { ...alpha, atoms: alpha.atoms.map((a, i) => [a[0], a[1], i % 2 ? 0.2 : -0.2]) };
  for (const [name, sheet] of [['α (8 atoms, planar)', alpha], ['buckled α (8 atoms, full block)', buckled]] as const) {
    const run = fitOnce(sheet, 100);
    console.log(`calibrate, ${name}, 100-point path, 3 starts: ${run.seconds.toFixed(3)} s (target ≤ 2 s); rms ${run.rms.toFixed(4)} eV, trial steps per start ${run.iterations.join(', ')}`);
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) await benchCalibrate();
