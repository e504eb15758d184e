/**
 * The layering of src/ (DEVELOPERS.md, "Layers"): every import goes from a module to the same or a lower layer,
 * and no file reaches itself through its imports. Regression guard of the project's own rule (no outside source):
 * it reads the import statements of every source file, and the checks are shown to fail on a made-up graph.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, normalize, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

const SRC = join(import.meta.dirname, '..', 'src');

/** Lowest first. Directories of one layer may import each other as long as no file cycle forms. */
const LAYERS: Record<string, number> = {
  validate: 0,
  lattice: 1,
  enumerate: 2,
  linalg: 2,
  tb: 3,
  substrate: 4,
  stm: 4,
  learn: 4,
  io: 5,
  figures: 6,
  cli: 7,
  app: 7,
  'index.ts': 8,
};

type ImportGraph = Map<string, string[]>;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) =>
    entry.isDirectory() ? sourceFiles(join(dir, entry.name)) : entry.name.endsWith('.ts') ? [join(dir, entry.name)] : []);
}

/** Relative imports of a file, as paths under src/: static, `export … from`, dynamic, and worker `new URL(…)`. */
function importsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  const found: string[] = [];
  for (const match of text.matchAll(/(?:from\s*|import\s*\(\s*|new URL\(\s*)['"](\.{1,2}\/[^'"]+)['"]/g)) {
    found.push(relative(SRC, normalize(join(dirname(file), match[1]))));
  }
  return found.filter((path) => !path.startsWith('..'));
}

const layerOf = (path: string): string => path.split('/')[0];

function upwardImports(graph: ImportGraph): string[] {
  const upward: string[] = [];
  for (const [file, targets] of graph) {
    for (const target of targets) if (LAYERS[layerOf(target)] > LAYERS[layerOf(file)]) upward.push(`${file} → ${target}`);
  }
  return upward;
}

/** Every cycle closed in a depth-first search (a node met again while still on the stack). */
function importCycles(graph: ImportGraph): string[] {
  const state = new Map<string, 'open' | 'done'>();
  const cycles: string[] = [];
  const stack: string[] = [];
  const visit = (file: string): void => {
    state.set(file, 'open');
    stack.push(file);
    for (const target of graph.get(file) ?? []) {
      if (state.get(target) === 'open') cycles.push([...stack.slice(stack.indexOf(target)), target].join(' → '));
      else if (!state.has(target)) visit(target);
    }
    stack.pop();
    state.set(file, 'done');
  };
  for (const file of graph.keys()) if (!state.has(file)) visit(file);
  return cycles;
}

const files = sourceFiles(SRC).map((file) => relative(SRC, file));
const graph: ImportGraph = new Map(files.map((file) => [file, importsOf(join(SRC, file))]));

describe('layers of src/', () => {
  it('every source directory has a layer', () => {
    expect([...new Set(files.map(layerOf))].filter((layer) => !(layer in LAYERS))).toEqual([]);
  });

  it('no import reaches a higher layer', () => {
    expect(upwardImports(graph)).toEqual([]);
  });

  it('no import cycle between files', () => {
    expect(importCycles(graph)).toEqual([]);
  });

  it('the reader finds imports, and both checks fail where they should', () => {
    expect(graph.get('tb/params.ts')).toContain('tb/paramsCheck.ts');
    expect(graph.get('app/main.ts')).toContain('app/worker/modelWorker.ts');
    const made: ImportGraph = new Map([['tb/a.ts', ['io/b.ts']], ['io/b.ts', ['tb/a.ts']]]);
    expect(upwardImports(made)).toEqual(['tb/a.ts → io/b.ts']);
    expect(importCycles(made)).toEqual(['tb/a.ts → io/b.ts → tb/a.ts']);
  });
});
