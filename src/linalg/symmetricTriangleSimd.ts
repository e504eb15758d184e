/**
 * The passes of the real Householder reduction (symmetricEigenvalues.ts) in WebAssembly SIMD: the rank-2 update
 * A ← A − u·wᵀ − w·uᵀ and the product q = A·v over the lower triangle, alone or fused in one pass.
 *
 * Layout: `work` n×n row-major f64 (lower triangle); u, w, v, q arrays of n f64 each; every address in bytes.
 * Two columns j, j+1 are one f64x2 (adjacent in a row, and in u, w, v, q); rows go in pairs, i and i+1, so that
 * each load of u, w, v and each update of q serves four entries. The rows of a pass start at `from` and are taken
 * two at a time, so row i always has an even count i − from of entries left of its diagonal: the pairs of columns
 * cover them exactly, and the 2×2 corner on the diagonal of each pair of rows is done in scalars.
 */
import { Code, Locals, type WasmFunction } from './wasmAssembler.ts';

interface Pass {
  update: boolean;
  product: boolean;
}

class PassBuilder {
  readonly l = new Locals();
  readonly c = new Code();
  readonly work = this.l.param('i32');
  readonly u = this.l.param('i32');
  readonly w = this.l.param('i32');
  readonly v = this.l.param('i32');
  readonly q = this.l.param('i32');
  readonly n = this.l.param('i32');
  readonly from = this.l.param('i32');
  readonly i = this.l.local('i32');
  /** Byte offset of entry i (or j) in u, w, v, q. */
  readonly ib = this.l.local('i32');
  readonly jb = this.l.local('i32');
  readonly a0 = this.l.local('i32');
  readonly a1 = this.l.local('i32');
  readonly pairs = this.l.local('i32');
  // Row constants splatted, row sums, and the column values.
  readonly u0 = this.l.local('v128');
  readonly w0 = this.l.local('v128');
  readonly v0 = this.l.local('v128');
  readonly u1 = this.l.local('v128');
  readonly w1 = this.l.local('v128');
  readonly v1 = this.l.local('v128');
  readonly s0 = this.l.local('v128');
  readonly s1 = this.l.local('v128');
  readonly uj = this.l.local('v128');
  readonly wj = this.l.local('v128');
  readonly vj = this.l.local('v128');
  readonly x0 = this.l.local('v128');
  readonly x1 = this.l.local('v128');
  // Scalars of the corner.
  readonly d0 = this.l.local('f64');
  readonly d1 = this.l.local('f64');
  readonly corner = this.l.local('f64');

  constructor(readonly pass: Pass) {}

  /** Pushes the f64 at array `base`, entry at byte offset `offset` + extra entries. */
  private scalar(base: number, offset: number, extra = 0): void {
    this.c.get(base).get(offset).i32Add().f64Load(8 * extra);
  }

  /** x = A entry pair at `at` updated with the row's splats (stored back) or loaded. */
  private entry(at: number, ui: number, wi: number, x: number): void {
    const c = this.c;
    if (this.pass.update) {
      c.get(at);
      c.get(at).v128Load().get(ui).get(this.wj).f64x2Mul().get(wi).get(this.uj).f64x2Mul().f64x2Add().f64x2Sub();
      c.tee(x).v128Store();
    } else {
      c.get(at).v128Load().set(x);
    }
  }

  /** A scalar entry of the corner: A − (u_r·w_c + w_r·u_c), stored back; left in `out`. */
  private cornerEntry(at: number, offset: number, r: number, col: number, out: number): void {
    const c = this.c;
    c.get(at).get(at).f64Load(offset);
    if (this.pass.update) {
      this.scalar(this.u, this.ib, r); this.scalar(this.w, this.ib, col); c.f64Mul();
      this.scalar(this.w, this.ib, r); this.scalar(this.u, this.ib, col); c.f64Mul();
      c.f64Add().f64Sub();
    }
    c.tee(out).f64Store(offset);
  }

