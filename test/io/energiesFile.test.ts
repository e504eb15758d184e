/**
 * parseEnergiesText / parseEnergiesObject: the energies file of `expand`, and expandEnergies' refusals of a
 * training set it cannot fit — each bad input a ValidationError naming the field and the reason.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { expandEnergies } from '../../src/learn/expansion/expand.ts';
import { parseEnergiesObject, parseEnergiesText } from '../../src/io/energiesFile.ts';
import { refusal } from './refusal.ts';

const structure = (supercell: number[][], vacancies: number[][], energy: number, extra: Record<string, unknown> = {}) => ({ supercell, vacancies, energy, ...extra });
/** Six distinct patterns with plausible energies (about −6 eV per atom). */
const SIX = [
  structure([[1, 0], [0, 1]], [], -6),
  structure([[3, 0], [0, 3]], [[0, 0]], -48),
  structure([[2, 0], [0, 3]], [[0, 0]], -30),
  structure([[3, 0], [1, 1]], [[0, 0]], -12.3),
  structure([[2, 0], [0, 2]], [[0, 0]], -18.2),
  structure([[3, 0], [0, 3]], [[0, 0], [1, 0]], -42.5),
];
const file = (structures: unknown[], extra: Record<string, unknown> = {}) => ({ structures, ...extra });

