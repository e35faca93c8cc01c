/**
 * Classifying bands as spin-allowed d–d, spin-forbidden, or charge-transfer
 * (or ligand) from molar absorptivity and width. Thresholds are common
 * practice (e.g. Lever, Inorganic Electronic Spectroscopy, 1984):
 * octahedral spin-allowed d–d ε ≈ 1–100, tetrahedral ≈ 100–1000;
 * spin-forbidden ε below about 1, or narrow (FWHM < ~1000 cm-1, the
 * intraconfigurational spin-flip bands); charge transfer ε above about
 * 1000, or very broad and strong at the UV edge.
 */
import type { BandKind } from './types.js';

export interface ClassificationThresholds {
  /** ε at or above which a band is charge transfer, L mol-1 cm-1. @default 1000 */
  chargeTransferEpsilon: number;
  /** ε below which a band is spin-forbidden. @default 1 */
  spinForbiddenEpsilon: number;
  /** Bands narrower than this (cm-1) and weaker than `spinAllowedMaxEpsilon` are spin-forbidden. @default 1000 */
  narrowFwhm: number;
  /** Upper end of spin-allowed d–d ε: 100 octahedral, 1000 tetrahedral (and when no geometry is given). */
  spinAllowedMaxEpsilon: number;
  /** Bands at or above this energy (cm-1) that are very broad (≥ broadFwhm) and strong are charge transfer. @default 25000 */
  uvEdge: number;
  /** "Very broad" at the UV edge, cm-1. @default 5000 */
  broadFwhm: number;
  /** Without ε: a UV band this many times stronger than every visible band is charge transfer. @default 10 */
  relativeChargeTransfer: number;
  /** Without ε: a narrow band weaker than this fraction of the strongest broad band is spin-forbidden. @default 0.5 */
  relativeSpinForbidden: number;
}

export function defaultThresholds(geometry?: 'octahedral' | 'tetrahedral'): ClassificationThresholds {
  return {
    chargeTransferEpsilon: 1000,
    spinForbiddenEpsilon: 1,
    narrowFwhm: 1000,
    spinAllowedMaxEpsilon: geometry === 'octahedral' ? 100 : 1000,
    uvEdge: 25000,
    broadFwhm: 5000,
    relativeChargeTransfer: 10,
    relativeSpinForbidden: 0.5,
  };
}

export interface ClassifiableBand {
  position: number;
  fwhm: number;
  height: number;
  epsilon: number | null;
}

/** Kind of a band whose ε is known. */
export function bandKindFromEpsilon(band: ClassifiableBand & { epsilon: number }, t: ClassificationThresholds): BandKind {
  const { epsilon, fwhm, position } = band;
  if (epsilon >= t.chargeTransferEpsilon) return 'charge-transfer';
  if (position >= t.uvEdge && fwhm >= t.broadFwhm && epsilon >= 0.2 * t.chargeTransferEpsilon) return 'charge-transfer';
  if (epsilon < t.spinForbiddenEpsilon) return 'spin-forbidden';
  if (fwhm < t.narrowFwhm && epsilon < t.spinAllowedMaxEpsilon) return 'spin-forbidden';
  return 'd-d';
}

/**
 * Kinds of all bands of a spectrum: by ε when every band has one, else by
 * height relative to the others and by width (`relative` is then true and
 * the caller should say so).
 */
export function bandsClassify(bands: ClassifiableBand[], t: ClassificationThresholds): { kinds: BandKind[]; relative: boolean } {
  if (bands.every((b) => b.epsilon !== null)) {
    return { kinds: bands.map((b) => bandKindFromEpsilon(b as ClassifiableBand & { epsilon: number }, t)), relative: false };
  }
  const visibleMax = Math.max(0, ...bands.filter((b) => b.position < t.uvEdge).map((b) => b.height));
  const broadMax = Math.max(0, ...bands.filter((b) => b.fwhm >= t.narrowFwhm && b.position < t.uvEdge).map((b) => b.height));
  const kinds = bands.map((b): BandKind => {
    if (b.position >= t.uvEdge && b.fwhm >= 0.8 * t.broadFwhm && visibleMax > 0 && b.height >= t.relativeChargeTransfer * visibleMax) return 'charge-transfer';
    if (b.fwhm < t.narrowFwhm && broadMax > 0 && b.height < t.relativeSpinForbidden * broadMax) return 'spin-forbidden';
    return 'd-d';
  });
  return { kinds, relative: true };
}
