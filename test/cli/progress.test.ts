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
