/**
 * The k-point density rule (src/tb/meshDensity.ts) on the ranking it was made for: `rank --sites 1-20 --holes 1-2
 * --isolated` at the default k-spacing against the same ranking at mesh 36 for every cell (what rank did before).
 * Prints both times and the largest difference of band energy per atom; the targets (≤ 5 s, ≤ 1e-3 eV/atom) are
 * stated beside the figures, never asserted. Timed twice: in this thread (the core alone), and as the command a
 * user runs (`lacuna rank`, a new process, its threads on every core).
 */
import { spawnSync } from 'node:child_process';
import { cpus } from 'node:os';
import { join } from 'node:path';
import { enumerateStructures } from '../src/enumerate/index.ts';
import { DEFAULT_KSPACING, DEFAULT_PARAMETERS, fill, findParameterPreset, meshForSpacing, rankByBandEnergy, TightBindingModel, type ParameterSet, type RankingResult } from '../src/tb/index.ts';
import { patternToSheet } from '../src/lattice/pattern.ts';
import { reducedSheet } from '../src/lattice/reducedCell.ts';
import type { Pattern } from '../src/lattice/sheet.ts';

function patterns(): { name: string; pattern: Pattern }[] {
  const list: { name: string; pattern: Pattern }[] = [];
  for (const s of enumerateStructures({ sites: [1, 20], holes: [1, 2], isolated: true })) {
    if (s.sites === s.holes) continue;
    list.push({ name: s.canonical, pattern: s.pattern });
  }
  return list;
}

function energies(result: RankingResult): Map<string, { energy: number; mesh: number }> {
  const map = new Map<string, { energy: number; mesh: number }>();
  for (const g of result.groups) for (const p of g.patterns) map.set(p.name, { energy: p.bandEnergyPerAtom, mesh: p.mesh });
  return map;
}

/** Spacing of the converged reference (Å⁻¹), mesh side capped at 160. */
const CONVERGED_SPACING = 0.025;

function converged(pattern: Pattern, params: ParameterSet): number {
  const sheet = reducedSheet(patternToSheet(pattern));
  return fill(new TightBindingModel(sheet, params), { mesh: Math.min(160, meshForSpacing(sheet.cell, CONVERGED_SPACING)) }).bandEnergyPerAtom;
}

export async function benchMeshDensity(spacings: number[] = [DEFAULT_KSPACING]): Promise<void> {
  const params = findParameterPreset(DEFAULT_PARAMETERS)!;
  const list = patterns();
  let started = performance.now();
  const reference = energies(rankByBandEnergy(list, params, { mesh: 36 }));
  const referenceSeconds = (performance.now() - started) / 1000;
  console.log(`rank --sites 1-20 --holes 1-2 --isolated: ${list.length} patterns`);
  console.log(`  mesh 36 on every cell           ${referenceSeconds.toFixed(1)} s`);
  for (const spacing of spacings) {
    started = performance.now();
    const dense = energies(rankByBandEnergy(list, params, { kspacing: spacing }));
    const seconds = (performance.now() - started) / 1000;
    let worst = 0;
    let where = '';
    const far: string[] = [];
    let meshes = [Infinity, 0];
    for (const [name, r] of reference) {
      const d = dense.get(name)!;
      const diff = Math.abs(d.energy - r.energy);
      if (diff > worst) [worst, where] = [diff, `${name} (mesh ${d.mesh})`];
      if (diff > 5e-4) far.push(name);
      meshes = [Math.min(meshes[0], d.mesh), Math.max(meshes[1], d.mesh)];
    }
    console.log(`  k-spacing ${spacing} Å⁻¹ (meshes ${meshes[0]}–${meshes[1]})  ${seconds.toFixed(1)} s (target ≤ 5 s); largest band-energy difference ${worst.toExponential(2)} eV/atom (target ≤ 1e-3) at ${where}`);
    // Which side is off: both against a converged mesh, on the patterns where they differ by more than 5e-4 eV.
    let off36 = 0;
    let offDensity = 0;
    for (const name of far) {
      const best = converged(list.find((p) => p.name === name)!.pattern, params);
      off36 = Math.max(off36, Math.abs(reference.get(name)!.energy - best));
      offDensity = Math.max(offDensity, Math.abs(dense.get(name)!.energy - best));
    }
    if (spacing === DEFAULT_KSPACING) commandTiming(reference);
    if (far.length) console.log(`    on the ${far.length} patterns differing by > 5e-4 eV, against spacing ${CONVERGED_SPACING} Å⁻¹: mesh 36 off by ≤ ${off36.toExponential(2)}, k-spacing ${spacing} off by ≤ ${offDensity.toExponential(2)} eV/atom`);
  }
}

/** `lacuna rank …` as a user runs it, on every core; its band energies against the mesh-36 reference. */
function commandTiming(reference: Map<string, { energy: number; mesh: number }>): void {
  const bin = join(import.meta.dirname, '..', 'bin', 'lacuna.mjs');
  const started = performance.now();
  const run = spawnSync(process.execPath, [bin, 'rank', '--sites', '1-20', '--holes', '1-2', '--isolated', '--json'], { encoding: 'utf8', maxBuffer: 1 << 26 });
  const seconds = (performance.now() - started) / 1000;
  if (run.status !== 0) {
    console.log(`  lacuna rank failed: ${run.stderr.trim()}`);
    return;
  }
  const result = JSON.parse(run.stdout) as { groups: { patterns: { canonical: string; band_energy_per_atom: number }[] }[] };
  let worst = 0;
  let compared = 0;
  for (const p of result.groups.flatMap((g) => g.patterns)) {
    const r = reference.get(p.canonical);
    if (!r) continue;
    compared++;
    worst = Math.max(worst, Math.abs(p.band_energy_per_atom - r.energy));
  }
  if (compared !== reference.size) console.log(`  lacuna rank: ${compared} of ${reference.size} patterns found by canonical form`);
  console.log(`  lacuna rank (new process, ${cpus().length} cores)  ${seconds.toFixed(1)} s (target ≤ 5 s); largest band-energy difference from mesh 36 ${worst.toExponential(2)} eV/atom (target ≤ 1e-3)`);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  // `npx tsx bench/meshDensity.ts 0.12 0.08` compares other spacings too.
  const given = process.argv.slice(2).map(Number).filter((x) => x > 0);
  await benchMeshDensity(given.length ? given : undefined);
}
