import { describe, expect, it } from 'vitest';
import { bandModelParameterCount, bandModelWork, type BandModelLayout, xBandModelValues, xyBandModelCost, xyBandModelNormal } from '../../src/spectrum/band-model.js';
import { bandFitBic, gaussiansMerge } from '../../src/spectrum/fit-band-model.js';
import { gaussianValue } from '../../src/spectrum/gaussian.js';
import { gaussianDeviates, mulberry32 } from '../../src/spectrum/random.js';
import { xPolynomialScale } from '../../src/spectrum/xy-polynomial.js';
import { xyRefineBands } from '../../src/spectrum/xy-refine-bands.js';
import { referenceModel, referenceNormal } from '../reference/band-model.js';

const random = mulberry32(777);
const normal = gaussianDeviates(mulberry32(778));

/** Seeded random problem: ascending x with a gap, 1–4 bands, maybe an edge, a baseline, uneven weights. */
function problem() {
  const x = Float64Array.from({ length: 180 }, (_, i) => 9000 + 120 * i + (i > 90 ? 900 : 0) + 20 * random());
  const scale = xPolynomialScale(x);
  const layout: BandModelLayout = { bands: 1 + Math.floor(4 * random()), edge: random() < 0.7, polynomialLength: 1 + Math.floor(3 * random()), scale, xEnd: x[x.length - 1]! };
  const p: number[] = [];
  for (let j = 0; j < layout.bands; j++) p.push(11000 + 18000 * random(), 0.05 + random(), 400 + 4000 * random());
  if (layout.edge) p.push(0.05 + 0.5 * random(), 2000 + 15000 * random(), 6000 + 10000 * random());
  for (let k = 0; k < layout.polynomialLength; k++) p.push(0.1 * (random() - 0.5));
  const y = Float64Array.from(x, () => 0.5 * random());
  const weights = Float64Array.from(x, () => 200 + 800 * random());
  return { x, y, layout, p: Float64Array.from(p), weights };
}

const ref = (l: BandModelLayout) => ({ bands: l.bands, edge: l.edge, polynomialLength: l.polynomialLength, centre: l.scale.centre, halfWidth: l.scale.halfWidth, xEnd: l.xEnd });

describe('band model normal equations (fast path against the dense reference)', () => {
  it('match JᵀWJ, JᵀWr and the cost on seeded random problems', () => {
    for (let trial = 0; trial < 25; trial++) {
      const { x, y, layout, p, weights } = problem();
      const q = bandModelParameterCount(layout);
      expect(q).toBe(p.length);
      const a = new Float64Array(q * q);
      const g = new Float64Array(q);
      const cost = xyBandModelNormal(x, y, weights, layout, p, a, g, bandModelWork(x.length, q));
      const values = xBandModelValues(x, layout, p, new Float64Array(x.length));
      referenceModel(Array.from(x), ref(layout), Array.from(p)).forEach((v, i) => expect(values[i]!).toBeCloseTo(v, 8)); // bands cut at ±2.75 FWHM: ≤ 1e-9 × height
      const r = referenceNormal(Array.from(x), Array.from(y), Array.from(weights), ref(layout), Array.from(p));
      expect(cost / r.cost - 1).toBeCloseTo(0, 9);
      expect(xyBandModelCost(x, y, weights, layout, p, new Float64Array(x.length)) / r.cost - 1).toBeCloseTo(0, 9);
      for (let u = 0; u < q; u++) {
        const scaleU = Math.sqrt(r.a[u]![u]!);
        // central differences carry ~1e-7 relative error
        expect(Math.abs(g[u]! - r.g[u]!)).toBeLessThan(1e-5 * scaleU * Math.sqrt(r.cost) + 1e-12);
        for (let v = 0; v < q; v++) expect(Math.abs(a[u * q + v]! - r.a[u]![v]!)).toBeLessThan(1e-5 * scaleU * Math.sqrt(r.a[v]![v]!) + 1e-12);
      }
    }
  });
});

