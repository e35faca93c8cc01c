import { optimize } from 'ml-spectra-fitting';
import { describe, expect, it } from 'vitest';
import { gaussianValue } from '../../src/spectrum/gaussian.js';
import { gaussianDeviates, mulberry32 } from '../../src/spectrum/random.js';
import { sgSecondDerivativeNoise } from '../../src/spectrum/sg-noise.js';
import { xNoiseFromSecondDifferences, xNoiseLocal } from '../../src/spectrum/x-noise.js';
import { xyCorrectDetectorSteps, xyFindDetectorSteps } from '../../src/spectrum/xy-detector-steps.js';
import { xyLowerHull } from '../../src/spectrum/xy-lower-hull.js';
import { xyMaskedRegions, xyMaskPoints } from '../../src/spectrum/xy-mask.js';
import { xPolynomialScale, xPolynomialValues, xyPolynomialFit } from '../../src/spectrum/xy-polynomial.js';
import { xyRefineBands } from '../../src/spectrum/xy-refine-bands.js';
import { xChooseGridStep, xUniformGrid, xyResampleUniform } from '../../src/spectrum/xy-resample.js';
import {
  referenceLowerHull, referenceResample, referenceSgSecondDerivativeNoise,
} from '../reference/spectrum-kernels.js';

const random = mulberry32(20240501);
const normal = gaussianDeviates(mulberry32(99));

describe('resampling', () => {
  it('matches the slow reference on seeded random non-uniform data with masks', () => {
    for (let trial = 0; trial < 20; trial++) {
      const n = 30 + Math.floor(random() * 40);
      const x: number[] = [];
      let v = 9000;
      for (let i = 0; i < n; i++) x.push((v += 20 + 300 * random()));
      const y = x.map(() => random());
      const kept = x.map(() => random() > 0.15);
      const step = 50 + 250 * random();
      const grid = xUniformGrid(x[0]!, x[n - 1]!, step);
      const fast = xyResampleUniform(Float64Array.from(x), Float64Array.from(y), Uint8Array.from(kept, Number), grid);
      const slow = referenceResample(x, y, kept, Array.from(grid));
      for (let g = 0; g < grid.length; g++) {
        if (Number.isNaN(slow[g]!)) expect(fast[g]).toBeNaN();
        else expect(fast[g]).toBeCloseTo(slow[g]!, 12);
      }
    }
  });

  it('chooses the median data spacing, but no more than maxPoints', () => {
    const x = Float64Array.from({ length: 101 }, (_, i) => 10000 + 10 * i);
    expect(xChooseGridStep(x, 1000)).toBe(10);
    expect(xChooseGridStep(x, 11)).toBe(100);
  });
});

describe('lower hull', () => {
  it('matches the O(n³) reference and never lies above the data', () => {
    for (let trial = 0; trial < 20; trial++) {
      const n = 5 + Math.floor(random() * 30);
      const x = Array.from({ length: n }, (_, i) => i * 10 + random() * 5);
      const y = x.map((xi) => Math.sin(xi / 30) + random());
      const hull = xyLowerHull(Float64Array.from(x), Float64Array.from(y));
      const slow = referenceLowerHull(x, y);
      for (let i = 0; i < n; i++) {
        expect(hull[i]).toBeCloseTo(slow[i]!, 10);
        expect(hull[i]!).toBeLessThanOrEqual(y[i]! + 1e-12);
      }
    }
  });
});

describe('noise', () => {
  it('recovers the deviation of white noise on a smooth curve', () => {
    const y = Float64Array.from({ length: 20000 }, (_, i) => 0.5 * Math.sin(i / 2000) + 0.01 * normal());
    expect(xNoiseFromSecondDifferences(y)).toBeGreaterThan(0.0095);
    expect(xNoiseFromSecondDifferences(y)).toBeLessThan(0.0105);
  });

  it('follows noise that changes along the spectrum', () => {
    const y = Float64Array.from({ length: 4000 }, (_, i) => (i < 2000 ? 0.001 : 0.004) * normal());
    const local = xNoiseLocal(y);
    expect(local[500]! / 0.001).toBeGreaterThan(0.8);
    expect(local[500]! / 0.001).toBeLessThan(1.2);
    expect(local[3500]! / 0.004).toBeGreaterThan(0.8);
    expect(local[3500]! / 0.004).toBeLessThan(1.2);
  });

  it('gives the Savitzky–Golay second-derivative noise of the least-squares definition', () => {
    for (const w of [5, 7, 9, 15, 31]) {
      const step = 10 + 90 * random();
      expect(sgSecondDerivativeNoise(w, step, 0.003)).toBeCloseTo(referenceSgSecondDerivativeNoise(w, step, 0.003), 12);
    }
  });
});

