/**
 * Back-transformation V = Q·D·Z (see eigh.ts) with WebAssembly SIMD: the Householder reflectors are applied
 * straight to the eigenvectors, X ← P_k·X for k = n−2…0 starting from X = D·Z (8n³ real flops, against
 * 16n³/3 + 4n³ for forming Q and multiplying; Golub & Van Loan, Matrix Computations, 4th ed., §5.1.6).
 *
 * Each eigenvector is a row of Xᵀ (n complex numbers, interleaved, one f64x2 lane pair each), so a reflector
 * step is a dot product s = u_kᴴ·x and an update x ← x − τ_k·s·u_k along two contiguous rows; the update of
 * step k and the dot product of step k−1 share one pass (the reflectors are read once per pass), and two
 * eigenvectors share each load of u. conj(u)·x and u·t are formed without lane shuffles by keeping each
 * reflector also with its lanes swapped: Σ u⊙x = (Σ u_re x_re, Σ u_im x_im) and Σ swap(u)⊙x give s, and
 * u·t = u⊙(t_re, t_re) + swap(u)⊙(−t_im, t_im).
 *
 * Memory (bytes, f64 little-endian): X at 0, rows of 16n (an even count: a spare row when n is odd); then the
 * reflectors U (row k = u_k, entries k+1…n−1, 16 bytes each), their swapped copy S, and τ (8 bytes each).
 */
import { Code, type WasmFunction } from './wasmAssembler.ts';

// Locals of applyReflectors: parameters, then i32, then v128, then f64.
const X = 0, U = 1, S = 2, TAU = 3, N = 4;
const K = 5, R = 6, END = 7, ROW_U = 8, ROW_S = 9, NEXT_U = 10, NEXT_S = 11, X1 = 12, ROW_BYTES = 13;
const A0 = 14, B0 = 15, A1 = 16, B1 = 17, T1A = 18, T2A = 19, T1B = 20, T2B = 21, XV = 22, UV = 23, SV = 24;
const TR = 25, TI = 26, TK = 27;

/** acc += load(base + r) ⊙ value(local). */
function accumulate(code: Code, acc: number, base: number, value: number): void {
  code.get(acc).get(base).get(R).i32Add().v128Load().get(value).f64x2Mul().f64x2Add().set(acc);
}

/** t = τ_k·s with s from the sums a = Σ u⊙x, b = Σ swap(u)⊙x; splat forms (t_re, t_re) and (−t_im, t_im). */
function stepVectors(code: Code, a: number, b: number, t1: number, t2: number): void {
  code.get(a).f64x2ExtractLane(0).get(a).f64x2ExtractLane(1).f64Add().get(TK).f64Mul().set(TR);
  code.get(b).f64x2ExtractLane(1).get(b).f64x2ExtractLane(0).f64Sub().get(TK).f64Mul().set(TI);
  code.get(TR).f64x2Splat().set(t1);
  code.get(TI).f64x2Splat().get(TI).f64Neg().f64x2ReplaceLane(0).set(t2);
}

/** x_r ← x_r − u⊙t1 − swap(u)⊙t2 for the row at `row`, result left in XV (u in UV, swap(u) in SV). */
function updateElement(code: Code, row: number, t1: number, t2: number): void {
  code.get(row).get(R).i32Add();
  code.get(row).get(R).i32Add().v128Load()
    .get(UV).get(t1).f64x2Mul().f64x2Sub()
    .get(SV).get(t2).f64x2Mul().f64x2Sub()
    .tee(XV).v128Store();
}

function applyReflectorsBody(): number[] {
  const c = new Code();
  const zero = (local: number) => c.f64(0).f64x2Splat().set(local);
  // n < 2: nothing to apply.
  c.block((exit) => {
    exit.get(N).i32(2).i32LtS().brIf(0);
    c.get(N).i32(16).i32Mul().tee(ROW_BYTES).set(END);
    c.get(X).get(ROW_BYTES).i32Add().set(X1);
    c.get(N).i32(2).i32Sub().set(K);
    // Row k of U and S: base + 16·k·n.
    c.get(U).get(K).get(ROW_BYTES).i32Mul().i32Add().set(ROW_U);
    c.get(S).get(K).get(ROW_BYTES).i32Mul().i32Add().set(ROW_S);
    // Dot products of the first reflector applied (k = n−2) over rows k+1…n−1.
    zero(A0); zero(B0); zero(A1); zero(B1);
    c.get(K).i32(1).i32Add().i32(16).i32Mul().set(R);
    c.loop(() => {
      c.get(X).get(R).i32Add().v128Load().set(XV);
      accumulate(c, A0, ROW_U, XV);
      accumulate(c, B0, ROW_S, XV);
      c.get(X1).get(R).i32Add().v128Load().set(XV);
      accumulate(c, A1, ROW_U, XV);
      accumulate(c, B1, ROW_S, XV);
      c.get(R).i32(16).i32Add().tee(R).get(END).i32LtS().brIf(0);
    });
    c.loop(() => {
      c.get(TAU).get(K).i32(8).i32Mul().i32Add().f64Load().set(TK);
      stepVectors(c, A0, B0, T1A, T2A);
      stepVectors(c, A1, B1, T1B, T2B);
      c.get(K).i32(1).i32Add().i32(16).i32Mul().set(R);
      c.block((last) => {
        // k > 0: the update of step k fused with the dot products of step k−1.
        last.get(K).i32Eqz().brIf(0);
        c.get(ROW_U).get(ROW_BYTES).i32Sub().set(NEXT_U);
        c.get(ROW_S).get(ROW_BYTES).i32Sub().set(NEXT_S);
        // Row k is untouched by P_k and is the first row of u_{k−1}.
        c.get(K).i32(16).i32Mul().set(R);
        c.get(X).get(R).i32Add().v128Load().set(XV);
        zero(A0); zero(B0); zero(A1); zero(B1);
        accumulate(c, A0, NEXT_U, XV);
        accumulate(c, B0, NEXT_S, XV);
        c.get(X1).get(R).i32Add().v128Load().set(XV);
        accumulate(c, A1, NEXT_U, XV);
        accumulate(c, B1, NEXT_S, XV);
        c.get(R).i32(16).i32Add().set(R);
        c.loop(() => {
          c.get(ROW_U).get(R).i32Add().v128Load().set(UV);
          c.get(ROW_S).get(R).i32Add().v128Load().set(SV);
          updateElement(c, X, T1A, T2A);
          accumulate(c, A0, NEXT_U, XV);
          accumulate(c, B0, NEXT_S, XV);
          updateElement(c, X1, T1B, T2B);
          accumulate(c, A1, NEXT_U, XV);
          accumulate(c, B1, NEXT_S, XV);
          c.get(R).i32(16).i32Add().tee(R).get(END).i32LtS().brIf(0);
        });
        c.get(NEXT_U).set(ROW_U);
        c.get(NEXT_S).set(ROW_S);
        c.get(K).i32(1).i32Sub().set(K);
        c.br(1);
      });
      // k = 0: the last update, no further dot products.
      c.loop(() => {
        c.get(ROW_U).get(R).i32Add().v128Load().set(UV);
        c.get(ROW_S).get(R).i32Add().v128Load().set(SV);
        updateElement(c, X, T1A, T2A);
        updateElement(c, X1, T1B, T2B);
        c.get(R).i32(16).i32Add().tee(R).get(END).i32LtS().brIf(0);
      });
    });
  });
  return c.bytes;
}

