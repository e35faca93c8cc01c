/**
 * A found band as the ligand-field fit takes it: one rule for the analysis
 * (src/analysis.ts) and the page's refit request (web/state.ts).
 */
import type { BandFlag, BandInput } from './fit/bands.js';
import { defaultBandSigma } from './fit/observations.js';
import { DEFAULT_C_OVER_B } from './fit/settings.js';
import type { Band, BandKind } from './spectrum/types.js';

/** The fit's flags of a band: its kind (charge-transfer, spin-forbidden) and whether it is a shoulder. */
export function bandFlagsOf(band: { kind: BandKind; shoulder: boolean }): BandFlag[] {
  const flags: BandFlag[] = [];
  if (band.kind === 'charge-transfer') flags.push('charge-transfer');
  if (band.kind === 'spin-forbidden') flags.push('spin-forbidden');
  if (band.shoulder) flags.push('shoulder');
  return flags;
}

/** A band's kind from its fit flags, the inverse of bandFlagsOf (charge-transfer wins over spin-forbidden, as the fit refuses both). */
export function bandKindOfFlags(flags: readonly BandFlag[]): BandKind {
  if (flags.includes('charge-transfer')) return 'charge-transfer';
  return flags.includes('spin-forbidden') ? 'spin-forbidden' : 'd-d';
}

/**
 * Standard uncertainty of a band maximum as a transition energy, cm-1: the
 * spectral fit's σ of the position combined in quadrature with the fit's
 * default σ for a band maximum (max(100 cm-1, 1 %)), because the maximum of
 * a broad band is not the vertical transition energy and that model error
 * dominates on clean data.
 */
export function bandFitSigma(position: number, positionUncertainty: number): number {
  return Math.hypot(positionUncertainty, defaultBandSigma(position));
}

/** A found band (cm-1) as a fit input: position, σ (bandFitSigma), width, area, ε when known, flags. */
export function bandToFitInput(band: Band): BandInput {
  const input: BandInput = {
    position: band.position,
    uncertainty: bandFitSigma(band.position, band.positionUncertainty),
    width: band.fwhm,
    flags: bandFlagsOf(band),
  };
  if (band.epsilon !== null) input.epsilon = band.epsilon;
  // The area weights the components of a split band (their intensity-weighted centroid, src/fit/observations.ts).
  if (Number.isFinite(band.area) && band.area > 0) input.area = band.area;
  return input;
}

/**
 * The C/B a fit stands for: its fitted or fixed ratio, else C/B of its
 * values, else the fit's default DEFAULT_C_OVER_B (the ratio the analysis
 * uses when no free-ion C0/B0 is known). Used to draw the fit's
 * Tanabe–Sugano diagram.
 */
export function cOverBOfFit(fit: { cOverB?: number | null; b: number | null; c: number | null }): number {
  if (fit.cOverB !== null && fit.cOverB !== undefined) return fit.cOverB;
  return fit.b !== null && fit.c !== null && fit.b > 0 ? fit.c / fit.b : DEFAULT_C_OVER_B;
}
