import { expect } from 'vitest';
import { runCli } from '../../src/cli/run.ts';
import { fakeIo } from './fakeIo.ts';

/** Runs one CLI command in-process on an in-memory file system; `tty` makes stderr a terminal. */
export async function cli(argv: string[], files: Record<string, string | Uint8Array> = {}, tty = false) {
  const io = fakeIo(files);
  io.err.isTTY = tty;
  const code = await runCli(argv, io);
  return { code, stdout: io.stdout(), stderr: io.stderr(), files: io.files };
}

/** Every error path: exit 2, exactly one line on stderr in the project's error form, nothing on stdout. */
export async function refused(argv: string[], pattern: RegExp, files: Record<string, string | Uint8Array> = {}) {
  const result = await cli(argv, files);
  expect(result.code).toBe(2);
  expect(result.stdout).toBe('');
  expect(result.stderr).toMatch(/^invalid [^\n]+\n$/);
  expect(result.stderr).toMatch(pattern);
}