describe('detector steps', () => {
  it('finds one step of known size on a noisy smooth curve and removes it', () => {
    const n = 800;
    const x = Float64Array.from({ length: n }, (_, i) => 9000 + 30 * i);
    const clean = Float64Array.from(x, (v) => 0.2 + gaussianValue(v, 17000, 0.3, 3000));
    const y = Float64Array.from(clean, (v, i) => v + (i <= 300 ? 0.02 : 0) + 0.001 * normal());
    const steps = xyFindDetectorSteps(x, y);
    expect(steps).toHaveLength(1);
    expect(steps[0]!.index).toBe(300);
    expect(steps[0]!.size).toBeCloseTo(-0.02, 2);
    const fixed = xyCorrectDetectorSteps(y, steps);
    let worst = 0;
    for (let i = 0; i < n; i++) worst = Math.max(worst, Math.abs(fixed[i]! - clean[i]!));
    expect(worst).toBeLessThan(0.006);
  });

  it('does not take a spike or a narrow band for a step', () => {
    const x = Float64Array.from({ length: 400 }, (_, i) => 9000 + 50 * i);
    const y = Float64Array.from(x, (v) => gaussianValue(v, 15000, 0.05, 400) + 0.0005 * normal());
    y[200] = (y[200] as number) + 0.05;
    expect(xyFindDetectorSteps(x, y)).toEqual([]);
  });
});

describe('masking', () => {
  it('masks saturated and negative points and reports regions with from < to', () => {
    const x = Float64Array.from({ length: 10 }, (_, i) => 10000 + 100 * i);
    const a = Float64Array.of(0.1, -0.5, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 3.5, Number.POSITIVE_INFINITY);
    const reasons = xyMaskPoints(a, { negativeLimit: 0.01, saturationMargin: 1 });
    expect(reasons).toEqual([null, 'negative', null, null, null, null, null, 'saturated', 'saturated', 'saturated']);
    expect(xyMaskedRegions(x, reasons)).toEqual([
      { from: 10050, to: 10150, reason: 'negative' },
      { from: 10650, to: 10900, reason: 'saturated' },
    ]);
  });
});

describe('polynomial baseline', () => {
  it('fits a polynomial of its own order exactly', () => {
    const x = Float64Array.from({ length: 50 }, (_, i) => 9000 + 500 * i);
    const scale = xPolynomialScale(x);
    const c = Float64Array.of(0.1, -0.05, 0.02);
    const y = xPolynomialValues(x, c, scale);
    const fitted = xyPolynomialFit(x, y, 2, scale);
    for (let k = 0; k < 3; k++) expect(fitted[k]).toBeCloseTo(c[k]!, 12);
  });
});

describe('band refinement', () => {
  it('agrees with ml-spectra-fitting optimize on band-only data (library as reference)', () => {
    for (let trial = 0; trial < 3; trial++) {
      const x = Float64Array.from({ length: 300 }, (_, i) => 10000 + 60 * i);
      const truth = [
        { position: 15000 + 1000 * random(), height: 0.3 + 0.2 * random(), fwhm: 2500 + 1000 * random() },
        { position: 21000 + 1000 * random(), height: 0.2 + 0.2 * random(), fwhm: 3000 + 1000 * random() },
      ];
      const y = Float64Array.from(x, (v) => truth.reduce((s, b) => s + gaussianValue(v, b.position, b.height, b.fwhm), 0) + 0.002 * normal());
      const start = truth.map((b) => ({ position: b.position + 300, height: b.height * 0.8, fwhm: b.fwhm * 1.2 }));
      const ours = xyRefineBands(x, y, { bands: start, edge: null, baselineGuess: new Float64Array(x.length), baselineOrder: 0 });
      // ml-spectra-fitting 6 optimize as reference (no baseline term; the data have none).
      const ref = optimize({ x, y }, start.map((b) => ({ x: b.position, y: b.height, shape: { kind: 'gaussian' as const, fwhm: b.fwhm } })), {
        optimization: { kind: 'lm', options: { maxIterations: 300 } },
      });
      ours.bands.forEach((b, k) => {
        const r = ref.peaks[k]!;
        // Both minimise the same sum of squares; ours also fits a constant, which moves the optimum by much less than the noise allows.
        expect(Math.abs(b.position - r.x)).toBeLessThan(0.01 * b.fwhm);
        expect(Math.abs(b.height - r.y) / r.y).toBeLessThan(0.02);
        expect(Math.abs(b.fwhm - r.shape.fwhm!) / r.shape.fwhm!).toBeLessThan(0.02);
      });
      expect(ours.converged).toBe(true);
    }
  });
});

describe('Cholesky solve', () => {
  it('matches ml-matrix solve on seeded random SPD systems (library as reference)', async () => {
    const { Matrix, solve } = await import('ml-matrix');
    const { choleskySolveInPlace } = await import('../../src/spectrum/levenberg-marquardt.js');
    for (let trial = 0; trial < 10; trial++) {
      const p = 2 + Math.floor(random() * 15);
      const b = Matrix.rand(p + 3, p, { random });
      const a = b.transpose().mmul(b);
      const rhs = Float64Array.from({ length: p }, () => random() - 0.5);
      const out = new Float64Array(p);
      expect(choleskySolveInPlace(Float64Array.from(a.to1DArray()), rhs, p, out)).toBe(true);
      const ref = solve(a, Matrix.columnVector(Array.from(rhs))).getColumn(0); // ml-matrix 6 LU solve as reference
      for (let j = 0; j < p; j++) expect(out[j]).toBeCloseTo(ref[j]!, 8);
    }
  });
});
