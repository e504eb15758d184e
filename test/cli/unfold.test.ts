/**
 * `lacuna unfold` (DESIGN.md contract): the JSON document, the CSV files, and the refusals. The physics is checked
 * against outside sources in test/tb/unfold.test.ts; here the command's wiring, against the other commands and
 * against facts that any correct output must show.
 */
import { describe, expect, it } from 'vitest';
import { cli, refused } from './runCommand.ts';

const json = async (argv: string[], files: Record<string, string> = {}) => {
  const result = await cli(argv, files);
  expect(result.stderr).toBe('');
  expect(result.code).toBe(0);
  return { document: JSON.parse(result.stdout), files: result.files };
};

describe('lacuna unfold', () => {
  it('--path auto --json: kpoints, energies ascending, one weight per energy, the path Γ–M–K–Γ; the sum rule holds', async () => {
    const { document } = await json(['unfold', 'beta12', '--path', 'auto', '--points', '25', '--json']);
    expect(Object.keys(document)).toEqual(expect.arrayContaining(['kpoints', 'energies', 'weights', 'path']));
    expect(document.kpoints).toHaveLength(25);
    expect(document.path.labels.map((l: { label: string }) => l.label)).toEqual(['Γ', 'M', 'K', 'Γ']);
    expect(document.path.distance).toHaveLength(25);
    // β12: 5 atoms on 6 sites (Feng et al., Nat. Chem. 8, 563 (2016)): η = 1/6.
    expect(document).toMatchObject({ atoms: 5, sites: 6, parameters: 'harrison1980', sheet: 'beta12' });
    for (let k = 0; k < 25; k++) {
      const energies: number[] = document.energies[k];
      const weights: number[] = document.weights[k];
      expect(energies).toHaveLength(20);
      expect(weights).toHaveLength(20);
      for (let n = 1; n < 20; n++) expect(energies[n]).toBeGreaterThanOrEqual(energies[n - 1]);
      // Completeness: Σ_n W_n = 4(1 − η) (src/tb/unfold.ts).
      expect(Math.abs(weights.reduce((a, b) => a + b, 0) - 4 * (5 / 6))).toBeLessThan(1e-10);
    }
    // The primitive K of the triangular lattice at |K| = 4π/(3d) (common practice), d = 1.69 Å.
    const K = document.path.labels[2].k;
    expect(Math.hypot(K[0], K[1])).toBeCloseTo((4 * Math.PI) / (3 * 1.69), 10);
  });

  it('--kpoints FILE: the file\'s points as given; a defect-free supercell carries weight 1 exactly on the bands of `bands delta6`', async () => {
    const file = JSON.stringify({ kpoints: [[0.1, 0.2], [1.3, -0.7], [2.0, 0.5]] });
    const sheet = JSON.stringify({ bond: 1.69, supercell: [[2, 0], [1, 2]], vacancies: [] });
    const { document } = await json(['unfold', sheet, '--kpoints', 'k.json', '--json'], { 'k.json': file });
    const primitive = JSON.parse((await cli(['bands', 'delta6', '--kpoints', 'k.json', '--json'], { 'k.json': file })).stdout);
    expect(document.kpoints).toEqual(JSON.parse(file).kpoints);
    expect(document.path).toBeUndefined();
    for (let k = 0; k < 3; k++) {
      const strong = document.energies[k].filter((_: number, n: number) => document.weights[k][n] > 0.5);
      expect(strong).toHaveLength(4);
      strong.forEach((e: number, i: number) => expect(e).toBeCloseTo(primitive.energies[k][i], 9));
    }
  });

  it('an explicit sheet is unfolded in its own frame: the pattern turned by 20° gives the same weights at k turned by 20°', async () => {
    const c = Math.cos(Math.PI / 9), s = Math.sin(Math.PI / 9);
    const d = 1.69;
    // α as an explicit sheet: the 3×3 cell with the hole at the origin (its pattern, written out by hand).
    const turn = ([x, y]: number[]) => [c * x - s * y, s * x + c * y];
    const atoms: number[][] = [];
    for (let j = 0; j < 3; j++) for (let i = 0; i < 3; i++) if (i || j) atoms.push([i / 3, j / 3, 0]);
    const explicit = JSON.stringify({ cell: [turn([3 * d, 0]), turn([1.5 * d, 1.5 * Math.sqrt(3) * d])], atoms });
    const k = [[0.4, 0.9], [-1.1, 0.3]];
    const plain = await json(['unfold', 'alpha', '--kpoints', 'k.json', '--json'], { 'k.json': JSON.stringify({ kpoints: k }) });
    const turned = await json(['unfold', explicit, '--kpoints', 't.json', '--json'], { 't.json': JSON.stringify({ kpoints: k.map(turn) }) });
    for (let q = 0; q < 2; q++) {
      plain.document.energies[q].forEach((e: number, n: number) => expect(turned.document.energies[q][n]).toBeCloseTo(e, 9));
    }
    // Degenerate states may share their weight differently: compare the weight summed per energy.
    const perEnergy = (doc: { energies: number[][]; weights: number[][] }, q: number) => {
      const sums = new Map<string, number>();
      doc.energies[q].forEach((e, n) => sums.set(e.toFixed(6), (sums.get(e.toFixed(6)) ?? 0) + doc.weights[q][n]));
      return [...sums.values()];
    };
    for (let q = 0; q < 2; q++) {
      perEnergy(plain.document, q).forEach((w, i) => expect(perEnergy(turned.document, q)[i]).toBeCloseTo(w, 9));
    }
    const turnedPath = await json(['unfold', explicit, '--path', 'auto', '--points', '4', '--json']);
    expect(turnedPath.document.path.labels[2].k[0]).toBeCloseTo(c * (4 * Math.PI) / (3 * d), 9);
  });

  it('the honeycomb: the π bands cross two thirds of the way from Γ to M of the triangular zone', async () => {
    // Derivation and the analytic checks: test/tb/unfold.test.ts (Wallace 1947).
    const { document } = await json(['unfold', 'honeycomb', '--path', 'auto', '--points', '301', '--json']);
    const m = document.path.labels[1].index;
    const piGap = (k: number) => {
      const pi = document.energies[k].filter((_: number, n: number) => document.weights_sigma[k][n] === 0 && document.weights[k][n] >= 0);
      return pi[1] - pi[0];
    };
    let best = 0;
    for (let k = 0; k < 301; k++) if (piGap(k) < piGap(best)) best = k;
    expect(Math.abs(best - (2 / 3) * m)).toBeLessThanOrEqual(1);
  });

  it('--spectral writes A(k, E) per k and energy; --cut writes the cut at E_F of `fill`, over the zone', async () => {
    const { document, files } = await json(['unfold', 'chi3', '--path', 'auto', '--points', '8', '--spectral', 'a.csv', '--energy-grid', '50', '--cut', 'c.csv', '--cut-points', '21', '--json']);
    const spectral = (files.get('a.csv') as string).trim().split('\n');
    expect(spectral[0]).toBe('k_index,kx,ky,distance,energy_eV,total,sigma,pi');
    expect(spectral).toHaveLength(1 + 8 * 50);
    const cut = (files.get('c.csv') as string).trim().split('\n');
    expect(cut[0]).toBe('kx,ky,total,sigma,pi');
    expect(cut.length - 1).toBe(document.cut.points);
    // The cut's E_F is the one `fill` computes for the same sheet, parameters, mesh and width.
    const fill = JSON.parse((await cli(['fill', 'chi3', '--json'])).stdout);
    expect(document.cut.fermi).toBe(fill.fermi);
    expect(document.cut).toMatchObject({ relative: 0, mesh: fill.mesh, smearing: 0.1 });
    // Every value finite and σ + π = total.
    for (const line of cut.slice(1)) {
      const [, , total, sigma, pi] = line.split(',').map(Number);
      expect(Math.abs(sigma + pi - total)).toBeLessThan(1e-12);
    }
  });

  it('prints a text summary with the sum rule, the states at Γ, M, K and the model caveat', async () => {
    const { code, stdout } = await cli(['unfold', 'alpha', '--path', 'auto', '--points', '10']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^alpha: 8 atoms on 9 sites of the triangular lattice/);
    expect(stdout).toMatch(/sum rule: Σ_n W_n\(k\) = 4\(1 − η\) = 3\.555556/);
    expect(stdout).toMatch(/at M, states of weight/);
    expect(stdout).toMatch(/not a prediction/);
  });

  it('refuses a sheet off the triangular lattice, naming SHEET and why, and bad flag combinations', async () => {
    await refused(['unfold', '{"cell": [[2, 0], [0, 2]], "atoms": [[0, 0]]}', '--path', 'auto'], /^invalid SHEET: "inline JSON" \(its atoms do not sit on the sites of one triangular lattice/);
    await refused(['unfold', 'sq.json', '--path', 'auto'], /^invalid SHEET: "sq.json" \(its atoms do not sit/, { 'sq.json': '{"cell": [[3, 0], [0, 3]], "atoms": [[0, 0], [0.5, 0.5]]}' });
    await refused(['unfold', 'alpha'], /^invalid --path: missing \(give --path auto or --kpoints FILE\)/);
    await refused(['unfold', 'alpha', '--path', 'auto', '--kpoints', 'k.json'], /^invalid --kpoints: "k.json" \(give either --kpoints or --path auto, not both\)/);
    await refused(['unfold', 'alpha', '--points', '9', '--kpoints', 'k.json'], /^invalid --points: "9" \(only with --path auto\)/);
    await refused(['unfold', 'alpha', '--kpoints', 'k.json'], /^invalid --kpoints: "k.json" \(cannot read the file\)/);
    await refused(['unfold', 'alpha', '--path', 'auto', '--points', '3'], /^invalid --points: 3 \(need an integer of at least 4/);
    await refused(['unfold', 'alpha', '--path', 'auto', '--energy-grid', '9'], /^invalid --energy-grid: "9" \(only with --spectral\)/);
    await refused(['unfold', 'alpha', '--path', 'auto', '--cut-energy', '-1'], /^invalid --cut-energy: "-1" \(only with --cut\)/);
    await refused(['unfold', 'alpha', '--path', 'auto', '--smearing', '0.2'], /^invalid --smearing: "0.2" \(only with --spectral or --cut\)/);
    await refused(['unfold', 'alpha', '--path', 'auto', '--spectral', 'x.csv', '--cut', 'x.csv'], /^invalid --cut: "x.csv" \(the same file as --spectral\)/);
    await refused(['unfold', 'alpha', '--path', 'auto', '--spectral', 'old.csv'], /^invalid --spectral: "old.csv" \(the file exists; add --overwrite/, { 'old.csv': 'kept' });
    await refused(['unfold', 'alpha', '--kpoints', 'k.json'], /^invalid kpoints\[0\]\[1\]: "y" \(not a finite number; in the k-points file "k.json"\)/, { 'k.json': '{"kpoints": [[0, "y"]]}' });
  });
});

describe('lacuna plot --figure unfolded | cut', () => {
  it('draws both pictures with E_F from `fill`, the part and the cut energy on the svg', async () => {
    const fill = JSON.parse((await cli(['fill', 'alpha', '--json'])).stdout);
    const unfolded = await json(['plot', 'alpha', '--figure', 'unfolded', '--points', '40', '--part', 'sigma', '--svg', 'u.svg', '--json']);
    expect(unfolded.document).toMatchObject({ figure: 'unfolded', fermi: fill.fermi, sheet: 'alpha', parameters: 'harrison1980' });
    const svg = String(unfolded.files.get('u.svg'));
    expect(svg).toMatch(/data-figure="unfolded"/);
    expect(svg).toMatch(/data-part="sigma"/);
    expect(svg).toMatch(/data:image\/png;base64,/);
    const cut = await json(['plot', 'alpha', '--figure', 'cut', '--cut-points', '15', '--cut-energy', '-0.5', '--svg', 'c.svg', '--json']);
    expect(cut.document.fermi).toBe(fill.fermi);
    expect(String(cut.files.get('c.svg'))).toContain(`data-cut-energy="${fill.fermi - 0.5}"`);
  });

  it('refuses the unfolding flags with other figures, --points with the cut, and a sheet off the lattice', async () => {
    await refused(['plot', 'alpha', '--figure', 'bands', '--cut-energy', '1', '--svg', 'b.svg'], /^invalid --cut-energy: "1" \(only for --figure cut\)/);
    await refused(['plot', 'alpha', '--figure', 'bands', '--part', 'pi', '--svg', 'b.svg'], /^invalid --part: "pi" \(only for --figure unfolded or cut\)/);
    await refused(['plot', 'alpha', '--figure', 'cut', '--points', '50', '--svg', 'c.svg'], /^invalid --points: "50" \(not used by the cut figure/);
    await refused(['plot', '{"cell": [[2, 0], [0, 2]], "atoms": [[0, 0]]}', '--figure', 'unfolded', '--svg', 'u.svg'], /^invalid SHEET: "inline JSON" \(its atoms do not sit/);
  });
});
