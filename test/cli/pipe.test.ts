/**
 * The CLI as a real process whose stdout reader stops early (`… | head -1`), for every output mode: it stops
 * quietly — nothing on stderr, status 141 = 128 + SIGPIPE, what shells show for a closed pipe (POSIX signal
 * numbering, SIGPIPE = 13: common practice) — and it stops the work too: the enumeration below would run for
 * minutes if it went on after the reader left (vitest's timeout would fail the test).
 */
import { spawn } from 'node:child_process';
import { describe, expect, it } from 'vitest';

/** Runs `lacuna args | reader` under bash with pipefail; returns lacuna's status, the reader's output and stderr. */
function throughReader(args: string[], reader: string): Promise<{ status: string; stdout: string; stderr: string }> {
  const quoted = args.map((a) => `'${a}'`).join(' ');
  const script = `"${process.execPath}" --import tsx src/cli/main.ts ${quoted} | ${reader}; echo "status \${PIPESTATUS[0]}" >&2`;
  return new Promise((resolve) => {
    const child = spawn('bash', ['-c', script], { stdio: ['ignore', 'pipe', 'pipe'] });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on('data', (chunk: Buffer) => out.push(chunk));
    child.stderr.on('data', (chunk: Buffer) => err.push(chunk));
    child.on('close', () => {
      const stderr = Buffer.concat(err).toString('utf8');
      const status = /status (\d+)\n$/.exec(stderr)?.[1] ?? 'none';
      resolve({ status, stdout: Buffer.concat(out).toString('utf8'), stderr: stderr.replace(/status \d+\n$/, '') });
    });
  });
}

// Minutes of work when run to the end: a reader that leaves must stop it.
const LONG = ['enumerate', '--sites', '1-30', '--holes', '0-10', '--allow-large-output'];

describe('lacuna into a pipe that closes early', () => {
  it('enumerate --jsonl | head -1: one line, then a quiet stop', async () => {
    const { status, stdout, stderr } = await throughReader([...LONG, '--jsonl'], 'head -1');
    expect(stderr).toBe('');
    expect(status).toBe('141');
    expect(stdout.split('\n')).toHaveLength(2);
    expect(JSON.parse(stdout).sites).toBe(1);
  });

  it('enumerate --json | head -1', async () => {
    const { status, stdout, stderr } = await throughReader([...LONG, '--json'], 'head -1');
    expect(stderr).toBe('');
    expect(status).toBe('141');
    expect(stdout).toBe('{"structures":[\n');
  });

  it('enumerate (plain text) | head -1', async () => {
    const { status, stdout, stderr } = await throughReader(LONG, 'head -1');
    expect(stderr).toBe('');
    expect(status).toBe('141');
    expect(stdout).toMatch(/^N=1 k=0 /);
  });

  it('bands alpha --path auto --json | head -c 50', async () => {
    const { status, stdout, stderr } = await throughReader(['bands', 'alpha', '--path', 'auto', '--json'], 'head -c 50');
    expect(stderr).toBe('');
    expect(status).toBe('141');
    expect(stdout).toHaveLength(50);
  });
});
