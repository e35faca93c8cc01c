/**
 * From checked bands to the observations a fit uses, and their weights.
 *
 * Charge-transfer bands are set aside. The others are d–d bands: those
 * flagged spin-forbidden, and the rest ("primary"), each sorted by energy.
 * Weights: when any d–d band carries an uncertainty the fit is weighted by
 * 1/σ², a band without one taking the default σ = max(100 cm-1, 1% of its
 * position) (a band maximum read off a broad d–d band is rarely better); when
 * none does the fit is unweighted. The same default σ gives the uncertainty
 * of an exactly determined fit.
 */
import type { ObservedBand } from './bands.js';

export interface Observation {
  position: number;
  /** σ used for weights and exact-fit uncertainties: the band's own or the default. */
  sigma: number;
  /** Input indices of the band(s): two or three for an averaged Jahn–Teller pair. */
  bands: number[];
  flags: ObservedBand['flags'];
  width?: number;
  /** Molar absorption coefficient at the maximum, L mol-1 cm-1, if given. */
  epsilon?: number;
  /**
   * Integrated intensity in the list's own unit (bandIntensity): the band's
   * area, else ε·width; undefined when neither is known.
   */
  intensity?: number;
}

export interface SortedObservations {
  primary: Observation[];
  flagged: Observation[];
  chargeTransfer: ObservedBand[];
  weighted: boolean;
}

export function defaultBandSigma(position: number): number {
  return Math.max(100, 0.01 * position);
}

function observationOf(band: ObservedBand): Observation {
  const obs: Observation = {
    position: band.position,
    sigma: band.uncertainty ?? defaultBandSigma(band.position),
    bands: [band.index],
    flags: band.flags,
  };
  if (band.width !== undefined) obs.width = band.width;
  if (band.epsilon !== undefined) obs.epsilon = band.epsilon;
  const intensity = bandIntensity(band);
  if (intensity !== undefined) obs.intensity = intensity;
  return obs;
}

/**
 * A band's integrated intensity, for weighting the components of a split
 * band: its area when given, else ε·FWHM (the area of a band of that height
 * and width, up to a shape factor shared by all bands), else undefined. The
 * unit is the list's own (only ratios are used), so one list must not mix
 * areas and ε·width: the area is used only when every band of the average
 * has one (intensityWeights).
 */
export function bandIntensity(band: { area?: number; epsilon?: number; width?: number }): number | undefined {
  if (band.area !== undefined && band.area > 0) return band.area;
  if (band.epsilon !== undefined && band.width !== undefined && band.epsilon > 0) return band.epsilon * band.width;
  return undefined;
}

export function sortObservations(bands: readonly ObservedBand[]): SortedObservations {
  const byEnergy = (a: Observation, b: Observation) => a.position - b.position;
  const dd = bands.filter((b) => !b.flags.includes('charge-transfer'));
  return {
    primary: dd.filter((b) => !b.flags.includes('spin-forbidden')).map(observationOf).sort(byEnergy),
    flagged: dd.filter((b) => b.flags.includes('spin-forbidden')).map(observationOf).sort(byEnergy),
    chargeTransfer: bands.filter((b) => b.flags.includes('charge-transfer')),
    weighted: dd.some((b) => b.uncertainty !== undefined),
  };
}

/**
 * Weights of the components of one split band: their integrated
 * intensities when every component has one, else equal weights (nothing
 * says which component carries more of the transition).
 */
export function intensityWeights(list: readonly Observation[]): number[] {
  const intensities = list.map((o) => o.intensity);
  if (intensities.every((v): v is number => v !== undefined && v > 0)) return intensities;
  return list.map(() => 1);
}

/**
 * Weights of a close pair that may be one band (reductions.ts): 1/σ² when
 * the fit is weighted, else equal. Such a pair is either a split band or one
 * asymmetric band that the band fit described by two overlapping
 * components, a main one and a poorly placed shoulder on its tail; for the
 * latter the maximum, not the first moment, is the transition energy (the
 * first moment of a skewed band lies toward its tail), and the better
 * placed component carries it. On the validation corpus the two choices
 * explain as many cases, each failing a different few; the precision
 * weights stay for pairs, and the intensity-weighted centroid is used where
 * the physics says the band is split (one transition, several bands:
 * candidates.ts).
 */
export function precisionWeights(list: readonly Observation[], weighted: boolean): number[] {
  return list.map((o) => (weighted ? 1 / o.sigma ** 2 : 1));
}

/**
 * The components of one split band (Jahn–Teller or spin–orbit components,
 * or a maximum with its shoulder) as one observation at their
 * intensity-weighted centroid, Σ Iᵢ·νᵢ / Σ Iᵢ with Iᵢ the integrated
 * intensity (area, else ε·width; equal weights when a component has none).
 *
 * Why the centroid: a distortion or spin–orbit coupling acts on a degenerate
 * cubic level as a perturbation that is traceless over it to first order (a
 * tetragonal Ds, Dt field or ζ l·s shifts its components but not their
 * degeneracy-weighted mean: the barycentre rule), and each component's
 * intensity is, to the same order, proportional to its share of the
 * degeneracy; so the first moment of the split band is the energy of the
 * unsplit cubic transition, which is what the cubic fit needs (common
 * practice). The plain mean of the two maxima is not: a weak low component
 * 3 000 cm-1 below a strong one pulls it 1 500 cm-1 down instead of about
 * 1 000.
 *
 * `w` replaces the intensity weights where a caller knows better
 * (precisionWeights). σ: that of the weighted mean of independent
 * positions. ε: that of the strongest component (the band's height, for the
 * intensity term of the score); the intensity is the sum.
 */
export function averageObservations(list: readonly Observation[], w: readonly number[] = intensityWeights(list)): Observation {
  const total = w.reduce((s, v) => s + v, 0);
  const position = list.reduce((s, o, i) => s + w[i]! * o.position, 0) / total;
  // σ of a weighted mean of independent positions.
  const sigma = Math.sqrt(list.reduce((s, o, i) => s + (w[i]! * o.sigma) ** 2, 0)) / total;
  const averaged: Observation = { position, sigma, bands: list.flatMap((o) => o.bands), flags: [...new Set(list.flatMap((o) => o.flags))] };
  const eps = list.map((o) => o.epsilon).filter((e): e is number => e !== undefined);
  if (eps.length > 0) averaged.epsilon = Math.max(...eps);
  const intensities = list.map((o) => o.intensity);
  if (intensities.every((v): v is number => v !== undefined)) averaged.intensity = intensities.reduce((s, v) => s + v, 0);
  return averaged;
}
