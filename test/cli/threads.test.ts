/**
 * `rank` on worker threads (src/cli/threads.ts, shardWorker.ts) against the same ranking in one thread: the result
 * must not depend on how the work was spread. Regression guard of our own plumbing (the numbers themselves are
 * checked against outside sources in test/tb); real threads, each running bin/lacuna.mjs.
 */
import { describe, expect, it } from 'vitest';
import { threadCount, THREADS_FROM_SECONDS } from '../../src/cli/threads.ts';
import { cli, refused } from './runCommand.ts';

describe('rank --threads', () => {
  it('two threads give exactly the one-thread ranking, patterns named and canonical forms included', async () => {
    const argv = ['rank', '--sites', '1-12', '--holes', '1-2', '--isolated', '--mesh', '6', '--json'];
    const one = await cli([...argv, '--threads', '1']);
    const two = await cli([...argv, '--threads', '2']);
    expect(one.code).toBe(0);
    expect(two.code).toBe(0);
    expect(two.stdout).toBe(one.stdout);
    const patterns = JSON.parse(one.stdout).groups.flatMap((g: { patterns: { canonical: string }[] }) => g.patterns);
    expect(patterns.length).toBeGreaterThan(10);
    expect(patterns.every((p: { canonical: string }) => typeof p.canonical === 'string' && p.canonical.length > 0)).toBe(true);
  }, 60_000);

  it('threads only when the work pays for them, never more than the items', () => {
    expect(threadCount(undefined, THREADS_FROM_SECONDS / 2, 100)).toBe(1);
    expect(threadCount(undefined, THREADS_FROM_SECONDS * 10, 1)).toBe(1);
    expect(threadCount(3, 0, 100)).toBe(3);
    expect(threadCount(8, 0, 2)).toBe(2);
  });

  it('--threads 0 is refused, naming the flag', async () => {
    await refused(['rank', '--sites', '1-9', '--holes', '1', '--threads', '0'], /--threads/);
  });
});
