import { describe, expect, it } from 'vitest';
import { enumerateStructures } from '../../src/enumerate/index.ts';
import { patternToSheet } from '../../src/lattice/pattern.ts';
import { autoPath, computeBands, fill, findParameterPreset, TightBindingModel } from '../../src/tb/index.ts';

// The solver on every enumerated pattern, not only on the presets: every isolated-hole pattern of 3–10 sites with
// one to three holes, planar and buckled.
const PATTERNS = [...enumerateStructures({ sites: [3, 10], holes: [1, 3], isolated: true })];
const HARRISON = findParameterPreset('harrison1980')!;

describe('bands and filling of enumerated patterns', () => {
  it('covers a real set of patterns', () => {
    expect(PATTERNS.length).toBeGreaterThan(25);
  });

  it('counts 3 + δ electrons per atom at E_F (to 1e-10) and σ + π adds up, for every pattern', () => {
    for (const structure of PATTERNS) {
      const model = new TightBindingModel(patternToSheet(structure.pattern), HARRISON);
      for (const doping of [-0.3, 0, 0.4]) {
        const result = fill(model, { mesh: 6, doping });
        // Electron count: 3 valence electrons per B plus the doping (DESIGN.md conventions).
        expect(Math.abs(result.electronsPerAtom - (3 + doping))).toBeLessThan(1e-9);
        expect(result.sigmaElectronsPerAtom + result.piElectronsPerAtom).toBeCloseTo(3 + doping, 9);
      }
    }
  });

  it('gives ascending bands with σ weights in [0, 1] on the automatic path, planar and buckled', () => {
    for (const structure of PATTERNS.slice(0, 12)) {
      const planar = patternToSheet(structure.pattern);
      // Buckled: alternate atoms raised by ±0.2 Å, which mixes σ and π (weights strictly inside (0, 1) somewhere).
      const buckled = { ...planar, atoms: planar.atoms.map(([f1, f2], k) => [f1, f2, k % 2 ? 0.2 : -0.2] as [number, number, number]) };
      for (const sheet of [planar, buckled]) {
        const path = autoPath(sheet.cell, 30);
        const result = computeBands(new TightBindingModel(sheet, HARRISON), path.kpoints);
        expect(result.bands).toBe(4 * sheet.atoms.length);
        for (let k = 0; k < result.count; k++) {
          for (let b = 0; b < result.bands; b++) {
            const w = result.sigmaWeight[k * result.bands + b];
            expect(w).toBeGreaterThanOrEqual(-1e-12);
            expect(w).toBeLessThanOrEqual(1 + 1e-12);
            if (b > 0) expect(result.energies[k * result.bands + b]).toBeGreaterThanOrEqual(result.energies[k * result.bands + b - 1]);
          }
        }
      }
    }
  });
});

describe('a flat sheet at any height', () => {
  it('is planar (exact σ/π split: weights exactly 0 or 1), and its bands do not depend on the height', () => {
    const alpha = patternToSheet(enumerateStructures({ sites: [9, 9], holes: [1, 1], isolated: true }).next().value!.pattern);
    const raised = { ...alpha, atoms: alpha.atoms.map(([f1, f2]) => [f1, f2, 1] as [number, number, number]) };
    const model = new TightBindingModel(raised, HARRISON);
    expect(model.planar).toBe(true);
    const path = autoPath(alpha.cell, 20);
    const flat = computeBands(new TightBindingModel(alpha, HARRISON), path.kpoints);
    const high = computeBands(model, path.kpoints);
    for (const w of high.sigmaWeight) expect(w === 0 || w === 1).toBe(true);
    for (let i = 0; i < flat.energies.length; i++) expect(high.energies[i]).toBeCloseTo(flat.energies[i], 12);
  });
});
