/**
 * Helpers for the eigensolver tests: invariant measures and independent constructions of test matrices.
 * Layout as in src/linalg/eigh.ts: split re/im, row-major, eigenvector m in column m.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { fillRandomHermitian, xorshift32 } from '../../src/linalg/eighRandom.ts';

export interface ComplexMatrix {
  n: number;
  re: Float64Array;
  im: Float64Array;
}

export function randomHermitian(n: number, seed: number, scale = 1): ComplexMatrix {
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  fillRandomHermitian(n, xorshift32(seed), re, im);
  for (let i = 0; i < n * n; i++) {
    re[i] *= scale;
    im[i] *= scale;
  }
  return { n, re, im };
}

/** Frobenius norm ‖H‖_F, scaled by the largest entry so tiny or huge matrices do not under/overflow. */
export function frobenius({ n, re, im }: ComplexMatrix): number {
  let largest = 0;
  for (let i = 0; i < n * n; i++) largest = Math.max(largest, Math.abs(re[i]), Math.abs(im[i]));
  if (largest === 0) return 0;
  let sum = 0;
  for (let i = 0; i < n * n; i++) sum += (re[i] / largest) ** 2 + (im[i] / largest) ** 2;
  return largest * Math.sqrt(sum);
}

/** max_m ‖H·v_m − λ_m·v_m‖₂. */
export function residual(h: ComplexMatrix, values: Float64Array, vecRe: Float64Array, vecIm: Float64Array): number {
  const { n, re, im } = h;
  let worst = 0;
  for (let m = 0; m < n; m++) {
    let sum = 0;
    for (let r = 0; r < n; r++) {
      let sRe = -values[m] * vecRe[r * n + m];
      let sIm = -values[m] * vecIm[r * n + m];
      for (let c = 0; c < n; c++) {
        const a = re[r * n + c];
        const b = im[r * n + c];
        sRe += a * vecRe[c * n + m] - b * vecIm[c * n + m];
        sIm += a * vecIm[c * n + m] + b * vecRe[c * n + m];
      }
      sum += sRe * sRe + sIm * sIm;
    }
    worst = Math.max(worst, Math.sqrt(sum));
  }
  return worst;
}

/** max |(V†V − I)_{pq}|. */
export function orthonormalityError(n: number, vecRe: Float64Array, vecIm: Float64Array): number {
  let worst = 0;
  for (let p = 0; p < n; p++) {
    for (let q = 0; q < n; q++) {
      let sRe = p === q ? -1 : 0;
      let sIm = 0;
      for (let r = 0; r < n; r++) {
        const aRe = vecRe[r * n + p];
        const aIm = vecIm[r * n + p];
        const bRe = vecRe[r * n + q];
        const bIm = vecIm[r * n + q];
        sRe += aRe * bRe + aIm * bIm;
        sIm += aRe * bIm - aIm * bRe;
      }
      worst = Math.max(worst, Math.hypot(sRe, sIm));
    }
  }
  return worst;
}

export function trace({ n, re }: ComplexMatrix): number {
  let sum = 0;
  for (let i = 0; i < n; i++) sum += re[i * n + i];
  return sum;
}

/**
 * Eigenvalues of H = A + iB from ml-matrix's real symmetric decomposition of the embedding [[A, −B], [B, A]],
 * which has every eigenvalue of H twice (standard linear algebra); returns the 2n values ascending.
 */
export function embeddingEigenvalues({ n, re, im }: ComplexMatrix): number[] {
  const big = Matrix.zeros(2 * n, 2 * n);
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      const a = re[r * n + c];
      const b = im[r * n + c];
      big.set(r, c, a);
      big.set(r + n, c + n, a);
      big.set(r, c + n, -b);
      big.set(r + n, c, b);
    }
  }
  return new EigenvalueDecomposition(big, { assumeSymmetric: true }).realEigenvalues.sort((x, y) => x - y);
}

/**
 * embeddingEigenvalues of H + σI minus σ, σ = 2‖H‖_F (the spectrum shifts exactly by σ; rounding adds ~ε·3‖H‖).
 * For inputs with tiny or subnormal entries: ml-matrix's tql2 divides by an off-diagonal,
 * (d[l+1] − d[l])/(2e[l]), which overflows for a subnormal e[l] beside a zero diagonal and ends in an exception
 * (seen on [[0, 0, 1e-310], [0, 0, 0], [1e-310, 0, 1]]); with every diagonal entry near 2‖H‖ such e[l] deflate first.
 */
