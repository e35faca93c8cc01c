/**
 * Bands that ride on the charge-transfer edge: a shoulder (no maximum of its
 * own in the data) at a place where the modelled UV edge alone is stronger
 * than the band. Its position is traded against the edge's shape (a CT band
 * of unknown shape above the range, the heavy high-energy tails of
 * asymmetric d–d bands, a scattering baseline's bend), so it may be a d–d
 * band or a piece of the edge; the analysis leaves such a band unassigned
 * when no assignment of the ion can take it as d–d (src/analysis.ts).
 */
import { gaussianValue } from './gaussian.js';
import type { AbsorptionEdge } from './types.js';

export interface EdgeRidingBand {
  position: number;
  height: number;
  shoulder: boolean;
}

/** Indices of the bands that are shoulders lower than the edge beneath them (heights and edge in one signal unit). */
export function bandsOnEdge(bands: readonly EdgeRidingBand[], edge: AbsorptionEdge | null): number[] {
  if (edge === null) return [];
  return bands.flatMap((b, k) => (b.shoulder && gaussianValue(b.position, edge.position, edge.height, edge.fwhm) > b.height ? [k] : []));
}
