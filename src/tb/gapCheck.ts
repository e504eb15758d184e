/**
 * Is an empty energy interval of a mesh spectrum a gap of the bands, or only a hole between mesh points?
 *
 * A mesh samples the zone at M² points; a band that runs steeply between them, or whose extremum sits off the
 * mesh (K of a hexagonal cell when 3 ∤ M), leaves intervals that hold no mesh state although the bands cross them.
 * The verdict, with mid the interval's midpoint:
 * 1. Bands are continuous in k, so if the number of states below mid differs between two checked k-points, a band
 *    crosses mid between them: no gap.
 * 2. Otherwise (n states below mid everywhere) the gap is (max over k of the states below mid, min over k of the
 *    states above mid), both taken over every checked k-point: the mesh, the automatic path through the special
 *    points (src/tb/kspacePath.ts, Γ, M, K, … included) and a local search that climbs from the mesh's highest
 *    state below mid and descends from its lowest state above mid (pattern search on the fractional coordinates,
 *    steps from half a mesh spacing down to 1/32 of one). A gap needs that interval to be wider than GAP_FLOOR.
 * The check can only narrow a gap or refute it: an extremum that lies off the mesh, off the path and outside the
 * basin the local search starts in would be missed (a finer mesh is the remedy).
 * Which states count: 'all' every band; 'sigma' the σ block of a planar sheet (its σ and π bands cross freely,
 * since the blocks decouple); on a buckled sheet 'sigma' means all bands.
 */
import { HermitianEigensolver } from '../linalg/eigh.ts';
import { reciprocal } from './kspace.ts';
import { autoPath } from './kspacePath.ts';
import type { MeshSpectrum } from './meshSpectrum.ts';
import type { HamiltonianBlock, TightBindingModel } from './model.ts';

/** Gaps narrower than this (eV) are bands that touch, up to rounding. */
export const GAP_FLOOR = 1e-6;

/** Options of checkGap. */
export interface GapCheckOptions {
  /** Which states: every band ('all', default) or the σ block of a planar sheet ('sigma'). */
  bands?: 'all' | 'sigma';
  /** Points on the automatic path (default 2·mesh + 1, at least 61). */
  pathPoints?: number;
}

/** A k-point (Cartesian Å⁻¹), the special point it is (if any) and a state energy there (eV). */
export interface GapWitness {
  k: [number, number];
  label?: string;
  energy: number;
}

/** The verdict on one interval. */
export interface GapVerdict {
  /** 'gap': the bands have a gap there; 'mesh-gap': the mesh is empty there but the bands cross it. */
  kind: 'gap' | 'mesh-gap';
  /** The interval as found on the mesh (eV). */
  mesh: { lower: number; upper: number };
  /** For 'gap': its edges over every checked k (top of the band below, bottom of the band above); ⊂ mesh. */
  gap?: { lower: number; upper: number };
  /** States below the midpoint at every checked k (for 'gap'; for 'mesh-gap' the count on the mesh's first point). */
  bandsBelow: number;
  /** For 'mesh-gap': a state found inside the interval off the mesh, when one was. */
  crossing?: GapWitness;
  /** For 'gap': where its edges lie (the k-points of the top below and the bottom above). */
  edges?: { lower: GapWitness; upper: GapWitness };
  /** k-points checked besides the mesh: on the path and in the local search. */
  checked: { mesh: number; path: number; search: number };
}

/**
 * Eigenvalues at one k with workspaces made once: the σ block alone, the σ and π blocks (planar, all bands) or
 * the full matrix (buckled). Order within a row does not matter here: only counts and extremes are taken.
 */
class PointSpectrum {
  readonly values: Float64Array;
  private readonly parts: { block: HamiltonianBlock; solver: HermitianEigensolver; re: Float64Array; im: Float64Array; out: Float64Array }[];

