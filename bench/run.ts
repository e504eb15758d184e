/**
 * `npm run bench`: every benchmark in turn, printing figures. Targets are stated beside each figure;
 * nothing here fails a build — speed lives in figures, not in timed tests.
 */
import { benchEigh } from './eigh.ts';
import { benchEnumerate } from './enumerate.ts';
import { benchExpansion } from './expansion.ts';
import { benchFigures } from './figures.ts';
import { benchSubstrate } from './substrate.ts';
import { benchTightBinding } from './tb.ts';
import { benchMeshDensity } from './meshDensity.ts';
import { benchStm } from './stm.ts';
import { benchUnfold } from './unfold.ts';
import { benchCalibrate } from './calibrate.ts';

const suites: [string, () => Promise<void>][] = [
  ['enumeration', benchEnumerate],
  ['Hermitian eigensolver', benchEigh],
  ['tight binding', benchTightBinding],
  ['figures', benchFigures],
  ['mesh density (rank)', () => benchMeshDensity()],
  ['substrate', benchSubstrate],
  ['STM pictures', benchStm],
  ['cluster expansion', benchExpansion],
  ['unfolding', benchUnfold],
  ['calibrate', benchCalibrate],
];

const only = process.argv[2];
for (const [name, suite] of suites) {
  if (only && !name.includes(only)) continue;
  console.log(`\n== ${name}`);
  await suite();
}
