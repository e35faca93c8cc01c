/**
 * The blocked products of the band fit's normal equations
 * (src/spectrum/jacobian-normal-products.ts) against the plain pass per pair
 * of columns they replaced (tests/reference/band-model.ts): the same numbers
 * to the bit, on Jacobians xyBandModelNormal fills for seeded random layouts
 * (1–6 bands, with and without the edge, baselines of order 0–3, uneven
 * weights or none) and on hand-made windows (empty, disjoint, nested).
 * A comparison of fieldgap with itself; the normal equations against a dense
 * reference are in band-model.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { bandModelParameterCount, bandModelWork, type BandModelLayout, xyBandModelNormal } from '../../src/spectrum/band-model.js';
import { reusedBandModelWork } from '../../src/spectrum/band-model-work-reuse.js';
import { jacobianNormalProducts } from '../../src/spectrum/jacobian-normal-products.js';
import { mulberry32 } from '../../src/spectrum/random.js';
import { xPolynomialScale } from '../../src/spectrum/xy-polynomial.js';
import { referencePairwiseProducts } from '../reference/band-model.js';

const random = mulberry32(4242);

function sameBits(a: Float64Array, b: Float64Array): boolean {
  return a.length === b.length && a.every((v, i) => Object.is(v, b[i]));
}

function problem() {
  const n = 60 + Math.floor(400 * random());
  const x = Float64Array.from({ length: n }, (_, i) => 8000 + 55 * i + 10 * random());
  const layout: BandModelLayout = {
    bands: 1 + Math.floor(6 * random()), edge: random() < 0.6, polynomialLength: 1 + Math.floor(4 * random()), scale: xPolynomialScale(x), xEnd: x[n - 1]!,
  };
  const p: number[] = [];
  for (let j = 0; j < layout.bands; j++) p.push(8000 + 55 * n * random(), 0.01 + random(), 200 + 5000 * random());
  if (layout.edge) p.push(0.05 + 0.5 * random(), 2000 + 15000 * random(), 6000 + 10000 * random());
  for (let k = 0; k < layout.polynomialLength; k++) p.push(0.1 * (random() - 0.5));
  const y = Float64Array.from(x, () => random());
  const weights = random() < 0.8 ? Float64Array.from(x, () => 100 + 900 * random()) : null;
  return { x, y, layout, p: Float64Array.from(p), weights };
}

describe('jacobianNormalProducts', () => {
  it('sums JᵀWJ and JᵀWr to the same bits as one pass per pair of columns', () => {
    for (let trial = 0; trial < 60; trial++) {
      const { x, y, layout, p, weights } = problem();
      const n = x.length;
      const q = bandModelParameterCount(layout);
      const work = bandModelWork(n, q);
      const a = new Float64Array(q * q);
      const g = new Float64Array(q);
      xyBandModelNormal(x, y, weights, layout, p, a, g, work);
      const aRef = new Float64Array(q * q).fill(Number.NaN);
      const gRef = new Float64Array(q).fill(Number.NaN);
      referencePairwiseProducts(work.jacobian, work.residuals, work.from, work.to, n, q, aRef, gRef);
      expect(sameBits(a, aRef), `trial ${trial}: ${layout.bands} bands, edge ${layout.edge}, ${layout.polynomialLength} baseline terms`).toBe(true);
      expect(sameBits(g, gRef)).toBe(true);
      expect(a.some((v) => v !== 0)).toBe(true);
    }
  });

  it('fills every entry for windows that are empty, disjoint, nested or unequal within a run', () => {
    const n = 50;
    const q = 8;
    const jac = Float64Array.from({ length: n * q }, () => random() - 0.5);
    const r = Float64Array.from({ length: n }, () => random() - 0.5);
    const from = Int32Array.from([0, 0, 0, 10, 10, 40, 5, 30]);
    const to = Int32Array.from([50, 50, 50, 20, 20, 45, 5, 35]);
    const a = new Float64Array(q * q).fill(Number.NaN);
    const g = new Float64Array(q).fill(Number.NaN);
    jacobianNormalProducts(jac, r, from, to, n, q, a, g);
    const aRef = new Float64Array(q * q);
    const gRef = new Float64Array(q);
    referencePairwiseProducts(jac, r, from, to, n, q, aRef, gRef);
    expect(sameBits(a, aRef)).toBe(true);
    expect(sameBits(g, gRef)).toBe(true);
  });
});

describe('reusedBandModelWork', () => {
  it('hands back one set of arrays, grown when a larger fit asks', () => {
    const small = reusedBandModelWork(100, 5);
    expect(reusedBandModelWork(80, 4)).toBe(small);
    const large = reusedBandModelWork(300, 12);
    expect(large.jacobian.length).toBeGreaterThanOrEqual(300 * 12);
    expect(large.residuals.length).toBeGreaterThanOrEqual(300);
    expect(reusedBandModelWork(100, 5)).toBe(large);
  });

  it('gives the same normal equations as fresh arrays after a fit of another size left values in it', () => {
    for (let trial = 0; trial < 20; trial++) {
      const before = problem();
      const qb = bandModelParameterCount(before.layout);
      xyBandModelNormal(before.x, before.y, before.weights, before.layout, before.p, new Float64Array(qb * qb), new Float64Array(qb), reusedBandModelWork(before.x.length, qb));
      const { x, y, layout, p, weights } = problem();
      const q = bandModelParameterCount(layout);
      const a = new Float64Array(q * q);
      const g = new Float64Array(q);
      const cost = xyBandModelNormal(x, y, weights, layout, p, a, g, reusedBandModelWork(x.length, q));
      const aFresh = new Float64Array(q * q);
      const gFresh = new Float64Array(q);
      expect(xyBandModelNormal(x, y, weights, layout, p, aFresh, gFresh, bandModelWork(x.length, q))).toBe(cost);
      expect(sameBits(a, aFresh)).toBe(true);
      expect(sameBits(g, gFresh)).toBe(true);
    }
  });
});
