import { describe, expect, it } from 'vitest';
import { inv, multiply, transpose } from 'mathjs';
import { leastSquares, LEAST_SQUARES_MESSAGES } from '../../src/fit/least-squares.js';
import { covarianceCorrelation, covarianceStandardErrors, jacobianCovariance } from '../../src/fit/covariance.js';
import { FieldgapError } from '../../src/errors.js';
import { seededRandom, uniform } from './random.js';

describe('leastSquares', () => {
  it('finds the minimum of the Rosenbrock function written as residuals', () => {
    // r = (10(y − x²), 1 − x): the minimum is (1, 1) with zero cost (Rosenbrock 1960, the standard test)
    const result = leastSquares(
      (t, out) => {
        out[0] = 10 * (t[1]! - t[0]! ** 2);
        out[1] = 1 - t[0]!;
      },
      Float64Array.of(-1.2, 1),
      2,
    );
    expect(result.success).toBe(true);
    expect(result.params[0]).toBeCloseTo(1, 8);
    expect(result.params[1]).toBeCloseTo(1, 8);
    expect(result.cost).toBeLessThan(1e-16);
    expect(result.message).toBe(LEAST_SQUARES_MESSAGES[result.status]);
    expect(result.evaluations).toBeGreaterThan(result.iterations);
  });

  it('matches the normal-equation solution of a straight line on seeded noisy data', () => {
    const random = seededRandom(7);
    for (let trial = 0; trial < 10; trial++) {
      const a = uniform(random, -5, 5);
      const b = uniform(random, -2, 2);
      const t = Array.from({ length: 12 }, (_, i) => i / 2);
      const y = t.map((ti) => a + b * ti + uniform(random, -0.3, 0.3));
      const result = leastSquares(
        (p, out) => t.forEach((ti, i) => (out[i] = p[0]! + p[1]! * ti - y[i]!)),
        Float64Array.of(0, 0),
        t.length,
      );
      // mathjs 15 inv as reference for (XᵀX)⁻¹Xᵀy
      const x = t.map((ti) => [1, ti]);
      const xt = transpose(x);
      const coef = multiply(multiply(inv(multiply(xt, x)), xt), y) as number[];
      // ftol = 1e-10 on the cost leaves about √1e-10 relative in the parameters' neighbourhood; 6 digits is what it promises.
      expect(result.params[0]).toBeCloseTo(coef[0]!, 6);
      expect(result.params[1]).toBeCloseTo(coef[1]!, 6);

      const dof = t.length - 2;
      const s2 = (2 * result.cost) / dof;
      const cov = jacobianCovariance(result.jacobian, t.length, 2, { scale: s2 })!;
      const reference = inv(multiply(xt, x)) as number[][];
      // mathjs 15 inv as reference for s²(XᵀX)⁻¹; the forward-difference Jacobian is good to ~1e-8 relative
      expect(cov[0]! / (s2 * reference[0]![0]!)).toBeCloseTo(1, 6);
      expect(cov[1]! / (s2 * reference[0]![1]!)).toBeCloseTo(1, 6);
      expect(cov[3]! / (s2 * reference[1]![1]!)).toBeCloseTo(1, 6);
      const corr = covarianceCorrelation(cov, 2);
      expect(corr[0]).toBeCloseTo(1, 12);
      expect(Math.abs(corr[1]!)).toBeLessThanOrEqual(1);
      expect(corr[1]).toBeCloseTo(corr[2]!, 12);
      expect(covarianceStandardErrors(cov, 2)[1]).toBeCloseTo(Math.sqrt(cov[3]!), 12);
    }
  });

  it('recovers the parameters of an exponential decay without noise', () => {
    const random = seededRandom(11);
    for (let trial = 0; trial < 10; trial++) {
      const amp = uniform(random, 1, 10);
      const rate = uniform(random, 0.1, 2);
      const t = Array.from({ length: 20 }, (_, i) => i * 0.25);
      const result = leastSquares(
        (p, out) => t.forEach((ti, i) => (out[i] = p[0]! * Math.exp(-p[1]! * ti) - amp * Math.exp(-rate * ti))),
        Float64Array.of(amp * 0.7, rate * 1.4),
        t.length,
      );
      expect(result.success).toBe(true);
      expect(result.params[0]).toBeCloseTo(amp, 6);
      expect(result.params[1]).toBeCloseTo(rate, 6);
    }
  });

  it('uses an analytic Jacobian when given and counts its evaluations', () => {
    let calls = 0;
    const result = leastSquares(
      (p, out) => {
        calls++;
        out[0] = p[0]! - 3;
        out[1] = 2 * (p[0]! - 3);
      },
      Float64Array.of(10),
      2,
      {
        jacobian: (_p, _r, out) => {
          out[0] = 1;
          out[1] = 2;
          return 0;
        },
      },
    );
    expect(result.params[0]).toBeCloseTo(3, 10);
    expect(result.evaluations).toBe(calls);
  });

  it('projects onto lower bounds', () => {
    const result = leastSquares((p, out) => (out[0] = p[0]! + 2), Float64Array.of(5), 1, {
      lower: Float64Array.of(0),
    });
    expect(result.params[0]).toBe(0);
    expect(result.success).toBe(true);
  });

  it('reports running out of evaluations as a failure with its message', () => {
    const result = leastSquares(
      (t, out) => {
        out[0] = 10 * (t[1]! - t[0]! ** 2);
        out[1] = 1 - t[0]!;
      },
      Float64Array.of(-1.2, 1),
      2,
      { maxEvaluations: 3 },
    );
    expect(result.success).toBe(false);
    expect(result.status).toBe(0);
    expect(result.message).toMatch(/maximum number of residual evaluations/);
  });

  it('checks its arguments before iterating', () => {
    const noop = () => undefined;
    expect(() => leastSquares(noop, new Float64Array(0), 1)).toThrow(FieldgapError);
    expect(() => leastSquares(noop, Float64Array.of(NaN), 1)).toThrow(/finite/);
    expect(() => leastSquares(noop, Float64Array.of(1), 0)).toThrow(/residuals/);
    expect(() => leastSquares(noop, Float64Array.of(1), 1, { ftol: -1 })).toThrow(/ftol/);
    expect(() => leastSquares(noop, Float64Array.of(1), 1, { lower: Float64Array.of(0, 0) })).toThrow(/lower/);
  });
});

