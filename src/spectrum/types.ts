/**
 * Public types of fieldgap's spectrum stage: what the parsers return, what
 * processing returns, and the bands the fit consumes.
 *
 * Conventions: energies are wavenumbers in cm-1 (ν̃ = 10^7 / λ[nm]); every
 * array that processing returns is sorted by ascending wavenumber. Units
 * other than cm-1 appear only in `Spectrum` (as read) and in
 * `Band.wavelength` (nm, for display).
 */

/**
 * Unit of a spectrum's x axis. 'um' is the micrometre (µm is accepted when
 * reading headers and options).
 */
export const X_UNITS = ['nm', 'cm-1', 'eV', 'um'] as const;
export type XUnit = (typeof X_UNITS)[number];

/**
 * Unit of a spectrum's y axis.
 * - 'absorbance': decadic absorbance A (dimensionless);
 * - 'transmittance': T as a fraction 0..1;
 * - 'transmittance-percent': T in percent 0..100;
 * - 'epsilon': molar (decadic) absorptivity ε in L mol-1 cm-1.
 */
export const Y_UNITS = ['absorbance', 'transmittance', 'transmittance-percent', 'epsilon'] as const;
export type YUnit = (typeof Y_UNITS)[number];

/** One spectrum as read from a file, in the file's own units and order. */
export interface Spectrum {
  /** x values as read (ascending or descending, strictly monotonic). */
  x: Float64Array;
  /** y values as read, same length as x. */
  y: Float64Array;
  xUnit: XUnit;
  yUnit: YUnit;
  /** The column header, the JCAMP ##TITLE, or "y<column>" when the file has none. */
  name: string;
  /** 1-based index of the y column (1 = the first column after x); 1 for JCAMP. */
  column: number;
  /** Metadata found in the file: preamble "key: value" lines or JCAMP records. */
  metadata: Record<string, string>;
}

/** The result of reading one file's text. */
export interface ParsedFile {
  format: 'delimited' | 'jcamp';
  /** One spectrum per y column (only the selected one when `column` was given). */
  spectra: Spectrum[];
  /** Things the reader inferred or skipped (unit guesses, skipped lines and cells). */
  warnings: string[];
}

/** A detector change-over step removed from the data. */
export interface StepCorrection {
  /** Wavenumber of the jump, cm-1. */
  position: number;
  /** The same in nm. */
  wavelength: number;
  /** Size of the jump (value above it minus below it, in ascending wavenumber), signal unit; the low-energy side was shifted by it. */
  size: number;
  /** Size in noise deviations of the jump. */
  significance: number;
}

/** Why a region of the spectrum was left out of the band analysis. */
export type MaskReason = 'saturated' | 'detector-step' | 'negative';

/** A region left out of the fit, in cm-1 (from < to). */
export interface MaskedRegion {
  from: number;
  to: number;
  reason: MaskReason;
}

/** Kind of an absorption band. */
export type BandKind = 'd-d' | 'spin-forbidden' | 'charge-transfer';

/**
 * Where a band's maximum lies relative to the measured range. "Red" is the
 * low-energy (long-wavelength) end and "blue" the high-energy end, whatever
 * part of the spectrum was measured. 'near-…' when the maximum is inside but
 * less than half the band's FWHM from that end (the band's fall on the far
 * side is not measured down to half height), 'beyond-…' when the centre had
 * to be extrapolated from the flank inside the range.
 */
export type BandWindow = 'inside' | 'near-red-end' | 'near-blue-end' | 'beyond-red-end' | 'beyond-blue-end';

/** One absorption band, modelled as a Gaussian in energy. */
export interface Band {
  /**
   * Maximum of the band, cm-1: the top of the data the band describes (the
   * data less the baseline and the other bands), which on an asymmetric band
   * lies on the steep side of the Gaussian's centre; the centroid of the
   * fitted components of an unresolved multiplet whose top lies above it;
   * the Gaussian's centre for a shoulder or a band centred beyond the range.
   */
  position: number;
  /** The same position as a wavelength in nm (10^7 / position). */
  wavelength: number;
  /** Peak height above the baseline in the signal unit (absorbance, or ε when the file holds ε). */
  height: number;
  /** Molar absorptivity at the maximum, L mol-1 cm-1; null when no concentration is known. */
  epsilon: number | null;
  /** Full width at half maximum, cm-1. */
  fwhm: number;
  /** Integrated intensity of the Gaussian, signal unit × cm-1. */
  area: number;
  /** f = 4.32e-9 ∫ε dν̃; null when ε is unknown. */
  oscillatorStrength: number | null;
  kind: BandKind;
  /** One standard deviation of `position`, cm-1 (from the fit covariance). */
  positionUncertainty: number;
  /** True when the band shows no local maximum of its own in the fitted spectrum. */
  shoulder: boolean;
  /** Where the maximum lies relative to the data used: the measured range less masked end stretches (see BandWindow). */
  window: BandWindow;
  /** True when the centre lies within the measured range (window 'inside' or 'near-…'). */
  maximumInWindow: boolean;
}

/** A charge-transfer or ligand absorption edge whose maximum lies above the measured range. */
export interface AbsorptionEdge {
  /** Centre of the Gaussian whose low-energy tail models the edge, cm-1 (above the range). */
  position: number;
  /** Height of that Gaussian at its centre, signal unit (an extrapolation). */
  height: number;
  fwhm: number;
}

/** How the least-squares refinement went. */
export interface FitSummary {
  /** Number of grid points the fit used (masked points excluded). */
  points: number;
  /** Number of free parameters (bands, edge and baseline). */
  parameters: number;
  /** Root-mean-square residual, signal unit. */
  rms: number;
  /** Iterations of the last Levenberg–Marquardt run. */
  iterations: number;
  /** False when the last run stopped at its iteration limit (a warning says so too). */
  converged: boolean;
}

/** Everything processing a spectrum yields. */
export interface ProcessedSpectrum {
  /** Number of points of the input spectrum. */
  points: number;
  /** Measured range, [min, max] in cm-1. */
  range: [number, number];
  /**
   * The range of the data the bands were fitted to, [min, max] in cm-1: the
   * measured range less a masked stretch at either end (kept-window.ts).
   * Each band's window is judged against it.
   */
  keptRange: [number, number];
  /** Units of the input spectrum. */
  xUnit: XUnit;
  yUnit: YUnit;
  masked: MaskedRegion[];
  /** Uniform wavenumber grid, cm-1, ascending. */
  grid: Float64Array;
  /** The data on the grid in the signal unit (absorbance, or ε for ε input); NaN where masked. */
  signal: Float64Array;
  /** Fitted baseline (polynomial plus absorption edge) on the grid. */
  baseline: Float64Array;
  /** Fitted model (baseline plus all bands) on the grid. */
  model: Float64Array;
  /** The signal unit: 'absorbance', or 'epsilon' when the input was ε. */
  signalUnit: 'absorbance' | 'epsilon';
  bands: Band[];
  /** Each band's fitted Gaussian (centre, height, FWHM; cm-1 and signal unit), in the order of `bands`: the curves to draw. */
  components: Array<{ position: number; height: number; fwhm: number }>;
  edge: AbsorptionEdge | null;
  /** Noise standard deviation on the grid, signal unit. */
  noise: number;
  /** Rounding step of the values as read (0.01 for two decimals), signal unit; 0 when not rounded. */
  quantization: number;
  /** Detector steps removed from the data (listed in warnings too); empty when none or correction was off. */
  stepCorrections: StepCorrection[];
  fit: FitSummary;
  warnings: string[];
}
