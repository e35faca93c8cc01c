/**
 * Band shapes of the validation corpus: the log-normal band in energy, the
 * asymmetric shape that measured absorption bands of complexes have (a
 * steeper low-energy side, a longer high-energy tail). Form of
 * D. B. Siano and D. E. Metzler, "Band shapes of the electronic spectra of
 * complex molecules", J. Chem. Phys. 51 (1969) 1856, written with the band's
 * maximum, its full width at half maximum and its skewness ρ:
 *
 *   f(ν) = exp(−(ln 2 / ln²ρ) · ln²(1 + (ν − ν₀)(ρ² − 1)/(ρ·H)))   for ν > ν₀ − ρH/(ρ² − 1),
 *   f(ν) = 0                                                          below,
 *
 * with ν₀ the maximum (cm-1), H the FWHM (cm-1), and ρ the ratio of the
 * high-energy half-width to the low-energy one (ρ > 1: tail to high energy;
 * ρ = 1 is the Gaussian). f(ν₀) = 1 and f = 1/2 at ν₀ + Hρ/(1+ρ) and
 * ν₀ − H/(1+ρ). Derived here from the definition (the half-width points
 * satisfy ln(1 + x/t) = ±ln ρ with t = ρH/(ρ² − 1)); generator.test.ts
 * checks these properties numerically.
 */

/** Skewness below which the band is taken as a Gaussian (the log-normal's limit). */
const GAUSSIAN_LIMIT = 1e-6;

/** Peak-normalised log-normal band at wavenumber `nu` (cm-1). */
export function logNormalBand(nu: number, maximum: number, fwhm: number, skew: number): number {
  if (Math.abs(skew - 1) < GAUSSIAN_LIMIT) {
    const z = (nu - maximum) / fwhm;
    return Math.exp(-4 * Math.LN2 * z * z);
  }
  const argument = 1 + ((nu - maximum) * (skew * skew - 1)) / (skew * fwhm);
  if (argument <= 0) return 0;
  const l = Math.log(argument);
  const ls = Math.log(skew);
  return Math.exp((-Math.LN2 / (ls * ls)) * l * l);
}

/** Half-maximum points [low, high] of a log-normal band, cm-1 (closed form, see the header). */
export function logNormalHalfPoints(maximum: number, fwhm: number, skew: number): [number, number] {
  return [maximum - fwhm / (1 + skew), maximum + (fwhm * skew) / (1 + skew)];
}
