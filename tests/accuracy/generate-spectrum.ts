/**
 * A corpus spectrum as an instrument would export it: absorbance against
 * wavelength (nm, 1 nm steps) over a window, with the distortions measured
 * data has. Deterministic: everything random comes from the case's seed.
 *
 * The absorbance at wavelength λ (ν̃ = 10^7/λ cm-1) is
 *
 *   A = c·l·Σ ε_i·f_i(ν̃)                        d–d and charge-transfer bands (log-normal, band-shape.ts)
 *     + offset + slope·(ν̃ − 20 000)/10 000        cell and solvent mismatch
 *     + scatter·(ν̃/25 000)^4                      Rayleigh-like scattering of a slightly turbid sample
 *     + step·[λ > at]                              a real detector change-over step (when the case has one)
 *     + noise                                       seeded Gaussian, optionally smoothed by the "instrument"
 *
 * then rounded to `digits` decimals, as instrument exports are.
 */
import { gaussianDeviates, mulberry32 } from '../../src/spectrum/random.js';
import { logNormalBand } from './band-shape.js';
import type { TruthBand } from './truth-bands.js';

/** A measured range: wavelengths fromNm..toNm in stepNm steps. */
export interface SpectralWindow {
  name: WindowName;
  fromNm: number;
  toNm: number;
  stepNm: number;
}

export type WindowName = 'visible' | 'uv-vis' | 'uv-vis-nir';

/**
 * The windows of the corpus (common practice): a visible-only diode-array or
 * teaching instrument (380–780 nm), a UV-vis double-beam instrument
 * (200–1100 nm), and a UV-vis-NIR instrument (250–2500 nm), all at 1 nm.
 */
export const WINDOWS: Readonly<Record<WindowName, SpectralWindow>> = {
  visible: { name: 'visible', fromNm: 380, toNm: 780, stepNm: 1 },
  'uv-vis': { name: 'uv-vis', fromNm: 200, toNm: 1100, stepNm: 1 },
  'uv-vis-nir': { name: 'uv-vis-nir', fromNm: 250, toNm: 2500, stepNm: 1 },
};

/** [low, high] wavenumber of a window, cm-1. */
export function windowRange(window: SpectralWindow): [number, number] {
  return [1e7 / window.toNm, 1e7 / window.fromNm];
}

export interface Distortions {
  /** Decimals of the exported absorbance: 2 (0.01) or 3 (0.001). */
  digits: 2 | 3;
  /** Standard deviation of the noise before rounding, absorbance; 0: noise-free. */
  noise: number;
  /** Moving-average points the instrument smooths with (odd; 1 = none). @default 1 */
  smooth?: number;
  /** Baseline offset, absorbance. */
  offset: number;
  /** Baseline slope, absorbance per 10 000 cm-1. */
  slope: number;
  /** Scattering absorbance at 25 000 cm-1 (∝ ν̃^4). */
  scatter: number;
  /** A real detector or lamp change-over step: `size` added at wavelengths above `atNm`. */
  step?: { atNm: number; size: number };
  /** Charge-transfer band above the window: its absorbance at the window's blue end, FWHM and ε. */
  chargeTransfer?: { edgeAbsorbance: number; fwhm: number; epsilon: number };
  /** Wavelengths listed from long to short, as scanning instruments do. @default false */
  descending?: boolean;
}

export interface CorpusSpectrum {
  /** nm, in file order. */
  wavelength: Float64Array;
  /** Absorbance, rounded to `digits`. */
  absorbance: Float64Array;
  /** All bands drawn, the charge-transfer band included. */
  bands: TruthBand[];
  /** CSV text: "Wavelength (nm),Absorbance" and one row per point. */
  csv: string;
}

/**
 * The charge-transfer band whose tail gives `edgeAbsorbance` at the window's
 * blue end: placed above the window so that its peak (ε·c·l) falls off to
 * that value there. ε ≥ 1000 as charge-transfer bands are (common practice).
 */
export function chargeTransferBand(window: SpectralWindow, ct: NonNullable<Distortions['chargeTransfer']>, concentration: number, pathLength: number): TruthBand {
  const edge = 1e7 / window.fromNm;
  const peak = ct.epsilon * concentration * pathLength;
  const ratio = Math.max(peak / ct.edgeAbsorbance, 1.0001);
  // Gaussian tail: A_edge = A_peak·exp(−4 ln2 (Δ/H)^2).
  const offset = ct.fwhm * Math.sqrt(Math.log(ratio) / (4 * Math.LN2));
  return {
    label: 'CT', level: 'CT', centre: edge + offset, position: edge + offset, fwhm: ct.fwhm, skew: 1,
    epsilon: ct.epsilon, kind: 'charge-transfer', weak: false,
  };
}

/** Builds the spectrum of `bands` (ε) at `concentration` (mol/L) and `pathLength` (cm) over `window`. */
export function generateSpectrum(
  bands: readonly TruthBand[], window: SpectralWindow, distortions: Distortions, concentration: number, seed: number, pathLength = 1,
): CorpusSpectrum {
  const all = [...bands];
  if (distortions.chargeTransfer) all.push(chargeTransferBand(window, distortions.chargeTransfer, concentration, pathLength));
  const n = Math.round((window.toNm - window.fromNm) / window.stepNm) + 1;
  const wavelength = new Float64Array(n);
  const exact = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const nm = window.fromNm + i * window.stepNm;
    const nu = 1e7 / nm;
    let a = distortions.offset + (distortions.slope * (nu - 20_000)) / 10_000 + distortions.scatter * (nu / 25_000) ** 4;
    for (const band of all) a += concentration * pathLength * band.epsilon * logNormalBand(nu, band.position, band.fwhm, band.skew);
    if (distortions.step && nm > distortions.step.atNm) a += distortions.step.size;
    wavelength[i] = nm;
    exact[i] = a;
  }
  const noisy = addNoise(exact, distortions.noise, distortions.smooth ?? 1, seed);
  const scale = 10 ** distortions.digits;
  const absorbance = noisy.map((v) => Math.round(v * scale) / scale);
  if (distortions.descending) {
    wavelength.reverse();
    absorbance.reverse();
  }
  return { wavelength, absorbance, bands: all, csv: toCsv(wavelength, absorbance, distortions.digits) };
}

/** Seeded Gaussian noise, then a centred moving average of `smooth` points (1: none). */
function addNoise(y: Float64Array, sd: number, smooth: number, seed: number): Float64Array {
  if (sd === 0) return Float64Array.from(y);
  const normal = gaussianDeviates(mulberry32(seed));
  const noise = Float64Array.from(y, () => sd * normal());
  const half = Math.floor(smooth / 2);
  return Float64Array.from(y, (v, i) => {
    let sum = 0;
    let count = 0;
    for (let k = Math.max(0, i - half); k <= Math.min(y.length - 1, i + half); k++) {
      sum += noise[k]!;
      count++;
    }
    // Smoothing lowers the noise by √count; scale it back so `sd` stays the exported noise level.
    return v + (sum / count) * Math.sqrt(count);
  });
}

function toCsv(wavelength: Float64Array, absorbance: Float64Array, digits: number): string {
  const rows = ['Wavelength (nm),Absorbance'];
  for (let i = 0; i < wavelength.length; i++) rows.push(`${wavelength[i]},${absorbance[i]!.toFixed(digits)}`);
  return `${rows.join('\n')}\n`;
}
