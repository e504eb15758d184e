import { describe, expect, it } from 'vitest';
import { timeEigenvalues, timeSymmetricEigenvalues } from '../../src/linalg/eighBench.ts';

describe('timeEigenvalues(sizes, options)', () => {
  it('returns one row per size, in order, with a positive finite time (no speed is asserted)', () => {
    const rows = timeEigenvalues([3, 8], { batches: 1, seed: 9 });
    expect(rows.map((r) => r.n)).toEqual([3, 8]);
    for (const row of rows) {
      expect(Number.isFinite(row.secondsPerMatrix)).toBe(true);
      expect(row.secondsPerMatrix).toBeGreaterThan(0);
    }
  });

  it('timeSymmetricEigenvalues: one row per size, on either route, with a positive finite time', () => {
    for (const simd of [true, false]) {
      const rows = timeSymmetricEigenvalues([3, 8], { batches: 1, seed: 9, simd });
      expect(rows.map((r) => r.n)).toEqual([3, 8]);
      for (const row of rows) {
        expect(Number.isFinite(row.secondsPerMatrix)).toBe(true);
        expect(row.secondsPerMatrix).toBeGreaterThan(0);
      }
    }
  });
});