  body(): number[] {
    const c = this.c;
    const { update, product } = this.pass;
    const splat = (array: number, extra: number, out: number) => { this.scalar(array, this.ib, extra); c.f64x2Splat().set(out); };
    const zero = (out: number) => c.f64(0).f64x2Splat().set(out);
    const hsum = (sum: number) => c.get(sum).f64x2ExtractLane(0).get(sum).f64x2ExtractLane(1).f64Add();
    c.get(this.from).i32(3).i32Shl().set(this.ib);
    if (product) {
      // q = 0 over from…n−1 (scalar stores: the count may be odd).
      c.block(() => {
        c.get(this.from).get(this.n).i32GeS().brIf(0);
        c.loop(() => {
          c.get(this.q).get(this.ib).i32Add().f64(0).f64Store();
          c.get(this.ib).i32(8).i32Add().tee(this.ib).get(this.n).i32(3).i32Shl().i32LtS().brIf(0);
        });
      });
      c.get(this.from).i32(3).i32Shl().set(this.ib);
    }
    c.get(this.from).set(this.i);
    c.block(() => {
      c.loop(() => {
        c.get(this.i).get(this.n).i32GeS().brIf(1);
        // Does row i+1 exist? `pairs` = 1 for a pair of rows, 0 for the last single row.
        c.get(this.i).i32(1).i32Add().get(this.n).i32LtS().set(this.pairs);
        if (update) { splat(this.u, 0, this.u0); splat(this.w, 0, this.w0); }
        if (product) { splat(this.v, 0, this.v0); zero(this.s0); zero(this.s1); }
        // Row i+1's constants (read only when it exists; a lone last row uses zeros).
        c.block(() => {
          if (update) { zero(this.u1); zero(this.w1); }
          if (product) zero(this.v1);
          c.get(this.pairs).i32Eqz().brIf(0);
          if (update) { splat(this.u, 1, this.u1); splat(this.w, 1, this.w1); }
          if (product) splat(this.v, 1, this.v1);
        });
        // a0 = work + 8·(i·n + from), a1 = a0 + 8n; for a lone last row a1 = a0 with row constants 0, so the
        // second row rewrites row i's entries unchanged and adds 0 to q (no branch in the loop).
        c.get(this.work).get(this.i).get(this.n).i32Mul().get(this.from).i32Add().i32(3).i32Shl().i32Add().set(this.a0);
        c.get(this.a0).get(this.n).i32(3).i32Shl().get(this.pairs).i32Mul().i32Add().set(this.a1);
        c.get(this.from).i32(3).i32Shl().set(this.jb);
        c.block(() => {
          c.get(this.jb).get(this.ib).i32GeS().brIf(0);
          c.loop(() => {
            if (update) {
              c.get(this.u).get(this.jb).i32Add().v128Load().set(this.uj);
              c.get(this.w).get(this.jb).i32Add().v128Load().set(this.wj);
            }
            if (product) c.get(this.v).get(this.jb).i32Add().v128Load().set(this.vj);
            this.entry(this.a0, this.u0, this.w0, this.x0);
            this.entry(this.a1, this.u1, this.w1, this.x1);
            if (product) {
              c.get(this.s0).get(this.x0).get(this.vj).f64x2Mul().f64x2Add().set(this.s0);
              c.get(this.s1).get(this.x1).get(this.vj).f64x2Mul().f64x2Add().set(this.s1);
              c.get(this.q).get(this.jb).i32Add();
              c.get(this.q).get(this.jb).i32Add().v128Load()
                .get(this.x0).get(this.v0).f64x2Mul().get(this.x1).get(this.v1).f64x2Mul().f64x2Add().f64x2Add();
              c.v128Store();
            }
            c.get(this.a0).i32(16).i32Add().set(this.a0);
            c.get(this.a1).i32(16).i32Add().set(this.a1);
            c.get(this.jb).i32(16).i32Add().tee(this.jb).get(this.ib).i32LtS().brIf(0);
          });
        });
        // The corner: (i, i); then (i+1, i) and (i+1, i+1) when row i+1 exists. a0 and a1 now point at column i.
        this.cornerEntry(this.a0, 0, 0, 0, this.d0);
        c.block(() => {
          c.block(() => {
            c.get(this.pairs).i32Eqz().brIf(0);
            this.cornerEntry(this.a1, 0, 1, 0, this.corner);
            this.cornerEntry(this.a1, 8, 1, 1, this.d1);
            if (product) {
              // q_i += Σ + d0·v_i + c·v_{i+1};  q_{i+1} += Σ + c·v_i + d1·v_{i+1}.
              c.get(this.q).get(this.ib).i32Add();
              this.scalar(this.q, this.ib); hsum(this.s0).f64Add();
              c.get(this.d0); this.scalar(this.v, this.ib); c.f64Mul().f64Add();
              c.get(this.corner); this.scalar(this.v, this.ib, 1); c.f64Mul().f64Add();
              c.f64Store();
              c.get(this.q).get(this.ib).i32Add();
              this.scalar(this.q, this.ib, 1); hsum(this.s1).f64Add();
              c.get(this.corner); this.scalar(this.v, this.ib); c.f64Mul().f64Add();
              c.get(this.d1); this.scalar(this.v, this.ib, 1); c.f64Mul().f64Add();
              c.f64Store(8);
            }
            c.br(1);
          });
          if (product) {
            // A lone last row: q_i += Σ + d0·v_i.
            c.get(this.q).get(this.ib).i32Add();
            this.scalar(this.q, this.ib); hsum(this.s0).f64Add();
            c.get(this.d0); this.scalar(this.v, this.ib); c.f64Mul().f64Add();
            c.f64Store();
          }
        });
        c.get(this.i).i32(2).i32Add().set(this.i);
        c.get(this.ib).i32(16).i32Add().set(this.ib);
        c.br(0);
      });
    });
    return c.bytes;
  }
}

