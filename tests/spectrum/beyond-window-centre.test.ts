/**
 * A band centre outside the measured window (issue 13 item 1: "bounded,
 * with an honest uncertainty"; AUDIT3 finding 3). The σ of such a centre
 * comes from a profile of the centre (src/spectrum/xy-profile-band-centre.ts),
 * not from the curvature at the best fit.
 *
 * The spectra are SYNTHESIZED by the corpus generator (tests/accuracy/
 * generate-spectrum.ts: asymmetric log-normal bands that overlap, a CT band
 * above the window, ν̃⁴ scattering, a sloping offset, 380–780 nm at 1 nm,
 * absorbance rounded to 0.01): they are not measurements, and the truth is
 * the generator's band maximum, a check against our own synthetic input,
 * not an outside value.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { xyProfileBandCentre } from '../../src/spectrum/xy-profile-band-centre.js';
import { xyRefineBands } from '../../src/spectrum/xy-refine-bands.js';
import { generateSpectrum, WINDOWS } from '../accuracy/generate-spectrum.js';
import type { TruthBand } from '../accuracy/truth-bands.js';

const band = (position: number, fwhm: number, skew: number, epsilon: number, kind: TruthBand['kind'] = 'spin-allowed'): TruthBand => ({
  label: 'x', level: 'x#0', centre: position, position, fwhm, skew, epsilon, kind, weak: false,
});

const DISTORTIONS = { digits: 2, noise: 0, offset: 0.005, slope: 0.004, scatter: 0.01, chargeTransfer: { edgeAbsorbance: 1.2, fwhm: 8000, epsilon: 2000 } } as const;

/** The reported band nearest `position`. */
function nearest(bands: ReturnType<typeof processSpectrum>['bands'], position: number) {
  return bands.reduce((a, b) => (Math.abs(b.position - position) < Math.abs(a.position - position) ? b : a));
}

describe('the profile of a band centre', () => {
  // Two Gaussians on a flat baseline, the lower centred 900 cm-1 below the start of the data (a check of the profile
  // machinery against a slow reference, not an outside value).
  const x = Float64Array.from({ length: 300 }, (_, i) => 12000 + 40 * i);
  const y = Float64Array.from(x, (v) => 0.4 * Math.exp(-4 * Math.LN2 * ((v - 11100) / 3000) ** 2) + 0.5 * Math.exp(-4 * Math.LN2 * ((v - 17500) / 3300) ** 2) + 0.01);
  const weights = new Float64Array(x.length).fill(1 / 0.002);
  const start = { bands: [{ position: 11600, height: 0.3, fwhm: 2600 }, { position: 17400, height: 0.45, fwhm: 3000 }], edge: null, baselineGuess: new Float64Array(x.length).fill(0.01), weights, beyondLowEnd: 10 };
  const best = xyRefineBands(x, y, { ...start, maxIterations: 300 });

  it('the best fit finds the centre beyond the start of the data (noise-free Gaussians)', () => {
    expect(Math.abs((best.bands[0]?.position ?? 0) - 11100)).toBeLessThan(20);
  });

  it('Δχ² at each held centre matches a slow reference: an independent refit from the true other parameters', () => {
    const profile = xyProfileBandCentre(x, y, best, 0, { weights, baselineGuess: start.baselineGuess, baselineOrder: 1, beyondLowEnd: 10, towards: 1, step: 150, limit: 1e4, maxSteps: 3, maxFwhm: 20000 });
    expect(profile.positions.length).toBe(7);
    for (let k = 0; k < profile.positions.length; k++) {
      const at = profile.positions[k] as number;
      // Reference: started afresh at the held centre from the true parameters of everything else, many iterations.
      const ref = xyRefineBands(x, y, {
        ...start, bands: [{ position: at, height: 0.4, fwhm: 3000 }, { position: 17500, height: 0.5, fwhm: 3300 }],
        fixedPositions: [at, Number.NaN], maxIterations: 500, chiSquareTolerance: 1e-6, fwhmLimits: [250, 20000], positionFreedom: 5000,
      });
      const delta = Math.max(ref.chiSquare - best.chiSquare, 0);
      expect(Math.abs((profile.deltaChiSquare[k] as number) - delta), `${at}`).toBeLessThanOrEqual(0.02 * delta + 0.5);
    }
    // The profile rises on both sides of the best centre.
    expect(profile.deltaChiSquare[0]).toBeGreaterThan(1);
    expect(profile.deltaChiSquare[6]).toBeGreaterThan(1);
  });
});

