/**
 * Limits of the sheet file (DESIGN.md, sheet contract). Inputs past them are refused with a field-level
 * error; every preset and every enumerated structure lies far inside them.
 */

/** Longest sheet file text, in characters (a 4096-atom explicit file, pretty-printed, is about 1 MB). */
export const MAX_SHEET_TEXT_LENGTH = 4_000_000;

/** Longest `name`, in characters. */
export const MAX_NAME_LENGTH = 200;

/** Most atoms of an explicit sheet (its overlap check is quadratic in the count). */
export const MAX_ATOMS = 4096;

/** Most lattice sites of a pattern's supercell, |det supercell|. */
export const MAX_SUPERCELL_SITES = 4096;

/** Largest |entry| of a supercell row or a vacancy; keeps every product in HNF reduction an exact double. */
export const MAX_INTEGER_ENTRY = 1_000_000;

/** Largest |component| of a cell vector, Å. */
export const MAX_CELL_COMPONENT = 1000;

/** Largest |fractional coordinate| of an atom before wrapping to [0, 1). */
export const MAX_ABS_FRACTION = 10;

/** Largest |z| of an atom, Å (a boron sheet buckles by about 1 Å at most). */
export const MAX_ABS_HEIGHT = 10;

/** Closest two atoms may be, Å, periodic images included (B–B bonds are about 1.6–1.9 Å; common practice). */
export const MIN_ATOM_SEPARATION = 0.5;

/** Longest pattern bond, Å. */
export const MAX_BOND = 10;

/** Smallest |sin γ| of a cell: below it the two vectors count as collinear. */
export const MIN_CELL_SINE = 1e-9;
