/**
 * Process entry of the CLI (`npm run -s lacuna -- <command>`): wires the real stdout, stderr and file system.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { runCli } from './run.ts';

const chunks: string[] = [];
let pending = 0;

function out(text: string): void {
  // Batch small writes: enumerate streams many short pieces.
  chunks.push(text);
  pending += text.length;
  if (pending > 1 << 16) flush();
}

function flush(): void {
  if (chunks.length === 0) return;
  const text = chunks.join('');
  chunks.length = 0;
  pending = 0;
  writeFileSync(1, text);
}

const code = await runCli(
  process.argv.slice(2),
  {
    out,
    err: { isTTY: process.stderr.isTTY === true, write: (text) => process.stderr.write(text) },
    readText: (path) => (path === '-' ? readFileSync(0, 'utf8') : readFileSync(path, 'utf8')),
    writeFile: (path, data) => writeFileSync(path, data),
  },
  Boolean(process.env.LACUNA_DEBUG),
);
flush();
process.exitCode = code;
