/**
 * A band the first fit loses is found again in the residual
 * (fit-band-model.ts, residualCandidates). On noisy V(II) near-IR spectra
 * the first fit can let the 4T1g(P) band under the charge-transfer rise
 * collapse to zero height; the residual then holds a band as tall as the
 * others, but its curvature was judged against the fit's σ, whose band-shape
 * error (3 % of the signal, large under the CT rise) is smooth and counted
 * as white noise sets the threshold many times too high: the band never came
 * back (rms 0.15). Spectra from the corpus generator (tests/accuracy/
 * generate-spectrum.ts: asymmetric log-normal bands with sharp spin-forbidden
 * lines, a CT band above the range, ∝ ν̃⁴ scattering, 250–2500 nm, noise
 * smoothed over 5 points, absorbance rounded to 0.001): synthetic, not
 * measurements.
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { generateSpectrum, WINDOWS } from '../accuracy/generate-spectrum.js';
import { VANADIUM_AQUA_BANDS } from './helpers/vanadium-aqua.js';

// [V(H2O)6]2+ (tests/spectrum/helpers/vanadium-aqua.ts: positions and sources there).
const vanadium = VANADIUM_AQUA_BANDS;

describe('a band the first fit lost is added back from the residual', () => {
  // [offset, slope per 10 000 cm-1, noise seed]: before residualCandidates the fit ended without 4T1g(P) (rms 0.149
  // absorbance, where the noise is 0.0015; 1 of 40 seeds of tests/spectrum/many-candidates.test.ts's spectrum).
  const settings: Array<[offset: number, slope: number, seed: number]> = [[0.0116, 0.0198, 1023]];
  it.each(settings)('V(II) aqua, 250–2500 nm, noisy (offset %f, slope %f, seed %i): 4T1g(P) is there and the fit explains the data', (offset, slope, seed) => {
    const s = generateSpectrum(vanadium, WINDOWS['uv-vis-nir'], {
      digits: 3, noise: 0.0015, smooth: 5, offset, slope, scatter: 0.0278, chargeTransfer: { edgeAbsorbance: 2.08, fwhm: 7880, epsilon: 2280 },
    }, 0.12, seed);
    const r = processSpectrum(parseSpectrumText(s.csv).spectra[0]!, { geometry: 'octahedral', concentration: 0.12 });
    for (const p of [12490, 18714, 29106]) {
      expect(r.bands.some((b) => b.kind === 'd-d' && Math.abs(b.position - p) < 600), `${p}: ${r.bands.map((b) => Math.round(b.position)).join(',')}`).toBe(true);
    }
    // A band of absorbance 0.5 left out leaves an rms near 0.15; with it the Gaussian model's shape error on the skewed
    // bands and the CT rise (absorbance up to 2.3) leaves about 0.02.
    expect(r.fit.rms).toBeLessThan(0.05);
  });
});
