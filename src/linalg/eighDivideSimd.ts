/**
 * The matrix product of the divide-and-conquer merge (eighDivide.ts) with WebAssembly SIMD:
 * out[r][i] = Σ_g a[r][g]·bt[i][g] for rows in pairs and columns in fours, each entry a dot product of two
 * contiguous rows taken two terms (one f64x2) at a time, eight sums held in registers.
 *
 * Memory (bytes, f64): `a` rows of `stride` bytes, `bt` rows of `stride` bytes, `out` rows of `outStride` bytes.
 * The caller pads: an even number of rows (a spare row of a), a multiple of four columns (zero rows of bt), and
 * an even g range (g0, g1 in bytes, multiples of 16) whose widening only adds terms that are zero.
 */
import { Code, type WasmFunction } from './wasmAssembler.ts';

const A = 0, BT = 1, OUT = 2, ROWS = 3, COLS = 4, G0 = 5, G1 = 6, STRIDE = 7, OUT_STRIDE = 8;
const R = 9, I = 10, G = 11, PA0 = 12, PA1 = 13, PB0 = 14, PB1 = 15, PB2 = 16, PB3 = 17, OUT_ROW = 18;
const S = 19; // S + 4·row + column, eight sums
const X0 = 27, X1 = 28, Y = 29;

function body(): number[] {
  const c = new Code();
  const load = (base: number) => c.get(base).get(G).i32Add().v128Load();
  const madd = (sum: number, x: number) => c.get(sum).get(x).get(Y).f64x2Mul().f64x2Add().set(sum);
  const storeSum = (row: number, column: number) => {
    const sum = S + 4 * row + column;
    c.get(OUT_ROW);
    if (row === 1) c.get(OUT_STRIDE).i32Add();
    c.get(I).i32(column).i32Add().i32(8).i32Mul().i32Add();
    c.get(sum).f64x2ExtractLane(0).get(sum).f64x2ExtractLane(1).f64Add().f64Store();
  };
  c.block(() => {
    c.get(ROWS).i32Eqz().brIf(0);
    c.get(COLS).i32Eqz().brIf(0);
    c.get(A).set(PA0);
    c.get(OUT).set(OUT_ROW);
    c.i32(0).set(R);
    c.loop(() => {
      c.get(PA0).get(STRIDE).i32Add().set(PA1);
      c.get(BT).set(PB0);
      c.i32(0).set(I);
      c.loop(() => {
        c.get(PB0).get(STRIDE).i32Add().tee(PB1).get(STRIDE).i32Add().tee(PB2).get(STRIDE).i32Add().set(PB3);
        for (let s = 0; s < 8; s++) c.f64(0).f64x2Splat().set(S + s);
        c.get(G0).set(G);
        c.block(() => {
          c.get(G).get(G1).i32GeS().brIf(0);
          c.loop(() => {
            load(PA0).set(X0);
            load(PA1).set(X1);
            [PB0, PB1, PB2, PB3].forEach((base, column) => {
              load(base).set(Y);
              madd(S + column, X0);
              madd(S + 4 + column, X1);
            });
            c.get(G).i32(16).i32Add().tee(G).get(G1).i32LtS().brIf(0);
          });
        });
        for (let row = 0; row < 2; row++) for (let column = 0; column < 4; column++) storeSum(row, column);
        c.get(PB3).get(STRIDE).i32Add().set(PB0);
        c.get(I).i32(4).i32Add().tee(I).get(COLS).i32LtS().brIf(0);
      });
      c.get(PA1).get(STRIDE).i32Add().set(PA0);
      c.get(OUT_ROW).get(OUT_STRIDE).i32Add().get(OUT_STRIDE).i32Add().set(OUT_ROW);
      c.get(R).i32(2).i32Add().tee(R).get(ROWS).i32LtS().brIf(0);
    });
  });
  return c.bytes;
}

/** The kernel `multiplyRows(a, bt, out, rows, cols, g0, g1, stride, outStride)` (addresses and g in bytes). */
export function multiplyRowsFunction(): WasmFunction {
  return {
    name: 'multiplyRows',
    params: new Array(9).fill('i32'),
    locals: [...new Array(OUT_ROW - R + 1).fill('i32'), ...new Array(Y - S + 1).fill('v128')],
    body: body(),
  };
}
