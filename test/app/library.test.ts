import { describe, expect, it } from 'vitest';
import { emptyLibrary, libraryToJson, loadLibrary, mergeLibraries, parseLibrary, saveLibrary, STORAGE_KEY } from '../../src/app/library.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { PARAMETER_PRESETS } from '../../src/tb/params.ts';

class MemoryStorage {
  items = new Map<string, string>();
  get length() { return this.items.size; }
  clear() { this.items.clear(); }
  getItem(key: string) { return this.items.get(key) ?? null; }
  key(index: number) { return [...this.items.keys()][index] ?? null; }
  removeItem(key: string) { this.items.delete(key); }
  setItem(key: string, value: string) { this.items.set(key, value); }
}

describe('the library file', () => {
  it('round-trips sheets (both forms) and parameter sets', () => {
    const library = {
      sheets: [
        { label: 'stripe', pattern: findSheetPreset('beta12')!.pattern },
        { label: 'odd', sheet: { cell: [[3, 0], [0, 4]] as [[number, number], [number, number]], atoms: [[0, 0, 0], [0.5, 0.5, 0.3]] as [number, number, number][] } },
      ],
      parameterSets: [PARAMETER_PRESETS[1]],
    };
    const back = parseLibrary(libraryToJson(library));
    expect(back.sheets[0].pattern!.vacancies).toEqual(library.sheets[0].pattern!.vacancies);
    expect(back.sheets[1].sheet!.atoms).toEqual(library.sheets[1].sheet!.atoms);
    expect(back.parameterSets[0]).toEqual(PARAMETER_PRESETS[1]);
  });

  it('names the entry and field of a bad import', () => {
    const text = JSON.stringify({ lacuna_library: 1, sheets: [{ label: 'x', sheet: { bond: 1.69, supercell: [[2, 0], [0, 2]], vacancies: [[0, 0.5]] } }] });
    expect(() => parseLibrary(text)).toThrow(/^invalid sheets\[0\]\.sheet\.vacancies\[0\]\[1\]/);
    expect(() => parseLibrary('{"lacuna_library": 2}')).toThrow(/invalid lacuna_library: 2/);
    const params = JSON.stringify({ lacuna_library: 1, parameter_sets: [{ ...PARAMETER_PRESETS[0], d0: -1 }] });
    expect(() => parseLibrary(params)).toThrow(/^invalid parameter_sets\[0\]\.d0/);
  });

  it('merges by label and name, the incoming entry winning', () => {
    const a = { sheets: [{ label: 's', pattern: findSheetPreset('alpha')!.pattern }], parameterSets: [] };
    const b = { sheets: [{ label: 's', pattern: findSheetPreset('chi3')!.pattern }], parameterSets: [PARAMETER_PRESETS[0]] };
    const merged = mergeLibraries(a, b);
    expect(merged.sheets).toHaveLength(1);
    expect(merged.sheets[0].pattern).toBe(b.sheets[0].pattern);
    expect(merged.parameterSets).toHaveLength(1);
  });

  it('keeps an unreadable stored library under a backup key instead of losing it', () => {
    const storage = new MemoryStorage();
    storage.setItem(STORAGE_KEY, '{"lacuna_library": 1, "sheets": 5}');
    const { library, error } = loadLibrary(storage as unknown as Storage);
    expect(library).toEqual(emptyLibrary());
    expect(error?.message).toMatch(/^invalid sheets: 5/);
    expect([...storage.items.keys()].some((k) => k.startsWith(`${STORAGE_KEY}.unreadable.`))).toBe(true);
    saveLibrary(storage as unknown as Storage, emptyLibrary());
    expect(loadLibrary(storage as unknown as Storage).error).toBeUndefined();
  });
});
