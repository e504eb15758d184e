/**
 * The passes of eighTriangle.ts (rank-2 update A₂₂ ← A₂₂ − u·wᴴ − w·uᴴ, Hermitian product q = A₂₂·v, or both
 * fused) in WebAssembly SIMD. A complex number is one f64x2 (re, im), so the layout of eighTriangle.ts is kept:
 * `work` n×n row-major complex interleaved (lower triangle), `lanes` 64 bytes per index j — u at +0, w at +16,
 * v at +32, q at +48. `swaps` (32 bytes per j) receives s(u_j), s(w_j) at the start of an updating pass.
 *
 * Complex products without horizontal sums, s(x) = (x_im, x_re) being the lanes swapped (one shuffle):
 *   a·conj(b) = b ⊙ (a_re, −a_re) + s(b) ⊙ (a_im, a_im)     (the update, a = u_i or w_i fixed along row i)
 *   conj(x)·v = x ⊙ (v_re, −v_re) + s(x) ⊙ (v_im, v_im)      (q_j += conj(A_ij)·v_i)
 *   Σ_j x_j·v_j = (Σ x⊙v)₀ − (Σ x⊙v)₁ + i·((Σ s(x)⊙v)₀ + (Σ s(x)⊙v)₁)   (row i's sum, two accumulators).
 * One row at a time: per entry that is 8 multiplications, 8 additions and one shuffle on f64x2, with the row's
 * six constants and two sums in registers. Rows in pairs (as in TypeScript, where loads are what cost) measured
 * slower here: 16 constants and sums no longer fit the 16 vector registers. The row loop is software-pipelined.
 * hermitianColumn is the O(n) step before each reflector (eighHouseholder.ts `column`).
 */
import { Code, Locals, type WasmFunction } from './wasmAssembler.ts';

interface Pass {
  update: boolean;
  product: boolean;
}

class PassBuilder {
  readonly l = new Locals();
  readonly c = new Code();
  // Parameters: byte addresses of work, lanes and swaps; n; the first row and column, start.
  readonly work = this.l.param('i32');
  readonly lanes = this.l.param('i32');
  readonly swaps = this.l.param('i32');
  readonly n = this.l.param('i32');
  readonly start = this.l.param('i32');
  readonly i = this.l.local('i32');
  /** Lanes and swaps of index i (the row) and of index j (along the row). */
  readonly li = this.l.local('i32');
  readonly si = this.l.local('i32');
  readonly lj = this.l.local('i32');
  readonly sj = this.l.local('i32');
  readonly lanesEnd = this.l.local('i32');
  /** Address of entry (i, j). */
  readonly at = this.l.local('i32');
  readonly sign = this.l.local('v128');
  // Row constants: the update's c1…c4 (from u_i, w_i), the product's d1, d2 (from v_i); the row sums.
  readonly c1 = this.l.local('v128');
  readonly c2 = this.l.local('v128');
  readonly c3 = this.l.local('v128');
  readonly c4 = this.l.local('v128');
  readonly d1 = this.l.local('v128');
  readonly d2 = this.l.local('v128');
  readonly s1 = this.l.local('v128');
  readonly s2 = this.l.local('v128');
  readonly x = this.l.local('v128');
  readonly sx = this.l.local('v128');
  readonly vj = this.l.local('v128');
  readonly xp = this.l.local('v128');
  readonly sxp = this.l.local('v128');

  constructor(readonly pass: Pass) {}

  /** Pushes (x_lane, −x_lane) or (x_lane, x_lane) of the vector in `x`. */
  private splat(lane: number, negated: boolean): void {
    this.c.get(this.x).f64x2ExtractLane(lane).f64x2Splat();
    if (negated) this.c.get(this.sign).f64x2Mul();
  }

  /** The constants of row i (lanes at li) and its sums zeroed. */
  private rowConstants(): void {
    const c = this.c;
    // (1, −1), formed per row so that it holds no register through the row's loop.
    c.f64(1).f64x2Splat().f64(-1).f64x2ReplaceLane(1).set(this.sign);
    if (this.pass.update) {
      c.get(this.li).v128Load(0).set(this.x);
      this.splat(0, true); c.set(this.c1);
      this.splat(1, false); c.set(this.c2);
      c.get(this.li).v128Load(16).set(this.x);
      this.splat(0, true); c.set(this.c3);
      this.splat(1, false); c.set(this.c4);
    }
    if (this.pass.product) {
      c.get(this.li).v128Load(32).set(this.x);
      this.splat(0, true); c.set(this.d1);
      this.splat(1, false); c.set(this.d2);
      c.f64(0).f64x2Splat().tee(this.s1).set(this.s2);
    }
  }

