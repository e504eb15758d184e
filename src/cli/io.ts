/**
 * What a command may touch of the outside world. The real process supplies it in main.ts; tests supply a fake,
 * so every command runs in-process under test.
 */
import { ValidationError } from '../validate/invalid.ts';
import type { ProgressSink } from './progress.ts';

export interface CliIo {
  /** Writes to standard output (no newline added). */
  out(text: string): void;
  /** Standard error: messages and progress. */
  err: ProgressSink;
  /** Reads a text file; throws (any error) when it cannot. */
  readText(path: string): string;
  /** Reads a file's bytes (pictures); throws (any error) when it cannot. */
  readBytes(path: string): Uint8Array;
  /** Writes a file, creating or replacing it. */
  writeFile(path: string, data: string | Uint8Array): void;
  /** True when something exists at path. */
  exists(path: string): boolean;
}

/**
 * Thrown by `out` when the reader of stdout has gone (EPIPE: `… | head -1`). Not an error of the user or of
 * lacuna: the shell stops quietly with the status a closed pipe gives (PIPE_CLOSED_STATUS), and the work stops
 * with it because the exception unwinds the command.
 */
export class PipeClosed extends Error {
  override readonly name = 'PipeClosed';
  constructor() {
    super('the reader of standard output has closed the pipe');
  }
}

/** 128 + SIGPIPE (13): what a shell shows for a program stopped by a closed pipe. */
export const PIPE_CLOSED_STATUS = 141;

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

/**
 * Refuses, before any work is done, to replace an existing file unless the user said --overwrite: a results file
 * the user made is never lost to a repeated command.
 */
export function checkOutputPath(io: CliIo, field: string, path: string | undefined, overwrite: boolean): void {
  if (path !== undefined && !overwrite && io.exists(path)) {
    throw new ValidationError(field, JSON.stringify(path), 'the file exists; add --overwrite to replace it');
  }
}
