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
  return obs;
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

/** The mean of Jahn–Teller components (weighted by 1/σ² when the fit is weighted), as one observation. */
export function averageObservations(list: readonly Observation[], weighted: boolean): Observation {
  const w = list.map((o) => (weighted ? 1 / o.sigma ** 2 : 1));
  const total = w.reduce((s, v) => s + v, 0);
  const position = list.reduce((s, o, i) => s + w[i]! * o.position, 0) / total;
  // σ of a (weighted) mean of independent positions.
  const sigma = Math.sqrt(list.reduce((s, o, i) => s + (w[i]! * o.sigma) ** 2, 0)) / total;
  const averaged: Observation = { position, sigma, bands: list.flatMap((o) => o.bands), flags: [...new Set(list.flatMap((o) => o.flags))] };
  // The band's intensity is that of its strongest component (for the intensity term of the score).
  const eps = list.map((o) => o.epsilon).filter((e): e is number => e !== undefined);
  if (eps.length > 0) averaged.epsilon = Math.max(...eps);
  return averaged;
}
