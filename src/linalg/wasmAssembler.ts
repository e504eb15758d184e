/**
 * A minimal WebAssembly assembler: our kernels are written in TypeScript as instruction lists (`Code`) and
 * encoded here into a module's bytes when first used, so no compiler, toolchain or prebuilt binary is involved.
 * Only what the kernels use is covered: i32 and f64 scalars, the f64x2 SIMD lanes, loads and stores, blocks and
 * loops (WebAssembly Core Specification 2.0, §5 binary format; the SIMD opcodes of its §5.4.8).
 *
 * The module imports its memory as env.memory and exports each function by name.
 */

export type ValueType = 'i32' | 'f64' | 'v128';
const TYPE_CODE: Record<ValueType, number> = { i32: 0x7f, f64: 0x7c, v128: 0x7b };

/**
 * One function: parameter and local types by name, and its body as bytes (see `Code`) — or as a function of
 * `indexOf`, which gives the index of another function of the module by name (for `Code.call`).
 */
export interface WasmFunction {
  name: string;
  params: ValueType[];
  locals: ValueType[];
  body: number[] | ((indexOf: (name: string) => number) => number[]);
}

function unsigned(value: number, out: number[]): void {
  do {
    let byte = value & 0x7f;
    value >>>= 7;
    if (value !== 0) byte |= 0x80;
    out.push(byte);
  } while (value !== 0);
}

function signed(value: number, out: number[]): void {
  for (;;) {
    const byte = value & 0x7f;
    value >>= 7;
    if ((value === 0 && (byte & 0x40) === 0) || (value === -1 && (byte & 0x40) !== 0)) {
      out.push(byte);
      return;
    }
    out.push(byte | 0x80);
  }
}

function vector(items: number[][], out: number[]): void {
  unsigned(items.length, out);
  for (const item of items) out.push(...item);
}

function text(name: string): number[] {
  const bytes = Array.from(new TextEncoder().encode(name));
  const out: number[] = [];
  unsigned(bytes.length, out);
  return [...out, ...bytes];
}

function section(id: number, contents: number[], out: number[]): void {
  out.push(id);
  unsigned(contents.length, out);
  out.push(...contents);
}

/**
 * Numbers a function's locals as the binary format does: parameters first, then declared locals (each declared
 * alone, so types may come in any order).
 */
export class Locals {
  readonly params: ValueType[] = [];
  readonly locals: ValueType[] = [];
  param(type: ValueType): number {
    this.params.push(type);
    return this.params.length - 1;
  }
  local(type: ValueType): number {
    this.locals.push(type);
    return this.params.length + this.locals.length - 1;
  }
}

/**
 * Instruction builder: each method appends one instruction and returns the builder. Locals are addressed by
 * index (parameters first, then declared locals, as in the binary format).
 */
export class Code {
  readonly bytes: number[] = [];

  private op(...bytes: number[]): this {
    this.bytes.push(...bytes);
    return this;
  }
  private simd(opcode: number, ...immediates: number[]): this {
    this.bytes.push(0xfd);
    unsigned(opcode, this.bytes);
    this.bytes.push(...immediates);
    return this;
  }
  private memory(opcode: number, align: number, offset: number, isSimd = false): this {
    if (isSimd) {
      this.bytes.push(0xfd);
      unsigned(opcode, this.bytes);
    } else {
      this.bytes.push(opcode);
    }
    unsigned(align, this.bytes);
    unsigned(offset, this.bytes);
    return this;
  }

  get(local: number): this { this.bytes.push(0x20); unsigned(local, this.bytes); return this; }
  set(local: number): this { this.bytes.push(0x21); unsigned(local, this.bytes); return this; }
  tee(local: number): this { this.bytes.push(0x22); unsigned(local, this.bytes); return this; }
  i32(value: number): this { this.bytes.push(0x41); signed(value | 0, this.bytes); return this; }
  f64(value: number): this {
    const view = new DataView(new ArrayBuffer(8));
    view.setFloat64(0, value, true);
    return this.op(0x44, ...new Uint8Array(view.buffer));
  }

  /** block … end; `br` depth 0 inside jumps to its end. */
  block(inner: (code: this) => void): this { this.op(0x02, 0x40); inner(this); return this.op(0x0b); }
  /** loop … end; `br` depth 0 inside jumps back to its start. */
  loop(inner: (code: this) => void): this { this.op(0x03, 0x40); inner(this); return this.op(0x0b); }
  brIf(depth: number): this { this.bytes.push(0x0d); unsigned(depth, this.bytes); return this; }
  /** Calls function `index` of the module (its parameters taken from the stack). */
  call(index: number): this { this.bytes.push(0x10); unsigned(index, this.bytes); return this; }
  /** The first or the second of two values by an i32 condition (≠ 0: the first). */
  select(): this { return this.op(0x1b); }
  br(depth: number): this { this.bytes.push(0x0c); unsigned(depth, this.bytes); return this; }