describe('band refinement invariants', () => {
  it('recovers noise-free bands, edge and baseline exactly from a perturbed start', () => {
    for (let trial = 0; trial < 5; trial++) {
      const x = Float64Array.from({ length: 300 }, (_, i) => 9000 + 80 * i);
      const xEnd = x[x.length - 1]!;
      const truth = [
        { position: 14000 + 2000 * random(), height: 0.3 + 0.3 * random(), fwhm: 2500 + 800 * random() },
        { position: 22000 + 2000 * random(), height: 0.2 + 0.3 * random(), fwhm: 3000 + 800 * random() },
      ];
      const edge = { position: xEnd + 6000 + 6000 * random(), height: 2, fwhm: 9000 };
      const y = Float64Array.from(x, (v) => 0.02 + 0.01 * (v - 20000) / 10000 + gaussianValue(v, edge.position, edge.height, edge.fwhm)
        + truth.reduce((s, b) => s + gaussianValue(v, b.position, b.height, b.fwhm), 0));
      const start = truth.map((b) => ({ position: b.position + 250, height: 0.8 * b.height, fwhm: 1.15 * b.fwhm }));
      const fit = xyRefineBands(x, y, { bands: start, edge: { position: xEnd + 6000, height: 1, fwhm: 12000 }, baselineGuess: new Float64Array(x.length), baselineOrder: 1, maxIterations: 300 });
      expect(fit.rms).toBeLessThan(1e-5);
      fit.bands.forEach((b, k) => {
        expect(Math.abs(b.position - truth[k]!.position)).toBeLessThan(1);
        expect(Math.abs(b.fwhm / truth[k]!.fwhm - 1)).toBeLessThan(1e-3);
      });
      // the edge's value at the top of the range is what the data fix
      expect(gaussianValue(xEnd, fit.edge!.position, fit.edge!.height, fit.edge!.fwhm)).toBeCloseTo(gaussianValue(xEnd, edge.position, edge.height, edge.fwhm), 4);
    }
  });

  it('positionSd matches the scatter of the fitted position over noise realisations', () => {
    const x = Float64Array.from({ length: 250 }, (_, i) => 10000 + 80 * i);
    const band = { position: 18000, height: 0.1, fwhm: 3000 };
    const positions: number[] = [];
    let sd = 0;
    for (let k = 0; k < 60; k++) {
      const y = Float64Array.from(x, (v) => gaussianValue(v, band.position, band.height, band.fwhm) + 0.01 + 0.005 * normal());
      const fit = xyRefineBands(x, y, { bands: [band], edge: null, baselineGuess: new Float64Array(x.length).fill(0.01), baselineOrder: 1, weights: new Float64Array(x.length).fill(200) });
      positions.push(fit.bands[0]!.position);
      sd += fit.positionSd[0]! / 60;
    }
    const mean = positions.reduce((s, v) => s + v, 0) / positions.length;
    const scatter = Math.sqrt(positions.reduce((s, v) => s + (v - mean) ** 2, 0) / (positions.length - 1));
    // 60 samples: the sample deviation is within ~±25 % of the true one (χ² with 59 degrees of freedom)
    expect(scatter / sd).toBeGreaterThan(0.7);
    expect(scatter / sd).toBeLessThan(1.3);
  });
});

describe('model selection helpers', () => {
  it('merging two Gaussians keeps their area and mean, and one Gaussian merged with itself is itself', () => {
    for (let trial = 0; trial < 10; trial++) {
      const p = { position: 15000 + 5000 * random(), height: 0.1 + random(), fwhm: 1000 + 3000 * random() };
      const q = { position: p.position + 2000 * (random() - 0.5), height: 0.1 + random(), fwhm: 1000 + 3000 * random() };
      const m = gaussiansMerge(p, q);
      expect(m.height * m.fwhm).toBeCloseTo(p.height * p.fwhm + q.height * q.fwhm, 10);
      expect(m.position).toBeCloseTo((p.height * p.fwhm * p.position + q.height * q.fwhm * q.position) / (p.height * p.fwhm + q.height * q.fwhm), 6);
      expect(m.fwhm).toBeGreaterThanOrEqual(Math.min(p.fwhm, q.fwhm) - 1e-9);
      const same = gaussiansMerge(p, p);
      expect(same.position).toBeCloseTo(p.position, 8);
      expect(same.fwhm).toBeCloseTo(p.fwhm, 8);
      expect(same.height).toBeCloseTo(2 * p.height, 10);
    }
  });

  it('BIC is χ² plus p ln n', () => {
    const fit = { chiSquare: 412.5, parameters: 11 } as Parameters<typeof bandFitBic>[0];
    expect(bandFitBic(fit, 400)).toBeCloseTo(412.5 + 11 * Math.log(400), 12);
  });
});
