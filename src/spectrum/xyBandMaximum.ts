/**
 * The maximum of one band as measured: the vertex of a least-squares
 * parabola through the top of the band's own data (the data less the
 * baseline and the other fitted bands), cm-1.
 *
 * Why: bands are fitted as Gaussians, but measured d–d bands are
 * asymmetric (a steeper low-energy side, a longer high-energy tail;
 * skewness 1.05–1.3). A Gaussian's centre then lies toward the tail, by
 * about FWHM·(ρ − 1)/(2(ρ + 1)) for a log-normal band of skewness ρ and
 * more when the fit follows the tails, while the transition energy the
 * ligand-field fit needs is the band's maximum (common practice). The top of
 * a band is close to a parabola over its upper part, whatever its skew, so
 * the vertex of a parabola over ±FWHM/4 around the highest point finds the
 * maximum without assuming a band shape.
 *
 * Only a maximum on the low-energy side of the centre is taken: that is
 * where the asymmetry of a d–d band puts it (Siano & Metzler, J. Chem.
 * Phys. 51 (1969) 1856: the high-energy tail is the longer). A top on the
 * high-energy side means unresolved components of unequal height (a
 * Jahn–Teller pair, a spin–orbit shoulder): their centroid, which the
 * Gaussian's centre approximates, is then the better transition energy.
 */
import { xPolynomialScale, xyPolynomialFit } from './xyPolynomial.js';

/** Fewest points a parabola is fitted through; with fewer the Gaussian centre stands. */
const MIN_POINTS = 5;

/**
 * Vertex of the parabola through own(x) within ±fwhm/4 of its highest
 * point within ±fwhm/2 of `centre`; null when there are too few points, the
 * parabola opens upward, or its vertex lies above the centre or more than
 * fwhm/2 below it (keep the Gaussian's centre). `x` ascending, cm-1;
 * `own` the band's own signal at each x.
 */
export function xyBandMaximum(x: Float64Array, own: Float64Array, centre: number, fwhm: number): number | null {
  let top = -1;
  for (let i = 0; i < x.length; i++) {
    const v = x[i] as number;
    if (Math.abs(v - centre) > fwhm / 2) continue;
    if (top < 0 || (own[i] as number) > (own[top] as number)) top = i;
  }
  if (top < 0) return null;
  const peak = x[top] as number;
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 0; i < x.length; i++) {
    if (Math.abs((x[i] as number) - peak) <= fwhm / 4) {
      xs.push(x[i] as number);
      ys.push(own[i] as number);
    }
  }
  if (xs.length < MIN_POINTS) return null;
  const fx = Float64Array.from(xs);
  const scale = xPolynomialScale(fx);
  const [, c1, c2] = xyPolynomialFit(fx, Float64Array.from(ys), 2, scale) as unknown as [number, number, number];
  if (!(c2 < 0)) return null;
  const vertex = scale.centre - (c1 / (2 * c2)) * scale.halfWidth;
  // Asymmetry puts the maximum on the steep, low-energy side of the centre; a top above the centre is unresolved components.
  return vertex <= centre && centre - vertex <= fwhm / 2 && vertex >= (x[0] as number) ? vertex : null;
}