  constructor(private readonly model: TightBindingModel, blocks: HamiltonianBlock[]) {
    let total = 0;
    let offset = 0;
    for (const block of blocks) total += model.size(block);
    this.values = new Float64Array(total);
    this.parts = blocks.map((block) => {
      const n = model.size(block);
      const out = this.values.subarray(offset, offset + n);
      offset += n;
      return { block, solver: new HermitianEigensolver(n), re: new Float64Array(n * n), im: new Float64Array(n * n), out };
    });
  }

  at(kx: number, ky: number): Float64Array {
    for (const part of this.parts) {
      this.model.hamiltonian(kx, ky, part.block, part.re, part.im);
      part.solver.eigenvalues(part.re, part.im, part.out);
    }
    return this.values;
  }
}

/** The six neighbours of a point of the triangular grid of fractional k (pattern-search directions). */
const STEPS: readonly (readonly [number, number])[] = [[1, 0], [-1, 0], [0, 1], [0, -1], [1, -1], [-1, 1]];

/** Energies closer than this (eV) are one state seen twice: far above rounding, far below any real splitting. */
const TIE = 1e-9;

/** Running extremes over checked k-points; numbers only, so that adding a k-point allocates nothing. */
class Tally {
  count = -1;
  uniform = true;
  top = -Infinity;
  bottom = Infinity;
  /** Highest state below mid and lowest above mid of the last k-point added. */
  high = -Infinity;
  low = Infinity;
  readonly topK = new Float64Array(2);
  readonly bottomK = new Float64Array(2);
  topLabel: string | undefined;
  bottomLabel: string | undefined;
  crossing: GapWitness | undefined;

  constructor(readonly mid: number, readonly lower: number, readonly upper: number) {}

  /** One k-point's states values[first, end). */
  add(values: Float64Array, first: number, end: number, kx: number, ky: number, label?: string): void {
    let below = 0;
    let high = -Infinity;
    let low = Infinity;
    for (let b = first; b < end; b++) {
      const e = values[b];
      if (e < this.mid) {
        below++;
        if (e > high) high = e;
      } else if (e < low) low = e;
      if (!this.crossing && e > this.lower && e < this.upper) this.crossing = witness(kx, ky, label, e);
    }
    this.high = high;
    this.low = low;
    if (this.count < 0) this.count = below;
    else if (below !== this.count) this.uniform = false;
    // A tie at a labelled point takes the label (Γ is both the mesh's first point and the path's). Ties are
    // within TIE: the mesh and the path may solve one k-point by different kernels (real form, complex).
    const topTie = label !== undefined && !this.topLabel && Math.abs(high - this.top) <= TIE;
    if (high > this.top + TIE || topTie) {
      this.top = Math.max(high, topTie ? this.top : high);
      this.topK[0] = kx;
      this.topK[1] = ky;
      this.topLabel = label;
    } else if (high > this.top) {
      this.top = high;
    }
    const bottomTie = label !== undefined && !this.bottomLabel && Math.abs(low - this.bottom) <= TIE;
    if (low < this.bottom - TIE || bottomTie) {
      this.bottom = Math.min(low, bottomTie ? this.bottom : low);
      this.bottomK[0] = kx;
      this.bottomK[1] = ky;
      this.bottomLabel = label;
    } else if (low < this.bottom) {
      this.bottom = low;
    }
  }
}

function witness(kx: number, ky: number, label: string | undefined, energy: number): GapWitness {
  return label ? { k: [kx, ky], label, energy } : { k: [kx, ky], energy };
}

/**
 * Decides whether the bands of `model` have a gap in the interval (lower, upper) that `spectrum` (its mesh
 * spectrum) leaves empty. Call only with an interval free of mesh states of the chosen kind.
 */
