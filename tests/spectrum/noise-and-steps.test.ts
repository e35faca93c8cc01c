/**
 * The noise model of rounded, smoothed and noise-free data, and detector
 * step correction only on overwhelming evidence. Spectra are invented test
 * inputs (realistic.ts, synthesize.ts); no check value comes from outside.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { gaussianDeviates, mulberry32, parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { xQuantizationStep } from '../../src/spectrum/x-quantization-step.js';
import { caseSpectrum, corpusCases } from '../accuracy/cases.js';
import { caseOptions } from '../accuracy/run-corpus.js';
import { cli } from '../analysis/helpers.js';
import { makeTestApp, type TestApp } from '../server/helpers.js';
import { realisticCsv, type RealisticOptions } from './realistic.js';
import { COBALT, COPPER, NICKEL } from './visible-cases.js';

/** Slow reference for decimal exports: 10^-k for the smallest k at which every value is a whole multiple of 10^-k; 0 if none up to 8. */
function referenceDecimalStep(values: number[]): number {
  for (let k = 0; k <= 8; k++) {
    const q = 10 ** -k;
    if (values.every((v) => Math.abs(v / q - Math.round(v / q)) < 1e-6)) return q;
  }
  return 0;
}

describe('xQuantizationStep', () => {
  const normal = gaussianDeviates(mulberry32(5));
  const smooth = Array.from({ length: 300 }, (_, i) => 0.3 + 0.25 * Math.sin(i / 37) + 0.1 * Math.exp(-(((i - 150) / 30) ** 2)));

  it('finds the rounding step of values exported with 2, 3 and 4 decimals', () => {
    for (const decimals of [2, 3, 4]) {
      const rounded = smooth.map((v) => Number(v.toFixed(decimals)));
      expect(xQuantizationStep(Float64Array.from(rounded))).toBeCloseTo(10 ** -decimals, 12);
      expect(referenceDecimalStep(rounded)).toBeCloseTo(10 ** -decimals, 12);
    }
  });

  it('gives 0 for unrounded, noisy or too short data', () => {
    expect(xQuantizationStep(Float64Array.from(smooth))).toBe(0);
    expect(xQuantizationStep(Float64Array.from(smooth, (v) => v + 0.001 * normal()))).toBe(0);
    expect(xQuantizationStep(Float64Array.from([0.1, 0.2, 0.3]))).toBe(0);
  });
});

describe('no false structure on rounded and smooth data', () => {
  const cases: Array<[string, RealisticOptions, number]> = [
    ['Ni(II)', NICKEL.spectrum, 3], ['Co(II)', COBALT.spectrum, 3], ['Cu(II)', COPPER.spectrum, 1],
  ];
  for (const [name, o, bands] of cases) {
    for (const decimals of [2, 3, 4, 6]) {
      it(`${name}, ${decimals} decimals: ${bands} band(s), no step corrected`, () => {
        const r = processSpectrum(parseSpectrumText(realisticCsv({ ...o, decimals })).spectra[0]!, {});
        expect(r.bands).toHaveLength(bands);
        expect(r.stepCorrections).toEqual([]);
        expect(r.warnings.some((w) => /step/.test(w))).toBe(false);
      });
    }
  }
});

/** The Ni(II) spectrum with a detector step of `size` absorbance at 600 nm (above it in wavelength). */
function withStep(size: number, decimals = 2): string {
  const lines = realisticCsv({ ...NICKEL.spectrum, decimals: 6 }).trim().split('\n');
  return `${[lines[0], ...lines.slice(1).map((line) => {
    const [nm, a] = line.split(',').map(Number) as [number, number];
    return `${nm},${(a + (nm > 600 ? size : 0)).toFixed(decimals)}`;
  })].join('\n')}\n`;
}

