/**
 * Reference bands: the band energies of the user's own calculation (e.g. density-functional) at given k-points,
 * in the `bands --json` form (DESIGN.md, calibrate contract). The parser is src/io/referenceBandsFile.ts.
 *
 * Layout: kpoints kx, ky interleaved (Cartesian Å⁻¹, Bloch phase exp(i k·r)); energies k-major, count × bands,
 * ascending at every k (eV, on the reference calculation's own zero).
 */
export interface ReferenceBands {
  /** Number of k-points. */
  count: number;
  /** Bands per k-point. */
  bands: number;
  kpoints: Float64Array;
  energies: Float64Array;
  /** The reference calculation's Fermi level (eV, its own zero), when the file gives it. */
  fermi?: number;
  /** Special-point labels at k-point indices (the `path.labels` of `bands --json`), for the figure. */
  labels?: { label: string; index: number }[];
  /** Free text the file carries about itself (`title`, `source`): shown with the fit. */
  title?: string;
  /** The sheet the file says it belongs to (`sheet` of `bands --json`), compared with the fitted sheet. */
  sheet?: string;
}
