/**
 * The Tersoff–Hamann LDOS at the tip as a Fourier series over the sheet's reciprocal lattice, at a few tip heights.
 *
 * A Bloch state ψ(r) = Σ_atoms Σ_T e^{ik·(R+T)} [c_s φ_s + c_z φ_z](r − R − T) (the tight-binding basis with the phase
 * convention of src/tb/model.ts) becomes, by Poisson summation over the lattice T and the transforms of src/stm/tails.ts,
 *   ψ(r, z) = (1/A) Σ_G e^{i(k+G)·r} e^{−γ(z − z_atom)} Σ_atoms e^{−iG·R} [c_s·S(γ) + c_z·Z],   γ = √(κ² + |k+G|²),
 * A the cell area. The LDOS in the bias window, ρ(r, z) = Σ_{k,n} w_k·w(E_nk)·|ψ_nk|², is then the series
 *   ρ(r, z) = Σ_Q ρ_Q(z) e^{iQ·r},   ρ_Q = Σ_{k,n} w·Σ_{G − G' = Q} a_G a*_G'.
 * Terms with e^{−(γ − κ)·h_min} below `accuracy` are dropped (h_min the lowest tip height).
 *
 * Layout: Q = m1·b1 + m2·b2, |m1|, |m2| ≤ order; coefficient of height j at re/im[j·side² + (m1 + order)·side + (m2 + order)],
 * side = 2·order + 1. Heights are measured from the highest atom.
 */
import { signedArea, type Sheet, type Vec2 } from '../lattice/sheet.ts';
import { HermitianEigensolver } from '../linalg/eigh.ts';
import { reciprocal } from '../tb/kspace.ts';
import type { TightBindingModel } from '../tb/model.ts';
import type { WeightedKpoints } from './halfMesh.ts';
import { pzTransform, sTransform } from './tails.ts';

export interface LdosOptions {
  /** Vacuum decay κ (Å⁻¹). */
  kappa: number;
  /** Tip heights above the highest atom (Å), each > 0. */
  heights: readonly number[];
  /** Weight of a state at energy E (eV): the bias window. */
  weight: (energy: number) => number;
  kpoints: WeightedKpoints;
  /** Relative size of the smallest plane-wave amplitude kept (default 1e-7). */
  accuracy?: number;
}

/** The LDOS Fourier series (layout in the module comment). */
export interface LdosSeries {
  cell: Sheet['cell'];
  b1: Vec2;
  b2: Vec2;
  order: number;
  side: number;
  heights: Float64Array;
  re: Float64Array;
  im: Float64Array;
  /** Height z (Å) of the highest atom; tip heights are above it. */
  top: number;
  /** Σ_k w_k Σ_n w(E_nk): the number of states in the window per cell (0 when the window is empty). */
  states: number;
}

/** Plane waves G = g1·b1 + g2·b2 with |G| ≤ radius. */
function planeWaves(b1: Vec2, b2: Vec2, cell: Sheet['cell'], radius: number): { g1: Int32Array; g2: Int32Array } {
  const n1 = Math.ceil((radius * Math.hypot(...cell[0])) / (2 * Math.PI));
  const n2 = Math.ceil((radius * Math.hypot(...cell[1])) / (2 * Math.PI));
  const a: number[] = [];
  const b: number[] = [];
  for (let i = -n1; i <= n1; i++) {
    for (let j = -n2; j <= n2; j++) {
      if (Math.hypot(i * b1[0] + j * b2[0], i * b1[1] + j * b2[1]) <= radius) {
        a.push(i);
        b.push(j);
      }
    }
  }
  return { g1: Int32Array.from(a), g2: Int32Array.from(b) };
}

