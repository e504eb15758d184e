/** Shared by the figure tests: presets prepared once per file, a headless document, golden-file comparison. */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';
import { prepareEtaDelta, prepareSheet, prepareSpectra } from '../../src/figures/prepare.ts';
import { headlessDocument } from '../../src/figures/headless.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { findParameterPreset, type ParameterSet } from '../../src/tb/params.ts';
import type { EnergyHullData, EtaDeltaData, SheetData, SpectraData } from '../../src/figures/types.ts';
import { expandEnergies } from '../../src/learn/expansion/expand.ts';
import { prepareEnergyHull } from '../../src/figures/prepareEnergyHull.ts';
import { parseEnergiesText } from '../../src/io/energiesFile.ts';
import { SHEET_PRESETS } from '../../src/lattice/presets.ts';
import { dopingMap } from '../../src/substrate/dopingMap.ts';
import { SUBSTRATES } from '../../src/substrate/substrates.ts';

export const GOLDEN = join(dirname(fileURLToPath(import.meta.url)), 'golden');
export const PARAMS = findParameterPreset('harrison1980') as ParameterSet;
export const document = headlessDocument();

/** A preset's sheet data (its smallest cell) and spectra on a small mesh and a short path (fast tests). */
export function preset(name: string, options: { mesh?: number; pathPoints?: number } = {}): { sheet: SheetData; spectra: SpectraData } {
  const found = findSheetPreset(name);
  if (!found) throw new Error(`no preset ${name}`);
  const sheet = prepareSheet({ label: name, pattern: found.pattern }, { bondCutoff: PARAMS.cutoff, repeats: [3, 3] });
  const spectra = prepareSpectra(sheet.sheet, PARAMS, { label: name, mesh: options.mesh ?? 12, pathPoints: options.pathPoints ?? 60 });
  return { sheet, spectra };
}

/**
 * Golden files are regression guards (not outside references): a change of the drawing shows up as a diff to look
 * at. A mismatch writes `<name>.actual.svg` beside the golden file and fails; LACUNA_UPDATE_GOLDEN=1 accepts the
 * new drawing; a missing golden file fails under CI and is written otherwise.
 */
export function matchesGolden(name: string, actual: string): void {
  const file = join(GOLDEN, `${name}.svg`);
  if (!existsSync(file)) {
    if (process.env.CI) throw new Error(`golden file ${name}.svg is missing (write it locally and commit it)`);
    writeFileSync(file, actual);
  } else if (process.env.LACUNA_UPDATE_GOLDEN) {
    writeFileSync(file, actual);
  }
  const expected = readFileSync(file, 'utf8');
  if (actual !== expected) writeFileSync(join(GOLDEN, `${name}.actual.svg`), actual);
  expect(actual === expected, `${name}.svg differs from the drawing; see ${name}.actual.svg beside it`).toBe(true);
}

/** The η–δ data of the named sheets on the four metals, on a small mesh (fast tests), with alpha as the page's sheet. */
export function presetEtaDelta(): EtaDeltaData {
  const map = dopingMap(SHEET_PRESETS.map((p) => ({ name: p.name, pattern: p.pattern })), { substrates: SUBSTRATES, parameters: PARAMS, mesh: 12 });
  return prepareEtaDelta(map, { label: 'alpha', eta: 1 / 9 });
}

/** The energy–η data of the DEMO energies with the isolated patterns up to 9 sites predicted (small and fast). */
export function demoEnergyHull(): EnergyHullData {
  const file = parseEnergiesText(readFileSync('presets/demo/hsl-energies.json', 'utf8'));
  return prepareEnergyHull(expandEnergies(file.structures, { predict: { sites: [1, 9], holes: [0, 3], isolated: true } }), file);
}