describe('parseEnergiesObject', () => {
  it('reads the DEMO file: twelve structures, labelled DEMO, χ3 given in non-HNF rows brought to HNF', () => {
    const demo = parseEnergiesText(readFileSync('presets/demo/hsl-energies.json', 'utf8'), 'hsl-energies.json');
    expect(demo.demo).toBe(true);
    expect(demo.title).toMatch(/^DEMO/);
    expect(demo.structures.length).toBe(12);
    const chi3 = demo.structures.find((s) => s.name === 'χ3')!;
    expect(chi3.pattern.supercell).toEqual({ a: 5, b: 2, c: 1 }); // |det [[2,1],[−1,2]]| = 5 sites
  });

  it('refuses a structure given twice, as itself, translated, rotated or in a larger cell — naming both', () => {
    const alpha = structure([[3, 0], [0, 3]], [[0, 0]], -48);
    for (const twin of [
      structure([[3, 0], [0, 3]], [[0, 0]], -48.1), // itself
      structure([[3, 0], [0, 3]], [[2, 1]], -48.1), // translated
      structure([[0, 3], [-3, 3]], [[0, 0]], -48.1), // rotated by 60°: a1 → a2, a2 → a2 − a1
      structure([[6, 0], [0, 3]], [[0, 0], [3, 0]], -96.2), // the same pattern in a cell twice as large
    ]) {
      expect(refusal(() => parseEnergiesObject(file([...SIX.slice(0, 1), alpha, twin])))).toMatch(/^invalid structures\[2\]: .* \(the same pattern as structures\[1\] up to rotations, mirrors and translations/);
    }
  });

  it('refuses NaN and infinite energies, in a file (bare NaN, which JSON lacks) and in an object, naming the field', () => {
    const text = JSON.stringify(file(SIX)).replace('-30', 'NaN');
    expect(refusal(() => parseEnergiesText(text, 'e.json'))).toBe('invalid structures[2].energy: NaN (not a finite number)');
    expect(refusal(() => parseEnergiesText(JSON.stringify(file(SIX)).replace('-48', '-Infinity'), 'e.json'))).toMatch(/^invalid structures\[1\]\.energy: -?Infinity \(not a finite number\)/);
    expect(refusal(() => parseEnergiesObject(file([...SIX.slice(0, 3), structure([[2, 0], [0, 2]], [[0, 0]], NaN)])))).toBe('invalid structures[3].energy: NaN (not a finite number)');
    // A bare NaN inside a string is text, not a number: the parse still fails where JSON does.
    expect(refusal(() => parseEnergiesText('{"structures": [{"name": "NaN", "energy": nan}]}', 'e.json'))).toMatch(/^invalid e\.json: .* \(not JSON/);
  });

  it('refuses absurd energies: per atom beyond any code, or far from the rest of the file (mixed units)', () => {
    expect(refusal(() => parseEnergiesObject(file([structure([[2, 0], [0, 2]], [[0, 0]], -3e4)])))).toMatch(/^invalid structures\[0\]\.energy: -30000 \(-1\.000e\+4 eV per atom for 3 atoms/);
    const rydberg = [...SIX.slice(0, 5), structure([[3, 0], [0, 3]], [[0, 0], [1, 0]], -42.5 * 13.6)];
    expect(refusal(() => parseEnergiesObject(file(rydberg)))).toMatch(/^invalid structures\[5\]\.energy: -578 \(-82\.57\d* eV per atom, .* from the median .*\(mixed units or codes\?\)/);
    expect(refusal(() => parseEnergiesObject(file([structure([[1, 0], [0, 1]], [], 1e8)])))).toMatch(/^invalid structures\[0\]\.energy: 100000000 \(\|value\| above the limit/);
  });

  it('names the field of a bad pattern inside a structure, an unknown field, a missing energy', () => {
    expect(refusal(() => parseEnergiesObject(file([structure([[2, 0], [4, 0]], [], -6)])))).toBe('invalid structures[0].supercell: [[2,0],[4,0]] (singular: determinant 0)');
    expect(refusal(() => parseEnergiesObject(file([structure([[1, 0], [0, 1]], [[0, 0]], -6)])))).toMatch(/^invalid structures\[0\]\.vacancies: .*no atoms/);
    expect(refusal(() => parseEnergiesObject(file([structure([[1, 0], [0, 1]], [], -6, { bond: -1 })])))).toBe('invalid structures[0].bond: -1 (must be positive)');
    expect(refusal(() => parseEnergiesObject(file([structure([[1, 0], [0, 1]], [], -6, { enrgy: 1 })])))).toMatch(/^invalid structures\[0\]\.enrgy: 1 \(unknown field/);
    expect(refusal(() => parseEnergiesObject(file([{ supercell: [[1, 0], [0, 1]], vacancies: [] }])))).toMatch(/^invalid structures\[0\]\.energy: missing \(required/);
    expect(refusal(() => parseEnergiesObject({ structure: [] }))).toMatch(/^invalid structure: \[\] \(unknown field/);
    expect(refusal(() => parseEnergiesObject(file([])))).toBe('invalid structures: [] (empty: give the structures you computed)');
    expect(refusal(() => parseEnergiesText('{"structures": [', 'mine.json'))).toMatch(/^invalid mine\.json: .* \(not JSON/);
  });
});

describe('expandEnergies refusals', () => {
  const six = parseEnergiesObject(file(SIX)).structures;

  it('too few structures for the clusters asked, naming the count and the flags that ask for them', () => {
    expect(refusal(() => expandEnergies(six.slice(0, 5)))).toBe('invalid structures: 5 structures (5 clusters asked (empty, point, 3 pair shells) need at least 6 structures for a fit with leave-one-out cross-validation; add structures or lower --pair-shells)');
    expect(refusal(() => expandEnergies(six, { tripletShells: 1 }))).toMatch(/^invalid structures: 6 structures \(6 clusters asked \(empty, point, 3 pair shells, 1 triplet orbits\) need at least 7 .* or --triplet-shells\)/);
    expect(refusal(() => expandEnergies(six.slice(0, 2), { pairShells: 0, fields: { structures: 'energies file', pairShells: 'pair shells', tripletShells: 'triplet shells', predictSites: 'sites' } })))
      .toMatch(/^invalid energies file: 2 structures .* lower pair shells\)$/);
  });

  it('structures that cannot tell a cluster apart: all at one η (the point term), or none with touching vacancies (pair 1)', () => {
    const oneEta = parseEnergiesObject(file([
      structure([[2, 0], [0, 2]], [[0, 0]], -18.2), structure([[2, 0], [1, 2]], [[0, 0]], -18.3), structure([[4, 0], [0, 2]], [[0, 0], [1, 0]], -36.1),
      structure([[4, 0], [1, 2]], [[0, 0], [1, 0]], -36.5), structure([[4, 0], [0, 2]], [[0, 0], [0, 1]], -36.3),
    ])).structures;
    expect(refusal(() => expandEnergies(oneEta, { pairShells: 2 }))).toMatch(/^invalid structures: 5 structures \(every structure has the same hole density η/);
    const isolated = six.filter((_, k) => k !== 5);
    expect(refusal(() => expandEnergies([...isolated, ...parseEnergiesObject(file([structure([[4, 0], [0, 4]], [[0, 0]], -90), structure([[4, 0], [1, 2]], [[0, 0]], -42)])).structures])))
      .toMatch(/^invalid --pair-shells: "3" \(the 7 structures do not determine pair 1: its correlations are a combination/);
  });
});
