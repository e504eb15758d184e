import { describe, expect, it } from 'vitest';
import { cli, refused } from './runCommand.ts';

describe('lacuna bench eigh', () => {
  it('--vectors --sizes 3,5 --json prints the contract form { eigh: [{ n, seconds_per_matrix }] } (no speed asserted)', async () => {
    for (const argv of [['bench', 'eigh', '--vectors', '--sizes', '3,5', '--json'], ['bench', 'eigh', '--sizes', '3,5', '--json']]) {
      const result = await cli(argv);
      expect(result.code).toBe(0);
      const document = JSON.parse(result.stdout) as { eigh: { n: number; seconds_per_matrix: number }[] };
      expect(Object.keys(document)).toEqual(['eigh']);
      expect(document.eigh.map((row) => row.n)).toEqual([3, 5]);
      for (const row of document.eigh) {
        expect(Object.keys(row)).toEqual(['n', 'seconds_per_matrix']);
        expect(row.seconds_per_matrix).toBeGreaterThan(0);
      }
    }
  });

  it('refuses a size out of range and an unknown kernel', async () => {
    await refused(['bench', 'eigh', '--vectors', '--sizes', '0'], /--sizes/);
    await refused(['bench', 'qr', '--vectors'], /KERNEL/);
  });
});