export function ldosSeries(model: TightBindingModel, options: LdosOptions): LdosSeries {
  const { kappa, kpoints, weight } = options;
  const heights = Float64Array.from(options.heights);
  const nh = heights.length;
  const sheet = model.sheet;
  const cell = sheet.cell;
  const n = model.atoms;
  const area = Math.abs(signedArea(cell));
  const [b1, b2] = reciprocal(cell);
  const cutoff = -Math.log(options.accuracy ?? 1e-7);
  const hMin = Math.min(...heights);
  const gammaMax = kappa + cutoff / hMin;
  const qMax = Math.sqrt(gammaMax * gammaMax - kappa * kappa);
  let kMax = 0;
  for (let p = 0; p < kpoints.kpoints.length; p += 2) kMax = Math.max(kMax, Math.hypot(kpoints.kpoints[p], kpoints.kpoints[p + 1]));
  const { g1, g2 } = planeWaves(b1, b2, cell, qMax + kMax);
  const ng = g1.length;
  let order = 0;
  for (let g = 0; g < ng; g++) order = Math.max(order, 2 * Math.abs(g1[g]), 2 * Math.abs(g2[g]));
  const side = 2 * order + 1;
  const re = new Float64Array(nh * side * side);
  const im = new Float64Array(nh * side * side);

  // Atom positions, depth below the highest atom, and e^{−iG·R} for every plane wave (k-independent).
  const rx = new Float64Array(n), ry = new Float64Array(n), depth = new Float64Array(n);
  let top = -Infinity;
  for (let i = 0; i < n; i++) top = Math.max(top, sheet.atoms[i][2]);
  for (let i = 0; i < n; i++) {
    const [f1, f2, z] = sheet.atoms[i];
    rx[i] = f1 * cell[0][0] + f2 * cell[1][0];
    ry[i] = f1 * cell[0][1] + f2 * cell[1][1];
    depth[i] = top - z;
  }
  const cosGR = new Float64Array(ng * n), sinGR = new Float64Array(ng * n);
  for (let g = 0; g < ng; g++) {
    const gx = g1[g] * b1[0] + g2[g] * b2[0], gy = g1[g] * b1[1] + g2[g] * b2[1];
    for (let i = 0; i < n; i++) {
      const phase = gx * rx[i] + gy * ry[i];
      cosGR[g * n + i] = Math.cos(phase);
      sinGR[g * n + i] = Math.sin(phase);
    }
  }

  // Per-k workspaces.
  const active = new Int32Array(ng);
  const sFactor = new Float64Array(ng), zFactor = new Float64Array(ng);
  const decay = new Float64Array(ng * nh);
  const atomDecay = new Float64Array(ng * n);
  const aRe = new Float64Array(ng * nh), aIm = new Float64Array(ng * nh);
  const blocks = model.planar ? [{ block: 'sigma' as const, width: 3, sRow: 0, zRow: -1 }, { block: 'pi' as const, width: 1, sRow: -1, zRow: 0 }]
    : [{ block: 'full' as const, width: 4, sRow: 0, zRow: 3 }];
  const solvers = blocks.map((b) => {
    const size = model.size(b.block);
    return { ...b, size, solver: new HermitianEigensolver(size), hRe: new Float64Array(size * size), hIm: new Float64Array(size * size),
      values: new Float64Array(size), vRe: new Float64Array(size * size), vIm: new Float64Array(size * size) };
  });
  let states = 0;

  for (let p = 0; p < kpoints.weights.length; p++) {
    const kx = kpoints.kpoints[2 * p], ky = kpoints.kpoints[2 * p + 1];
    let na = 0;
    for (let g = 0; g < ng; g++) {
      const qx = kx + g1[g] * b1[0] + g2[g] * b2[0], qy = ky + g1[g] * b1[1] + g2[g] * b2[1];
      const gamma = Math.sqrt(kappa * kappa + qx * qx + qy * qy);
      if (gamma > gammaMax) continue;
      active[na] = g;
      sFactor[na] = sTransform(kappa, gamma) / area;
      zFactor[na] = pzTransform(kappa) / area;
      for (let j = 0; j < nh; j++) decay[na * nh + j] = Math.exp(-gamma * heights[j]);
      for (let i = 0; i < n; i++) atomDecay[na * n + i] = depth[i] === 0 ? 1 : Math.exp(-gamma * depth[i]);
      na++;
    }
    for (const s of solvers) {
      model.hamiltonian(kx, ky, s.block, s.hRe, s.hIm);
      s.solver.eigensystem(s.hRe, s.hIm, s.values, s.vRe, s.vIm);
      const size = s.size;
      for (let m = 0; m < size; m++) {
        const w = kpoints.weights[p] * weight(s.values[m]);
        if (!(Math.abs(w) > 1e-14)) continue;
        states += w;
        for (let a = 0; a < na; a++) {
          const g = active[a];
          let sRe = 0, sIm = 0, zRe = 0, zIm = 0;
          for (let i = 0; i < n; i++) {
            const c = cosGR[g * n + i], sn = sinGR[g * n + i], f = atomDecay[a * n + i];
            if (s.sRow >= 0) {
              const r = (s.width * i + s.sRow) * size + m;
              const cr = s.vRe[r] * f, ci = s.vIm[r] * f;
              sRe += cr * c + ci * sn;
              sIm += ci * c - cr * sn;
            }
            if (s.zRow >= 0) {
              const r = (s.width * i + s.zRow) * size + m;
              const cr = s.vRe[r] * f, ci = s.vIm[r] * f;
              zRe += cr * c + ci * sn;
              zIm += ci * c - cr * sn;
            }
          }
          const baseRe = sFactor[a] * sRe + zFactor[a] * zRe, baseIm = sFactor[a] * sIm + zFactor[a] * zIm;
          for (let j = 0; j < nh; j++) {
            aRe[a * nh + j] = baseRe * decay[a * nh + j];
            aIm[a * nh + j] = baseIm * decay[a * nh + j];
          }
        }
        for (let a = 0; a < na; a++) {
          const ga1 = g1[active[a]], ga2 = g2[active[a]];
          for (let b = 0; b < na; b++) {
            const q = (ga1 - g1[active[b]] + order) * side + (ga2 - g2[active[b]] + order);
            for (let j = 0; j < nh; j++) {
              const xr = aRe[a * nh + j], xi = aIm[a * nh + j], yr = aRe[b * nh + j], yi = aIm[b * nh + j];
              const at = j * side * side + q;
              re[at] += w * (xr * yr + xi * yi);
              im[at] += w * (xi * yr - xr * yi);
            }
          }
        }
      }
    }
  }
  return { cell, b1, b2, order, side, heights, re, im, top, states };
}
