/**
 * The CLI as a real process (`npm run -s lacuna --` runs this entry through tsx): stdout carries exactly one JSON
 * document even through a slow pipe, and errors are one stderr line with exit code 2.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

/** Runs the CLI with its stdout piped into a reader that starts `readDelaySeconds` late (a shell pipeline). */
function runProcess(args: string[], readDelaySeconds = 0): Promise<{ code: number | null; stdout: string; stderr: string }> {
  const quoted = args.map((a) => `'${a.replace(/'/g, "'\\''")}'`).join(' ');
  const script = `set -o pipefail; "${process.execPath}" --import tsx src/cli/main.ts ${quoted} | (sleep ${readDelaySeconds}; cat)`;
  return new Promise((resolve) => {
    const child = spawn('bash', ['-c', script], { stdio: ['ignore', 'pipe', 'pipe'] });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on('data', (chunk: Buffer) => out.push(chunk));
    child.stderr.on('data', (chunk: Buffer) => err.push(chunk));
    child.on('close', (code) => resolve({ code, stdout: Buffer.concat(out).toString('utf8'), stderr: Buffer.concat(err).toString('utf8') }));
  });
}

describe('lacuna as a process', () => {
  it('writes a large JSON document whole through a pipe that is read late', async () => {
    const { code, stdout, stderr } = await runProcess(['enumerate', '--sites', '1-10', '--holes', '0-10', '--json'], 1.5);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    expect(stdout.length).toBeGreaterThan(1 << 17);
    const document = JSON.parse(stdout);
    expect(document.counts.length).toBeGreaterThan(50);
  });

  it('answers a bad flag with one stderr line, exit code 2 and no stack trace', async () => {
    const { code, stdout, stderr } = await runProcess(['fill', 'alpha', '--mesh', 'many']);
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(stderr).toBe('invalid --mesh: "many" (not an integer)\n');
  });

  it('writes an output file through a temporary name: afterwards only the whole file is there', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'lacuna-'));
    const target = join(dir, 'dos.csv');
    const { code } = await runProcess(['dos', 'alpha', '--mesh', '4', '--energy-grid', '50', '--csv', target]);
    expect(code).toBe(0);
    expect(readdirSync(dir)).toEqual(['dos.csv']);
    expect(readFileSync(target, 'utf8').trimEnd().split('\n')).toHaveLength(51);
  });
});
