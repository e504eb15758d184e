/**
 * Process entry of the CLI (`npm run -s lacuna -- <command>`): wires the real stdout, stderr and file system.
 */
import { existsSync, readFileSync, renameSync, rmSync, writeFileSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { PIPE_CLOSED_STATUS, PipeClosed } from './io.ts';
import { runCli } from './run.ts';

const chunks: string[] = [];
let pending = 0;
let lastFlush = performance.now();
/** Set once the reader of stdout has gone: later output is dropped and the command is stopped. */
let closed = false;

/** Longest a piece of output waits in the batch, so a slow stream still reaches its reader (and finds it gone). */
const FLUSH_MS = 100;

function out(text: string): void {
  if (closed) throw new PipeClosed();
  // Batch small writes: enumerate streams many short pieces.
  chunks.push(text);
  pending += text.length;
  if (pending > 1 << 16 || performance.now() - lastFlush > FLUSH_MS) flush();
}

const pause = new Int32Array(new SharedArrayBuffer(4));

/**
 * Writes everything to stdout synchronously (memory stays flat while enumerate streams). A pipe whose reader
 * lags makes non-blocking stdout answer EAGAIN or write part of the buffer: wait a millisecond and go on. A
 * reader that has gone (EPIPE) ends the command through PipeClosed.
 */
function writeAll(bytes: Uint8Array): void {
  let offset = 0;
  while (offset < bytes.length) {
    try {
      offset += writeSync(1, bytes, offset, bytes.length - offset);
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code;
      if (code === 'EPIPE') {
        closed = true;
        throw new PipeClosed();
      }
      if (code !== 'EAGAIN') throw error;
      Atomics.wait(pause, 0, 0, 1);
    }
  }
}

function flush(): void {
  lastFlush = performance.now();
  if (chunks.length === 0 || closed) return;
  const text = chunks.join('');
  chunks.length = 0;
  pending = 0;
  writeAll(Buffer.from(text, 'utf8'));
}

/** Writes to a temporary name beside the target, then renames: an interrupted run leaves no half-written file. */
function writeWhole(path: string, data: string | Uint8Array): void {
  const temporary = join(dirname(path), `.${basename(path)}.${process.pid}.part`);
  try {
    writeFileSync(temporary, data);
    renameSync(temporary, path);
  } catch (error) {
    rmSync(temporary, { force: true });
    throw error;
  }
}

// A closed stderr (`2>&1 | head`) must not crash the process either.
process.stderr.on('error', () => {});

let code = await runCli(
  process.argv.slice(2),
  {
    out,
    err: { isTTY: process.stderr.isTTY === true, write: (text) => process.stderr.write(text) },
    readText: (path) => (path === '-' ? readFileSync(0, 'utf8') : readFileSync(path, 'utf8')),
    readBytes: (path) => new Uint8Array(path === '-' ? readFileSync(0) : readFileSync(path)),
    writeFile: writeWhole,
    exists: (path) => existsSync(path),
  },
  Boolean(process.env.LACUNA_DEBUG),
);
try {
  flush();
} catch (error) {
  if (!(error instanceof PipeClosed)) throw error;
  code = PIPE_CLOSED_STATUS;
}
process.exitCode = code;
