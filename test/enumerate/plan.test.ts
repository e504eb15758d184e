import { describe, expect, it } from 'vitest';
import { countStructures } from '../../src/enumerate/count.ts';
import { enumerateStructures } from '../../src/enumerate/enumerate.ts';
import { planWork, settingsOf } from '../../src/enumerate/plan.ts';
import type { EnumerateOptions } from '../../src/enumerate/types.ts';

const CASES: EnumerateOptions[] = [
  { sites: [1, 12], holes: [0, 12] },
  { sites: [1, 20], holes: [0, 5], isolated: true },
];

describe('planWork(settings) with shards', () => {
  it('deals every work unit to exactly one shard', () => {
    for (const count of [1, 2, 3, 7]) {
      const plans = Array.from({ length: count }, (_, i) => planWork(settingsOf({ ...CASES[1], shard: { index: i + 1, count } })));
      plans[0].forEach((work, w) => {
        work.supercells.forEach((cell, s) => {
          for (let c = 0; c < work.sites; c++) {
            const owners = plans.filter((plan) => plan[w].supercells[s].branch[c] === 1).length;
            expect(owners).toBeLessThanOrEqual(1);
          }
          expect(plans.reduce((sum, plan) => sum + plan[w].supercells[s].branch[0], 0)).toBe(1);
        });
      });
    }
  });
});

describe('enumerateStructures(options) and countStructures(options) with shards', () => {
  it('give the whole list when the shards are put together, each shard in the global order (n = 2, 3, 5, 8)', () => {
    for (const options of CASES) {
      const whole = [...enumerateStructures(options)].map((s) => s.canonical);
      const position = new Map(whole.map((key, t) => [key, t]));
      for (const count of [2, 3, 5, 8]) {
        const parts = Array.from({ length: count }, (_, i) => [...enumerateStructures({ ...options, shard: { index: i + 1, count } })].map((s) => s.canonical));
        expect(parts.flat().sort()).toEqual([...whole].sort());
        for (const part of parts) {
          const places = part.map((key) => position.get(key)!);
          for (let t = 1; t < places.length; t++) expect(places[t]).toBeGreaterThan(places[t - 1]);
        }
        const rows = Array.from({ length: count }, (_, i) => countStructures({ ...options, shard: { index: i + 1, count } }));
        const summed = rows[0].map((row, r) => rows.reduce((sum, shard) => sum + shard[r].structures, 0));
        expect(summed).toEqual(countStructures(options).map((row) => row.structures));
      }
    }
  });

  it('shares the work out: no shard of 4 holds more than half of N ≤ 20 with ≤ 5 isolated holes', () => {
    const total = [...enumerateStructures(CASES[1])].length;
    for (let i = 1; i <= 4; i++) {
      const part = [...enumerateStructures({ ...CASES[1], shard: { index: i, count: 4 } })].length;
      expect(part).toBeLessThan(total / 2);
    }
  });

  it('is deterministic', () => {
    const run = () => [...enumerateStructures({ ...CASES[0], shard: { index: 2, count: 3 } })].map((s) => s.canonical);
    expect(run()).toEqual(run());
  });
});
