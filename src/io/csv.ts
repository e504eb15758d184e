/**
 * CSV writers of spectra, shared by the CLI and the web view: one header line, then one line per k-point (bands)
 * or per energy (DOS); numbers in JavaScript's shortest round-trip form.
 */

/** Bands at a list of k-points: energies and σ shares, k-major `count × bands`. */
export interface BandsTable {
  count: number;
  bands: number;
  /** Cartesian k (Å⁻¹), interleaved. */
  kpoints: Float64Array;
  /** Path distance (Å⁻¹) per point, for a path. */
  distance?: Float64Array;
  energies: Float64Array;
  sigmaWeight: Float64Array;
}

/** `k_index,kx,ky[,distance],e1…eB,sigma1…sigmaB`. */
export function bandsCsv(table: BandsTable): string {
  const header = ['k_index', 'kx', 'ky', ...(table.distance ? ['distance'] : [])];
  for (let b = 0; b < table.bands; b++) header.push(`e${b + 1}`);
  for (let b = 0; b < table.bands; b++) header.push(`sigma${b + 1}`);
  const lines = [header.join(',')];
  for (let k = 0; k < table.count; k++) {
    const cells: number[] = [k, table.kpoints[2 * k], table.kpoints[2 * k + 1]];
    if (table.distance) cells.push(table.distance[k]);
    for (let b = 0; b < table.bands; b++) cells.push(table.energies[k * table.bands + b]);
    for (let b = 0; b < table.bands; b++) cells.push(table.sigmaWeight[k * table.bands + b]);
    lines.push(cells.join(','));
  }
  return `${lines.join('\n')}\n`;
}

/** `energy_eV,total,sigma,pi` (states per eV per atom, both spins). */
export function dosCsv(dos: { energy: Float64Array; total: Float64Array; sigma: Float64Array; pi: Float64Array }): string {
  const lines = ['energy_eV,total,sigma,pi'];
  for (let i = 0; i < dos.energy.length; i++) lines.push(`${dos.energy[i]},${dos.total[i]},${dos.sigma[i]},${dos.pi[i]}`);
  return `${lines.join('\n')}\n`;
}

/** A(k, E) on an energy grid at a list of k-points: k-major `count × energies`, total and σ part. */
export interface SpectralTable {
  count: number;
  /** Cartesian k (Å⁻¹), interleaved; path distance (Å⁻¹) per point, for a path. */
  kpoints: Float64Array;
  distance?: Float64Array;
  energies: Float64Array;
  total: Float64Array;
  sigma: Float64Array;
}

/** `k_index,kx,ky[,distance],energy_eV,total,sigma,pi`: one line per k-point and energy (states per eV per site). */
export function spectralCsv(table: SpectralTable): string {
  const lines = [['k_index', 'kx', 'ky', ...(table.distance ? ['distance'] : []), 'energy_eV', 'total', 'sigma', 'pi'].join(',')];
  const points = table.energies.length;
  for (let k = 0; k < table.count; k++) {
    const head = `${k},${table.kpoints[2 * k]},${table.kpoints[2 * k + 1]}${table.distance ? `,${table.distance[k]}` : ''}`;
    for (let e = 0; e < points; e++) {
      const total = table.total[k * points + e];
      const sigma = table.sigma[k * points + e];
      lines.push(`${head},${table.energies[e]},${total},${sigma},${total - sigma}`);
    }
  }
  return `${lines.join('\n')}\n`;
}

/** `kx,ky,total,sigma,pi`: A(k, E0) at the k-points of a constant-energy cut (states per eV per site). */
export function cutCsv(cut: { kpoints: Float64Array; total: Float64Array; sigma: Float64Array }): string {
  const lines = ['kx,ky,total,sigma,pi'];
  for (let k = 0; k < cut.total.length; k++) {
    lines.push(`${cut.kpoints[2 * k]},${cut.kpoints[2 * k + 1]},${cut.total[k]},${cut.sigma[k]},${cut.total[k] - cut.sigma[k]}`);
  }
  return `${lines.join('\n')}\n`;
}
