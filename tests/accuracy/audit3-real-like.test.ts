/**
 * AUDIT3 (a chemist's walk-through, AUDIT3.md findings 1–3, 9 and 12): three
 * visible-only spectra (380–780 nm, 1 nm, absorbance to 0.01) on which the
 * pipeline gives a confident wrong answer today, and a 300–1700 nm pair with
 * and without a real detector step. The spectra are SYNTHESIZED
 * (fixtures/spectra/real-like/audit3/generate.mjs, band positions and their
 * sources in the README there); they are not measurements.
 *
 * The wrong answers are `it.fails`: once the pipeline is right, the marker
 * itself fails and the coordinator turns it into a plain `it`. The passing
 * checks pin what is right already (the file as read, the assignment kind).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeSpectrum, type AnalyzeOptions } from '../../src/analysis.js';

const DIR = join(import.meta.dirname, '..', '..', 'fixtures', 'spectra', 'real-like', 'audit3');

function analyze(file: string, options: AnalyzeOptions) {
  return analyzeSpectrum(readFileSync(join(DIR, file), 'utf8'), { fileName: file, ...options });
}

describe('the AUDIT3 fixtures look like a visible-only export', () => {
  it.each(['v-aqua-visible.csv', 'cocl4-visible.csv', 'ni-ammine-visible.csv'])('%s: 380–780 nm, 1 nm, 0.01', (file) => {
    const rows = readFileSync(join(DIR, file), 'utf8').trim().split('\r\n').slice(3);
    expect(rows).toHaveLength(401);
    expect(rows.every((r) => /^\d{3},\d+\.\d\d$/.test(r))).toBe(true);
    const r = analyze(file, { ion: file.startsWith('v-') ? 'V3+' : file.startsWith('co') ? 'Co2+' : 'Ni2+', geometry: file.startsWith('co') ? 'tetrahedral' : 'octahedral' });
    expect(r.spectrum.range[0]).toBeCloseTo(1e7 / 780, 0);
    expect(r.spectrum.range[1]).toBeCloseTo(1e7 / 380, 0);
  });
});

describe('AUDIT3 finding 1: visible-only [V(H2O)6]3+ with its concentration', () => {
  // Bands 17 800 (ε 6) and 25 700 (ε 9) (from memory: the usual [V(H2O)6]3+ values; docs/sources.md lists them as not found).
  const r = () => analyze('v-aqua-visible.csv', { ion: 'V3+', concentration: 0.05 });

  it('the lowest band is 3T1g → 3T2g and 10Dq is near 19 000, not the two-electron reading with 10Dq ≈ 13 000', () => {
    const fit = r().fit;
    const lowest = fit.assignments.reduce((a, b) => (b.observed < a.observed ? b : a));
    // The lowest spin-allowed band of octahedral d2 is 3T1g(F) → 3T2g(F) (common practice).
    expect(lowest.label).toMatch(/^3T2g/);
    // 10Dq of [V(H2O)6]3+ ≈ 18 600–19 000 (from memory; the same bands measured over 300–1100 nm give 19 186 here).
    expect(fit.tenDq).toBeGreaterThan(17800);
    expect(fit.tenDq).toBeLessThan(20500);
  });

  it('a band as strong as the spin-allowed one is not called the weak two-electron 3A2g jump', () => {
    const fit = r().fit;
    // Two-electron bands are far weaker than the spin-allowed bands of the same spectrum (common practice; issue 13 item 3).
    expect(fit.assignments.some((a) => a.label.startsWith('3A2g'))).toBe(false);
  });
});

describe('AUDIT3 finding 2: visible-only [CoCl4]2-, the spin–orbit multiplet of 4T1(P)', () => {
  // Components 14 300 / 15 000 / 16 000 (ε 450 / 600 / 350) of 4A2 → 4T1(P) (from memory); the visible multiplet of
  // tetrahedral Co(II) is 4T1(P) (common practice). 10Dq ≈ 3 100–3 200 (from memory); Jørgensen's estimate
  // f(Cl-)·g(Co2+)·4/9 = 0.78 × 9 000 × 4/9 = 3 120 (docs/sources.md JORGENSEN-FG).
  const r = () => analyze('cocl4-visible.csv', { ion: 'Co2+', geometry: 'tetrahedral', concentration: 0.002 });

  it('10Dq is a tetrahedral chloride value (2 000–4 500 cm-1) and β is physical', () => {
    const fit = r().fit;
    expect(fit.tenDq).toBeGreaterThan(2000);
    expect(fit.tenDq).toBeLessThan(4500);
    expect(fit.beta!).toBeGreaterThan(0.3);
  });

  it('the two maxima are not read as 4T2 and 4T1(F)', () => {
    const labels = r().fit.assignments.map((a) => a.label);
    expect(labels.some((l) => /^4T2/.test(l))).toBe(false);
  });

  // AUDIT3 finding 9 ("good" beside an unphysical β and an exactly determined fit that reproduces nothing) is fixed and
  // checked in tests/fit/goodness-of-fit.test.ts.
});

describe('AUDIT3 finding 3: visible-only [Ni(NH3)6]2+, 3T2g beyond the red end', () => {
  // Bands 10 750, 17 500, 28 200 (from memory); f(NH3)·g(Ni2+) = 1.25 × 8 700 = 10 875 (docs/sources.md JORGENSEN-FG).
  const r = () => analyze('ni-ammine-visible.csv', { ion: 'Ni2+', concentration: 0.1 });

  it('the red-end band is reported as lying beyond the window', () => {
    const beyond = r().bands.filter((b) => b.position < 1e7 / 780);
    expect(beyond.length).toBeGreaterThan(0);
  });

  // The band beyond the red end now carries the model error of its extrapolation (src/spectrum/xy-profile-band-centre.ts):
  // 12 184 ± 1 018 (was ± 306), and the fit weighs it by that ±.
  it('10Dq is honest: 10 750 lies within two reported standard uncertainties', () => {
    const fit = r().fit;
    expect(Math.abs(fit.tenDq - 10750)).toBeLessThanOrEqual(2 * fit.uncertainty.tenDq!);
  });

  // Still fails: β 0.535. Two bands fix 10Dq and B exactly, so the band's ± moves neither, and the β prior is flat
  // between 0.35 and 1. Given the true maxima (`fit --ion Ni2+ --bands 10750,17500 --window 380-780nm`) src/fit picks
  // 3T1g(F), 3T1g(P) (10Dq 6 711, β 0.52) at 50 % against the right reading: the choice is src/fit's to make.
  it.fails('β is an ammine β (> 0.6)', () => {
    expect(r().fit.beta!).toBeGreaterThan(0.6);
  });
});

describe('AUDIT3 finding 12: a real detector step at 860 nm on the flank of [Ni(en)3]2+ 3T2g', () => {
  // Internal checks only: the generator put a step of +0.015 from 860 nm up into an otherwise identical file
  // (fixtures/spectra/real-like/audit3/generate.mjs); the reference is the analysis of the file without it.
  const plain = () => analyze('ni-en3-nir.csv', { ion: 'Ni2+', concentration: 0.05 });
  const stepped = () => analyze('ni-en3-nir-step860.csv', { ion: 'Ni2+', concentration: 0.05 });
  const nu1 = (r: ReturnType<typeof plain>) => r.bands.reduce((a, b) => (b.position < a.position ? b : a));

  it('the step is found near 860 nm and listed with its size; the file without it has none', () => {
    expect(plain().spectrum.stepCorrections).toEqual([]);
    const steps = stepped().spectrum.stepCorrections;
    expect(steps).toHaveLength(1);
    expect(Math.abs(steps[0]!.wavelength - 860)).toBeLessThan(2);
    expect(Math.abs(Math.abs(steps[0]!.size) - 0.015)).toBeLessThan(0.003);
  });

  it.fails('after the correction the lowest band lies where it lies without the step (within 3 of its reported σ)', () => {
    const a = nu1(plain());
    const b = nu1(stepped());
    expect(Math.abs(b.position - a.position)).toBeLessThanOrEqual(3 * Math.max(a.positionUncertainty, b.positionUncertainty));
  });
});

describe('AUDIT3 finding 15: visible-only [Cr(en)3]3+, one spin-allowed band and the sharp 2Eg line', () => {
  // Bands 21 800 (4T2g) and the 2Eg line near 14 900 (from memory). Internal check: the solutions that keep 4T2g at the
  // same 10Dq and differ only in what the sharp line is called are one spin-allowed assignment (README, assignmentGroup).
  const r = () => analyze('cr-en3-visible-desc.csv', { ion: 'Cr3+', concentration: 0.01 });

  it('10Dq is the 4T2g band (ν1 = 10Dq for d3, common practice)', () => {
    const fit = r().fit;
    const nu1 = fit.assignments.find((a) => a.label.startsWith('4T2g'));
    expect(nu1).toBeDefined();
    expect(fit.tenDq).toBeCloseTo(nu1!.observed, 0);
  });

  it.fails('the labellings of the sharp line are grouped: the spin-allowed assignment is > 95 % and no "not certain" warning', () => {
    const result = r();
    expect(result.fit.assignmentGroup.probability).toBeGreaterThan(0.95);
    expect(result.warnings.some((w) => /not certain/.test(w))).toBe(false);
  });
});