  /**
   * x = entry (i, j + e) at `at` + 16e, updated against index j + e (lanes at lj + 64e, swaps at sj + 32e) and
   * stored, or loaded; s(x) in sx for the product.
   */
  private entry(lj: number, sj: number, e = 0): void {
    const c = this.c;
    if (this.pass.update) {
      c.get(this.at);
      c.get(this.at).v128Load(16 * e);
      c.get(lj).v128Load(64 * e + 16).get(this.c1).f64x2Mul().get(sj).v128Load(32 * e + 16).get(this.c2).f64x2Mul().f64x2Add();
      c.get(lj).v128Load(64 * e).get(this.c3).f64x2Mul().get(sj).v128Load(32 * e).get(this.c4).f64x2Mul().f64x2Add();
      c.f64x2Add().f64x2Sub().tee(this.x).v128Store(16 * e);
    } else {
      c.get(this.at).v128Load(16 * e).set(this.x);
    }
    if (this.pass.product) c.f64x2Swapped(this.x).set(this.sx);
  }

  /** Row sums s1 += x⊙v_j, s2 += s(x)⊙v_j of the previous entry (xp, sxp; v_j in vj). */
  private sums(): void {
    const c = this.c;
    c.get(this.s1).get(this.xp).get(this.vj).f64x2Mul().f64x2Add().set(this.s1);
    c.get(this.s2).get(this.sxp).get(this.vj).f64x2Mul().f64x2Add().set(this.s2);
  }

  /** Adds the value on the stack to q at lanes `l`. */
  private addToQ(l: number): void {
    this.c.set(this.vj);
    this.c.get(l).get(l).v128Load(48).get(this.vj).f64x2Add().v128Store(48);
  }

  /** A loop from `from` over the lanes of indices …end−1 (64 bytes each, swaps 32 each) while lj < end. */
  private forColumns(from: number, swapsFrom: number, end: number, inner: () => void): void {
    const c = this.c;
    c.get(from).set(this.lj);
    c.get(swapsFrom).set(this.sj);
    c.block(() => {
      c.get(this.lj).get(end).i32GeS().brIf(0);
      c.loop(() => {
        inner();
        c.get(this.sj).i32(32).i32Add().set(this.sj);
        c.get(this.lj).i32(64).i32Add().tee(this.lj).get(end).i32LtS().brIf(0);
      });
    });
  }

  body(): number[] {
    const c = this.c;
    const { update, product } = this.pass;
    c.get(this.lanes).get(this.n).i32(64).i32Mul().i32Add().set(this.lanesEnd);
    c.get(this.lanes).get(this.start).i32(64).i32Mul().i32Add().set(this.li);
    c.get(this.swaps).get(this.start).i32(32).i32Mul().i32Add().set(this.si);
    if (update) {
      // s(u_j), s(w_j) over start…n−1, read by every row.
      this.forColumns(this.li, this.si, this.lanesEnd, () => {
        c.get(this.sj);
        c.get(this.lj).v128Load(0).set(this.x);
        c.f64x2Swapped(this.x).v128Store(0);
        c.get(this.sj);
        c.get(this.lj).v128Load(16).set(this.x);
        c.f64x2Swapped(this.x).v128Store(16);
      });
    }
    if (product) {
      this.forColumns(this.li, this.si, this.lanesEnd, () => {
        c.get(this.lj).f64(0).f64x2Splat().v128Store(48);
      });
    }
    // The rows: i from start, li/si its lanes and swaps; the columns start…i−1 in the loop, then the diagonal.
    c.get(this.start).set(this.i);
    const rowStartLanes = this.l.local('i32');
    const rowStartSwaps = this.l.local('i32');
    c.get(this.li).set(rowStartLanes);
    c.get(this.si).set(rowStartSwaps);
    c.block(() => {
      c.loop(() => {
        c.get(this.i).get(this.n).i32GeS().brIf(1);
        this.rowConstants();
        // (i, start) at work + 16·(i·n + start).
        c.get(this.work).get(this.i).get(this.n).i32Mul().get(this.start).i32Add().i32(16).i32Mul().i32Add().set(this.at);
        // Software-pipelined: entry j+1 is updated while entry j goes into the product, so no turn waits on its
        // own update (measured 7 % faster); the last turn leaves the updated diagonal in x.
        this.entry(rowStartLanes, rowStartSwaps, 0);
        this.forColumns(rowStartLanes, rowStartSwaps, this.li, () => {
          if (product) c.get(this.x).set(this.xp).get(this.sx).set(this.sxp);
          this.entry(this.lj, this.sj, 1);
          if (product) {
            c.get(this.lj).v128Load(32).set(this.vj);
            this.sums();
            // q_j += conj(x)·v_i.
            c.get(this.xp).get(this.d1).f64x2Mul().get(this.sxp).get(this.d2).f64x2Mul().f64x2Add();
            this.addToQ(this.lj);
          }
          c.get(this.at).i32(16).i32Add().set(this.at);
        });
        // The diagonal (real): the update's formula leaves its imaginary lane as it was (p − q + (q − p) = 0 in
        // floating point), as the TypeScript pass does; q_i += Σ_j x_ij·v_j + d·v_i.
        if (product) {
          c.get(this.s1).f64x2ExtractLane(0).get(this.s1).f64x2ExtractLane(1).f64Sub().f64x2Splat();
          c.get(this.s2).f64x2ExtractLane(0).get(this.s2).f64x2ExtractLane(1).f64Add().f64x2ReplaceLane(1);
          c.get(this.x).f64x2ExtractLane(0).f64x2Splat().get(this.li).v128Load(32).f64x2Mul().f64x2Add();
          this.addToQ(this.li);
        }
        c.get(this.i).i32(1).i32Add().set(this.i);
        c.get(this.li).i32(64).i32Add().set(this.li);
        c.get(this.si).i32(32).i32Add().set(this.si);
        c.br(0);
      });
    });
    return c.bytes;
  }
}

