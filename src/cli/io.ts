/**
 * What a command may touch of the outside world. The real process supplies it in main.ts; tests supply a fake,
 * so every command runs in-process under test.
 */
import { ValidationError } from '../io/invalid.ts';
import type { ProgressSink } from './progress.ts';

export interface CliIo {
  /** Writes to standard output (no newline added). */
  out(text: string): void;
  /** Standard error: messages and progress. */
  err: ProgressSink;
  /** Reads a text file; throws (any error) when it cannot. */
  readText(path: string): string;
  /** Writes a file, creating or replacing it. */
  writeFile(path: string, data: string | Uint8Array): void;
}

/** A command: parses its own flags from argv and returns the exit code. */
export interface Command {
  readonly spec: import('./args.ts').CommandSpec;
  run(argv: readonly string[], io: CliIo): Promise<number> | number;
}

/** Writes a file named by option `field`; a failure becomes `invalid <field>: <path> (<reason>)`. */
export function writeNamedFile(io: CliIo, field: string, path: string, data: string | Uint8Array): void {
  try {
    io.writeFile(path, data);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new ValidationError(field, JSON.stringify(path), `cannot write the file${code ? `: ${code}` : ''}`);
  }
}
