/**
 * A real periodic field ρ(r) = Σ_Q ρ_Q e^{iQ·r} (Q = m1·b1 + m2·b2) kept as its significant terms, evaluated at any
 * in-plane points. ρ is real, so ρ_{−Q} = ρ_Q* and only half the terms are kept: ρ = ρ_0 + 2·Σ_half Re(ρ_Q e^{iQ·r}).
 * Layout: terms t = 0…count−1 with integer indices m1[t], m2[t] and coefficient re[t] + i·im[t].
 */
import type { Vec2 } from '../lattice/sheet.ts';
import type { LdosSeries } from './ldosSeries.ts';

export interface SeriesField {
  b1: Vec2;
  b2: Vec2;
  order: number;
  /** The mean ρ_0. */
  mean: number;
  count: number;
  m1: Int32Array;
  m2: Int32Array;
  re: Float64Array;
  im: Float64Array;
}

/** The field of height index j of a series; terms below `relative`·|ρ_0| are dropped (default 1e-9). */
export function seriesField(series: LdosSeries, j: number, relative = 1e-9): SeriesField {
  const { side, order } = series;
  const base = j * side * side;
  const mean = series.re[base + order * side + order];
  const floor = relative * Math.abs(mean);
  const m1: number[] = [], m2: number[] = [], re: number[] = [], im: number[] = [];
  for (let a = -order; a <= order; a++) {
    for (let b = -order; b <= order; b++) {
      if (a < 0 || (a === 0 && b <= 0)) continue;
      const at = base + (a + order) * side + (b + order);
      if (Math.hypot(series.re[at], series.im[at]) <= floor) continue;
      m1.push(a); m2.push(b); re.push(series.re[at]); im.push(series.im[at]);
    }
  }
  return { b1: series.b1, b2: series.b2, order, mean, count: m1.length, m1: Int32Array.from(m1), m2: Int32Array.from(m2),
    re: Float64Array.from(re), im: Float64Array.from(im) };
}

/** e^{imθ} for m = −order…order at [m + order], by repeated multiplication (error ~ m·ε, no trig per m). */
function powers(theta: number, order: number, c: Float64Array, s: Float64Array): void {
  const cs = Math.cos(theta), sn = Math.sin(theta);
  let pc = 1, ps = 0;
  for (let m = 0; m <= order; m++) {
    c[order + m] = pc; s[order + m] = ps;
    c[order - m] = pc; s[order - m] = -ps;
    const next = pc * cs - ps * sn;
    ps = pc * sn + ps * cs;
    pc = next;
  }
}

/** Evaluates a field at points (x[p], y[p]) (Å) into out[p]; reuses one table of e^{imθ}, allocates once per call. */
export function evaluateField(field: SeriesField, x: Float64Array, y: Float64Array, out: Float64Array): Float64Array {
  const { b1, b2, order, count, m1, m2, re, im } = field;
  const side = 2 * order + 1;
  const c1 = new Float64Array(side), s1 = new Float64Array(side), c2 = new Float64Array(side), s2 = new Float64Array(side);
  for (let p = 0; p < x.length; p++) {
    const t1 = b1[0] * x[p] + b1[1] * y[p];
    const t2 = b2[0] * x[p] + b2[1] * y[p];
    powers(t1, order, c1, s1);
    powers(t2, order, c2, s2);
    let sum = 0;
    for (let t = 0; t < count; t++) {
      const i = m1[t] + order, j = m2[t] + order;
      const c = c1[i] * c2[j] - s1[i] * s2[j];
      const s = s1[i] * c2[j] + c1[i] * s2[j];
      sum += re[t] * c - im[t] * s;
    }
    out[p] = field.mean + 2 * sum;
  }
  return out;
}
