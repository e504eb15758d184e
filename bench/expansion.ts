/**
 * Benchmark of the vacancy cluster expansion (figures only; no test depends on them). Run: `npx tsx bench/expansion.ts`.
 * (1) the fit of the DEMO energies (12 structures, pairs to shell 3); (2) predictions of every isolated pattern with
 * N ≤ 24 sites (the enumerator streaming, the correlations on cached supercell tables), target ≤ 5 s; (3) the whole
 * `expand` job on that range (fit, predictions, both hulls, suggestions); (4) the same range with triplets to shell 2.
 */
import { readFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { clusterSet } from '../src/learn/expansion/clusters.ts';
import { expandEnergies } from '../src/learn/expansion/expand.ts';
import { fitExpansion, isFitProblem } from '../src/learn/expansion/fit.ts';
import { predictStructures } from '../src/learn/expansion/predict.ts';
import { parseEnergiesText } from '../src/io/energiesFile.ts';

function timed(label: string, task: () => string): void {
  const start = performance.now();
  const note = task();
  console.log(`${label.padEnd(62)} ${(performance.now() - start).toFixed(0).padStart(7)} ms   ${note}`);
}

export async function benchExpansion(): Promise<void> {
  const structures = parseEnergiesText(readFileSync(new URL('../presets/demo/hsl-energies.json', import.meta.url), 'utf8')).structures;
  const range = { sites: [1, 24] as [number, number], holes: [0, 24] as [number, number], isolated: true };
  let fit = fitExpansion(clusterSet({ pairShells: 3, tripletShells: 0 }), structures);
  timed('fit of the DEMO energies (12 structures, pairs to shell 3)', () => {
    fit = fitExpansion(clusterSet({ pairShells: 3, tripletShells: 0 }), structures);
    return isFitProblem(fit) ? fit.kind : `CV ${(1000 * fit.cvRms).toFixed(2)} meV/site`;
  });
  if (isFitProblem(fit)) throw new Error('the DEMO energies cannot be fitted');
  const fitted = fit;
  timed('predictions, all isolated patterns N ≤ 24 (target ≤ 5 s)', () => {
    let count = 0;
    for (const _ of predictStructures(fitted, range)) count++;
    return `${count} patterns`;
  });
  timed('whole expand job on that range (hulls, suggestions)', () => {
    const result = expandEnergies(structures, { predict: range });
    return `${result.predictions.length} patterns, ${result.suggestions.length} suggestions`;
  });
  timed('predictions with pairs to shell 4 and triplets to shell 2', () => {
    // The DEMO set cannot determine triplets; the predictions' cost is timed on a fit of its own clusters to itself.
    const set = clusterSet({ pairShells: 4, tripletShells: 2 });
    let count = 0;
    const cost = fitExpansion(set, [...predictStructures(fitted, { sites: [1, 9], holes: [0, 9] })].map((p) => ({ pattern: p.structure.pattern, energy: p.energy })));
    if (isFitProblem(cost)) return `not fitted (${cost.kind})`;
    for (const _ of predictStructures(cost, range)) count++;
    return `${count} patterns, ${set.orbits.length} clusters`;
  });
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) await benchExpansion();
