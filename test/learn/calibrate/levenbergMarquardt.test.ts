import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { choleskySolve, levenbergMarquardt, type LeastSquaresProblem } from '../../../src/learn/calibrate/levenbergMarquardt.ts';
import { xorshift32 } from '../../../src/linalg/eighRandom.ts';

describe('levenbergMarquardt(problem, x0, options)', () => {
  it('finds the minimum (1, 1) of Rosenbrock\'s valley from its classic start (−1.2, 1) (Rosenbrock, Comput. J. 3, 175 (1960); analytic minimum)', () => {
    // S = (10(x2 − x1²))² + (1 − x1)², zero only at (1, 1).
    const problem: LeastSquaresProblem = {
      parameters: 2,
      residuals: 2,
      evaluate(x, r, j) {
        r[0] = 10 * (x[1] - x[0] * x[0]);
        r[1] = 1 - x[0];
        if (j) j.set([-20 * x[0], 10, -1, 0]);
      },
    };
    const x0 = Float64Array.of(-1.2, 1);
    const result = levenbergMarquardt(problem, x0);
    expect(result.converged).toBe(true);
    expect(result.x[0]).toBeCloseTo(1, 8);
    expect(result.x[1]).toBeCloseTo(1, 8);
    expect(Array.from(x0)).toEqual([-1.2, 1]);
  });

  it('on a linear problem gives the least-squares solution of the normal equations (reference library: ml-matrix solve)', () => {
    const uniform = xorshift32(5);
    const n = 40;
    const p = 4;
    const a = Array.from({ length: n }, () => Array.from({ length: p }, () => 2 * uniform() - 1));
    const b = Array.from({ length: n }, () => 3 * uniform() - 1);
    const problem: LeastSquaresProblem = {
      parameters: p,
      residuals: n,
      evaluate(x, r, j) {
        for (let i = 0; i < n; i++) {
          r[i] = a[i].reduce((sum, v, c) => sum + v * x[c], 0) - b[i];
          if (j) for (let c = 0; c < p; c++) j[i * p + c] = a[i][c];
        }
      },
    };
    const result = levenbergMarquardt(problem, new Float64Array(p));
    // ml-matrix's solve of a non-square system is its least-squares solution (by SVD).
    const expected = solve(new Matrix(a), Matrix.columnVector(b), true).to1DArray();
    for (let c = 0; c < p; c++) expect(result.x[c]).toBeCloseTo(expected[c], 8);
  });

  it('stops by the iteration limit and says so', () => {
    const problem: LeastSquaresProblem = {
      parameters: 1,
      residuals: 1,
      evaluate(x, r, j) {
        r[0] = Math.exp(x[0]) - 2;
        if (j) j[0] = Math.exp(x[0]);
      },
    };
    const result = levenbergMarquardt(problem, Float64Array.of(5), { maxIterations: 1 });
    expect(result.converged).toBe(false);
    expect(result.reason).toBe('iterations');
  });

  it('returns x0 with reason "not-finite" when S(x0) is NaN (the documented sentinel), never throws', () => {
    const problem: LeastSquaresProblem = { parameters: 1, residuals: 1, evaluate: (_x, r) => void (r[0] = NaN) };
    const result = levenbergMarquardt(problem, Float64Array.of(3));
    expect(result.reason).toBe('not-finite');
    expect(result.converged).toBe(false);
    expect(result.x[0]).toBe(3);
  });
});

describe('choleskySolve(m, b, p)', () => {
  it('solves symmetric positive definite systems as ml-matrix does, and refuses an indefinite one', () => {
    const uniform = xorshift32(9);
    const p = 6;
    const g = Array.from({ length: p }, () => Array.from({ length: p }, () => 2 * uniform() - 1));
    const spd = new Matrix(g).transpose().mmul(new Matrix(g)).add(Matrix.eye(p).mul(0.1));
    const b = Array.from({ length: p }, () => uniform());
    const m = Float64Array.from(spd.to1DArray());
    const x = Float64Array.from(b);
    expect(choleskySolve(m, x, p)).toBe(true);
    const expected = solve(spd, Matrix.columnVector(b)).to1DArray();
    for (let c = 0; c < p; c++) expect(x[c]).toBeCloseTo(expected[c], 9);
    expect(choleskySolve(Float64Array.of(1, 2, 2, 1), Float64Array.of(1, 1), 2)).toBe(false);
  });
});
