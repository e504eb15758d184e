/**
 * `lacuna expand` in-process: the contract's JSON keys, the text output and its caveat, progress, the figure
 * files, and every refusal as one line naming the field.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { cli, refused } from './runCommand.ts';

const DEMO = readFileSync('presets/demo/hsl-energies.json', 'utf8');
const files = { 'demo.json': DEMO };
const PREDICT = ['--predict-sites', '1-12', '--predict-holes', '0-4', '--isolated'];

describe('lacuna expand', () => {
  it('--json: exactly one document with the contract keys (DESIGN.md), defaults pairs to shell 3 and no triplets', async () => {
    const { code, stdout, stderr } = await cli(['expand', '--energies', 'demo.json', ...PREDICT, '--json'], files);
    expect(code).toBe(0);
    expect(stderr).toBe('');
    const result = JSON.parse(stdout);
    for (const key of ['clusters', 'fit_rms', 'cv_rms', 'predictions', 'hull', 'suggest']) expect(result, key).toHaveProperty(key);
    expect(result.clusters.map((c: { kind: string; shell: number }) => `${c.kind}${c.shell}`)).toEqual(['empty0', 'point0', 'pair1', 'pair2', 'pair3']);
    for (const c of result.clusters) expect(typeof c.eci).toBe('number');
    expect(result.predictions.length).toBeGreaterThan(50);
    for (const p of result.predictions) {
      for (const key of ['sites', 'holes', 'supercell', 'vacancies', 'energy', 'above_hull']) expect(p, key).toHaveProperty(key);
      const [[a, zero], [b, c]] = p.supercell;
      expect(zero).toBe(0);
      expect(a * c).toBe(p.sites);
      expect(b >= 0 && b < a).toBe(true);
      // Per cell and per lattice site: energy = sites × energy_per_site (the contract's unit rule).
      expect(p.energy).toBeCloseTo(p.sites * p.energy_per_site, 9);
    }
    for (const h of result.hull) for (const key of ['eta', 'energy_per_site', 'supercell', 'vacancies']) expect(h, key).toHaveProperty(key);
    expect(result.hull[0].eta).toBe(0);
    expect(result.hull[0].boron_chemical_potential.max).toBeNull(); // the η = 0 end is stable for all high μ
    expect(result.suggest.length).toBe(5);
    for (const s of result.suggest) for (const key of ['supercell', 'vacancies', 'why']) expect(s, key).toHaveProperty(key);
    expect(result.caveat).toMatch(/interpolation of them/);
  });

  it('without a range: no predictions and no suggestions, the fit and the hull still', async () => {
    const result = JSON.parse((await cli(['expand', '--energies', 'demo.json', '--json'], files)).stdout);
    expect(result.predictions).toEqual([]);
    expect(result.suggest).toEqual([]);
    expect(result.hull.length).toBeGreaterThan(1);
  });

  it('--pair-shells and --triplet-shells set the clusters; the DEMO set cannot determine the nearest-neighbour triangle', async () => {
    const result = JSON.parse((await cli(['expand', '--energies', 'demo.json', '--pair-shells', '2', '--json'], files)).stdout);
    expect(result.clusters.map((c: { name: string }) => c.name)).toEqual(['empty', 'point', 'pair 1', 'pair 2']);
    // Ten of its twelve patterns have isolated vacancies, where a triangle holds at most one: Φ = 1 − 6η, linear in η
    // (2N triangles, 6 per vacancy; analytic); the two divacancy patterns do not separate it from pair 1 (as the fit finds).
    await refused(['expand', '--energies', 'demo.json', '--triplet-shells', '1'], /^invalid --triplet-shells: "1" \(the 12 structures do not determine triplet 1-1-1/, files);
  });

  it('text: the ECIs, fit and CV, the hull with chemical potentials, the suggestions and the caveat; DEMO named', async () => {
    const { code, stdout } = await cli(['expand', '--energies', 'demo.json', ...PREDICT], files);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^cluster expansion of 12 structures \(DEMO/);
    expect(stdout).toMatch(/leave-one-out CV [\d.]+ meV\/site/);
    expect(stdout).toMatch(/μ_B ≥ /);
    expect(stdout).toMatch(/compute next/);
    expect(stdout.trimEnd().split('\n').pop()).toMatch(/^A cluster expansion fitted to your own calculations: an interpolation/);
  });

  it('--progress: the estimate, then done, as JSON lines on stderr', async () => {
    const { stderr } = await cli(['expand', '--energies', 'demo.json', ...PREDICT, '--json', '--progress'], files);
    const lines = stderr.trim().split('\n').map((line) => JSON.parse(line));
    expect(lines[0]).toMatchObject({ job: 'expand', event: 'estimate' });
    expect(lines[lines.length - 1]).toMatchObject({ job: 'expand', event: 'done', unit: 'patterns' });
  });

  it('--svg and --png write the energy–η figure', async () => {
    const { code, files: written } = await cli(['expand', '--energies', 'demo.json', ...PREDICT, '--svg', 'e.svg', '--png', 'e.png', '--json'], files);
    expect(code).toBe(0);
    expect(String(written.get('e.svg'))).toMatch(/<svg[^>]*data-figure="energy-hull"/);
    expect(Array.from((written.get('e.png') as Uint8Array).slice(1, 4))).toEqual([0x50, 0x4e, 0x47]); // "PNG"
  });

  it('refuses bad input with one line naming the field', async () => {
    await refused(['expand', '--json'], /^invalid --energies: missing \(required/);
    await refused(['expand', '--energies', 'none.json'], /^invalid --energies: "none\.json" \(no such file\)/);
    await refused(['expand', '--energies', 'demo.json', '--predict-sites', '1-6'], /^invalid --predict-holes: missing \(required with --predict-sites/, files);
    await refused(['expand', '--energies', 'demo.json', '--isolated'], /^invalid --isolated: "--isolated" \(only with --predict-sites/, files);
    await refused(['expand', '--energies', 'demo.json', '--pair-shells', '11'], /^invalid --pair-shells: "11" \(must be from 0 to 10\)/, files);
    await refused(['expand', '--energies', 'demo.json', '--predict-sites', '1-40', '--predict-holes', '0-20'], /^invalid --predict-sites: "1-40" \(about .* patterns to predict/, files);
    const three = JSON.stringify({ structures: JSON.parse(DEMO).structures.slice(0, 3) });
    await refused(['expand', '--energies', 'few.json'], /^invalid structures: 3 structures \(5 clusters asked .* at least 6 structures/, { 'few.json': three });
    const twice = JSON.parse(DEMO);
    twice.structures.push({ ...twice.structures[2], vacancies: [[1, 1]] });
    await refused(['expand', '--energies', 'twice.json'], /^invalid structures\[12\]: .*the same pattern as structures\[2\] \("α"\).*; in the energies file "twice\.json"\)\n$/, { 'twice.json': JSON.stringify(twice) });
    await refused(['expand', '--energies', 'nan.json'], /^invalid structures\[0\]\.energy: NaN \(not a finite number; in the energies file "nan\.json"\)\n$/, { 'nan.json': DEMO.replace('-5.869', 'NaN') });
  });
});
