/**
 * The bands of one sheet at fixed k-points as a function of the parameter vector (modelParameters.ts), with their
 * derivatives by the Hellmann–Feynman theorem: dE_n/dθ = ⟨n|∂H/∂θ|n⟩ for a normalised eigenvector |n⟩ (Hellmann
 * 1937, Feynman 1939). H is linear in εs, εp and the four V(d0), so ∂H/∂θ is H built from that one parameter; the
 * exponent enters through V(d) = V(d0)·(d0/d)^x, ∂V(d)/∂x = V(d)·ln(d0/d).
 *
 * Degenerate states: a sorted band's energy has a derivative only when the degeneracy is kept by the change (as
 * symmetry keeps it); then every state of the degenerate set moves by Tr(P·∂H/∂θ)/dim, the mean of the states'
 * ⟨n|∂H/∂θ|n⟩ in any orthonormal basis of the set, which is what is returned for each of them.
 *
 * Layout. H(k) as src/tb/model.ts (split re/im, row-major, row = width·atom + orbital of the part); bonds as
 * src/lattice/neighbours.ts; per bond e four unit Slater–Koster blocks (src/tb/slaterKoster.ts layout) at
 * unit[64e + 16t + 4a + b] for t = ssσ, spσ, ppσ, ppπ. Outputs k-major: energies[k·bands + n],
 * derivatives[(k·bands + n)·7 + j] with j in MODEL_PARAMETERS order.
 */
import { neighbours } from '../../lattice/neighbours.ts';
import { isPlanar, type Sheet } from '../../lattice/sheet.ts';
import { HermitianEigensolver } from '../../linalg/eigh.ts';
import { slaterKosterBlock } from '../../tb/slaterKoster.ts';
import { MODEL_PARAMETERS } from './modelParameters.ts';

/** Which states are matched: every band ('full'), or one block of a planar sheet (σ: s, px, py; π: pz). */
export type BandBlock = 'full' | 'sigma' | 'pi';

/** Parameters per derivative row. */
const PARAMETERS = MODEL_PARAMETERS.length;

/** States closer than this (eV) count as one degenerate set. */
export const DEGENERATE = 1e-7;

/** One diagonalised part of H(k): orbitals first … first + width − 1 of every atom. */
interface Part {
  width: number;
  first: number;
  size: number;
  solver: HermitianEigensolver;
  re: Float64Array;
  im: Float64Array;
  values: Float64Array;
  vecRe: Float64Array;
  vecIm: Float64Array;
  /** Derivative rows of the part's states, size × 7. */
  slopes: Float64Array;
}

function part(width: number, first: number, atoms: number): Part {
  const size = width * atoms;
  return {
    width, first, size,
    solver: new HermitianEigensolver(size),
    re: new Float64Array(size * size),
    im: new Float64Array(size * size),
    values: new Float64Array(size),
    vecRe: new Float64Array(size * size),
    vecIm: new Float64Array(size * size),
    slopes: new Float64Array(size * PARAMETERS),
  };
}

export class ParametricBands {
  readonly atoms: number;
  readonly planar: boolean;
  readonly block: BandBlock;
  /** Bands per k-point in the output: 4n ('full'), 3n ('sigma') or n ('pi'), ascending. */
  readonly bands: number;
  /** k-points, kx, ky interleaved (Å⁻¹). */
  readonly kpoints: Float64Array;
  readonly count: number;
  readonly d0: number;
  readonly cutoff: number;
  /** Bond lengths of the ordered bonds within the cutoff (Å). */
  readonly bondLength: Float64Array;
  private readonly bondFrom: Int32Array;
  private readonly bondTo: Int32Array;
  private readonly bondX: Float64Array;
  private readonly bondY: Float64Array;
  private readonly logRatio: Float64Array;
  private readonly unit: Float64Array;
  private readonly scale: Float64Array;
  private readonly blocks: Float64Array;
  private readonly parts: Part[];
  private readonly order: Int32Array;
  /** cos, sin of k·r of every bond at the current k. */
  private readonly phaseCos: Float64Array;
  private readonly phaseSin: Float64Array;
  /** Per-state accumulators of the slopes of a part: 7 rows of length size (largest part), and one row of products. */
  private readonly sums: Float64Array;
  private readonly products: Float64Array;
  /** One bond of each pair i→j, j→i (the pair gives complex-conjugate terms of ⟨n|∂H|n⟩: twice the real part of one). */
  private readonly halfBonds: Int32Array;

