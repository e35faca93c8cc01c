/**
 * Test helper: spectra that look like what a UV-vis instrument records,
 * not like the fit's own model. Bands are asymmetric in energy (a split
 * Gaussian: a wider high-energy side, as the vibronic envelope of a d–d band
 * has), may overlap, and carry Jahn–Teller or spin–orbit components; sharp
 * spin-forbidden features, charge-transfer tails from above the range and a
 * Rayleigh-like scattering baseline (∝ ν̃⁴, i.e. 1/λ⁴) can be added. The
 * values are written as an instrument exports them: wavelength in nm at
 * a fixed step and absorbance rounded to a fixed number of decimals, with
 * no noise of its own (instrument software smooths; the rounding is the
 * noise).
 *
 * The band lists the tests build from this are published band positions
 * (each test names its source); the shapes and widths are invented.
 */

/** One band: a split Gaussian in energy. */
export interface RealisticBand {
  /** Maximum, cm-1. */
  position: number;
  /** Peak ε, L mol-1 cm-1. */
  epsilon: number;
  /** Full width at half maximum, cm-1 (sum of the two half widths). */
  fwhm: number;
  /** High-energy half width / low-energy half width. @default 1.3 */
  skew?: number;
}

export interface RealisticOptions {
  bands: RealisticBand[];
  /** mol/L. */
  concentration: number;
  /** @default 380 */
  fromNm?: number;
  /** @default 780 */
  toNm?: number;
  /** @default 1 */
  stepNm?: number;
  /** Decimals of the absorbance column. @default 2 */
  decimals?: number;
  /** Scattering absorbance at 400 nm (∝ 1/λ⁴). @default 0 */
  scatterAt400?: number;
  /** Constant offset (cell, solvent). @default 0 */
  offset?: number;
  /** Charge-transfer band above the range: centre cm-1, FWHM, peak ε. @default none */
  chargeTransfer?: { position: number; fwhm: number; epsilon: number };
  /** Wavelengths from long to short, as many instruments scan. @default true */
  descending?: boolean;
}

/** Split-Gaussian value at ν: half widths lo (below the maximum) and hi (above). */
export function splitGaussian(nu: number, band: RealisticBand): number {
  const skew = band.skew ?? 1.3;
  const lo = band.fwhm / (1 + skew);
  const hi = band.fwhm - lo;
  const half = nu < band.position ? lo : hi;
  const t = (nu - band.position) / half;
  return band.epsilon * Math.exp(-Math.LN2 * t * t);
}

/** Absorbance at wavelength nm (unrounded). */
export function realisticAbsorbance(nm: number, o: RealisticOptions): number {
  const nu = 1e7 / nm;
  let epsilon = 0;
  for (const b of o.bands) epsilon += splitGaussian(nu, b);
  if (o.chargeTransfer !== undefined) {
    const { position, fwhm, epsilon: e } = o.chargeTransfer;
    epsilon += e * Math.exp(-4 * Math.LN2 * ((nu - position) / fwhm) ** 2);
  }
  return (o.offset ?? 0) + (o.scatterAt400 ?? 0) * (400 / nm) ** 4 + epsilon * o.concentration;
}

/** The spectrum as CSV text, "nm,absorbance" with a header, as an instrument exports it. */
export function realisticCsv(o: RealisticOptions): string {
  const { fromNm = 380, toNm = 780, stepNm = 1, decimals = 2, descending = true } = o;
  const n = Math.round((toNm - fromNm) / stepNm) + 1;
  const lines = ['wavelength_nm,absorbance'];
  for (let k = 0; k < n; k++) {
    const nm = descending ? toNm - k * stepNm : fromNm + k * stepNm;
    lines.push(`${nm.toFixed(stepNm < 1 ? 1 : 0)},${realisticAbsorbance(nm, o).toFixed(decimals)}`);
  }
  return `${lines.join('\n')}\n`;
}
