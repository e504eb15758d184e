import { describe, expect, it } from 'vitest';
import { brief } from '../../src/io/brief.ts';
import { show } from '../../src/io/invalid.ts';

describe('brief(value)', () => {
  it('cuts deep nesting so that show() can render it (JSON.stringify overflows on 10⁶ levels)', () => {
    const deep = JSON.parse('['.repeat(1_000_000) + ']'.repeat(1_000_000));
    expect(show(brief(deep))).toBe('[[[["…"]]]]');
  });

  it('cuts long arrays, objects and strings; keeps small values as they are', () => {
    expect(brief([1, 2, 3, 4, 5, 6, 7, 8])).toEqual([1, 2, 3, 4, 5, 6, '…']);
    expect(brief({ a: [1, 2], b: 'x' })).toEqual({ a: [1, 2], b: 'x' });
    expect((brief('y'.repeat(1000)) as string).length).toBe(61);
    expect(brief(12.5)).toBe(12.5);
    expect(brief(10n)).toBe('10n');
  });

  it('survives unreadable values', () => {
    const trap = { get x() { throw new Error('no'); } };
    expect(brief(trap)).toBe('[unreadable]');
  });
});
