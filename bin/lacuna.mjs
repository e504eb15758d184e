#!/usr/bin/env node
// Runs the CLI: the bundle in dist/cli when it is newer than every source it was built from, otherwise the
// TypeScript sources through tsx (so an edit is never hidden behind a stale build). A worker thread started by
// the CLI itself (src/cli/threads.ts) runs the same way, with the shard entry in place of the command line.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { isMainThread, workerData } from 'node:worker_threads';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const shard = !isMainThread && workerData?.lacunaShard === true;
const bundle = join(root, 'dist', 'cli', shard ? 'shard.js' : 'lacuna.js');
const source = join(root, 'src', 'cli', shard ? 'shardWorker.ts' : 'main.ts');

function newestSource(folder) {
  let newest = 0;
  for (const entry of readdirSync(folder, { withFileTypes: true })) {
    const path = join(folder, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestSource(path) : statSync(path).mtimeMs);
  }
  return newest;
}

const fresh = existsSync(bundle) && statSync(bundle).mtimeMs >= Math.max(newestSource(join(root, 'src')), newestSource(join(root, 'presets')));
if (fresh) {
  await import(pathToFileURL(bundle).href);
} else {
  const { register } = await import('tsx/esm/api');
  register();
  await import(pathToFileURL(source).href);
}
