/**
 * Peaks of a power spectrum: local maxima (8 neighbours) in the upper half-plane (ky > 0, or ky = 0 and kx > 0; the
 * other half mirrors it), at least `minCycles` periods across the picture, above both `significance` × the noise
 * and `relative` × the strongest peak; weaker
 * peaks within 3 bins of a stronger one (window side lobes) are dropped. Positions are refined to a fraction of a bin
 * by a parabola through ln P along each axis (Gaussian interpolation, common practice).
 * The noise is the median power in the ring of the same |k| (rings one bin wide, at least 64 bins each), so a
 * background that falls with frequency (1/f noise of real scans) does not hide or fake peaks; white noise exceeds
 * its median by more than ~22× in fewer than one bin in a million (exponential statistics), so the default 40× is safe.
 */
import type { PowerSpectrum } from './spectrum.ts';

export interface SpectrumPeak {
  /** Wave vector (rad/pixel, y up). */
  kx: number;
  ky: number;
  power: number;
}

export interface PeakOptions {
  minCycles: number;
  significance: number;
  relative: number;
  /** Shorter picture side (pixels). */
  side: number;
  maxPeaks: number;
  /** Drop peaks within 2 bins of kx = 0: line-by-line background removal subtracts each row's mean, which
   * puts a negative copy of every peak's projection there. */
  skipScanAxis?: boolean;
}

export const PEAK_DEFAULTS: Omit<PeakOptions, 'side'> = { minCycles: 3, significance: 40, relative: 1e-4, maxPeaks: 40 };

/** Median power per ring of |k| (ring r holds the bins with r ≤ |k|/bin < r + 1, merged outward to ≥ 64 bins). */
function ringNoise(spectrum: PowerSpectrum): { ring: (fx: number, fy: number) => number; noise: Float64Array } {
  const { nx, ny, power } = spectrum;
  const scale = Math.max(nx, ny);
  const ring = (fx: number, fy: number) => Math.floor(Math.hypot((fx * scale) / nx, (fy * scale) / ny));
  const rings = ring(nx / 2, ny / 2) + 1;
  const members: number[][] = Array.from({ length: rings }, () => []);
  for (let fy = 0; fy <= ny / 2; fy++) {
    for (let fx = 0; fx < nx; fx++) {
      const sx = fx <= nx / 2 ? fx : fx - nx;
      members[ring(sx, fy)].push(power[fy * nx + fx]);
    }
  }
  const noise = new Float64Array(rings);
  for (let r = 0; r < rings; r++) {
    let pool = members[r];
    for (let w = 1; pool.length < 64 && w < rings; w++) pool = pool.concat(members[r + w] ?? [], members[r - w] ?? []);
    const sorted = Float64Array.from(pool).sort();
    noise[r] = sorted.length > 0 ? sorted[sorted.length >> 1] : 0;
  }
  return { ring, noise };
}

function refine(minus: number, centre: number, plus: number): number {
  const a = Math.log(Math.max(minus, 1e-300)), b = Math.log(centre), c = Math.log(Math.max(plus, 1e-300));
  const curvature = a - 2 * b + c;
  if (!(curvature < 0)) return 0;
  return Math.max(-0.5, Math.min(0.5, (0.5 * (a - c)) / curvature));
}

export function findPeaks(spectrum: PowerSpectrum, options: PeakOptions): SpectrumPeak[] {
  const { nx, ny, power } = spectrum;
  const { ring, noise } = ringNoise(spectrum);
  const raw: { fx: number; fy: number; p: number }[] = [];
  const minFrequency = options.minCycles / options.side; // cycles per pixel
  for (let fy = 0; fy <= ny / 2; fy++) {
    for (let fx = 0; fx < nx; fx++) {
      const sx = fx <= nx / 2 ? fx : fx - nx;
      if (fy === 0 && sx <= 0) continue;
      if (Math.hypot(sx / nx, fy / ny) < minFrequency) continue;
      if (options.skipScanAxis && Math.abs(sx) <= 2) continue;
      const p = power[fy * nx + fx];
      if (!(p > options.significance * noise[ring(sx, fy)])) continue;
      let isMax = true;
      for (let dy = -1; dy <= 1 && isMax; dy++) {
        for (let dx = -1; dx <= 1; dx++) {
          if (dx === 0 && dy === 0) continue;
          const q = power[((fy + dy + ny) % ny) * nx + ((fx + dx + nx) % nx)];
          if (q > p) {
            isMax = false;
            break;
          }
        }
      }
      if (isMax) raw.push({ fx: sx, fy, p });
    }
  }
  raw.sort((a, b) => b.p - a.p);
  const strongest = raw.length > 0 ? raw[0].p : 0;
  const kept: typeof raw = [];
  for (const peak of raw) {
    if (peak.p < options.relative * strongest || kept.length >= options.maxPeaks) break;
    const near = kept.some((k) => Math.abs(k.fx - peak.fx) <= 3 && Math.abs(k.fy - peak.fy) <= 3)
      || kept.some((k) => Math.abs(k.fx + peak.fx) <= 3 && Math.abs(k.fy + peak.fy) <= 3);
    if (!near) kept.push(peak);
  }
  return kept.map(({ fx, fy, p }) => {
    const at = (x: number, y: number) => power[((y + ny) % ny) * nx + ((x + nx) % nx)];
    const dx = refine(at(fx - 1, fy), p, at(fx + 1, fy));
    const dy = refine(at(fx, fy - 1), p, at(fx, fy + 1));
    return { kx: (2 * Math.PI * (fx + dx)) / nx, ky: (2 * Math.PI * (fy + dy)) / ny, power: p };
  });
}
