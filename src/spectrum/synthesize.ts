/**
 * Synthetic UV-vis-NIR absorbance spectra from known bands, for tests,
 * benchmarks and invented demo data: Gaussian bands in energy sampled on a
 * wavelength grid, a sloping baseline, a UV absorption edge, optional
 * detector step and saturation ceiling, and seeded Gaussian noise.
 */
import { invalidArgument } from '../errors.js';
import { gaussianValue } from './gaussian.js';
import { gaussianDeviates, mulberry32 } from './random.js';

export interface SyntheticBand {
  /** Centre, cm-1. */
  position: number;
  /** Full width at half maximum, cm-1. */
  fwhm: number;
  /** Peak absorbance; or give `epsilon` with the spectrum's concentration. */
  height?: number;
  /** Peak ε, L mol-1 cm-1 (needs `concentration`). */
  epsilon?: number;
}

export interface SynthesizeOptions {
  bands: SyntheticBand[];
  /** Shortest wavelength, nm. @default 300 */
  fromNm?: number;
  /** Longest wavelength, nm. @default 1100 */
  toNm?: number;
  /** Wavelength step, nm. @default 1 */
  stepNm?: number;
  /** List wavelengths from long to short, as many instruments scan. @default false */
  descending?: boolean;
  /** Baseline absorbance at 10 000 cm-1. @default 0 */
  baselineOffset?: number;
  /** Baseline slope, absorbance per 10 000 cm-1. @default 0 */
  baselineSlope?: number;
  /** UV edge: a strong Gaussian centred above the range, whose tail enters it. @default none */
  edge?: { position: number; fwhm: number; height: number };
  /** A detector change-over step: absorbance added at wavelengths above `atNm`. @default none */
  detectorStep?: { atNm: number; size: number };
  /** Instrument ceiling: absorbance above it reads as the ceiling plus noise. @default none */
  ceiling?: number;
  /** Standard deviation of the noise, absorbance. @default 0 */
  noise?: number;
  /** Seed of the noise generator. @default 1 */
  seed?: number;
  /** mol/L, to turn band ε into absorbance. @default none */
  concentration?: number;
  /** cm. @default 1 */
  pathLength?: number;
}

export interface SyntheticSpectrum {
  /** nm, in scan order. */
  wavelength: Float64Array;
  absorbance: Float64Array;
}

export function synthesizeSpectrum(options: SynthesizeOptions): SyntheticSpectrum {
  const {
    bands, fromNm = 300, toNm = 1100, stepNm = 1, descending = false, baselineOffset = 0, baselineSlope = 0,
    noise = 0, seed = 1, pathLength = 1,
  } = options;
  if (!(toNm > fromNm) || !(fromNm > 0) || !(stepNm > 0)) {
    throw invalidArgument('fromNm', `expected 0 < fromNm < toNm and stepNm > 0, got ${fromNm}, ${toNm}, ${stepNm}`);
  }
  const heights = bands.map((b, i) => bandHeight(b, i, options.concentration, pathLength));
  const n = Math.floor((toNm - fromNm) / stepNm + 1e-9) + 1;
  const wavelength = new Float64Array(n);
  const absorbance = new Float64Array(n);
  const normal = gaussianDeviates(mulberry32(seed));
  for (let k = 0; k < n; k++) {
    const nm = descending ? toNm - k * stepNm : fromNm + k * stepNm;
    const nu = 1e7 / nm;
    let a = baselineOffset + (baselineSlope * (nu - 10000)) / 10000;
    for (let b = 0; b < bands.length; b++) a += gaussianValue(nu, (bands[b] as SyntheticBand).position, heights[b] as number, (bands[b] as SyntheticBand).fwhm);
    if (options.edge !== undefined) a += gaussianValue(nu, options.edge.position, options.edge.height, options.edge.fwhm);
    if (options.detectorStep !== undefined && nm > options.detectorStep.atNm) a += options.detectorStep.size;
    if (options.ceiling !== undefined && a > options.ceiling) a = options.ceiling;
    wavelength[k] = nm;
    absorbance[k] = a + noise * normal();
  }
  return { wavelength, absorbance };
}

function bandHeight(band: SyntheticBand, index: number, concentration: number | undefined, pathLength: number): number {
  if (band.height !== undefined) return band.height;
  if (band.epsilon !== undefined && concentration !== undefined) return band.epsilon * concentration * pathLength;
  throw invalidArgument(`bands[${index}]`, `bands[${index}]: give a height, or an epsilon and the concentration`);
}