/**
 * `symmetricColumn(work, u, w, v, q, normAt, n, start, tau)`: the O(n) work of symmetricEigenvalues.ts before the
 * reflector of column `start`, in scalars. When τ (of the current reflector u) ≠ 0: w = τ·q − (τ²·qᵀu/2)·u and
 * the column's rank-2 update (rows start…n−1); then the column below the diagonal is copied into v and Σ x² is
 * stored at normAt.
 */
function columnFunction(): WasmFunction {
  const l = new Locals();
  const c = new Code();
  const work = l.param('i32'), u = l.param('i32'), w = l.param('i32'), v = l.param('i32'), q = l.param('i32');
  const normAt = l.param('i32'), n = l.param('i32'), start = l.param('i32'), tau = l.param('f64');
  const ib = l.local('i32'), end = l.local('i32'), at = l.local('i32'), rowBytes = l.local('i32');
  const half = l.local('f64'), us = l.local('f64'), ws = l.local('f64'), wi = l.local('f64'), x = l.local('f64');
  const norm2 = l.local('f64');
  const load = (base: number) => c.get(base).get(ib).i32Add().f64Load();
  /** w_i = τ·q_i − half·u_i (i at byte ib). */
  const rankTwo = () => { load(q).get(tau).f64Mul().get(half); load(u); c.f64Mul().f64Sub(); };
  const updating = (inner: () => void) => c.block(() => { c.get(tau).f64(0).f64Eq().brIf(0); inner(); });
  c.get(n).i32(3).i32Shl().tee(rowBytes).set(end);
  c.f64(0).set(norm2);
  updating(() => {
    c.f64(0).set(x);
    c.get(start).i32(3).i32Shl().set(ib);
    c.loop(() => {
      c.get(x); load(q); load(u); c.f64Mul().f64Add().set(x);
      c.get(ib).i32(8).i32Add().tee(ib).get(end).i32LtS().brIf(0);
    });
    c.f64(0.5).get(tau).f64Mul().get(tau).f64Mul().get(x).f64Mul().set(half);
    c.get(start).i32(3).i32Shl().set(ib);
    load(u); c.set(us);
    rankTwo(); c.set(ws);
  });
  // Rows start…n−1 of the column: (i, start) at work + 8·(i·n + start).
  c.get(start).i32(3).i32Shl().set(ib);
  c.get(work).get(start).get(n).i32Mul().get(start).i32Add().i32(3).i32Shl().i32Add().set(at);
  c.loop(() => {
    c.get(at).f64Load().set(x);
    updating(() => {
      // x − (u_i·w_s + w_i·u_s), w_i kept.
      c.get(x);
      load(u); c.get(ws).f64Mul();
      rankTwo(); c.tee(wi).get(us).f64Mul();
      c.f64Add().f64Sub().set(x);
      c.get(w).get(ib).i32Add().get(wi).f64Store();
      c.get(at).get(x).f64Store();
    });
    // Below the diagonal: into v, and into ‖x‖².
    c.block(() => {
      c.get(ib).get(start).i32(3).i32Shl().i32Eq().brIf(0);
      c.get(v).get(ib).i32Add().get(x).f64Store();
      c.get(norm2).get(x).get(x).f64Mul().f64Add().set(norm2);
    });
    c.get(at).get(rowBytes).i32Add().set(at);
    c.get(ib).i32(8).i32Add().tee(ib).get(end).i32LtS().brIf(0);
  });
  c.get(normAt).get(norm2).f64Store();
  return { name: 'symmetricColumn', params: l.params, locals: l.locals, body: c.bytes };
}

/**
 * `symmetricReduce(work, u, v, w, q, diag, offSquared, normAt, n)`, n ≥ 3: the whole reduction of
 * symmetricEigenvalues.ts in one call (its TypeScript `reduce` step for step: the column step, the reflector, the
 * pass; u and v swap roles each step), so that a solve pays one call into WebAssembly, not two per step. Leaves
 * diag[0…n−3] and offSquared[0…n−3]; the last 2×2 is read by the caller.
 */