/**
 * `hermitianColumn(work, lanes, reflRe, reflIm, tailAt, n, k, tau, updating)`: the O(n) work of eighHouseholder.ts
 * before reflector k, in one place. When `updating` (τ = τ_{k−1} ≠ 0): the next reflector and its product become
 * u and p = τ·q, w = p − (τ·uᴴp/2)·u (indices k…n−1), and column k (rows k…n−1) gets the rank-2 update,
 * a·conj(b) = a ⊙ (b_re, b_re) + s(a) ⊙ (b_im, −b_im) with b = w_k or u_k fixed. Then column k below the diagonal
 * is copied to row k of reflRe/reflIm and to the v lanes, and Σ_{r ≥ k+2} |x_r|² is stored at tailAt.
 */
function columnFunction(): WasmFunction {
  const l = new Locals();
  const c = new Code();
  const work = l.param('i32'), lanes = l.param('i32'), reflRe = l.param('i32'), reflIm = l.param('i32');
  const tailAt = l.param('i32'), n = l.param('i32'), k = l.param('i32'), tau = l.param('f64');
  const updating = l.param('i32');
  const lj = l.local('i32'), lanesEnd = l.local('i32'), at = l.local('i32'), row = l.local('i32'), i = l.local('i32');
  const half = l.local('f64');
  const acc = l.local('v128'), x = l.local('v128'), ui = l.local('v128'), wi = l.local('v128');
  const halfs = l.local('v128'), wRe = l.local('v128'), wIm = l.local('v128'), uRe = l.local('v128'), uIm = l.local('v128');
  /** (lane, lane) or (lane, −lane) of the vector in `local`. */
  const pair = (local: number, lane: number, negated: boolean) => {
    c.get(local).f64x2ExtractLane(lane).f64x2Splat();
    if (negated) c.get(local).f64x2ExtractLane(lane).f64Neg().f64x2ReplaceLane(1);
  };
  /** Entry (i, k): updated (when updating) and stored, or loaded; left in x. */
  const entry = () => {
    c.block(() => {
      c.get(at).v128Load().set(x);
      c.get(updating).i32Eqz().brIf(0);
      c.get(lj).v128Load(0).set(ui);
      c.get(lj).v128Load(16).get(halfs).get(ui).f64x2Mul().f64x2Sub().set(wi);
      c.get(lj).get(wi).v128Store(16);
      c.get(at);
      c.get(x);
      c.get(ui).get(wRe).f64x2Mul().f64x2Swapped(ui).get(wIm).f64x2Mul().f64x2Add();
      c.get(wi).get(uRe).f64x2Mul().f64x2Swapped(wi).get(uIm).f64x2Mul().f64x2Add();
      c.f64x2Add().f64x2Sub().tee(x).v128Store();
    });
  };
  /** x to row k of reflRe/reflIm (entry i, at byte `row`) and, below the diagonal, to the v lanes. */
  const gather = () => {
    c.get(reflRe).get(row).i32Add().get(x).f64x2ExtractLane(0).f64Store();
    c.get(reflIm).get(row).i32Add().get(x).f64x2ExtractLane(1).f64Store();
    c.get(lj).get(x).v128Store(32);
  };
  const next = () => {
    c.get(at).get(n).i32(16).i32Mul().i32Add().set(at);
    c.get(row).i32(8).i32Add().set(row);
    c.get(i).i32(1).i32Add().set(i);
    c.get(lj).i32(64).i32Add().set(lj);
  };
  c.get(lanes).get(n).i32(64).i32Mul().i32Add().set(lanesEnd);
  c.f64(0).f64x2Splat().set(acc);
  c.block(() => {
    c.get(updating).i32Eqz().brIf(0);
    // u = v, p = τ·q, Σ u⊙p over k…n−1.
    c.get(lanes).get(k).i32(64).i32Mul().i32Add().set(lj);
    c.loop(() => {
      c.get(lj).get(lj).v128Load(32).tee(ui).v128Store(0);
      c.get(lj).get(lj).v128Load(48).get(tau).f64x2Splat().f64x2Mul().tee(x).v128Store(16);
      c.get(acc).get(ui).get(x).f64x2Mul().f64x2Add().set(acc);
      c.get(lj).i32(64).i32Add().tee(lj).get(lanesEnd).i32LtS().brIf(0);
    });
    c.f64(0.5).get(tau).f64Mul().get(acc).f64x2ExtractLane(0).get(acc).f64x2ExtractLane(1).f64Add().f64Mul().set(half);
    c.get(half).f64x2Splat().set(halfs);
    // w_k and u_k, the fixed factors of the column's update.
    c.get(lanes).get(k).i32(64).i32Mul().i32Add().set(lj);
    c.get(lj).v128Load(0).set(ui);
    c.get(lj).v128Load(16).get(halfs).get(ui).f64x2Mul().f64x2Sub().set(wi);
    pair(wi, 0, false); c.set(wRe);
    pair(wi, 1, true); c.set(wIm);
    pair(ui, 0, false); c.set(uRe);
    pair(ui, 1, true); c.set(uIm);
  });
  c.f64(0).f64x2Splat().set(acc);
  c.get(k).set(i);
  c.get(lanes).get(k).i32(64).i32Mul().i32Add().set(lj);
  c.get(work).get(k).get(n).i32Mul().get(k).i32Add().i32(16).i32Mul().i32Add().set(at);
  c.get(k).get(n).i32Mul().get(k).i32Add().i32(8).i32Mul().set(row);
  // The diagonal entry (k, k), then (k+1, k) — x₀ of the reflector — then the tail.
  entry();
  next();
  c.block(() => {
    c.get(i).get(n).i32GeS().brIf(0);
    entry();
    gather();
    next();
    c.block(() => {
      c.get(i).get(n).i32GeS().brIf(0);
      c.loop(() => {
        entry();
        gather();
        c.get(acc).get(x).get(x).f64x2Mul().f64x2Add().set(acc);
        next();
        c.get(i).get(n).i32LtS().brIf(0);
      });
    });
  });
  c.get(tailAt).get(acc).f64x2ExtractLane(0).get(acc).f64x2ExtractLane(1).f64Add().f64Store();
  return { name: 'hermitianColumn', params: l.params, locals: l.locals, body: c.bytes };
}

function passFunction(name: string, pass: Pass): WasmFunction {
  const builder = new PassBuilder(pass);
  const body = builder.body();
  return { name, params: builder.l.params, locals: builder.l.locals, body };
}

/**
 * The three passes, each `(work, lanes, swaps, n, start)` (addresses in bytes) over rows and columns start…n−1:
 * hermitianProduct (q = A₂₂·v), hermitianUpdate (the rank-2 update alone), hermitianUpdateProduct (both fused);
 * and hermitianColumn, the O(n) work before each reflector.
 */
export function hermitianPassFunctions(): WasmFunction[] {
  return [
    columnFunction(),
    passFunction('hermitianProduct', { update: false, product: true }),
    passFunction('hermitianUpdate', { update: true, product: false }),
    passFunction('hermitianUpdateProduct', { update: true, product: true }),
  ];
}
