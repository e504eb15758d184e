/**
 * The CLI's mesh rule, feedback and names (issue: cost that follows the cell; one name for one thing). Expected
 * values come from src/tb/meshDensity.ts's rule (tested against analytic reciprocal lengths in
 * test/tb/meshDensity.test.ts) and from the documented contract defaults (DESIGN.md: mesh 36 for `fill NAME`).
 */
import { describe, expect, it } from 'vitest';
import { makePattern, patternToSheet } from '../../src/lattice/pattern.ts';
import { DEFAULT_KSPACING, meshForSpacing } from '../../src/tb/meshDensity.ts';
import { cli, refused } from './runCommand.ts';



/** A 16-site cell with one hole: 15 atoms, over the 12-atom limit of the fixed default mesh. */
const large = { bond: 1.69, supercell: [[4, 0], [0, 4]] as [[number, number], [number, number]], vacancies: [[0, 0]] as [number, number][] };
const largeText = JSON.stringify(large);

describe('the mesh of every mesh command', () => {
  it('fill NAME --json keeps mesh 36 on the presets (the contract default) and says why', async () => {
    const document = JSON.parse((await cli(['fill', 'alpha', '--json'])).stdout);
    expect(document.mesh).toBe(36);
    expect(document.mesh_rule).toBe('default_mesh');
    expect(document.kspacing).toBeUndefined();
  });

  it('a cell over 12 atoms gets the default spacing, and every command says so', async () => {
    const expected = meshForSpacing(patternToSheet(makePattern(large)).cell, DEFAULT_KSPACING);
    for (const command of ['fill', 'scan', 'dos', 'bonding']) {
      const document = JSON.parse((await cli([command, 'big.json', '--json'], { 'big.json': largeText })).stdout);
      expect(document.mesh, command).toBe(expected);
      expect(document.mesh_rule, command).toBe('default_kspacing');
      expect(document.kspacing, command).toBe(DEFAULT_KSPACING);
    }
  });

  it('--kspacing gives the mesh of the rule and names itself; the text says the mesh and why', async () => {
    const document = JSON.parse((await cli(['fill', 'alpha', '--kspacing', '0.2', '--json'])).stdout);
    expect(document.mesh).toBe(meshForSpacing(patternToSheet(makePattern({ bond: 1.69, supercell: [[3, 0], [0, 3]], vacancies: [[0, 0]] })).cell, 0.2));
    expect(document.mesh_rule).toBe('kspacing');
    const text = (await cli(['fill', 'alpha', '--kspacing', '0.2'])).stdout;
    expect(text).toMatch(/\d+×\d+ mesh \(k-spacing 0\.2 Å⁻¹, given\)/);
    expect(text).toMatch(/Gaussian width 0\.1 eV/);
    expect(text).not.toMatch(/σ = /);
  });

  it('refuses --mesh with --kspacing on every mesh command', async () => {
    for (const command of ['fill', 'scan', 'dos', 'bonding']) {
      await refused([command, 'alpha', '--mesh', '8', '--kspacing', '0.1'], /^invalid --kspacing: "0\.1" \(give --mesh or --kspacing, not both\)/);
    }
    await refused(['rank', '--sites', '3', '--holes', '1', '--mesh', '8', '--kspacing', '0.1'], /^invalid --kspacing: "0\.1"/);
  });

  it('rank uses one density for every cell by default and reports each mesh', async () => {
    const { code, stdout } = await cli(['rank', '--sites', '3-9', '--holes', '1', '--isolated', '--json']);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document.mesh_rule).toBe('default_kspacing');
    expect(document.kspacing).toBe(DEFAULT_KSPACING);
    const meshes = document.groups.flatMap((g: { patterns: { mesh: number }[] }) => g.patterns.map((p) => p.mesh));
    expect(new Set(meshes).size).toBeGreaterThan(1); // cells of different size, different meshes
    const fixed = JSON.parse((await cli(['rank', '--sites', '3-4', '--holes', '1', '--mesh', '6', '--json'])).stdout);
    expect(fixed.mesh_rule).toBe('mesh');
    expect(fixed.groups[0].patterns[0].mesh).toBe(6);
  });

  it('rank echoes --sites as typed and says when there is nothing to rank', async () => {
    const { code, stdout } = await cli(['rank', '--sites', '3-4', '--holes', '5-6']);
    expect(code).toBe(0);
    expect(stdout).toBe('none: no pattern with atoms left for --sites 3-4 --holes 5-6\n');
  });
});

