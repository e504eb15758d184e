import { describe, expect, it } from 'vitest';
import { cli, refused } from './runCommand.ts';



describe('lacuna transfer', () => {
  it('--json carries every key of the DESIGN.md contract', async () => {
    const { code, stdout } = await cli(['transfer', 'chi3', '--substrate', 'ag111', '--mesh', '12', '--json']);
    expect(code).toBe(0);
    const d = JSON.parse(stdout);
    expect(d.eta).toBeCloseTo(1 / 5, 12);
    // counting rule at η = 1/5: δ = 8/(3·4/5) − 3 = 1/3 (the rule, analytic)
    expect(d.counting_rule.doping).toBeCloseTo(1 / 3, 12);
    expect(typeof d.sigma_filling.doping).toBe('number');
    expect(typeof d.alignment.electrons_per_atom).toBe('number');
    expect(typeof d.alignment.fermi_shift).toBe('number');
    expect(d.substrate).toMatchObject({ name: 'ag111', work_function: 4.74 });
  });

  it('no transfer when W_S + Δc equals the metal work function (the crossover of Giovannetti et al. 2008)', async () => {
    const d = JSON.parse((await cli(['transfer', 'beta12', '--substrate', 'au111', '--mesh', '6', '--sheet-work-function', '4.41', '--json'])).stdout);
    expect(Math.abs(d.alignment.electrons_per_atom)).toBeLessThan(1e-9);
    expect(Math.abs(d.alignment.fermi_shift)).toBeLessThan(1e-9);
  });

  it('metals of lower work function give more electrons (Giovannetti et al. 2008: the shift follows W_M)', async () => {
    const given = [];
    for (const metal of ['al111', 'ag111', 'cu111', 'au111']) {
      given.push(JSON.parse((await cli(['transfer', 'beta12', '--substrate', metal, '--mesh', '6', '--json'])).stdout).alignment.electrons_per_atom);
    }
    expect([...given].sort((a, b) => b - a)).toEqual(given);
  });

  it('the readable output says what the model is and is not', async () => {
    const { stdout } = await cli(['transfer', 'beta12', '--substrate', 'ag111', '--mesh', '6']);
    expect(stdout).toMatch(/Model estimates/);
    expect(stdout).toMatch(/not predictions/);
    expect(stdout).toMatch(/higher-level method/);
  });

  it('refuses bad input naming the flag', async () => {
    await refused(['transfer', 'beta12'], /^invalid --substrate: missing \(required; substrates: al111, ag111, cu111, au111\)/);
    await refused(['transfer', 'beta12', '--substrate', 'pt111'], /^invalid --substrate: "pt111" \(unknown substrate; substrates: al111, ag111, cu111, au111\)/);
    await refused(['transfer', 'beta12', '--substrate', 'ag111', '--distance', '2'], /^invalid --distance: 2 \(.*at least d0/);
    await refused(['transfer', 'beta12', '--substrate', 'ag111', '--d0', '4'], /^invalid --d0: 4 /);
    await refused(['transfer', 'beta12', '--substrate', 'ag111', '--sheet-work-function', '12'], /^invalid --sheet-work-function: "12"/);
  });
});

describe('lacuna fit', () => {
  it('--json carries every key of the DESIGN.md contract; β12 on Ag(111) first at 2 Ag atoms', async () => {
    const { code, stdout } = await cli(['fit', 'beta12', '--substrate', 'ag111', '--max-sites', '8', '--json']);
    expect(code).toBe(0);
    const d = JSON.parse(stdout);
    expect(d.substrate.name).toBe('ag111');
    expect(d.substrate.nn_distance).toBeCloseTo(4.0853 / Math.SQRT2, 12); // CRC Handbook a (from memory) / √2
    const [best] = d.matches;
    expect(Object.keys(best)).toEqual(expect.arrayContaining(['angle_deg', 'strain', 'sheet_supercell', 'substrate_supercell', 'sites']));
    expect(best.sites).toBe(2);
    // 1 − a_Ag/(√3·1.69 Å), analytic for the preset bond
    expect(best.strain).toBeCloseTo(1 - 4.0853 / Math.SQRT2 / (Math.sqrt(3) * 1.69), 10);
  });

  it('honeycomb (MgB2 bond) on Al(111): the 1×1 cell reported by Li et al., Sci. Bull. 2018, at the MgB2/Al mismatch (from memory; strain analytic)', async () => {
    const d = JSON.parse((await cli(['fit', 'honeycomb', '--substrate', 'al111', '--max-strain', '0.1', '--max-sites', '1', '--json'])).stdout);
    expect(d.matches).toHaveLength(1);
    expect(d.matches[0].sites).toBe(1);
    expect(d.matches[0].strain).toBeCloseTo(1 - 4.0495 / Math.SQRT2 / (Math.sqrt(3) * 1.782), 10);
  });

  it('refuses an out-of-range strain or size naming the flag', async () => {
    await refused(['fit', 'beta12', '--substrate', 'ag111', '--max-strain', '0'], /^invalid --max-strain: "0"/);
    await refused(['fit', 'beta12', '--substrate', 'ag111', '--max-sites', '1000'], /^invalid --max-sites: "1000"/);
    await refused(['fit', 'beta12', '--substrate', 'xx'], /^invalid --substrate: "xx" \(unknown substrate; substrates: /);
  });
});

describe('lacuna metals', () => {
  it('--json gives the curve, one point per named sheet with each metal, and the observed facts', async () => {
    const { code, stdout } = await cli(['metals', '--mesh', '6', '--json']);
    expect(code).toBe(0);
    const d = JSON.parse(stdout);
    expect(d.points.map((p: { name: string }) => p.name)).toEqual(['delta6', 'alpha', 'beta12', 'chi3', 'honeycomb']);
    for (const p of d.points) expect(Object.keys(p.alignment).sort()).toEqual(['ag111', 'al111', 'au111', 'cu111']);
    // counting-rule curve: δ(0) = −1/3, δ(1/3) = 1 (the rule, analytic)
    expect(d.curve[0].eta).toBe(0);
    expect(d.curve[0].doping).toBeCloseTo(-1 / 3, 14);
    expect(d.observed.map((o: { substrate: string }) => o.substrate)).toEqual(['al111', 'ag111']);
  });

  it('refuses --holes without --sites', async () => {
    await refused(['metals', '--holes', '1-2'], /^invalid --sites: missing \(required with --holes/);
  });
});