export function shiftedEmbeddingEigenvalues(h: ComplexMatrix): number[] {
  const { n } = h;
  // A matrix whose norm is itself tiny (every entry ~1e-300) is first scaled by an exact power of two to norm ~1:
  // ml-matrix works in plain floating point, and squares of 1e-300 underflow there (seen: errors of 1e-9 relative
  // on a 2×2 of 1e-300 entries). Scaling by 2^k changes no digit of a normal number and of the spectrum.
  const norm = frobenius(h);
  const exponent = norm > 0 && norm < 2 ** -200 ? -Math.floor(Math.log2(norm)) : 0;
  // 2^exponent can pass 2^1023 (a subnormal norm needs up to 2^1074): apply it in two exact halves.
  const half = Math.floor(exponent / 2);
  const up = (x: number) => x * 2 ** half * 2 ** (exponent - half);
  const down = (x: number) => x * 2 ** -half * 2 ** (half - exponent);
  const re = h.re.map(up);
  const im = h.im.map(up);
  const shift = 2 * frobenius({ n, re, im });
  for (let i = 0; i < n; i++) re[i * n + i] += shift;
  return embeddingEigenvalues({ n, re, im }).map((value) => down(value - shift));
}

/**
 * A random unitary U as a product of n Householder reflectors I − 2·v·v†/(v†v) (each unitary by construction),
 * so that U·diag(λ)·U† has exactly the spectrum λ without using the solver under test.
 */
export function randomUnitary(n: number, seed: number): ComplexMatrix {
  const uniform = xorshift32(seed);
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) re[i * n + i] = 1;
  const vRe = new Float64Array(n);
  const vIm = new Float64Array(n);
  for (let step = 0; step < n; step++) {
    let norm2 = 0;
    for (let i = 0; i < n; i++) {
      vRe[i] = 2 * uniform() - 1;
      vIm[i] = 2 * uniform() - 1;
      norm2 += vRe[i] * vRe[i] + vIm[i] * vIm[i];
    }
    // U ← (I − 2vv†/‖v‖²)·U: row r of U gains −(2/‖v‖²)·v_r·(v†U).
    for (let c = 0; c < n; c++) {
      let sRe = 0;
      let sIm = 0;
      for (let r = 0; r < n; r++) {
        sRe += vRe[r] * re[r * n + c] + vIm[r] * im[r * n + c];
        sIm += vRe[r] * im[r * n + c] - vIm[r] * re[r * n + c];
      }
      const f = 2 / norm2;
      for (let r = 0; r < n; r++) {
        re[r * n + c] -= f * (vRe[r] * sRe - vIm[r] * sIm);
        im[r * n + c] -= f * (vRe[r] * sIm + vIm[r] * sRe);
      }
    }
  }
  return { n, re, im };
}

/** U·diag(values)·U†. */
export function withSpectrum(u: ComplexMatrix, values: number[]): ComplexMatrix {
  const { n } = u;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      let sRe = 0;
      let sIm = 0;
      for (let m = 0; m < n; m++) {
        // U_rm·λ_m·conj(U_cm)
        const aRe = u.re[r * n + m];
        const aIm = u.im[r * n + m];
        const bRe = u.re[c * n + m];
        const bIm = -u.im[c * n + m];
        sRe += values[m] * (aRe * bRe - aIm * bIm);
        sIm += values[m] * (aRe * bIm + aIm * bRe);
      }
      re[r * n + c] = sRe;
      im[r * n + c] = sIm;
    }
  }
  // Exact Hermitian symmetry, as the solver's inputs require.
  for (let r = 0; r < n; r++) {
    im[r * n + r] = 0;
    for (let c = 0; c < r; c++) {
      const a = 0.5 * (re[r * n + c] + re[c * n + r]);
      const b = 0.5 * (im[r * n + c] - im[c * n + r]);
      re[r * n + c] = a;
      re[c * n + r] = a;
      im[r * n + c] = b;
      im[c * n + r] = -b;
    }
  }
  return { n, re, im };
}
