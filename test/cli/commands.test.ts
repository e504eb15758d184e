import { describe, expect, it } from 'vitest';
import { cli, refused } from './runCommand.ts';



describe('lacuna enumerate', () => {
  it('--json prints the contract document: counts and structures with both sheet forms', async () => {
    const { code, stdout } = await cli(['enumerate', '--sites', '1-9', '--holes', '1', '--isolated', '--json']);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document.counts).toContainEqual({ sites: 9, holes: 1, structures: expect.any(Number) });
    const alpha = document.structures.find((s: { phase?: string }) => s.phase === 'alpha');
    // α sheet: 3×3 cell with one hole, η = 1/9, 8 atoms (Tang & Ismail-Beigi, PRL 99, 115501 (2007)).
    expect(alpha).toMatchObject({ sites: 9, holes: 1, supercell: [[3, 0], [0, 3]], vacancies: [[0, 0]] });
    expect(alpha.eta).toBeCloseTo(1 / 9, 12);
    expect(alpha.atoms).toHaveLength(8);
    expect(alpha.cell[0][0]).toBeCloseTo(3 * 1.69, 12);
    for (const s of document.structures) expect(Object.keys(s)).toEqual(expect.arrayContaining(['sites', 'holes', 'eta', 'supercell', 'vacancies', 'cell', 'atoms']));
  });

  it('--counts-only agrees with the listed count', async () => {
    const listed = JSON.parse((await cli(['enumerate', '--sites', '1-8', '--holes', '0-8', '--json'])).stdout);
    const counted = JSON.parse((await cli(['enumerate', '--sites', '1-8', '--holes', '0-8', '--counts-only', '--json'])).stdout);
    expect(counted.counts).toEqual(listed.counts);
    const total = listed.counts.reduce((sum: number, row: { structures: number }) => sum + row.structures, 0);
    expect(listed.structures).toHaveLength(total);
  });

  it('refuses missing and malformed flags with the field named', async () => {
    await refused(['enumerate', '--holes', '1'], /^invalid --sites: missing \(required/);
    await refused(['enumerate', '--sites', '0-4', '--holes', '1'], /^invalid --sites: "0-4" \("0": must be from 1 to 64\)/);
    await refused(['enumerate', '--sites', '4', '--holes', 'x'], /^invalid --holes: "x"/);
    await refused(['frobnicate'], /^invalid command: "frobnicate" \(unknown; commands: enumerate/);
  });
});

describe('lacuna bands / fill / export', () => {
  it('bands --path auto --json has kpoints, energies, sigma_weight and the path', async () => {
    const { code, stdout } = await cli(['bands', 'honeycomb', '--path', 'auto', '--points', '40', '--json']);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document.kpoints).toHaveLength(40);
    expect(document.energies).toHaveLength(40);
    expect(document.energies[0]).toHaveLength(8); // 2 atoms × (s, px, py, pz)
    expect(document.sigma_weight[0]).toHaveLength(8);
    expect(document.path.labels.map((l: { label: string }) => l.label)).toEqual(['Γ', 'M', 'K', 'Γ']);
    expect(document.path.distance).toHaveLength(40);
    expect(document.parameters).toBe('harrison1980');
    for (const row of document.energies) for (let b = 1; b < row.length; b++) expect(row[b]).toBeGreaterThanOrEqual(row[b - 1]);
  });

  it('bands --kpoints reads a k-points file and --csv writes the bands', async () => {
    const files = { 'k.json': JSON.stringify({ kpoints: [[0, 0], [0.5, 0.1]] }) };
    const { code, stdout, files: written } = await cli(['bands', 'delta6', '--kpoints', 'k.json', '--csv', 'out.csv', '--json'], files);
    expect(code).toBe(0);
    expect(JSON.parse(stdout).kpoints).toEqual([[0, 0], [0.5, 0.1]]);
    expect(String(written.get('out.csv')).split('\n')[0]).toBe('k_index,kx,ky,e1,e2,e3,e4,sigma1,sigma2,sigma3,sigma4');
  });

  it('fill --json has every contract field', async () => {
    const { code, stdout } = await cli(['fill', 'alpha', '--mesh', '12', '--json']);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    for (const key of ['fermi', 'electrons_per_atom', 'sigma_electrons_per_atom', 'pi_electrons_per_atom', 'band_energy_per_atom']) {
      expect(Number.isFinite(document[key])).toBe(true);
    }
    expect(document.electrons_per_atom).toBeCloseTo(3, 9); // neutral boron: 3 valence electrons (common practice)
    expect(document.sigma_electrons_per_atom + document.pi_electrons_per_atom).toBeCloseTo(3, 9);
  });

  it('export --own-cell keeps the sheet\'s own cell; the default is the reduced cell (β12: √3d × 3d, Feng et al. 2016)', async () => {
    const own = (await cli(['export', 'beta12', '--format', 'cif', '--own-cell'])).stdout;
    const reduced = (await cli(['export', 'beta12', '--format', 'cif'])).stdout;
    const length = (cif: string, axis: string) => Number(new RegExp(`_cell_length_${axis}\\s+([\\d.]+)`).exec(cif)![1]);
    // Own HNF cell rows (3, 0), (2, 2): |A1| = 3d, |A2| = |2a1 + 2a2| = 2√3·d, with d = 1.69 Å.
    expect(length(own, 'a')).toBeCloseTo(3 * 1.69, 5);
    expect(length(own, 'b')).toBeCloseTo(2 * Math.sqrt(3) * 1.69, 5);
    // Reduced (right-handed, so a and b may come in either order): the rectangle √3d × 3d.
    const sides = [length(reduced, 'a'), length(reduced, 'b')].sort((x, y) => x - y);
    expect(sides[0]).toBeCloseTo(Math.sqrt(3) * 1.69, 5);
    expect(sides[1]).toBeCloseTo(3 * 1.69, 5);
  });

  it('export writes a CIF with the IUCr core names', async () => {
    const { code, stdout } = await cli(['export', 'honeycomb', '--format', 'cif']);
    expect(code).toBe(0);
    for (const name of ['_cell_length_a', '_cell_length_b', '_cell_length_c', '_cell_angle_gamma', '_atom_site_fract_x', '_atom_site_fract_y', '_atom_site_fract_z']) {
      expect(stdout).toContain(name);
    }
  });

  it('refuses bad sheets, parameter sets, k-points and output paths with the field named', async () => {
    await refused(['fill', 'nosuch'], /^invalid SHEET: "nosuch" \(no such preset or file; presets: delta6, alpha/);
    await refused(['fill', 'bad.json'], /^invalid /, { 'bad.json': '{"cell": [[1, 0], [2, 0]], "atoms": [[0, 0]]}' });
    await refused(['fill', 'alpha', '--params', 'nosuch'], /^invalid --params: "nosuch" \(no such parameter set or file/);
    await refused(['fill', 'alpha', '--mesh', '0'], /^invalid --mesh: "0"/);
    await refused(['fill', 'alpha', '--doping', '-4'], /^invalid --doping: "-4"/);
    await refused(['bands', 'alpha'], /^invalid --path: missing/);
    await refused(['bands', 'alpha', '--kpoints', 'k.json'], /^invalid kpoints\[0\]\[1\]: "x"/, { 'k.json': '{"kpoints": [[0, "x"]]}' });
    await refused(['bands', 'alpha', '--path', 'auto', '--csv', '/readonly/x.csv'], /^invalid --csv: "\/readonly\/x.csv" \(cannot write the file: EACCES\)/);
    await refused(['export', 'alpha', '--format', 'pdb'], /^invalid --format: "pdb" \(must be one of cif, xyz, json\)/);
    await refused(['export', 'alpha', '--format', 'cif', '--vacuum', '0.1'], /^invalid --vacuum: 0.1 \(must be finite and at least the sheet's thickness/);
  });
});

describe('lacuna dos / bonding / rank', () => {
  it('dos --json integrates to 8 states per atom, σ to 6 and π to 2 (4 orbitals × 2 spins; common practice)', async () => {
    for (const method of ['gaussian', 'triangle']) {
      const { code, stdout } = await cli(['dos', 'beta12', '--mesh', '12', '--method', method, '--energy-grid', '4001', '--json']);
      expect(code).toBe(0);
      const dos = JSON.parse(stdout);
      const step = dos.energy[1] - dos.energy[0];
      const sum = (values: number[]) => values.reduce((s, v) => s + v, 0) * step;
      expect(sum(dos.total)).toBeCloseTo(8, 2);
      expect(sum(dos.sigma)).toBeCloseTo(6, 2);
      expect(sum(dos.pi)).toBeCloseTo(2, 2);
    }
  });

  it('bonding --json puts the counting rule beside the σ filling', async () => {
    const { code, stdout } = await cli(['bonding', 'chi3', '--mesh', '12', '--json']);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    // Counting rule at η = 1/5: δ = 8/(3·4/5) − 3 = 1/3 (analytic, from the rule's formula).
    expect(document.counting_rule.doping).toBeCloseTo(1 / 3, 12);
    expect(document.eta).toBeCloseTo(1 / 5, 12);
    expect(Number.isFinite(document.sigma_filling.sigma_capacity)).toBe(true);
    expect(Number.isFinite(document.sigma_filling.doping)).toBe(true);
  });

  it('rank --json groups patterns by η, lowest band energy first', async () => {
    const { code, stdout } = await cli(['rank', '--sites', '1-9', '--holes', '1', '--isolated', '--mesh', '8', '--json']);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document.note).toMatch(/not across η/);
    for (const group of document.groups) {
      expect(group.patterns[0].above_lowest).toBe(0);
      for (let i = 1; i < group.patterns.length; i++) expect(group.patterns[i].band_energy_per_atom).toBeGreaterThanOrEqual(group.patterns[i - 1].band_energy_per_atom);
    }
    // η of the one-hole patterns with N ≤ 9 sites: 1/N for N = 3…9 (1 and 2 sites have no isolated hole).
    expect(document.groups.map((g: { eta: number }) => g.eta)).toEqual([1 / 9, 1 / 8, 1 / 7, 1 / 6, 1 / 5, 1 / 4, 1 / 3]);
  });
});

describe('lacuna enumerate --cell', () => {
  it('finds β12 for a measured rectangular 5.1 × 2.95 Å cell (β12 on Ag(111): about 5.0 × 2.9 Å, Feng et al., Nat. Chem. 8, 563 (2016); from memory)', async () => {
    const { code, stdout } = await cli(['enumerate', '--sites', '1-12', '--holes', '1-3', '--isolated', '--cell', '5.1,2.95,90', '--json']);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document.structures.map((s: { phase?: string }) => s.phase)).toContain('beta12');
    for (const s of document.structures) {
      expect(Math.abs(s.lattice.b - 5.1)).toBeLessThanOrEqual(0.15);
      expect(Math.abs(s.lattice.a - 2.95)).toBeLessThanOrEqual(0.15);
    }
    const counted = JSON.parse((await cli(['enumerate', '--sites', '1-12', '--holes', '1-3', '--isolated', '--cell', '5.1,2.95,90', '--counts-only', '--json'])).stdout);
    expect(counted.counts).toEqual(document.counts);
  });

  it('refuses a flat cell and a tolerance without a cell', async () => {
    await refused(['enumerate', '--sites', '1-4', '--holes', '1', '--cell', '5,5,180'], /^invalid --cell: "5,5,180" \(γ must lie strictly between/);
    await refused(['enumerate', '--sites', '1-4', '--holes', '1', '--cell', '5,5'], /^invalid --cell: "5,5" \(needs 3 comma-separated numbers\)/);
    await refused(['enumerate', '--sites', '1-4', '--holes', '1', '--cell-tolerance', '0.1,2'], /^invalid --cell-tolerance: .* \(only with --cell\)/);
  });
});

describe('lacuna enumerate: limits', () => {
  it('refuses ranges that would not finish, with the estimate', async () => {
    await refused(['enumerate', '--sites', '1-64', '--holes', '0-64', '--counts-only'], /^invalid --sites: "1-64" \(about [\d.]+e\+\d+ structures with these --holes; narrow the ranges/);
  });

  it('counts the empty labeling at N = 1, k = 1 (one-hole counts = OEIS A003051, a(1) = 1) and marks it empty', async () => {
    const document = JSON.parse((await cli(['enumerate', '--sites', '1-3', '--holes', '0-3', '--json'])).stdout);
    expect(document.counts).toContainEqual({ sites: 1, holes: 1, structures: 1 });
    expect(document.counts).toContainEqual({ sites: 3, holes: 3, structures: 0 });
    const empty = document.structures.filter((s: { atoms: unknown[] }) => s.atoms.length === 0);
    expect(empty).toHaveLength(1);
    expect(empty[0]).toMatchObject({ sites: 1, holes: 1, empty: true });
  });
});

describe('tight-binding commands: limits', () => {
  it('refuses a job estimated at hours, naming the flag that sizes it and a value that fits', async () => {
    // 900 atoms on a 36×36 mesh: (2700³ + 900³) operations per k-point, about 10 h here.
    const atoms: number[][] = [];
    for (let i = 0; i < 30; i++) for (let j = 0; j < 30; j++) atoms.push([(i + 0.5) / 60, (j + 0.5) / 60]);
    const sheet = JSON.stringify({ cell: [[60 * 1.69, 0], [30 * 1.69, 30 * 1.69 * Math.sqrt(3)]], atoms });
    await refused(['fill', 'big.json', '--mesh', '36'], /^invalid --mesh: "36" \(about [\d.]+ h for 900 atoms per cell; --mesh \d+ fits in an hour\)/, { 'big.json': sheet });
    // A fine spacing is refused against --kspacing, with a coarser spacing that fits.
    await refused(['fill', 'big.json', '--kspacing', '0.005'], /^invalid --kspacing: "0\.005" \(about [\d.]+ (min|h|days) for 900 atoms per cell; --kspacing [\d.]+ fits in an hour\)/, { 'big.json': sheet });
    await refused(['bands', 'big.json', '--path', 'auto'], /^invalid --points: "300" \(about/, { 'big.json': sheet });
  });

  it('warns on stderr when no bond lies within the cutoff, and still answers', async () => {
    const params = JSON.stringify({ name: 'short', source: 'test', onsite: { s: -1, p: 1 }, hopping: { ss_sigma: -1, sp_sigma: 1, pp_sigma: 1, pp_pi: -1 }, d0: 1.69, exponent: 2, cutoff: 1 });
    const { code, stderr } = await cli(['fill', 'alpha', '--params', 'p.json', '--mesh', '4'], { 'p.json': params });
    expect(code).toBe(0);
    expect(stderr).toMatch(/^warning: no two atoms of alpha are closer than the cutoff 1 Å of short/);
  });
});

describe('lacuna geometry', () => {
  it('reads the α sheet: six 5-fold and two 6-fold atoms around one hexagonal hole (Tang & Ismail-Beigi, PRL 99, 115501 (2007))', async () => {
    const { code, stdout } = await cli(['geometry', 'alpha', '--json']);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document.coordination).toEqual({ '5': 6, '6': 2 });
    expect(document.hole_clusters.hexagonal).toBe(1);
    expect(document.phase).toBe('alpha');
    expect(document.eta).toBeCloseTo(1 / 9, 12);
  });

  it('recognises an exported χ3 as the same pattern (β12/χ3 of Feng et al., Nat. Chem. 8, 563 (2016): 4- and 5-fold atoms)', async () => {
    const exported = (await cli(['export', 'chi3', '--format', 'json'])).stdout;
    const document = JSON.parse((await cli(['geometry', 'chi3.json', '--json'], { 'chi3.json': exported })).stdout);
    expect(document.phase).toBe('chi3');
    expect(document.coordination).toEqual({ '4': 2, '5': 2 });
  });
});

describe('lacuna enumerate --jsonl and --shard', () => {
  it('shard outputs concatenate (cat) to the whole list, as a set', async () => {
    const whole = (await cli(['enumerate', '--sites', '1-10', '--holes', '1-3', '--isolated', '--jsonl'])).stdout;
    let parts = '';
    for (let i = 1; i <= 4; i++) parts += (await cli(['enumerate', '--sites', '1-10', '--holes', '1-3', '--isolated', '--shard', `${i}/4`, '--jsonl'])).stdout;
    const lines = (text: string) => text.trimEnd().split('\n').sort();
    expect(lines(parts)).toEqual(lines(whole));
    for (const line of lines(whole)) expect(JSON.parse(line).holes).toBeGreaterThan(0);
  });

  it('--eta keeps only the count rows whose k/N lies in the range', async () => {
    const document = JSON.parse((await cli(['enumerate', '--sites', '1-9', '--holes', '1-2', '--eta', '0.15-0.2', '--counts-only', '--json'])).stdout);
    for (const row of document.counts) {
      expect(row.holes / row.sites).toBeGreaterThanOrEqual(0.15 - 1e-12);
      expect(row.holes / row.sites).toBeLessThanOrEqual(0.2 + 1e-12);
    }
  });
});

describe('the README examples on the shipped demo files', () => {
  it('fill with the demo sheet and the demo parameter file works and names the set', async () => {
    const { readFileSync } = await import('node:fs');
    const files = {
      'presets/demo/hsl-0427-sheet.json': readFileSync('presets/demo/hsl-0427-sheet.json', 'utf8'),
      'presets/demo/hsl-fit-params.json': readFileSync('presets/demo/hsl-fit-params.json', 'utf8'),
    };
    const { code, stdout } = await cli(['fill', 'presets/demo/hsl-0427-sheet.json', '--params', 'presets/demo/hsl-fit-params.json', '--mesh', '8', '--json'], files);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document.parameters).toBe('demo-hsl-fit');
    expect(document.electrons_per_atom).toBeCloseTo(3, 9); // neutral: 3 valence electrons per B (common practice)
    expect(JSON.parse(files['presets/demo/hsl-fit-params.json']).source).toMatch(/^DEMO/);
    expect(JSON.parse(files['presets/demo/hsl-0427-sheet.json']).name).toMatch(/^DEMO/);
  });
});

describe('lacuna scan', () => {
  it('moves E_F with doping; the honeycomb at δ = 1 (the MgB2 count) sits at the Dirac point εp', async () => {
    const { code, stdout } = await cli(['scan', 'honeycomb', '--dopings', '0,1,0.25', '--mesh', '24', '--json']);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document.rows.map((r: { doping: number }) => r.doping)).toEqual([0, 0.25, 0.5, 0.75, 1]);
    for (let i = 1; i < document.rows.length; i++) expect(document.rows[i].fermi).toBeGreaterThan(document.rows[i - 1].fermi);
    // Nearest-neighbour honeycomb π band: ε ± t|1 + e^{ik·a1} + e^{ik·a2}|, zero gap at K at ε = εp (Wallace, Phys. Rev. 71, 622 (1947));
    // harrison1980 εp = −6.64 eV. The mesh (24, a multiple of 3) contains K, and the σ bonding bands lie below.
    expect(document.rows[4].fermi).toBeCloseTo(-6.64, 6);
    expect(document.rows[4].pi_electrons_per_atom).toBeCloseTo(1, 6);
  });

  it('refuses an empty or outside range', async () => {
    await refused(['scan', 'alpha', '--dopings', '1,0,0.1'], /^invalid --dopings: "1,0,0.1" \(δ2 must not be below δ1\)/);
    await refused(['scan', 'alpha', '--dopings', '0,1,0'], /^invalid --dopings: "0,1,0" \(the step must be positive\)/);
    await refused(['scan', 'alpha', '--dopings', '-3,1,0.5'], /^invalid --dopings: "-3,1,0.5" \(every δ must lie strictly between/);
  });
});

describe('output files', () => {
  it('are never replaced without --overwrite, and the refusal comes before any work', async () => {
    await refused(['export', 'alpha', '--format', 'cif', '--out', 'mine.cif'], /^invalid --out: "mine.cif" \(the file exists; add --overwrite to replace it\)/, { 'mine.cif': 'my notes' });
    await refused(['bands', 'alpha', '--path', 'auto', '--csv', 'mine.csv'], /^invalid --csv: "mine.csv" \(the file exists/, { 'mine.csv': 'my data' });
    const replaced = await cli(['export', 'alpha', '--format', 'cif', '--out', 'mine.cif', '--overwrite'], { 'mine.cif': 'my notes' });
    expect(replaced.code).toBe(0);
    expect(String(replaced.files.get('mine.cif'))).toContain('_cell_length_a');
  });
});