describe('AUDIT3 finding 3: visible-only [Ni(NH3)6]2+, 3T2g beyond the red end', () => {
  const DIR = join(import.meta.dirname, '..', '..', 'fixtures', 'spectra', 'real-like', 'audit3');
  const r = processSpectrum(parseSpectrumText(readFileSync(join(DIR, 'ni-ammine-visible.csv'), 'utf8')).spectra[0]!, { concentration: 0.1, geometry: 'octahedral' });
  const red = nearest(r.bands, 10750);

  it('the band is reported beyond the red end, and its ± covers the true maximum (two σ)', () => {
    expect(red.window).toBe('beyond-red-end');
    // 10 750 cm-1: the maximum the fixture was generated with (fixtures/spectra/real-like/audit3/generate.mjs; the
    // band set of [Ni(NH3)6]2+ from memory, see the README there). Before the profile: 12 184 ± 306 (4.7 σ off).
    expect(Math.abs(red.position - 10750)).toBeLessThanOrEqual(2 * red.positionUncertainty);
  });

  it('the ± is not a blanket: under 1 500 cm-1, and the band inside the window keeps its tight one', () => {
    expect(red.positionUncertainty).toBeLessThan(1500);
    expect(nearest(r.bands, 17500).positionUncertainty).toBeLessThan(100);
  });

  it('the warning says where the ± comes from', () => {
    expect(r.warnings.some((w) => /maximum outside the measured range.*from how far the centre can move/.test(w))).toBe(true);
  });
});

describe('a sweep: the maximum 0–150 nm beyond the red end of a 380–780 nm window', () => {
  // Two families (invented, shaped like the usual cases): a d8-like spectrum with the first spin-allowed band beyond
  // the end overlapped by a second one 6 800 cm-1 above it (and a third in the near UV), and a d9-like single broad band.
  // Measured on this branch (z = |error| / σ): before the profile the truth lay within 2 σ in 11 of 14 cases (two
  // +125 nm: z 3.45; one +150 nm: z 2.30; one +75 nm: no band), after it in 12 of 14; within 1 σ in 6 of 14.
  const cases = [0, 25, 50, 75, 100, 125, 150].flatMap((beyond) => {
    const first = 1e7 / (780 + beyond);
    return [
      { name: `two overlapping bands, +${beyond} nm`, first, bands: [band(first, 3300, 1.25, 4), band(first + 6800, 3400, 1.2, 5), band(first + 17400, 3900, 1.2, 7)], conc: 0.1 },
      { name: `one broad band, +${beyond} nm`, first, bands: [band(first, 5200, 1.15, 12)], conc: 0.05 },
    ];
  });
  const results = cases.map((c) => {
    const s = generateSpectrum(c.bands, WINDOWS.visible, DISTORTIONS, c.conc, 7);
    const r = processSpectrum(parseSpectrumText(s.csv).spectra[0]!, { geometry: 'octahedral', concentration: c.conc });
    const b = r.bands.length === 0 ? null : nearest(r.bands, c.first);
    return { ...c, band: b, z: b === null ? Number.POSITIVE_INFINITY : Math.abs(b.position - c.first) / b.positionUncertainty };
  });
  const check = (r: (typeof results)[number]): void => {
    expect(r.band).not.toBeNull();
    expect(r.band!.maximumInWindow).toBe(false);
    expect(r.z).toBeLessThanOrEqual(2);
  };
  // Known misses, kept visible: the single band 75 nm beyond the end is lost altogether (no band reported: the
  // model selection, not its ±; it was lost before this change too), and the two-band case at +125 nm is fitted
  // narrower (FWHM 3 170) and 1 180 cm-1 high at z 2.6 (3.45 before).
  const KNOWN = new Set(['one broad band, +75 nm', 'two overlapping bands, +125 nm']);

  it.each(results.filter((r) => !KNOWN.has(r.name)).map((r) => [r.name, r] as const))('%s: reported outside the window, the truth within two of its σ', (_, r) => check(r));
  it.fails.each(results.filter((r) => KNOWN.has(r.name)).map((r) => [r.name, r] as const))('%s (known miss): reported outside the window, the truth within two of its σ', (_, r) => check(r));

  it('coverage: the truth within two σ in at least 12 of the 14 cases (95 % nominal: 13.3 expected)', () => {
    expect(results.filter((r) => r.z <= 2).length).toBeGreaterThanOrEqual(12);
  });
});
