/** The DEMO reference bands file is what its generator makes (regression guard: our own numbers). */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseReferenceBandsText } from '../../../src/io/referenceBandsFile.ts';
import { DEMO_REFERENCE_FILE, makeDemoReference } from './demoReference.ts';

describe('DEMO reference bands', () => {
  it('the file equals makeDemoReference() (regression guard), reads as reference bands and says DEMO', () => {
    const made = makeDemoReference();
    if (!existsSync(DEMO_REFERENCE_FILE) && !process.env.CI) {
      const rows = (key: 'kpoints' | 'energies') => (made[key] as number[][]).map((r) => `    ${JSON.stringify(r)}`).join(',\n');
      const { kpoints: _k, energies: _e, ...head } = made;
      const text = JSON.stringify(head, null, 2).replace(/\n}$/, `,\n  "kpoints": [\n${rows('kpoints')}\n  ],\n  "energies": [\n${rows('energies')}\n  ]\n}\n`);
      writeFileSync(DEMO_REFERENCE_FILE, text);
    }
    const text = readFileSync(DEMO_REFERENCE_FILE, 'utf8');
    expect(JSON.parse(text)).toEqual(made);
    const reference = parseReferenceBandsText(text);
    expect(reference.title).toMatch(/^DEMO/);
    expect(reference.count).toBe(90);
    expect(reference.bands).toBe(16);
  });
});