export function checkGap(
  model: TightBindingModel,
  spectrum: MeshSpectrum,
  interval: { lower: number; upper: number },
  options: GapCheckOptions = {},
): GapVerdict {
  const sigmaOnly = options.bands === 'sigma' && model.planar;
  const end = sigmaOnly ? model.size('sigma') : spectrum.bands;
  const point = new PointSpectrum(model, sigmaOnly ? ['sigma'] : model.planar ? ['sigma', 'pi'] : ['full']);
  const tally = new Tally(0.5 * (interval.lower + interval.upper), interval.lower, interval.upper);
  const { mesh, bands, energies } = spectrum;
  const [b1, b2] = reciprocal(model.sheet.cell);
  // 1. The mesh: its rows are in block order (σ first) for planar sheets, which is what 'sigma' needs.
  for (let p = 0; p < spectrum.count; p++) {
    const i = Math.floor(p / mesh) / mesh;
    const j = (p % mesh) / mesh;
    tally.add(energies, p * bands, p * bands + end, i * b1[0] + j * b2[0], i * b1[1] + j * b2[1]);
  }
  const meshCount = tally.count;
  // 2. The automatic path, special points labelled.
  const path = autoPath(model.sheet.cell, Math.max(61, options.pathPoints ?? 2 * mesh + 1));
  const labelAt = new Map(path.labels.map((l) => [l.index, l.label]));
  for (let p = 0; p < path.count; p++) {
    const kx = path.kpoints[2 * p];
    const ky = path.kpoints[2 * p + 1];
    tally.add(point.at(kx, ky), 0, end, kx, ky, labelAt.get(p));
  }
  // 3. Local search from the highest state below and the lowest above (only worth it while a gap still stands).
  let searched = 0;
  if (tally.uniform && tally.bottom - tally.top > GAP_FLOOR) {
    const a = model.sheet.cell;
    // Local value at fractional (u, v) of (b1, b2): the highest state below mid (sign +1) or minus the lowest above.
    const probe = (u: number, v: number, sign: number): number => {
      const kx = u * b1[0] + v * b2[0];
      const ky = u * b1[1] + v * b2[1];
      searched++;
      tally.add(point.at(kx, ky), 0, end, kx, ky);
      return sign > 0 ? tally.high : -tally.low;
    };
    for (const sign of [1, -1]) {
      const from = sign > 0 ? tally.topK : tally.bottomK;
      // Fractional coordinates: u = k·a1/2π, since b_i·a_j = 2π·δ_ij.
      let u = (from[0] * a[0][0] + from[1] * a[0][1]) / (2 * Math.PI);
      let v = (from[0] * a[1][0] + from[1] * a[1][1]) / (2 * Math.PI);
      let best = sign > 0 ? tally.top : -tally.bottom;
      for (let step = 0.5 / mesh; step >= 1 / (32 * mesh) && tally.uniform; step /= 2) {
        let moved = true;
        for (let round = 0; moved && round < 4 && tally.uniform; round++) {
          moved = false;
          for (const [du, dv] of STEPS) {
            const value = probe(u + du * step, v + dv * step, sign);
            if (value > best + 1e-12) {
              best = value;
              u += du * step;
              v += dv * step;
              moved = true;
              break;
            }
          }
        }
      }
    }
  }
  const checked = { mesh: spectrum.count, path: path.count, search: searched };
  const gapped = tally.uniform && tally.bottom - tally.top > GAP_FLOOR;
  if (!gapped) {
    return {
      kind: 'mesh-gap',
      mesh: { ...interval },
      bandsBelow: meshCount,
      ...(tally.crossing ? { crossing: tally.crossing } : {}),
      checked,
    };
  }
  return {
    kind: 'gap',
    mesh: { ...interval },
    gap: { lower: tally.top, upper: tally.bottom },
    bandsBelow: tally.count,
    edges: {
      lower: witness(tally.topK[0], tally.topK[1], tally.topLabel, tally.top),
      upper: witness(tally.bottomK[0], tally.bottomK[1], tally.bottomLabel, tally.bottom),
    },
    checked,
  };
}
