/**
 * The band shape: a Gaussian in energy with height h, centre x0 and full
 * width at half maximum w: h · exp(−4 ln2 (x − x0)² / w²). This is the
 * convention of ml-peak-shape-generator's 'gaussian', which the refinement
 * uses, so parameters pass between the two unchanged.
 */
export const FOUR_LN2 = 4 * Math.LN2;

export function gaussianValue(x: number, position: number, height: number, fwhm: number): number {
  const d = (x - position) / fwhm;
  return height * Math.exp(-FOUR_LN2 * d * d);
}

/** Adds a Gaussian to `target` at each x (in place) and returns target. */
export function xAddGaussian(x: Float64Array, target: Float64Array, position: number, height: number, fwhm: number): Float64Array {
  for (let i = 0; i < x.length; i++) target[i] = (target[i] as number) + gaussianValue(x[i] as number, position, height, fwhm);
  return target;
}
