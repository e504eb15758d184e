/**
 * The periodicity of a cell as an experimenter reads it off an image: the lengths a ≤ b and the angle γ of its
 * reduced cell (Gauss reduction, src/lattice/reduce.ts: γ in [90°, 120°]), which do not depend on the choice of
 * cell vectors. Used to match enumerated patterns to a measured cell.
 */
import { gaussReduce } from './reduce.ts';
import { cellMetrics } from './reducedCell.ts';
import type { Vec2 } from './sheet.ts';

/** Reduced-cell lengths (Å) and angle (degrees). */
export interface Periodicity {
  a: number;
  b: number;
  gammaDeg: number;
}

export function reducedPeriodicity(cell: readonly [Vec2, Vec2]): Periodicity {
  const { u, v } = gaussReduce(cell[0], cell[1]);
  const { a, b, gammaDeg } = cellMetrics([u, v]);
  return { a, b, gammaDeg };
}

/** The reduced periodicity of a cell given by lengths a, b (Å) and the angle γ between them (degrees). */
export function periodicityOf(a: number, b: number, gammaDeg: number): Periodicity {
  const gamma = (gammaDeg * Math.PI) / 180;
  return reducedPeriodicity([[a, 0], [b * Math.cos(gamma), b * Math.sin(gamma)]]);
}

/** Largest length difference (Å) and angle difference (degrees) between two reduced periodicities. */
export function periodicityMismatch(p: Periodicity, q: Periodicity): { length: number; angleDeg: number } {
  return { length: Math.max(Math.abs(p.a - q.a), Math.abs(p.b - q.b)), angleDeg: Math.abs(p.gammaDeg - q.gammaDeg) };
}