  constructor(sheet: Sheet, kpoints: Float64Array, options: { cutoff: number; d0: number; block: BandBlock }) {
    this.atoms = sheet.atoms.length;
    this.planar = isPlanar(sheet);
    this.block = options.block;
    if (!this.planar && options.block !== 'full') throw new TypeError(`invalid block: ${options.block} (a buckled sheet mixes σ and π states)`);
    this.kpoints = kpoints;
    this.count = kpoints.length / 2;
    this.d0 = options.d0;
    this.cutoff = options.cutoff;
    const list = neighbours(sheet, options.cutoff);
    this.bondFrom = list.from;
    this.bondTo = list.to;
    this.bondX = list.dx;
    this.bondY = list.dy;
    this.bondLength = list.distance;
    this.logRatio = new Float64Array(list.count);
    this.unit = new Float64Array(64 * list.count);
    this.scale = new Float64Array(list.count);
    this.blocks = new Float64Array(16 * list.count);
    for (let e = 0; e < list.count; e++) {
      const d = list.distance[e];
      this.logRatio[e] = Math.log(options.d0 / d);
      // Exactly zero n on planar sheets keeps the σ/π blocks exactly decoupled (as src/tb/model.ts).
      const n = list.dz[e] === 0 ? 0 : list.dz[e] / d;
      for (let t = 0; t < 4; t++) {
        slaterKosterBlock(list.dx[e] / d, list.dy[e] / d, n, t === 0 ? 1 : 0, t === 1 ? 1 : 0, t === 2 ? 1 : 0, t === 3 ? 1 : 0, this.unit, 64 * e + 16 * t);
      }
    }
    const n = this.atoms;
    if (options.block === 'sigma') this.parts = [part(3, 0, n)];
    else if (options.block === 'pi') this.parts = [part(1, 3, n)];
    else if (this.planar) this.parts = [part(3, 0, n), part(1, 3, n)];
    else this.parts = [part(4, 0, n)];
    this.bands = this.parts.reduce((sum, p) => sum + p.size, 0);
    this.order = new Int32Array(this.bands);
    this.phaseCos = new Float64Array(list.count);
    this.phaseSin = new Float64Array(list.count);
    const largest = Math.max(...this.parts.map((p) => p.size));
    this.sums = new Float64Array(PARAMETERS * largest);
    this.products = new Float64Array(largest);
    const half: number[] = [];
    for (let e = 0; e < list.count; e++) {
      const from = list.from[e];
      const to = list.to[e];
      if (from < to || (from === to && (list.dx[e] > 0 || (list.dx[e] === 0 && list.dy[e] > 0)))) half.push(e);
    }
    this.halfBonds = Int32Array.from(half);
  }

  /**
   * Writes the ascending bands at every k-point into `energies` (count × bands) and, when `derivatives` is given,
   * dE/dθ for the seven parameters (count × bands × 7). `values` in MODEL_PARAMETERS order. Allocates nothing.
   */
  evaluate(values: Float64Array, energies: Float64Array, derivatives: Float64Array | null): void {
    const bonds = this.scale.length;
    const exponent = values[6];
    for (let e = 0; e < bonds; e++) {
      const scale = Math.exp(exponent * this.logRatio[e]);
      this.scale[e] = scale;
      const base = 64 * e;
      for (let ab = 0; ab < 16; ab++) {
        this.blocks[16 * e + ab] = scale * (values[2] * this.unit[base + ab] + values[3] * this.unit[base + 16 + ab]
          + values[4] * this.unit[base + 32 + ab] + values[5] * this.unit[base + 48 + ab]);
      }
    }
    for (let k = 0; k < this.count; k++) {
      const kx = this.kpoints[2 * k];
      const ky = this.kpoints[2 * k + 1];
      for (let e = 0; e < bonds; e++) {
        const phase = kx * this.bondX[e] + ky * this.bondY[e];
        this.phaseCos[e] = Math.cos(phase);
        this.phaseSin[e] = Math.sin(phase);
      }
      for (const p of this.parts) {
        this.build(p, values);
        if (derivatives) {
          p.solver.eigensystem(p.re, p.im, p.values, p.vecRe, p.vecIm);
          this.slopes(p);
        } else {
          p.solver.eigenvalues(p.re, p.im, p.values);
        }
      }
      this.merge(k, energies, derivatives);
    }
  }

  private build(p: Part, values: Float64Array): void {
    const { width, first, size, re, im } = p;
    re.fill(0);
    im.fill(0);
    for (let atom = 0; atom < this.atoms; atom++) {
      for (let a = 0; a < width; a++) {
        const r = width * atom + a;
        re[r * size + r] = first + a === 0 ? values[0] : values[1];
      }
    }
    const blocks = this.blocks;
    for (let e = 0; e < this.scale.length; e++) {
      const c = this.phaseCos[e];
      const sn = this.phaseSin[e];
      const rowBase = width * this.bondFrom[e];
      const colBase = width * this.bondTo[e];
      for (let a = 0; a < width; a++) {
        const row = (rowBase + a) * size + colBase;
        const blockRow = 16 * e + 4 * (first + a) + first;
        for (let b = 0; b < width; b++) {
          const v = blocks[blockRow + b];
          re[row + b] += v * c;
          im[row + b] += v * sn;
        }
      }
    }
  }

