/**
 * A masked stretch at an end of the range is not measured data: no band may
 * be centred in it, and each band's window flag is judged against the data
 * kept (kept-window.ts). Spectra from the corpus generator (tests/accuracy/
 * generate-spectrum.ts: asymmetric log-normal bands with sharp spin-forbidden
 * lines, a CT band above the range, ∝ ν̃⁴ scattering, 250–2500 nm at 1 nm,
 * smoothed noise, absorbance rounded to 0.001) with a baseline that runs
 * below zero at the red end, so a stretch there is masked as negative:
 * synthetic, not measurements.
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { bandWindow } from '../../src/spectrum/bands-from-fit.js';
import { generateSpectrum, WINDOWS } from '../accuracy/generate-spectrum.js';
import { VANADIUM_AQUA_BANDS } from './helpers/vanadium-aqua.js';

// [V(H2O)6]2+ (tests/spectrum/helpers/vanadium-aqua.ts: positions and sources there).
const vanadium = VANADIUM_AQUA_BANDS;

describe('a stretch of negative absorbance masked at the red end (250–2500 nm, 0.001, smoothed noise)', () => {
  // [offset, slope per 10 000 cm-1, seed]: the baseline crosses zero between 6 000 and 9 000 cm-1 (the first is close to
  // the corpus's v2-aqua/nir, which had a d–d band invented at 7 548 cm-1 in its masked stretch, flagged "inside").
  // Before the kept window the first two had a band invented at 6 387 and 7 139 cm-1; the third lost 4T1g(P) (rms 0.16).
  const settings: Array<[offset: number, slope: number, seed: number]> = [[0.0116, 0.0198, 1016], [0.012, 0.02, 7], [0.01, 0.018, 11]];
  it.each(settings)('offset %f, slope %f, seed %i: no band below the kept data, windows judged on them', (offset, slope, seed) => {
    const s = generateSpectrum(vanadium, WINDOWS['uv-vis-nir'], {
      digits: 3, noise: 0.0015, smooth: 5, offset, slope, scatter: 0.028, chargeTransfer: { edgeAbsorbance: 2.08, fwhm: 7880, epsilon: 2280 },
    }, 0.12, seed);
    const r = processSpectrum(parseSpectrumText(s.csv).spectra[0]!, { geometry: 'octahedral', concentration: 0.12 });
    // No band is invented below 4T2g, where the data were masked out or rise from the masked stretch.
    expect(r.bands.filter((b) => b.position < 10000).map((b) => Math.round(b.position))).toEqual([]);
    // The red end is masked as negative, so the data used start above the measured range's end.
    expect(r.masked[0]?.reason).toBe('negative');
    expect(r.keptRange[0]).toBeGreaterThan(r.range[0] + 2000);
    expect(r.keptRange[1]).toBe(r.range[1]);
    // No fitted component is centred where the data were masked out.
    for (const c of r.components) expect(c.position, `component at ${c.position.toFixed(0)}`).toBeGreaterThanOrEqual(r.keptRange[0]);
    // Each band's window is judged against the kept data, not the measured range.
    r.bands.forEach((b, k) => expect(b.window).toBe(bandWindow(r.components[k]!, r.keptRange)));
    // The three spin-allowed bands stay (within 700 cm-1: a fifth of their width).
    for (const p of [12490, 18714, 29106]) expect(r.bands.some((b) => Math.abs(b.position - p) < 700), `${p}`).toBe(true);
  });
});
