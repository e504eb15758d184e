/**
 * Radix-2 complex FFT (Cooley & Tukey, Math. Comput. 19, 297 (1965)), iterative and in place, on split re/im arrays:
 * X[k] = Σ_n x[n]·e^{−2πi·kn/N} (forward), N a power of two. Twiddles and the bit-reversal table are built once per N;
 * transforms allocate nothing.
 */
export class Fft {
  readonly n: number;
  private readonly cos: Float64Array;
  private readonly sin: Float64Array;
  private readonly reversed: Uint32Array;

  constructor(n: number) {
    if (!(Number.isInteger(n) && n >= 1 && (n & (n - 1)) === 0)) throw new Error(`Fft: ${n} is not a power of two`);
    this.n = n;
    this.cos = new Float64Array(n / 2);
    this.sin = new Float64Array(n / 2);
    for (let k = 0; k < n / 2; k++) {
      this.cos[k] = Math.cos((2 * Math.PI * k) / n);
      this.sin[k] = -Math.sin((2 * Math.PI * k) / n);
    }
    this.reversed = new Uint32Array(n);
    const bits = Math.log2(n);
    for (let i = 0; i < n; i++) {
      let r = 0;
      for (let b = 0; b < bits; b++) r |= ((i >>> b) & 1) << (bits - 1 - b);
      this.reversed[i] = r;
    }
  }

  /** Forward transform of re[offset + stride·i], im[…], i = 0…n−1, in place. */
  transform(re: Float64Array, im: Float64Array, offset = 0, stride = 1): void {
    const n = this.n;
    for (let i = 0; i < n; i++) {
      const j = this.reversed[i];
      if (j > i) {
        const a = offset + stride * i, b = offset + stride * j;
        let t = re[a]; re[a] = re[b]; re[b] = t;
        t = im[a]; im[a] = im[b]; im[b] = t;
      }
    }
    for (let size = 2; size <= n; size *= 2) {
      const half = size / 2, step = n / size;
      for (let start = 0; start < n; start += size) {
        for (let k = 0; k < half; k++) {
          const wr = this.cos[k * step], wi = this.sin[k * step];
          const a = offset + stride * (start + k), b = offset + stride * (start + k + half);
          const xr = re[b] * wr - im[b] * wi, xi = re[b] * wi + im[b] * wr;
          re[b] = re[a] - xr; im[b] = im[a] - xi;
          re[a] += xr; im[a] += xi;
        }
      }
    }
  }
}

/** Smallest power of two ≥ n. */
export function nextPowerOfTwo(n: number): number {
  let p = 1;
  while (p < n) p *= 2;
  return p;
}

/** Forward 2D transform of an ny × nx array (row-major, both powers of two), in place: rows, then columns. */
export function fft2d(re: Float64Array, im: Float64Array, nx: number, ny: number): void {
  const rows = new Fft(nx), columns = new Fft(ny);
  for (let y = 0; y < ny; y++) rows.transform(re, im, y * nx, 1);
  for (let x = 0; x < nx; x++) columns.transform(re, im, x, nx);
}