function reduceFunction(): WasmFunction {
  const l = new Locals();
  const work = l.param('i32'), u0 = l.param('i32'), v0 = l.param('i32'), w = l.param('i32'), q = l.param('i32');
  const diag = l.param('i32'), offSquared = l.param('i32'), normAt = l.param('i32'), n = l.param('i32');
  const u = l.local('i32'), v = l.local('i32'), k = l.local('i32'), swap = l.local('i32');
  const tau = l.local('f64'), nextTau = l.local('f64'), norm2 = l.local('f64'), x0 = l.local('f64');
  const alpha = l.local('f64');
  const body = (indexOf: (name: string) => number): number[] => {
    const c = new Code();
    /**
     * `result` = τ of the reflector of the column whose index `column` pushes, from its copy at `out` and ‖x‖² at
     * normAt (symmetricEigenvalues.ts, reflector()); sets offSquared[col] and out[col + 1].
     */
    const reflector = (column: () => void, out: number, result: number) => {
      c.get(normAt).f64Load().set(norm2);
      // x0 = out[col + 1]; offSquared[col] = ‖x‖².
      c.get(out); column(); c.i32(1).i32Add().i32(3).i32Shl().i32Add().f64Load().set(x0);
      c.get(offSquared); column(); c.i32(3).i32Shl().i32Add().get(norm2).f64Store();
      c.f64(0).set(result);
      c.block(() => {
        c.get(norm2).get(x0).get(x0).f64Mul().f64Eq().brIf(0);
        c.get(norm2).f64Sqrt().set(alpha);
        // out[col + 1] = x0 ≥ 0 ? x0 + α : x0 − α (no cancellation); τ = 1/(α(α + |x0|)).
        c.get(out); column(); c.i32(1).i32Add().i32(3).i32Shl().i32Add();
        c.get(x0).get(alpha).f64Add().get(x0).get(alpha).f64Sub().get(x0).f64(0).f64Ge().select().f64Store();
        c.f64(1).get(alpha).get(alpha).get(x0).f64Abs().f64Add().f64Mul().f64Div().set(result);
      });
    };
    const pass = (name: string) => {
      c.get(work).get(u).get(w).get(v).get(q).get(n).get(k).i32(2).i32Add().call(indexOf(name));
    };
    c.get(u0).set(u);
    c.get(v0).set(v);
    // Column 0 into u (nothing to update yet), its reflector, and q = A·u from index 1.
    c.get(work).get(u).get(w).get(u).get(q).get(normAt).get(n).i32(0).f64(0).call(indexOf('symmetricColumn'));
    reflector(() => c.i32(0), u, tau);
    c.block(() => {
      c.get(tau).f64(0).f64Eq().brIf(0);
      c.get(work).get(u).get(w).get(u).get(q).get(n).i32(1).call(indexOf('symmetricProduct'));
    });
    c.i32(0).set(k);
    c.loop(() => {
      // diag[k] = A[k][k]; the column step of column k+1 (w and its update when τ ≠ 0), copied into v.
      c.get(diag).get(k).i32(3).i32Shl().i32Add();
      c.get(work).get(k).get(n).i32Mul().get(k).i32Add().i32(3).i32Shl().i32Add().f64Load().f64Store();
      c.get(work).get(u).get(w).get(v).get(q).get(normAt).get(n).get(k).i32(1).i32Add().get(tau)
        .call(indexOf('symmetricColumn'));
      c.f64(0).set(nextTau);
      c.block(() => {
        c.get(k).i32(3).i32Add().get(n).i32GeS().brIf(0);
        reflector(() => c.get(k).i32(1).i32Add(), v, nextTau);
      });
      // The pass from k+2: update and product, the update alone, or the product alone.
      c.block(() => {
        c.block(() => {
          c.get(tau).f64(0).f64Eq().brIf(0);
          c.block(() => {
            c.get(nextTau).f64(0).f64Eq().brIf(0);
            pass('symmetricUpdateProduct');
            c.br(2);
          });
          pass('symmetricUpdate');
          c.br(1);
        });
        c.get(nextTau).f64(0).f64Eq().brIf(0);
        pass('symmetricProduct');
      });
      c.get(u).set(swap);
      c.get(v).set(u);
      c.get(swap).set(v);
      c.get(nextTau).set(tau);
      c.get(k).i32(1).i32Add().tee(k).i32(2).i32Add().get(n).i32LtS().brIf(0);
    });
    return c.bytes;
  };
  return { name: 'symmetricReduce', params: l.params, locals: l.locals, body };
}

function passFunction(name: string, pass: Pass): WasmFunction {
  const builder = new PassBuilder(pass);
  const body = builder.body();
  return { name, params: builder.l.params, locals: builder.l.locals, body };
}

/**
 * The three passes, each `(work, u, w, v, q, n, from)` with byte addresses: symmetricProduct (q = A·v),
 * symmetricUpdate (the rank-2 update alone) and symmetricUpdateProduct (both in one pass); symmetricColumn, the
 * O(n) work before each reflector; and symmetricReduce, which runs them all.
 */
export function symmetricPassFunctions(): WasmFunction[] {
  return [
    reduceFunction(),
    columnFunction(),
    passFunction('symmetricProduct', { update: false, product: true }),
    passFunction('symmetricUpdate', { update: true, product: false }),
    passFunction('symmetricUpdateProduct', { update: true, product: true }),
  ];
}
