/**
 * runExpansion(input): the Energies panel's job — the DEMO fit as the panel shows it, indices that lead from a
 * figure point or a suggestion to its pattern, and refusals named with the panel's labels and the file's name.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { canonicalForm } from '../../src/enumerate/canonical.ts';
import { runExpansion, type ExpansionInput } from '../../src/app/expansionJob.ts';
import { readPairShells, readPredictSites } from '../../src/app/energiesFields.ts';
import { refusal } from '../io/refusal.ts';

const DEMO = readFileSync('presets/demo/hsl-energies.json', 'utf8');
const input: ExpansionInput = { text: DEMO, name: 'hsl-energies.json', pairShells: 3, tripletShells: 0, predict: { sites: [1, 12], holes: [0, 4], isolated: true } };

describe('runExpansion', () => {
  const view = runExpansion(input);

  it('says DEMO, and keeps the caveat with the result', () => {
    expect(view.demo).toBe(true);
    expect(view.title).toMatch(/^DEMO/);
    expect(view.caveat).toMatch(/interpolation of them, only as good as they are/);
  });

  it('every figure point leads to its own pattern: a computed point to the file\'s structure, a predicted one to its prediction', () => {
    const file = JSON.parse(DEMO);
    for (const point of view.figure.computed) expect(view.computed[point.index].label).toBe(file.structures[point.index].name);
    for (const point of view.figure.predicted) {
      const shown = view.predicted[point.index];
      expect(shown.pattern.vacancies.length / (shown.pattern.supercell.a * shown.pattern.supercell.c)).toBeCloseTo(point.eta, 14);
    }
    for (const s of view.suggestions) expect(view.figure.predicted.find((p) => p.index === s.index)?.suggested).toBeGreaterThan(0);
  });

  it('suggests first the one-hole-in-7 pattern the DEMO file leaves out (on the hull of its invented pair model; our arithmetic)', () => {
    const first = view.predicted[view.suggestions[0].index].pattern;
    expect(canonicalForm(first)).toBe(canonicalForm({ bond: 1.69, supercell: { a: 7, b: 2, c: 1 }, vacancies: [[0, 0]] }));
  });

  it('names refusals with the panel\'s labels and the file', () => {
    expect(refusal(() => runExpansion({ ...input, text: '{"structures": []}', name: 'mine.json' }))).toBe('invalid structures: [] (empty: give the structures you computed; in the energies file "mine.json")');
    expect(refusal(() => runExpansion({ ...input, tripletShells: 1 }))).toMatch(/^invalid triplet shells: "1" \(the 12 structures do not determine triplet 1-1-1/);
    expect(refusal(() => runExpansion({ ...input, predict: { sites: [1, 30], holes: [0, 30], isolated: false } }))).toMatch(/^invalid sites: "1-30" \(more than 20000 patterns in this range/);
    expect(refusal(() => readPairShells('11'))).toBe('invalid pair shells: "11" (must be from 0 to 10)');
    expect(refusal(() => readPredictSites('12-3'))).toBe('invalid sites: "12-3" (the range is empty (low end above high end))');
  });
});