/** The kernel `applyReflectors(x, u, s, tau, n)` (byte addresses), applied to two eigenvectors from x on. */
export function applyReflectorsFunction(): WasmFunction {
  return {
    name: 'applyReflectors',
    params: ['i32', 'i32', 'i32', 'i32', 'i32'],
    locals: [
      ...new Array<'i32'>(ROW_BYTES - K + 1).fill('i32'), ...new Array<'v128'>(SV - A0 + 1).fill('v128'),
      ...new Array<'f64'>(TK - TR + 1).fill('f64'),
    ],
    body: applyReflectorsBody(),
  };
}

/** The SIMD back-transformation for one order n, with its own memory (allocated once). */
export class SimdBackTransform {
  readonly n: number;
  private readonly memory: WebAssembly.Memory;
  private readonly run: (x: number, u: number, s: number, tau: number, n: number) => void;
  private readonly f64: Float64Array;
  private readonly xRows: number;
  private readonly uAt: number;
  private readonly sAt: number;
  private readonly tauAt: number;

  constructor(n: number, module: WebAssembly.Module) {
    this.n = n;
    this.xRows = n + (n % 2);
    // Offsets in f64 units.
    this.uAt = 2 * this.xRows * n;
    this.sAt = this.uAt + 2 * n * n;
    this.tauAt = this.sAt + 2 * n * n;
    const bytes = 8 * (this.tauAt + n);
    this.memory = new WebAssembly.Memory({ initial: Math.max(1, Math.ceil(bytes / 65536)) });
    const instance = new WebAssembly.Instance(module, { env: { memory: this.memory } });
    this.run = instance.exports.applyReflectors as (x: number, u: number, s: number, tau: number, n: number) => void;
    this.f64 = new Float64Array(this.memory.buffer);
  }

  /**
   * vecRe/vecIm[r·n + m] = (Q·D·Z)[r][m]: Z real n×n row-major (eigenvector m in column m), D = diag(phase),
   * Q from the reflectors (rows of reflRe/reflIm, τ in tau; eighHouseholder.ts). `order[m]` is the column of Z
   * that becomes eigenvector m. With `transposed`, z holds Zᵀ (eigenvector i in row i, as the QR kernel leaves it).
   */
  apply(
    tau: Float64Array, reflRe: Float64Array, reflIm: Float64Array, phaseRe: Float64Array, phaseIm: Float64Array,
    z: Float64Array, transposed: boolean, order: Int32Array | null, vecRe: Float64Array, vecIm: Float64Array,
  ): void {
    const n = this.n;
    const f = this.f64;
    for (let m = 0; m < n; m++) {
      const column = order === null ? m : order[m];
      for (let r = 0, at = 2 * m * n; r < n; r++, at += 2) {
        const v = transposed ? z[column * n + r] : z[r * n + column];
        f[at] = phaseRe[r] * v;
        f[at + 1] = phaseIm[r] * v;
      }
    }
    const uAt = this.uAt;
    const sAt = this.sAt;
    for (let k = 0; k + 1 < n; k++) {
      const t = tau[k];
      f[this.tauAt + k] = t;
      for (let r = k + 1, at = 2 * (k * n + r); r < n; r++, at += 2) {
        const a = t === 0 ? 0 : reflRe[k * n + r];
        const b = t === 0 ? 0 : reflIm[k * n + r];
        f[uAt + at] = a;
        f[uAt + at + 1] = b;
        f[sAt + at] = b;
        f[sAt + at + 1] = a;
      }
    }
    const rowBytes = 16 * n;
    for (let m = 0; m < n; m += 2) this.run(m * rowBytes, 8 * uAt, 8 * sAt, 8 * this.tauAt, n);
    for (let m = 0; m < n; m++) {
      for (let r = 0, at = 2 * m * n; r < n; r++, at += 2) {
        vecRe[r * n + m] = f[at];
        vecIm[r * n + m] = f[at + 1];
      }
    }
  }
}
