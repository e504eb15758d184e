import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { validateParameterObject } from '../../src/tb/paramsCheck.ts';
import { presetSheet } from '../tb/fixtures.ts';
import { BUCKLED, TRUTH, modelReference } from '../learn/calibrate/helpers.ts';
import { cli, refused } from './runCommand.ts';
import type { ReferenceBands } from '../../src/learn/calibrate/referenceBands.ts';
import { DEMO_MAKER } from '../learn/calibrate/demoReference.ts';

const DEMO = 'presets/demo/hsl-beta12-reference-bands.json';
const DEMO_FILES = { [DEMO]: readFileSync(DEMO, 'utf8') };

function bandsFile(reference: ReferenceBands): string {
  const rows = (values: Float64Array, width: number) => Array.from({ length: values.length / width }, (_, k) => Array.from(values.subarray(k * width, (k + 1) * width)));
  return JSON.stringify({ kpoints: rows(reference.kpoints, 2), energies: rows(reference.energies, reference.bands) });
}

const BUCKLED_TEXT = JSON.stringify({ cell: BUCKLED.cell, atoms: BUCKLED.atoms });

describe('lacuna calibrate (DESIGN.md contract)', () => {
  it('--json prints { parameters, rms, max_error, points }, parameters being a valid parameter file that fill accepts', async () => {
    const files = { 'ref.json': bandsFile(modelReference(presetSheet('beta12'), TRUTH, { offset: 3 })) };
    const { code, stdout, stderr } = await cli(['calibrate', 'beta12', '--bands', 'ref.json', '--shift', '--json'], files);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(Object.keys(document).slice(0, 4)).toEqual(['parameters', 'rms', 'max_error', 'points']);
    expect(document.points).toBe(50 * 20);
    expect(document.rms).toBeLessThan(1e-6);
    expect(document.max_error).toBeGreaterThanOrEqual(document.rms);
    const parameters = validateParameterObject(document.parameters);
    expect(parameters.hopping.pp_sigma).toBeCloseTo(TRUTH.hopping.pp_sigma, 5);
    expect(parameters.source).toMatch(/fitted by lacuna calibrate on \d{4}-\d\d-\d\d to the reference bands ref\.json .*rms/);
    const withFile = await cli(['fill', 'beta12', '--params', 'fit.json', '--mesh', '6', '--json'], { 'fit.json': JSON.stringify(document.parameters) });
    expect(withFile.code).toBe(0);
    expect(JSON.parse(withFile.stdout).parameters).toBe(parameters.name);
  });

  it('--out writes the parameter file (refused when it exists unless --overwrite); text output states the sign convention and what a fit is', async () => {
    const { code, stdout, files } = await cli(['calibrate', 'beta12', '--bands', DEMO, '--shift', '--out', 'fit.json', '--name', 'my-fit'], DEMO_FILES);
    expect(code).toBe(0);
    const written = validateParameterObject(JSON.parse(files.get('fit.json') as string));
    expect(written.name).toBe('my-fit');
    expect(stdout).toMatch(/reference bands 1–16 ↔ model bands 1–16/);
    expect(stdout).toMatch(/V_spσ is reported ≥ 0/);
    expect(stdout).toMatch(/interpolation of your own reference calculation/);
    expect(stdout).toMatch(/wrote fit\.json/);
    await refused(['calibrate', 'beta12', '--bands', DEMO, '--out', 'fit.json'], /^invalid --out: "fit\.json" \(the file exists; add --overwrite/, { ...DEMO_FILES, 'fit.json': '{}' });
  });

  it('the README example: the DEMO bands with --free cutoff,exponent come back to their invented maker (second neighbours, exponent 5) within the noise', async () => {
    const { code, stdout } = await cli(['calibrate', 'beta12', '--bands', DEMO, '--shift', '--free', 'cutoff,exponent', '--json'], DEMO_FILES);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    // The maker (test/learn/calibrate/demoReference.ts) is our own invented set: the fit must find it again.
    expect(document.parameters.exponent).toBeCloseTo(DEMO_MAKER.exponent, 1);
    for (const [name, value] of Object.entries(DEMO_MAKER.hopping)) expect(document.parameters.hopping[name]).toBeCloseTo(value, 1);
    expect(document.parameters.onsite.s - document.parameters.onsite.p).toBeCloseTo(DEMO_MAKER.onsite.s - DEMO_MAKER.onsite.p, 1);
    expect(document.rms).toBeLessThan(0.03);
    expect(document.cutoff_scan.length).toBeGreaterThan(1);
  });

  it('several sheets pair in order with several --bands; one shift each', async () => {
    const files = {
      'a.json': bandsFile(modelReference(presetSheet('alpha'), TRUTH, { offset: 1, points: 20 })),
      'b.json': bandsFile(modelReference(BUCKLED, TRUTH, { offset: -2, points: 20 })),
      'buckled.json': BUCKLED_TEXT,
    };
    const { code, stdout } = await cli(['calibrate', 'alpha', 'buckled.json', '--bands', 'a.json', '--bands', 'b.json', '--shift', '--json'], files);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document.sheets.map((s: { sheet: string; bands_file: string }) => [s.sheet, s.bands_file])).toEqual([['alpha', 'a.json'], ['buckled.json', 'b.json']]);
    expect(document.sheets[1].shift - document.sheets[0].shift).toBeCloseTo(-3, 5);
  });

  it('refuses bad input naming the field', async () => {
    const files = { ...DEMO_FILES, 'buckled.json': BUCKLED_TEXT, 'empty.json': '', 'bad.json': '{"kpoints": [[0, 0]], "energies": [[1, 0]]}' };
    await refused(['calibrate', 'beta12'], /^invalid --bands: missing \(give the reference bands file/, files);
    await refused(['calibrate', 'beta12', 'alpha', '--bands', DEMO], /^invalid --bands: ".*" \(1 file for 2 sheets: give one --bands per SHEET/, files);
    await refused(['calibrate', 'beta12', '--bands', 'nope.json'], /^invalid --bands: "nope\.json" \(no such file\)/, files);
    await refused(['calibrate', 'beta12', '--bands', 'empty.json'], /^invalid empty\.json: "" \(empty file/, files);
    await refused(['calibrate', 'beta12', '--bands', 'bad.json'], /^invalid energies\[0\]\[1\]: 0 \(below energies\[0\]\[0\] = 1: the energies at each k-point must be ascending; in the reference bands file "bad\.json"\)/, files);
    await refused(['calibrate', 'alpha', '--bands', DEMO], /^invalid kpoints\[\d+\]: .* \(outside 1\.5× the first Brillouin zone of this sheet.*; in the reference bands file/, files);
    await refused(['calibrate', 'beta12', '--bands', DEMO, '--model-bands', '5-25'], /^invalid --model-bands: "5-25" \(the sheet's model has 20 bands \(4 per atom\)\)/, files);
    await refused(['calibrate', 'beta12', '--bands', DEMO, '--reference-bands', '1-17'], /^invalid --reference-bands: "1-17" \(the reference file has 16 bands per k-point\)/, files);
    await refused(['calibrate', 'buckled.json', '--bands', DEMO, '--block', 'pi'], /^invalid --block: "pi" \(the sheet is buckled/, files);
    await refused(['calibrate', 'beta12', '--bands', DEMO, '--free', 'd0'], /^invalid --free: "d0" \(d0: d0 only says where the integrals are stated/, files);
    await refused(['calibrate', 'beta12', '--bands', DEMO, '--free', 'exponent'], /^invalid --free: "exponent" \(exponent: every bond of this sheet within the cutoff 2\.1 Å has one length/, files);
    await refused(['calibrate', 'beta12', '--bands', DEMO, '--hold', 'pp_sigma,ppp'], /^invalid --hold: "pp_sigma,ppp" \(ppp: not one of s, p, ss_sigma/, files);
    await refused(['calibrate', 'beta12', '--bands', DEMO, '--weight-width', '2', '--equal-weights'], /^invalid --weight-width: "2" \(give --weight-width or --equal-weights, not both\)/, files);
    await refused(['calibrate', 'beta12', 'alpha', '--bands', DEMO, '--bands', DEMO, '--block', 'pi', '--block', 'full', '--block', 'pi'], /^invalid --block: "pi full pi" \(given 3 times for 2 sheets/, files);
  });
});