  /**
   * ⟨n|∂H/∂θ|n⟩ of every state of a solved part into p.slopes. Loop order: bond, orbital pair, then the states m,
   * which run along a row of the eigenvector matrix (contiguous); only the non-zero unit integrals are visited.
   */
  private slopes(p: Part): void {
    const { width, first, size, vecRe, vecIm, slopes } = p;
    const unit = this.unit;
    const sums = this.sums;
    sums.fill(0, 0, PARAMETERS * size);
    // Rows 0, 1 of sums: the s and p weights of each state.
    for (let r = 0; r < size; r++) {
      const target = first + (r % width) === 0 ? 0 : size;
      const row = r * size;
      for (let m = 0; m < size; m++) sums[target + m] += vecRe[row + m] * vecRe[row + m] + vecIm[row + m] * vecIm[row + m];
    }
    const products = this.products;
    for (const e of this.halfBonds) {
      const c = this.phaseCos[e];
      const sn = this.phaseSin[e];
      // Twice: the reverse bond gives the complex conjugate term.
      const scale = 2 * this.scale[e];
      const log = this.logRatio[e];
      const rowBase = width * this.bondFrom[e];
      const colBase = width * this.bondTo[e];
      for (let a = 0; a < width; a++) {
        const x = (rowBase + a) * size;
        for (let b = 0; b < width; b++) {
          const y = (colBase + b) * size;
          const ab = 4 * (first + a) + first + b;
          let any = false;
          for (let t = 0; t < 4; t++) if (unit[64 * e + 16 * t + ab] !== 0) any = true;
          if (!any) continue;
          for (let m = 0; m < size; m++) {
            const xr = vecRe[x + m];
            const xi = vecIm[x + m];
            const yr = vecRe[y + m];
            const yi = vecIm[y + m];
            // Re[conj(x)·y·exp(iφ)]
            products[m] = (xr * yr + xi * yi) * c - (xr * yi - xi * yr) * sn;
          }
          for (let t = 0; t < 4; t++) {
            const u = scale * unit[64 * e + 16 * t + ab];
            if (u === 0) continue;
            const row = (2 + t) * size;
            for (let m = 0; m < size; m++) sums[row + m] += u * products[m];
          }
          const ux = log * this.blocks[16 * e + ab] * 2;
          if (ux !== 0) for (let m = 0; m < size; m++) sums[6 * size + m] += ux * products[m];
        }
      }
    }
    for (let m = 0; m < size; m++) {
      for (let t = 0; t < PARAMETERS; t++) slopes[m * PARAMETERS + t] = sums[t * size + m];
    }
  }

  /** The parts' states merged ascending into row k; degenerate sets get their mean derivative. */
  private merge(k: number, energies: Float64Array, derivatives: Float64Array | null): void {
    const bands = this.bands;
    const row = k * bands;
    const [one, two] = this.parts;
    // order[b] = state index: 0 … one.size − 1 in part one, one.size … in part two.
    let i = 0;
    let j = 0;
    for (let b = 0; b < bands; b++) {
      if (!two || j >= two.size || (i < one.size && one.values[i] <= two.values[j])) {
        energies[row + b] = one.values[i];
        this.order[b] = i++;
      } else {
        energies[row + b] = two.values[j];
        this.order[b] = one.size + j++;
      }
    }
    if (!derivatives) return;
    for (let b = 0; b < bands; b++) {
      const state = this.order[b];
      const source = state < one.size ? one.slopes : two.slopes;
      const at = (state < one.size ? state : state - one.size) * PARAMETERS;
      const out = (row + b) * PARAMETERS;
      for (let t = 0; t < PARAMETERS; t++) derivatives[out + t] = source[at + t];
    }
    let start = 0;
    for (let b = 1; b <= bands; b++) {
      if (b < bands && energies[row + b] - energies[row + b - 1] < DEGENERATE) continue;
      if (b - start > 1) {
        for (let t = 0; t < PARAMETERS; t++) {
          let sum = 0;
          for (let q = start; q < b; q++) sum += derivatives[(row + q) * PARAMETERS + t];
          const mean = sum / (b - start);
          for (let q = start; q < b; q++) derivatives[(row + q) * PARAMETERS + t] = mean;
        }
      }
      start = b;
    }
  }
}