  i32Add(): this { return this.op(0x6a); }
  i32Sub(): this { return this.op(0x6b); }
  i32Mul(): this { return this.op(0x6c); }
  i32GeS(): this { return this.op(0x4e); }
  i32LtS(): this { return this.op(0x48); }
  i32Eqz(): this { return this.op(0x45); }
  i32Eq(): this { return this.op(0x46); }
  i32Shl(): this { return this.op(0x74); }

  f64Load(offset = 0): this { return this.memory(0x2b, 3, offset); }
  f64Store(offset = 0): this { return this.memory(0x39, 3, offset); }
  f64Add(): this { return this.op(0xa0); }
  f64Sub(): this { return this.op(0xa1); }
  f64Mul(): this { return this.op(0xa2); }
  f64Neg(): this { return this.op(0x9a); }
  f64Eq(): this { return this.op(0x61); }
  f64Ge(): this { return this.op(0x66); }
  f64Abs(): this { return this.op(0x99); }
  f64Sqrt(): this { return this.op(0x9f); }
  f64Div(): this { return this.op(0xa3); }

  v128Load(offset = 0): this { return this.memory(0x00, 3, offset, true); }
  v128Store(offset = 0): this { return this.memory(0x0b, 3, offset, true); }
  f64x2Splat(): this { return this.simd(0x14); }
  f64x2ExtractLane(lane: number): this { return this.simd(0x21, lane); }
  f64x2ReplaceLane(lane: number): this { return this.simd(0x22, lane); }
  f64x2Add(): this { return this.simd(0xf0); }
  f64x2Sub(): this { return this.simd(0xf1); }
  f64x2Mul(): this { return this.simd(0xf2); }
  /** Lanes (first[a], first[b] or second[a − 2], second[b − 2]): a, b in 0…3 index the two operands' lanes. */
  f64x2Shuffle(a: number, b: number): this {
    const bytes = (lane: number) => Array.from({ length: 8 }, (_, i) => 8 * lane + i);
    return this.simd(0x0d, ...bytes(a), ...bytes(b));
  }
  /** The lanes of the vector in `local` swapped: (a, b) → (b, a) (a shuffle of the vector with itself). */
  f64x2Swapped(local: number): this { return this.get(local).get(local).f64x2Shuffle(1, 0); }
  dup(local: number): this { return this.tee(local).get(local); }
}

/** The bytes of a module importing env.memory and exporting `functions` (each returns nothing). */
export function assembleModule(functions: WasmFunction[]): Uint8Array<ArrayBuffer> {
  const indexOf = (name: string): number => {
    const index = functions.findIndex((f) => f.name === name);
    if (index < 0) throw new Error(`no function ${name} in the module`);
    return index;
  };
  const out = [0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00];
  section(1, (() => {
    const types = functions.map((f) => {
      const t = [0x60];
      vector(f.params.map((p) => [TYPE_CODE[p]]), t);
      t.push(0x00);
      return t;
    });
    const body: number[] = [];
    vector(types, body);
    return body;
  })(), out);
  section(2, (() => {
    const body: number[] = [];
    vector([[...text('env'), ...text('memory'), 0x02, 0x00, 0x01]], body);
    return body;
  })(), out);
  section(3, (() => {
    const body: number[] = [];
    vector(functions.map((_, i) => { const b: number[] = []; unsigned(i, b); return b; }), body);
    return body;
  })(), out);
  section(7, (() => {
    const body: number[] = [];
    vector(functions.map((f, i) => { const b = [...text(f.name), 0x00]; unsigned(i, b); return b; }), body);
    return body;
  })(), out);
  section(10, (() => {
    const body: number[] = [];
    vector(functions.map((f) => {
      const locals: number[][] = f.locals.map((t) => [0x01, TYPE_CODE[t]]);
      const code: number[] = [];
      vector(locals, code);
      code.push(...(typeof f.body === 'function' ? f.body(indexOf) : f.body), 0x0b);
      const entry: number[] = [];
      unsigned(code.length, entry);
      return [...entry, ...code];
    }), body);
    return body;
  })(), out);
  return new Uint8Array(out);
}
