/**
 * The one least-squares solver (src/numeric/least-squares.ts): non-finite
 * residuals are failures, bounds hold on both sides, the normal-equation and
 * residual entries agree, the band-fit adapter keeps its contract, and
 * results are checked against a slow reference (a dense grid search refined
 * by bisection, written out below) and by their optimality conditions.
 */
import { describe, expect, it } from 'vitest';
import {
  leastSquares, leastSquaresNormal, LEAST_SQUARES_MESSAGES, type NormalEquationsProblem,
} from '../../src/numeric/least-squares.js';
import { levenbergMarquardtNormal } from '../../src/spectrum/levenberg-marquardt.js';
import { seededRandom, uniform } from './random.js';

/** Σr² of a residual function at params. */
function sumSquares(f: (p: Float64Array, out: Float64Array) => void, params: Float64Array, m: number): number {
  const r = new Float64Array(m);
  f(params, r);
  return r.reduce((s, v) => s + v * v, 0);
}

/** Slow reference: a 2-parameter minimum by a dense grid, then nested golden-section refinement around the best cell. */
function slowMinimum2(f: (a: number, b: number) => number, box: [number, number, number, number]): [number, number] {
  const [a0, a1, b0, b1] = box;
  const n = 200;
  let best = [a0, b0];
  let bestValue = Infinity;
  for (let i = 0; i <= n; i++) {
    for (let j = 0; j <= n; j++) {
      const a = a0 + ((a1 - a0) * i) / n;
      const b = b0 + ((b1 - b0) * j) / n;
      const v = f(a, b);
      if (v < bestValue) {
        bestValue = v;
        best = [a, b];
      }
    }
  }
  const golden = (g: (x: number) => number, lo: number, hi: number) => {
    const phi = (Math.sqrt(5) - 1) / 2;
    for (let k = 0; k < 100; k++) {
      const x1 = hi - phi * (hi - lo);
      const x2 = lo + phi * (hi - lo);
      if (g(x1) < g(x2)) hi = x2;
      else lo = x1;
    }
    return (lo + hi) / 2;
  };
  const da = (a1 - a0) / n;
  const db = (b1 - b0) / n;
  let [a, b] = best as [number, number];
  for (let round = 0; round < 30; round++) {
    a = golden((x) => f(x, b), Math.max(a0, a - 2 * da), Math.min(a1, a + 2 * da));
    b = golden((y) => f(a, y), Math.max(b0, b - 2 * db), Math.min(b1, b + 2 * db));
  }
  return [a, b];
}

