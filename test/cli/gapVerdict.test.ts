import { describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/run.ts';
import { fakeIo } from './fakeIo.ts';

async function cli(argv: string[]) {
  const io = fakeIo();
  const code = await runCli(argv, io);
  return { code, stdout: io.stdout() };
}

describe('gap verdicts in the CLI', () => {
  it('fill honeycomb --mesh 35 --doping 1: a mesh gap, named so, with the crossing at K; no in_gap', async () => {
    // The π bands meet at K at εp = −6.64 eV (Wallace, Phys. Rev. 71, 622 (1947)); K is off a 35×35 mesh.
    const json = await cli(['fill', 'honeycomb', '--mesh', '35', '--doping', '1', '--json']);
    expect(json.code).toBe(0);
    const document = JSON.parse(json.stdout);
    expect(document.in_gap).toBeUndefined();
    expect(document.mesh_gap).toMatchObject({ crossing: { label: 'K', energy: expect.closeTo(-6.64, 9) } });
    expect(document.fermi).toBeCloseTo(-6.64, 9);
    const text = await cli(['fill', 'honeycomb', '--mesh', '35', '--doping', '1']);
    expect(text.stdout).toMatch(/gap of the 35×35 mesh only, not of the sheet/);
    expect(text.stdout).not.toMatch(/in a gap of the bands/);
  });

  it('fill honeycomb --mesh 35 (δ = 0): the σ/π gap is real and reported as in_gap', async () => {
    // π band bottom at Γ, εp + 3·Vppπ (Wallace 1947), above the filled σ bonding bands (common practice).
    const document = JSON.parse((await cli(['fill', 'honeycomb', '--mesh', '35', '--json'])).stdout);
    expect(document.mesh_gap).toBeUndefined();
    expect(document.in_gap.upper).toBeCloseTo(-6.64 + 3 * -2.161059 * (1.69 / 1.782) ** 2, 6);
  });

  it('bonding delta6 on defaults: the pseudogap where the two lowest σ bands meet, converged; no mesh-hole answer', async () => {
    const document = JSON.parse((await cli(['bonding', 'delta6', '--json'])).stdout);
    // Two σ electrons per atom in the lowest band of a one-atom cell (common practice).
    expect(document.sigma_filling.sigma_capacity).toBeCloseTo(2, 3);
    expect(document.sigma_filling.energy).toBeGreaterThan(-16.5);
    expect(document.sigma_filling.energy).toBeLessThan(-16.2);
    expect(document.convergence.converged).toBe(true);
    const text = (await cli(['bonding', 'delta6', '--mesh', '12'])).stdout;
    expect(text).toMatch(/NOT CONVERGED at mesh 12: .*try --mesh 24/);
  });
});
