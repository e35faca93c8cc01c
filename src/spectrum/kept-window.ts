/**
 * The window of the data actually used: the measured range, less a masked
 * stretch at either end. A band's window flag (inside, near-…, beyond-…) is
 * judged against it, since a band whose centre lies in a masked end stretch
 * was no more measured than one beyond the range.
 *
 * Whether a band may be centred beyond the kept red (low-energy) end: where
 * the measured range ends there, yes (the broad Cu(II) band beyond 780 nm),
 * and where the stretch beyond is masked as saturated (too much absorbance:
 * a band continues there); where it is masked as negative absorbance or
 * around a detector step, no: the data there were read and show no band
 * maximum (negative absorbance is a bad blank or a baseline below zero, not
 * absorption), so a band centred there would be one the data do not have
 * (tests/accuracy/, v2-aqua/nir: a band invented at 7 548 cm-1 in a masked
 * negative stretch at the red end).
 */
import type { MaskedRegion, MaskReason } from './types.js';

export interface KeptWindow {
  /** [min, max] of the kept data, cm-1: the measured range's end where no masked stretch reaches it. */
  window: [number, number];
  /** Why the stretch at each end was masked, or null when the kept data reach that end of the range. */
  lowEndMask: MaskReason | null;
  highEndMask: MaskReason | null;
  /** Whether a band's centre may lie below the kept red end (see the file's docstring). */
  redEndOpen: boolean;
}

/**
 * `range` the measured [min, max] (cm-1), `masked` the masked regions in
 * ascending cm-1 (xyMaskedRegions: a region at an end starts or stops
 * exactly at it), `kept` the ascending x of the data the fit uses (at least
 * one point).
 */
export function keptWindow(range: [number, number], masked: readonly MaskedRegion[], kept: Float64Array): KeptWindow {
  const low = masked.find((r) => r.from <= range[0])?.reason ?? null;
  const high = masked.find((r) => r.to >= range[1])?.reason ?? null;
  return {
    window: [low === null ? range[0] : kept[0] as number, high === null ? range[1] : kept[kept.length - 1] as number],
    lowEndMask: low,
    highEndMask: high,
    redEndOpen: low === null || low === 'saturated',
  };
}