describe('the one least-squares solver', () => {
  it('reports residuals that are not finite at the start as a failure', () => {
    const result = leastSquares((_p, out) => out.fill(Number.NaN), Float64Array.of(1, 2), 3);
    expect(result.success).toBe(false);
    expect(result.status).toBe(-3);
    expect(result.message).toBe(LEAST_SQUARES_MESSAGES[-3]);
  });

  it('reports residuals that turn non-finite wherever it steps as a failure, not as converged', () => {
    // Finite only at the start: every trial step meets NaN.
    const result = leastSquares((p, out) => {
      out[0] = p[0] === 4 ? 10 : Number.NaN;
      out[1] = p[0] === 4 ? 3 : Number.POSITIVE_INFINITY;
    }, Float64Array.of(4), 2, { jacobian: (_p, _r, out) => { out[0] = 1; out[1] = 1; return 0; } });
    expect(result.success).toBe(false);
    expect(result.status).toBe(-3);
  });

  it('reports a non-finite Jacobian as a failure', () => {
    const result = leastSquares((p, out) => { out[0] = p[0]! - 1; }, Float64Array.of(4), 1, {
      jacobian: (_p, _r, out) => { out[0] = Number.NaN; return 0; },
    });
    expect(result.status).toBe(-3);
    expect(result.success).toBe(false);
  });

  it('steps around a region where the residuals are not finite and still converges', () => {
    // NaN above x = 6: the first steps from 0 towards 5 may overshoot into it and are rejected.
    const result = leastSquares((p, out) => { out[0] = p[0]! > 6 ? Number.NaN : 3 * (p[0]! - 5); }, Float64Array.of(0), 1, {
      jacobian: (_p, _r, out) => { out[0] = 3; return 0; },
    });
    expect(result.success).toBe(true);
    expect(result.params[0]).toBeCloseTo(5, 8);
  });

  it('holds upper and lower bounds, with the gradient pointing out of the box at an active bound (KKT)', () => {
    const random = seededRandom(21);
    for (let trial = 0; trial < 20; trial++) {
      const target = [uniform(random, -5, 5), uniform(random, -5, 5)];
      const lower = Float64Array.of(uniform(random, -3, 0), uniform(random, -3, 0));
      const upper = Float64Array.of(uniform(random, 0, 3), uniform(random, 0, 3));
      const f = (p: Float64Array, out: Float64Array) => {
        out[0] = p[0]! - target[0]!;
        out[1] = 2 * (p[1]! - target[1]!) + 0.5 * (p[0]! - target[0]!);
        out[2] = p[0]! * p[1]! - target[0]! * target[1]!;
      };
      const result = leastSquares(f, Float64Array.of(0, 0), 3, { lower, upper });
      expect(result.success).toBe(true);
      for (let j = 0; j < 2; j++) {
        expect(result.params[j]).toBeGreaterThanOrEqual(lower[j]!);
        expect(result.params[j]).toBeLessThanOrEqual(upper[j]!);
        // ∂(½S)/∂θ_j = (Jᵀr)_j: zero inside, ≤ 0 at an upper bound, ≥ 0 at a lower bound.
        let grad = 0;
        for (let i = 0; i < 3; i++) grad += result.jacobian[i * 2 + j]! * result.residuals[i]!;
        const atLower = result.params[j] === lower[j];
        const atUpper = result.params[j] === upper[j];
        if (atLower) expect(grad).toBeGreaterThanOrEqual(-1e-6);
        else if (atUpper) expect(grad).toBeLessThanOrEqual(1e-6);
        else expect(Math.abs(grad)).toBeLessThan(1e-5);
      }
    }
  });

  it('agrees with the slow grid reference on seeded noisy exponential decays', () => {
    const random = seededRandom(5);
    for (let trial = 0; trial < 5; trial++) {
      const amp = uniform(random, 1, 5);
      const rate = uniform(random, 0.2, 1.5);
      const t = Array.from({ length: 15 }, (_, i) => i * 0.3);
      const y = t.map((ti) => amp * Math.exp(-rate * ti) + uniform(random, -0.05, 0.05));
      const f = (p: Float64Array, out: Float64Array) => t.forEach((ti, i) => (out[i] = p[0]! * Math.exp(-p[1]! * ti) - y[i]!));
      const result = leastSquares(f, Float64Array.of(1, 1), t.length);
      expect(result.success).toBe(true);
      const [a, b] = slowMinimum2((u, v) => sumSquares(f, Float64Array.of(u, v), t.length), [0.5, 6, 0.05, 2]);
      expect(result.params[0]).toBeCloseTo(a, 4);
      expect(result.params[1]).toBeCloseTo(b, 4);
      // The solver's cost is never above the reference's (it is the same minimum, to rounding).
      expect(2 * result.cost).toBeLessThanOrEqual(sumSquares(f, Float64Array.of(a, b), t.length) * (1 + 1e-9));
    }
  });

  it('gives the same answer through its normal-equation entry and through the band-fit adapter', () => {
    const t = Array.from({ length: 25 }, (_, i) => -3 + i * 0.25);
    const y = t.map((ti) => 2 * Math.exp(-((ti - 0.4) ** 2) / 0.8) + 0.1 * Math.sin(3 * ti));
    const f = (p: Float64Array, out: Float64Array) => t.forEach((ti, i) => (out[i] = p[0]! * Math.exp(-((ti - p[1]!) ** 2) / p[2]!) - y[i]!));
    const m = t.length;
    const normalProblem: NormalEquationsProblem = {
      cost: (p) => sumSquares(f, p, m),
      normal: (p, a, g) => {
        // Analytic Jacobian of the Gaussian, g = −Jᵀr.
        a.fill(0);
        g.fill(0);
        let s = 0;
        for (let i = 0; i < m; i++) {
          const e = Math.exp(-((t[i]! - p[1]!) ** 2) / p[2]!);
          const r = p[0]! * e - y[i]!;
          const jac = [e, (p[0]! * e * 2 * (t[i]! - p[1]!)) / p[2]!, (p[0]! * e * (t[i]! - p[1]!) ** 2) / p[2]! ** 2];
          for (let j = 0; j < 3; j++) {
            g[j] = g[j]! - jac[j]! * r;
            for (let k = 0; k < 3; k++) a[j * 3 + k] = a[j * 3 + k]! + jac[j]! * jac[k]!;
          }
          s += r * r;
        }
        return s;
      },
    };
    const start = Float64Array.of(1, 0, 1);
    const lower = Float64Array.of(0, -3, 0.05);
    const upper = Float64Array.of(10, 3, 10);
    const residualForm = leastSquares(f, start, m, { lower, upper });
    const normalForm = leastSquaresNormal(normalProblem, start, { lower, upper });
    const adapter = levenbergMarquardtNormal(normalProblem, { initial: start, lower, upper });
    expect(residualForm.success && normalForm.success && adapter.converged).toBe(true);
    for (let j = 0; j < 3; j++) {
      expect(normalForm.params[j]).toBeCloseTo(residualForm.params[j]!, 5);
      expect(adapter.parameters[j]).toBeCloseTo(residualForm.params[j]!, 5);
    }
    // The adapter reports Σr², the solver ½Σr².
    expect(adapter.cost).toBeCloseTo(2 * normalForm.cost, 8);
  });

  it('the band-fit adapter reports non-finite residuals as not converged', () => {
    const problem: NormalEquationsProblem = {
      cost: () => Number.NaN,
      normal: (_p, a, g) => {
        a.fill(1);
        g.fill(1);
        return Number.NaN;
      },
    };
    const result = levenbergMarquardtNormal(problem, { initial: Float64Array.of(1), lower: Float64Array.of(0), upper: Float64Array.of(2) });
    expect(result.converged).toBe(false);
    expect(result.status).toBe(-3);
  });

  it('checks upper bounds before iterating', () => {
    const f = (p: Float64Array, out: Float64Array) => { out[0] = p[0]!; };
    expect(() => leastSquares(f, Float64Array.of(1), 1, { upper: Float64Array.of(1, 2) })).toThrow(/upper/);
    expect(() => leastSquares(f, Float64Array.of(1), 1, { lower: Float64Array.of(2), upper: Float64Array.of(1) })).toThrow(/lower/);
  });
});
