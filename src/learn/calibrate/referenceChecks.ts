/**
 * Checks that a reference bands file can belong to a sheet, at the boundary (CLI flags, the page's fields), with
 * errors `invalid <field>: <value> (<why>)`.
 */
import { invalid } from '../../validate/invalid.ts';
import { isPlanar, type Sheet } from '../../lattice/sheet.ts';
import { brillouinZone } from '../../tb/zone.ts';
import type { BandBlock } from './parametricBands.ts';
import type { ReferenceBands } from './referenceBands.ts';

/** How far outside the first Brillouin zone (as a factor on the zone) a reference k-point may lie. */
export const ZONE_MARGIN = 1.5;

/**
 * Refuses a file with a k-point outside ZONE_MARGIN times the sheet's first Brillouin zone: band paths of a
 * calculation lie inside its own zone, so such a point means another cell, another orientation or other units
 * (Cartesian Å⁻¹ with phase exp(i k·r), no 2π, x along the sheet's first cell vector).
 */
export function checkKpointsFitSheet(sheet: Sheet, reference: ReferenceBands): void {
  const corners = brillouinZone(sheet.cell).corners;
  const m = corners.length;
  for (let k = 0; k < reference.count; k++) {
    const kx = reference.kpoints[2 * k];
    const ky = reference.kpoints[2 * k + 1];
    for (let c = 0; c < m; c++) {
      const [ax, ay] = corners[c];
      const [bx, by] = corners[(c + 1) % m];
      // Counter-clockwise convex polygon scaled by ZONE_MARGIN about Γ: inside when left of every edge.
      const cross = (bx - ax) * (ky - ZONE_MARGIN * ay) - (by - ay) * (kx - ZONE_MARGIN * ax);
      if (cross < 0) {
        invalid(`kpoints[${k}]`, [kx, ky], `outside ${ZONE_MARGIN}× the first Brillouin zone of this sheet: reference bands must be of the same cell and orientation, Cartesian Å⁻¹ with phase exp(i k·r) (no 2π), x along the sheet's first cell vector`);
      }
    }
  }
}

/** A single σ or π block exists only for a planar sheet. */
export function checkBlock(sheet: Sheet, block: BandBlock, field: string): void {
  if (block !== 'full' && !isPlanar(sheet)) {
    invalid(field, block, 'the sheet is buckled, so its σ and π states mix: only "full" matches its bands');
  }
}
