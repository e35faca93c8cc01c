/**
 * A broad band that has taken up both a real d–d band and the curvature
 * beside it (a steep charge-transfer onset at the blue end) is not replaced
 * by the baseline wholesale: the band the data show restarts from its
 * candidate (fitBands.ts, broadBandsToBaseline). Before, the 3T1g(P) band of
 * Ni(II) at 390 nm vanished and the fit's rms was a quarter of the signal.
 *
 * The spectrum comes from the validation corpus generator (tests/accuracy/),
 * whose band positions are the project's own ligand-field engine: NOT an
 * outside check. Outside anchor of the band's place: 3T1g(P) of hexaaqua
 * Ni(II) near 25 300 cm-1 (found: a thesis chapter on Ni(II) spectra,
 * 123docz.net/trich-doan/2479124, docs/sources.md NI-AQUA-VN).
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { caseSpectrum, corpusCases } from '../accuracy/cases.js';

describe('a broad band over a real maximum restarts from it', () => {
  it('ni2-aqua/uvvis-smooth: both visible bands found and the model follows the data', () => {
    const c = corpusCases().find((k) => k.id === 'ni2-aqua/uvvis-smooth')!;
    const result = processSpectrum(parseSpectrumText(caseSpectrum(c).csv).spectra[0]!, { geometry: 'octahedral' });
    const near = (v: number) => result.bands.filter((b) => Math.abs(b.position - v) < 1000 && b.kind === 'd-d');
    expect(near(14389)).toHaveLength(1);
    expect(near(25706)).toHaveLength(1);
    const tallest = Math.max(...result.bands.map((b) => b.height));
    // rms was 31 % of the tallest band before (the band lost), 11 % now: the steep onset at 200 nm is still only roughly modelled.
    expect(result.fit.rms).toBeLessThan(0.15 * tallest);
  });
});