describe('detector steps', () => {
  it('corrects a clear step (0.05 at 600 nm on data rounded to 0.01) and lists it with its size', () => {
    const r = analyzeSpectrum(withStep(0.05), { ion: 'Ni2+' });
    expect(r.spectrum.stepCorrections).toHaveLength(1);
    const step = r.spectrum.stepCorrections[0]!;
    expect(step.wavelength).toBeGreaterThan(599);
    expect(step.wavelength).toBeLessThan(601);
    expect(step.size).toBeCloseTo(-0.05, 2);
    expect(step.significance).toBeGreaterThan(8);
    expect(r.warnings.some((w) => /corrected a step of -0\.04\d+ at 1665\d cm-1 \(600\.\d nm\)/.test(w))).toBe(true);
  });

  it('leaves a step of one or two rounding steps alone: no evidence', () => {
    for (const size of [0.01, 0.02]) expect(analyzeSpectrum(withStep(size), { ion: 'Ni2+' }).spectrum.stepCorrections).toEqual([]);
  });

  it('stepCorrection false leaves even a clear step in the data', () => {
    const r = analyzeSpectrum(withStep(0.05), { ion: 'Ni2+', stepCorrection: false });
    expect(r.spectrum.stepCorrections).toEqual([]);
    expect(r.warnings.some((w) => /corrected a step/.test(w))).toBe(false);
  });

  describe('switched off on every interface', () => {
    let dir: string;
    let t: TestApp;
    beforeAll(() => {
      dir = mkdtempSync(join(tmpdir(), 'fieldgap-steps-'));
      writeFileSync(join(dir, 'step.csv'), withStep(0.05));
      t = makeTestApp();
    });
    afterAll(async () => {
      await t.dispose();
    });

    it('analyze --no-step-correction', async () => {
      const on = await cli(['analyze', join(dir, 'step.csv'), '--ion', 'Ni2+', '--json']);
      expect(on.code).toBe(0);
      expect(JSON.parse(on.stdout).spectrum.stepCorrections).toHaveLength(1);
      const off = await cli(['analyze', join(dir, 'step.csv'), '--ion', 'Ni2+', '--no-step-correction', '--json']);
      expect(off.code).toBe(0);
      expect(JSON.parse(off.stdout).spectrum.stepCorrections).toEqual([]);
      expect((await cli(['analyze', '--help'])).stdout).toContain('--no-step-correction');
    });

    it('POST /api/v1/analyze?stepCorrection=false', async () => {
      const content = readFileSync(join(dir, 'step.csv'));
      const on = await request(t.app).post('/api/v1/analyze?ion=Ni2%2B').set('content-type', 'text/csv').send(content).expect(200);
      expect(on.body.spectrum.stepCorrections).toHaveLength(1);
      const off = await request(t.app).post('/api/v1/analyze?ion=Ni2%2B&stepCorrection=false').set('content-type', 'text/csv').send(content).expect(200);
      expect(off.body.spectrum.stepCorrections).toEqual([]);
      const bad = await request(t.app).post('/api/v1/analyze?ion=Ni2%2B&stepCorrection=maybe').set('content-type', 'text/csv').send(content).expect(400);
      expect(bad.body.error.path).toBe('stepCorrection');
    });
  });
});

describe('what is not a step', () => {
  it('a sharp band (Mn(II)-like, FWHM 250 cm-1 near 400 nm) on rounded data', () => {
    const o: RealisticOptions = {
      concentration: 0.5, decimals: 2,
      bands: [{ position: 24_950, epsilon: 2, fwhm: 250, skew: 1.1 }, { position: 18_900, epsilon: 0.1, fwhm: 2000 }],
    };
    const r = processSpectrum(parseSpectrumText(realisticCsv(o)).spectra[0]!, {});
    expect(r.stepCorrections).toEqual([]);
  });

  it('the sharp quartet bands of the corpus\'s hexaaqua Mn(II) (tests/accuracy, 380–780 and 200–1100 nm)', () => {
    for (const id of ['mn2-aqua/vis', 'mn2-aqua/uvvis']) {
      const c = corpusCases().find((k) => k.id === id)!;
      expect(analyzeSpectrum(caseSpectrum(c).csv, caseOptions(c)).spectrum.stepCorrections, id).toEqual([]);
    }
  });

  it('smoothed noise (a moving average of 9 points of σ 0.002), rounded to 0.001', () => {
    const normal = gaussianDeviates(mulberry32(11));
    const raw = Array.from({ length: 809 }, () => 0.002 * normal());
    const smoothed = raw.slice(4, -4).map((_, i) => raw.slice(i, i + 9).reduce((s, v) => s + v, 0) / 3); // sum/3: σ stays ≈ 0.002
    const lines = smoothed.map((v, i) => `${380 + 0.5 * i},${(0.3 + v + 0.4 * Math.exp(-(((1e7 / (380 + 0.5 * i) - 17_000) / 1800) ** 2))).toFixed(3)}`);
    const r = processSpectrum(parseSpectrumText(`nm,A\n${lines.join('\n')}\n`).spectra[0]!, {});
    expect(r.stepCorrections).toEqual([]);
  });
});
