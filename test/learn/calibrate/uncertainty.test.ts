import { describe, expect, it } from 'vitest';
import { parameterCovariance } from '../../../src/learn/calibrate/uncertainty.ts';

describe('parameterCovariance(jacobian, residuals, n, p)', () => {
  it('gives the textbook standard errors of a straight-line fit (analytic: σ_b² = s²/Sxx, σ_a² = s²(1/n + x̄²/Sxx), corr = −x̄/√(x̄² + Sxx/n))', () => {
    const xs = [0, 1, 2, 3, 4, 5, 6];
    const residuals = Float64Array.of(0.1, -0.2, 0.05, 0.15, -0.1, 0.02, -0.02);
    const n = xs.length;
    const jacobian = new Float64Array(2 * n);
    xs.forEach((x, i) => jacobian.set([1, x], 2 * i));
    const result = parameterCovariance(jacobian, residuals, n, 2);
    const s2 = residuals.reduce((sum, r) => sum + r * r, 0) / (n - 2);
    const mean = xs.reduce((a, b) => a + b) / n;
    const sxx = xs.reduce((sum, x) => sum + (x - mean) ** 2, 0);
    expect(result.variance).toBeCloseTo(s2, 14);
    expect(result.sigma[1]).toBeCloseTo(Math.sqrt(s2 / sxx), 12);
    expect(result.sigma[0]).toBeCloseTo(Math.sqrt(s2 * (1 / n + (mean * mean) / sxx)), 12);
    expect(result.correlation[1]).toBeCloseTo(-mean / Math.sqrt(mean * mean + sxx / n), 12);
  });

  it('reports parameters the data cannot separate (two equal columns) or do not see (a zero column) as NaN, the others finite', () => {
    const n = 5;
    const jacobian = new Float64Array(4 * n);
    for (let i = 0; i < n; i++) jacobian.set([1, i, i, 0], 4 * i);
    const result = parameterCovariance(jacobian, Float64Array.of(0.1, -0.1, 0.2, 0, -0.2), n, 4);
    expect(Number.isFinite(result.sigma[0])).toBe(true);
    expect(result.sigma[1]).toBeNaN();
    expect(result.sigma[2]).toBeNaN();
    expect(result.sigma[3]).toBeNaN();
  });
});