describe('feedback on long work', () => {
  it('--progress writes the estimate first and a closing line, one JSON object per line, on stderr only', async () => {
    const { code, stdout, stderr } = await cli(['fill', 'alpha', '--mesh', '6', '--json', '--progress']);
    expect(code).toBe(0);
    JSON.parse(stdout);
    const lines = stderr.trimEnd().split('\n').map((l) => JSON.parse(l));
    expect(lines[0]).toMatchObject({ job: 'fill', event: 'estimate', mesh: 6, kpoints: 36 });
    expect(lines.at(-1)).toMatchObject({ job: 'fill', event: 'done' });
  });

  it('enumerate --progress states structures, bytes and seconds before it lists', async () => {
    const { stderr } = await cli(['enumerate', '--sites', '1-6', '--holes', '0-6', '--jsonl', '--progress']);
    const first = JSON.parse(stderr.split('\n')[0]);
    expect(first).toMatchObject({ job: 'enumerate', event: 'estimate' });
    expect(first.structures).toBeGreaterThan(0);
    expect(first.bytes).toBeGreaterThan(0);
  });

  it('refuses a listing estimated above 250 MB, with the estimate and the ways out; a short job stays silent on a terminal', async () => {
    await refused(['enumerate', '--sites', '1-22', '--holes', '0-22', '--json'], /^invalid --sites: "1-22" \(about \d+ MB of output or more \(about [\d.e+]+ structures, .*--counts-only.*--shard, or add --allow-large-output\)/);
    const quiet = await cli(['fill', 'alpha', '--mesh', '4'], {}, true);
    expect(quiet.stderr).toBe('');
  });

  it('the size estimate is per shard', async () => {
    // 1-22 × 0-22 is estimated at about 650 MB; each of 8 shards at an eighth (checked on the estimate: the run
    // itself takes minutes).
    const { estimateEnumerate } = await import('../../src/cli/enumerateEstimate.ts');
    const whole = estimateEnumerate({ sites: [1, 22], holes: [0, 22] }, 'json');
    const part = estimateEnumerate({ sites: [1, 22], holes: [0, 22], shard: { index: 1, count: 8 } }, 'json');
    expect(part.bytes).toBeCloseTo(whole.bytes / 8, 0);
    expect(whole.bytes).toBeGreaterThan(250e6);
  });
});

describe('enumerate on an empty range', () => {
  it('says there are none and why, instead of a bare table header', async () => {
    const { code, stdout } = await cli(['enumerate', '--sites', '1-3', '--holes', '5-6']);
    expect(code).toBe(0);
    expect(stdout).toBe('none: a cell of N sites holds at most N holes, and --holes starts at 5 while --sites ends at 3\n');
    const json = JSON.parse((await cli(['enumerate', '--sites', '4-6', '--holes', '1-2', '--eta', '0.9-1', '--json'])).stdout);
    expect(json.counts).toEqual([]);
    expect(json.note).toMatch(/^none: no hole density k\/N/);
  });
});

describe('one name for one thing', () => {
  it('eta is the hole density in enumerate, bonding, rank, geometry and presets', async () => {
    expect(JSON.parse((await cli(['bonding', 'alpha', '--mesh', '6', '--json'])).stdout)).toHaveProperty('eta');
    expect(JSON.parse((await cli(['geometry', 'alpha', '--json'])).stdout)).toHaveProperty('eta');
    expect(JSON.parse((await cli(['presets', '--json'])).stdout).sheets[0]).toHaveProperty('eta');
    for (const command of [['bonding', 'alpha', '--mesh', '6'], ['geometry', 'alpha'], ['rank', '--sites', '3-4', '--holes', '1', '--mesh', '4']]) {
      expect((await cli([...command, '--json'])).stdout).not.toMatch(/hole_density/);
    }
  });

  it('holes is a count and parameters a set name everywhere', async () => {
    const geometry = JSON.parse((await cli(['geometry', 'alpha', '--json'])).stdout);
    expect(geometry.holes).toBeUndefined();
    expect(geometry.hole_clusters.hexagonal).toBe(1);
    const presets = JSON.parse((await cli(['presets', '--json'])).stdout);
    expect(presets.parameters).toBeUndefined();
    expect(presets.parameter_sets.map((p: { name: string }) => p.name)).toContain('harrison1980');
  });

  it('dos takes its energy grid as --energy-grid; --points belongs to the path of bands', async () => {
    const document = JSON.parse((await cli(['dos', 'alpha', '--mesh', '4', '--energy-grid', '11', '--json'])).stdout);
    expect(document.energy).toHaveLength(11);
    await refused(['dos', 'alpha', '--points', '11'], /^invalid --points: "--points" \(unknown option for dos/);
  });

  it('bands gives every path label its Cartesian k (β12: X along ky of its own frame)', async () => {
    const { stdout } = await cli(['bands', 'beta12', '--path', 'auto', '--points', '20', '--json']);
    const labels = JSON.parse(stdout).path.labels as { label: string; k: [number, number] }[];
    expect(labels[0]).toMatchObject({ label: 'Γ', k: [0, 0] });
    const x = labels.find((l) => l.label === 'X')!;
    // β12's own cell: first vector 1.69 Å along x... X = b/2 along the reciprocal of the long axis (geometry of the
    // rectangular cell √3d × 3d in the sheet's frame, Feng et al., Nat. Chem. 8, 563 (2016)): here along ky.
    expect(Math.abs(x.k[0])).toBeLessThan(1e-12);
    expect(Math.abs(x.k[1])).toBeGreaterThan(0);
    const text = (await cli(['bands', 'beta12', '--path', 'auto', '--points', '20'])).stdout;
    expect(text).toMatch(/path points in Cartesian Å⁻¹ .*Γ \(0\.0000, 0\.0000\), X \(0\.0000, \d\.\d{4}\)/);
  });
});

describe('messages', () => {
  it('a single-dash word is an unknown option, named', async () => {
    await refused(['fill', 'alpha', '-m', '12'], /^invalid -m: "-m" \(unknown option for fill; options are written --name; known: --params/);
  });

  it('a field error inside a parameter or sheet file names the file', async () => {
    const params = JSON.stringify({ name: 'x', source: 'y', onsite: { s: -1, p: 'a' }, hopping: { ss_sigma: -1, sp_sigma: 1, pp_sigma: 1, pp_pi: -1 }, d0: 1.69, exponent: 2, cutoff: 2 });
    await refused(['fill', 'alpha', '--params', 'p.json'], /^invalid onsite\.p: "a" \(expected a number; in the parameter file "p\.json"\)\n$/, { 'p.json': params });
    await refused(['fill', 's.json'], /^invalid vacancies\[0\]\[1\]: "a" \(.*; in the sheet file "s\.json"\)\n$/, { 's.json': '{"bond":1.69,"supercell":[[3,0],[0,3]],"vacancies":[[0,"a"]]}' });
  });

  it('one quoting rule: a command-line value is quoted as typed, whether it was read as text or as a number', async () => {
    for (const argv of [
      ['fill', 'alpha', '--mesh', 'many'], ['fill', 'alpha', '--mesh', '5000'], ['fill', 'alpha', '--kspacing', '0.1', '--mesh', '3'],
      ['enumerate', '--sites', '1-3', '--holes', '0', '--cell-tolerance', '1,1'], ['bands', 'alpha', '--kpoints', 'k.json', '--points', '3'],
      ['rank', '--sites', '1-36', '--holes', '1-36'], ['fill', 'nosuch'], ['nosuch'],
    ]) {
      const { stderr } = await cli(argv);
      expect(stderr, argv.join(' ')).toMatch(/^invalid \S+: "[^"]*" \(/);
    }
  });
});
