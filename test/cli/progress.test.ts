import { afterEach, describe, expect, it, vi } from 'vitest';
import { ProgressLine } from '../../src/cli/progress.ts';

afterEach(() => vi.restoreAllMocks());

function sink(isTTY: boolean) {
  const writes: string[] = [];
  return { sink: { isTTY, write: (text: string) => void writes.push(text) }, writes };
}

describe('ProgressLine', () => {
  it('stays silent when stderr is not a terminal', () => {
    const { sink: s, writes } = sink(false);
    const clock = vi.spyOn(performance, 'now').mockReturnValue(0);
    const line = new ProgressLine(s, 'labelings');
    clock.mockReturnValue(5000);
    line.update(100, 0.5);
    line.done();
    expect(writes).toEqual([]);
  });

  it('waits half a second, then draws count, rate and bar, and clears at the end', () => {
    const { sink: s, writes } = sink(true);
    const clock = vi.spyOn(performance, 'now').mockReturnValue(0);
    const line = new ProgressLine(s, 'labelings');
    clock.mockReturnValue(400);
    line.update(10, 0.1);
    expect(writes).toEqual([]);
    clock.mockReturnValue(2000);
    line.update(50_000, 0.5, '12 found');
    expect(writes).toHaveLength(1);
    expect(writes[0]).toContain('50.0k labelings');
    expect(writes[0]).toContain('25.0k/s');
    expect(writes[0]).toContain(' 50%');
    expect(writes[0]).toContain('12 found');
    line.done();
    expect(writes[1]).toBe('\r\x1b[K');
  });
});

describe('ProgressLine estimates and machine lines', () => {
  it('announces a long estimate on a terminal, not a short one', () => {
    const { sink: s, writes } = sink(true);
    const line = new ProgressLine(s, 'k-points', { job: 'fill' });
    line.estimate(1, 'short');
    expect(writes).toEqual([]);
    line.estimate(40, '15 atoms on a 9×9 mesh');
    expect(writes).toEqual(['fill: 15 atoms on a 9×9 mesh; about 40 s (an estimate)\n']);
  });

  it('stays silent off a terminal without --progress', () => {
    const { sink: s, writes } = sink(false);
    new ProgressLine(s, 'k-points').estimate(1000, 'long');
    expect(writes).toEqual([]);
  });

  it('--progress: JSON lines (estimate, progress about once a second, done) whatever stderr is', () => {
    const { sink: s, writes } = sink(false);
    const clock = vi.spyOn(performance, 'now').mockReturnValue(0);
    const line = new ProgressLine(s, 'patterns', { machine: true, job: 'rank' });
    line.estimate(12.5, 'x', { patterns: 3 });
    clock.mockReturnValue(1500);
    line.update(1, 1 / 3);
    clock.mockReturnValue(1600);
    line.update(2, 2 / 3); // within the second: not written
    clock.mockReturnValue(3000);
    line.done();
    expect(writes.map((w) => JSON.parse(w))).toEqual([
      { job: 'rank', event: 'estimate', seconds: 12.5, patterns: 3 },
      { job: 'rank', event: 'progress', done: 1, fraction: 0.3333, unit: 'patterns', elapsed_s: 1.5 },
      { job: 'rank', event: 'done', done: 2, unit: 'patterns', elapsed_s: 3 },
    ]);
    expect(writes.every((w) => w.endsWith('\n') && !w.slice(0, -1).includes('\n'))).toBe(true);
  });
});
