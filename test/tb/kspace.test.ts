import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Sheet } from '../../src/lattice/sheet.ts';
import { kMesh, reciprocal } from '../../src/tb/kspace.ts';

const vector = fc.tuple(fc.double({ min: -10, max: 10, noNaN: true }), fc.double({ min: -10, max: 10, noNaN: true }));
const cellArbitrary = fc.tuple(vector, vector).filter(([a, b]) => Math.abs(a[0] * b[1] - a[1] * b[0]) > 0.5) as fc.Arbitrary<Sheet['cell']>;

describe('reciprocal(cell)', () => {
  it('satisfies b_i·a_j = 2π·δ_ij for either handedness (definition, e.g. Ashcroft & Mermin (1976), Eq. 5.3)', () => {
    fc.assert(fc.property(cellArbitrary, (cell) => {
      const b = reciprocal(cell);
      for (let i = 0; i < 2; i++) {
        for (let j = 0; j < 2; j++) {
          const dot = b[i][0] * cell[j][0] + b[i][1] * cell[j][1];
          if (Math.abs(dot - (i === j ? 2 * Math.PI : 0)) > 1e-9) return false;
        }
      }
      return true;
    }));
  });

  it('gives |b| = 4π/(√3·d) for the triangular lattice of spacing d (hexagonal reciprocal lattice, common practice)', () => {
    const d = 1.69;
    const [b1, b2] = reciprocal([[d, 0], [d / 2, (Math.sqrt(3) / 2) * d]]);
    expect(Math.hypot(...b1)).toBeCloseTo((4 * Math.PI) / (Math.sqrt(3) * d), 12);
    expect(Math.hypot(...b2)).toBeCloseTo((4 * Math.PI) / (Math.sqrt(3) * d), 12);
  });
});

describe('kMesh(cell, m)', () => {
  it('lists k = (i/M)·b1 + (j/M)·b2, i-major, of the cell as given (DESIGN.md fill contract)', () => {
    const cell: Sheet['cell'] = [[3, 0.5], [-1, 2]];
    const [b1, b2] = reciprocal(cell);
    const m = 5;
    const mesh = kMesh(cell, m);
    expect(mesh.length).toBe(2 * m * m);
    for (let i = 0; i < m; i++) {
      for (let j = 0; j < m; j++) {
        const p = i * m + j;
        expect(mesh[2 * p]).toBeCloseTo((i / m) * b1[0] + (j / m) * b2[0], 14);
        expect(mesh[2 * p + 1]).toBeCloseTo((i / m) * b1[1] + (j / m) * b2[1], 14);
      }
    }
    expect(mesh[0]).toBe(0);
    expect(mesh[1]).toBe(0);
  });
});
