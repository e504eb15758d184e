/**
 * Process entry of the CLI (`npm run -s lacuna -- <command>`): wires the real stdout, stderr and file system.
 */
import { existsSync, readFileSync, writeFileSync, writeSync } from 'node:fs';
import { runCli } from './run.ts';

const chunks: string[] = [];
let pending = 0;

function out(text: string): void {
  // Batch small writes: enumerate streams many short pieces.
  chunks.push(text);
  pending += text.length;
  if (pending > 1 << 16) flush();
}

const pause = new Int32Array(new SharedArrayBuffer(4));

/**
 * Writes everything to stdout synchronously (memory stays flat while enumerate streams). A pipe whose reader
 * lags makes non-blocking stdout answer EAGAIN or write part of the buffer: wait a millisecond and go on.
 */
function writeAll(bytes: Uint8Array): void {
  let offset = 0;
  while (offset < bytes.length) {
    try {
      offset += writeSync(1, bytes, offset, bytes.length - offset);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EAGAIN') throw error;
      Atomics.wait(pause, 0, 0, 1);
    }
  }
}

function flush(): void {
  if (chunks.length === 0) return;
  const text = chunks.join('');
  chunks.length = 0;
  pending = 0;
  writeAll(Buffer.from(text, 'utf8'));
}

const code = await runCli(
  process.argv.slice(2),
  {
    out,
    err: { isTTY: process.stderr.isTTY === true, write: (text) => process.stderr.write(text) },
    readText: (path) => (path === '-' ? readFileSync(0, 'utf8') : readFileSync(path, 'utf8')),
    readBytes: (path) => new Uint8Array(path === '-' ? readFileSync(0) : readFileSync(path)),
    writeFile: (path, data) => writeFileSync(path, data),
    exists: (path) => existsSync(path),
  },
  Boolean(process.env.LACUNA_DEBUG),
);
flush();
process.exitCode = code;
