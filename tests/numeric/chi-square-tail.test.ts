import { describe, expect, it } from 'vitest';
import { erf } from 'mathjs';
import { chiSquareTail, erfcOf } from '../../src/numeric/chi-square-tail.js';

/** Slow reference: Q(k/2, x/2) by the midpoint rule on the χ² density (k ≥ 1), integrated from x to far in the tail. */
function tailByQuadrature(x: number, k: number): number {
  const logGammaHalf = (n: number): number => {
    // Γ(n/2) for integer n ≥ 1 by the recurrence from Γ(1/2) = √π, Γ(1) = 1.
    let v = n % 2 === 0 ? 0 : 0.5 * Math.log(Math.PI);
    for (let a = n % 2 === 0 ? 1 : 0.5; a < n / 2; a += 1) v += Math.log(a);
    return v;
  };
  const logNorm = (k / 2) * Math.log(2) + logGammaHalf(k);
  const density = (t: number) => Math.exp((k / 2 - 1) * Math.log(t) - t / 2 - logNorm);
  const upper = x + 200 + 20 * k;
  const steps = 200_000;
  const h = (upper - x) / steps;
  let sum = 0;
  for (let i = 0; i < steps; i++) sum += density(x + (i + 0.5) * h);
  return sum * h;
}

describe('chiSquareTail', () => {
  it('erfc agrees with mathjs erf', () => {
    for (const z of [-2, -0.5, 0, 0.3, 1, 1.7, 2.5, 4]) {
      expect(erfcOf(z)).toBeCloseTo(1 - erf(z), 6); // mathjs 15 erf as reference
    }
  });

  it('gives the textbook critical values their tail probabilities', () => {
    // χ² critical values, NIST/SEMATECH e-Handbook of Statistical Methods, table 1.3.6.7.4 (from memory)
    expect(chiSquareTail(3.841, 1)).toBeCloseTo(0.05, 4);
    expect(chiSquareTail(6.635, 1)).toBeCloseTo(0.01, 4);
    expect(chiSquareTail(5.991, 2)).toBeCloseTo(0.05, 4);
    expect(chiSquareTail(9.21, 2)).toBeCloseTo(0.01, 4);
    expect(chiSquareTail(7.815, 3)).toBeCloseTo(0.05, 4);
    expect(chiSquareTail(11.345, 3)).toBeCloseTo(0.01, 4);
    expect(chiSquareTail(15.086, 5)).toBeCloseTo(0.01, 4);
  });

  it('matches a slow quadrature of the density for k = 1…8', () => {
    for (let k = 1; k <= 8; k++) {
      for (const x of [0.2, 1, 3, 8, 15]) {
        // The k = 1 density has an integrable singularity at 0 only, away from these x.
        expect(chiSquareTail(x, k)).toBeCloseTo(tailByQuadrature(x, k), 5);
      }
    }
  });

  it('is 1 at and below 0, 0 at infinity, and refuses a non-integer k', () => {
    expect(chiSquareTail(0, 3)).toBe(1);
    expect(chiSquareTail(-1, 1)).toBe(1);
    expect(chiSquareTail(Infinity, 2)).toBe(0);
    expect(() => chiSquareTail(1, 1.5)).toThrow(RangeError);
    expect(() => chiSquareTail(1, 0)).toThrow(RangeError);
  });
});