describe('jacobianCovariance', () => {
  it('says undefined for a parameter the data do not determine', () => {
    // Two identical columns: only their sum is determined.
    const jac = Float64Array.of(1, 1, 2, 2, 3, 3);
    expect(jacobianCovariance(jac, 3, 2)).toBeUndefined();
  });

  it('inverts JᵀJ: cov·(JᵀJ) = I on seeded random Jacobians', () => {
    const random = seededRandom(3);
    for (let trial = 0; trial < 20; trial++) {
      const m = 5;
      const p = 3;
      const jac = Float64Array.from({ length: m * p }, () => uniform(random, -1, 1));
      const cov = jacobianCovariance(jac, m, p)!;
      for (let j = 0; j < p; j++) {
        for (let k = 0; k < p; k++) {
          let sum = 0;
          for (let l = 0; l < p; l++) {
            let jtj = 0;
            for (let i = 0; i < m; i++) jtj += jac[i * p + l]! * jac[i * p + k]!;
            sum += cov[j * p + l]! * jtj;
          }
          expect(sum).toBeCloseTo(j === k ? 1 : 0, 9);
        }
      }
    }
  });
});

describe('leastSquares atol', () => {
  it('stops with status 5 once the cost is below atol', () => {
    let calls = 0;
    const result = leastSquares(
      (p, out) => {
        calls++;
        out[0] = p[0]! ** 3 - 8;
      },
      Float64Array.of(3),
      1,
      { atol: 1e-20 },
    );
    expect(result.status).toBe(5);
    expect(result.message).toMatch(/atol/);
    expect(result.params[0]).toBeCloseTo(2, 9);
    expect(calls).toBeLessThan(30);
  });
});
