/**
 * The Slater–Koster tight-binding model of a sheet: s, px, py, pz on every atom, two-centre integrals over all
 * bonds (every periodic image) shorter than the parameter set's cutoff, V(d) = V(d0)·(d0/d)^exponent, and the
 * Bloch sum H_{iα,jβ}(k) = ε_α·δ_ij·δ_αβ + Σ_bonds i→j E_αβ(r)·exp(i k·r), r the bond vector, k in Å⁻¹.
 *
 * Layout. Bond e (ordered, both directions listed): atoms bondFrom[e] → bondTo[e], in-plane vector
 * (bondX[e], bondY[e]) Å, and its 4×4 block at blocks[16e … 16e + 15] (src/tb/slaterKoster.ts layout).
 * H(k) is split storage, row-major (src/linalg/eigh.ts): element (r, c) = re[r·size + c] + i·im[r·size + c], with
 * row index 4·atom + orbital (full), 3·atom + orbital (σ: s, px, py) or atom (π: pz).
 *
 * Planar sheets: every bond has n = 0, so E_s,z = E_x,z = E_y,z = 0 exactly and H splits into the σ block (3n)
 * and the π block (n) — the exact σ/π decoupling of a flat sheet.
 */
import { neighbours } from '../lattice/neighbours.ts';
import { isPlanar, type Sheet } from '../lattice/sheet.ts';
import { sheetOperations, type SheetOperation } from '../lattice/sheetSymmetry.ts';
import type { ParameterSet } from './params.ts';
import { ORBITALS, slaterKosterBlock } from './slaterKoster.ts';

/** Which part of H(k): all 4n orbitals, the σ block (s, px, py: 3n) or the π block (pz: n). */
export type HamiltonianBlock = 'full' | 'sigma' | 'pi';

/** Magnitude (eV) below which an off-diagonal entry of H(k) is set to 0. */
export const TINY_ENTRY = 1e-150;

const BLOCK_WIDTH: Record<HamiltonianBlock, number> = { full: 4, sigma: 3, pi: 1 };
const BLOCK_FIRST: Record<HamiltonianBlock, number> = { full: 0, sigma: 0, pi: 3 };

/** H(k) of one sheet with one parameter set; the real Slater–Koster blocks are computed once, here. */
export class TightBindingModel {
  readonly sheet: Sheet;
  readonly parameters: ParameterSet;
  /** Atoms per cell. */
  readonly atoms: number;
  /** All atoms at one height: the σ and π blocks decouple exactly. */
  readonly planar: boolean;
  /** Ordered bonds (both directions) within the cutoff. */
  readonly bondCount: number;
  readonly bondFrom: Int32Array;
  readonly bondTo: Int32Array;
  readonly bondX: Float64Array;
  readonly bondY: Float64Array;
  readonly blocks: Float64Array;

  constructor(sheet: Sheet, params: ParameterSet) {
    this.sheet = sheet;
    this.parameters = params;
    this.atoms = sheet.atoms.length;
    this.planar = isPlanar(sheet);
    const list = neighbours(sheet, params.cutoff);
    this.bondCount = list.count;
    this.bondFrom = list.from;
    this.bondTo = list.to;
    this.bondX = list.dx;
    this.bondY = list.dy;
    this.blocks = new Float64Array(16 * list.count);
    const { ss_sigma, sp_sigma, pp_sigma, pp_pi } = params.hopping;
    for (let e = 0; e < list.count; e++) {
      const d = list.distance[e];
      const scale = (params.d0 / d) ** params.exponent;
      // Exactly zero n on planar sheets keeps the σ/π blocks exactly decoupled.
      const n = list.dz[e] === 0 ? 0 : list.dz[e] / d;
      slaterKosterBlock(
        list.dx[e] / d, list.dy[e] / d, n,
        ss_sigma * scale, sp_sigma * scale, pp_sigma * scale, pp_pi * scale,
        this.blocks, 16 * e,
      );
    }
  }

  private symmetry: SheetOperation[] | undefined;

  /** The sheet's symmetry operations (sheetSymmetry.ts), found on first use and kept: mesh stars and the real form use them. */
  get operations(): readonly SheetOperation[] {
    this.symmetry ??= sheetOperations(this.sheet);
    return this.symmetry;
  }

  /** Order of the matrix for a block: 4n, 3n or n. */
  size(block: HamiltonianBlock): number {
    return BLOCK_WIDTH[block] * this.atoms;
  }

  /**
   * Writes H(k) (or one of its planar blocks) into re, im (length ≥ size², overwritten), k = (kx, ky) Å⁻¹.
   * The result is exactly Hermitian (averaged with its conjugate transpose, which only removes rounding).
   * Entries below TINY_ENTRY in magnitude (far below rounding of eV-sized entries) are set to 0, so that no
   * subnormal numbers reach the eigensolver (which handles them correctly, but slowly). Allocates nothing.
   */
  hamiltonian(kx: number, ky: number, block: HamiltonianBlock, re: Float64Array, im: Float64Array): void {
    const width = BLOCK_WIDTH[block];
    const first = BLOCK_FIRST[block];
    const size = width * this.atoms;
    re.fill(0, 0, size * size);
    im.fill(0, 0, size * size);
    const { s, p } = this.parameters.onsite;
    for (let atom = 0; atom < this.atoms; atom++) {
      for (let a = 0; a < width; a++) {
        const r = width * atom + a;
        re[r * size + r] = first + a === 0 ? s : p;
      }
    }
    const blocks = this.blocks;
    for (let e = 0; e < this.bondCount; e++) {
      const phase = kx * this.bondX[e] + ky * this.bondY[e];
      const c = Math.cos(phase);
      const sn = Math.sin(phase);
      const rowBase = width * this.bondFrom[e];
      const colBase = width * this.bondTo[e];
      const base = 16 * e;
      for (let a = 0; a < width; a++) {
        const row = (rowBase + a) * size + colBase;
        const blockRow = base + ORBITALS * (first + a) + first;
        for (let b = 0; b < width; b++) {
          const v = blocks[blockRow + b];
          re[row + b] += v * c;
          im[row + b] += v * sn;
        }
      }
    }
    for (let r = 0; r < size; r++) {
      im[r * size + r] = 0;
      for (let col = r + 1; col < size; col++) {
        const upper = r * size + col;
        const lower = col * size + r;
        let mre = 0.5 * (re[upper] + re[lower]);
        let mim = 0.5 * (im[upper] - im[lower]);
        if (Math.abs(mre) < TINY_ENTRY) mre = 0;
        if (Math.abs(mim) < TINY_ENTRY) mim = 0;
        re[upper] = mre;
        re[lower] = mre;
        im[upper] = mim;
        im[lower] = -mim;
      }
    }
  }
}
