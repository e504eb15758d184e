/**
 * Bounds of the alignment model's inputs, one place for every front end (CLI flags, the page's fields, the URL).
 * Wide on purpose: they refuse typing slips (a work function of 48 eV), not unusual physics.
 */
import type { AlignmentParameters } from './transfer.ts';

export type AlignmentField = keyof AlignmentParameters;

/** [low, high], inclusive: W_S (eV), Δc (eV), d (Å), d0 (Å). */
export const ALIGNMENT_FLAG_LIMITS: Readonly<Record<AlignmentField, readonly [number, number]>> = {
  sheetWorkFunction: [1, 8],
  dipole: [-5, 5],
  distance: [0.5, 10],
  d0: [0, 10],
};
