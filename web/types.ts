/**
 * The JSON shapes the page reads from the fieldgap service (/api/v1).
 * Energies and positions are in cm-1; epsilon in L mol-1 cm-1; moments in μB.
 * Fields the page does not need are left out; everything it reads but may be
 * missing in an older or newer service is optional.
 */

// The core's own names for these shapes (type-only imports: nothing of src/ reaches the bundle).
import type { Diagram, DiagramLine, Geometry } from '../src/ligand-field/types.js';
import type { BandKind, XUnit } from '../src/spectrum/types.js';
import type { BandFlag } from '../src/fit/bands.js';
import type { ErrorCode } from '../src/errors.js';
import type { AssignedBand, FitResult as CoreFit, Alternative as CoreAlternative } from '../src/fit/types.js';
import type { FitSummary } from '../src/library/types.js';
import type { FileRecordEntry, NotSavedSpectrum } from '../src/library/store-file.js';
import type { TetragonalFitResult } from '../src/fit-tetragonal/types.js';
import type { RankedEntry, Ranking } from '../src/series/types.js';

export type { BandFlag, BandKind, Diagram, DiagramLine, Geometry, XUnit };
/** POST /fit with symmetry "tetragonal": the core's own result (what `fit --symmetry tetragonal --json` prints). */
export type { TetragonalFitResult };

export interface ApiErrorBody {
  /** The service's ErrorCode, or the page's own 'network' / 'http' when no service answer came. */
  code: ErrorCode | 'network' | 'http' | (string & {});
  message: string;
  path: string;
}

export interface MaskedRange {
  from: number;
  to: number;
  reason: string;
}

export interface SpectrumSummary {
  points: number;
  /** [min, max] in cm-1. */
  range: [number, number];
  xUnit: string;
  yUnit: string;
  masked: MaskedRange[];
  /** 'epsilon' (L mol-1 cm-1) when a concentration was given, else 'absorbance'. */
  signalUnit?: 'absorbance' | 'epsilon';
  noise?: number;
  /** The y column analysed (1-based). */
  column?: number;
  /** Every spectrum of a file that holds more than one (its y columns). */
  columns?: Array<{ column: number; name: string }>;
}

export interface Band {
  /** cm-1. */
  position: number;
  /** nm. */
  wavelength?: number;
  height?: number;
  /** L mol-1 cm-1, when a concentration was given. */
  epsilon?: number | null;
  /** cm-1. */
  fwhm?: number;
  area?: number;
  oscillatorStrength?: number | null;
  kind: BandKind;
  /** One standard deviation of the position from the spectral fit, cm-1. */
  positionUncertainty?: number;
  /** cm-1: how well the position is known (older services). */
  uncertainty?: number;
  shoulder?: boolean;
  flags?: BandFlag[];
  /** Where the maximum lies relative to the measured range (red = low-energy end). */
  window?: 'inside' | 'near-red-end' | 'near-blue-end' | 'beyond-red-end' | 'beyond-blue-end';
  maximumInWindow?: boolean;
}

/**
 * An assignment row as the page reads it: the core's AssignedBand
 * (src/fit/types.ts), with what an alternative's rows or an older service may
 * lack optional. observed and calculated in cm-1; `bands` two for a split
 * pair read at their mean.
 */
export type Assignment = Pick<AssignedBand, 'observed' | 'calculated' | 'term'>
  & Partial<Pick<AssignedBand, 'parent' | 'label' | 'bands' | 'spinAllowed' | 'multiplicity'>>;

export interface PredictedLevel {
  energy: number;
  term: string;
  parent?: string;
  label?: string;
  spinAllowed: boolean;
}

/**
 * The fit result as the page reads it: the core's FitResult (src/fit/types.ts),
 * its names and types, with the fields an older service may lack optional.
 * dq, tenDq, b, c in cm-1; beta = b / freeIonB.
 */
export type FitResult = Pick<CoreFit,
  'd' | 'geometry' | 'dq' | 'tenDq' | 'b' | 'c' | 'cOverB' | 'beta' | 'freeIonB' | 'groundTerm' | 'spinState'
  | 'unpairedElectrons' | 'spinOnlyMoment' | 'status' | 'warnings'>
  & Partial<Pick<CoreFit, 'ion' | 'message' | 'betaSd' | 'unassigned' | 'notes' | 'probability' | 'spinStateProbabilities' | 'undetermined' | 'assignmentGroup' | 'assignmentSpread' | 'goodnessOfFit' | 'penalties'>>
  & {
    rmsResidual: number | null;
    lfse?: unknown;
    uncertainty: Pick<CoreFit['uncertainty'], 'tenDq' | 'b' | 'c'>;
    assignments: Assignment[];
    alternatives?: Alternative[];
    predicted: PredictedLevel[];
  };

/** A competing assignment the fit found close to the best one (no uncertainties): the core's Alternative, every field optional. */
export type Alternative = Partial<Omit<CoreAlternative, 'assignments'>> & { assignments?: Assignment[] };

/** The curves behind the spectrum plot, on one uniform grid in cm-1 (ascending). */
export interface Curves {
  grid: number[];
  /** The data on the grid (absorbance, or ε with a concentration); null where masked. */
  signal: (number | null)[];
  /** Baseline, including a modelled UV edge. */
  baseline?: number[];
  /** Baseline plus every fitted band. */
  model?: number[];
  /** Each band's Gaussian above the baseline (baseline not included), in the order of `bands`. */
  components?: number[][];
}

export interface AnalyzeResult {
  spectrum: SpectrumSummary;
  bands: Band[];
  fit: FitResult | null;
  warnings: string[];
  curves?: Curves;
}

/** The numbers of a stored analysis the library lists (cm-1; sd = one standard deviation): the library's own FitSummary. */
export type LibrarySummary = FitSummary;

/** One row of GET /api/v1/analyses. */
export interface LibraryRow {
  id: number;
  sample: string;
  formula?: string;
  ion?: string;
  ligands?: string[];
  solvent?: string;
  note?: string;
  createdAt: string;
  updatedAt: string;
  original: { fileName: string; sha256: string; size: number };
  revision: number;
  summary: LibrarySummary;
}

export interface LibraryPage {
  analyses: LibraryRow[];
  total: number;
  limit: number;
  offset: number;
}

/** GET /api/v1/analyses/:id: the row with the stored options and analysis result. */
export interface LibraryRecord extends LibraryRow {
  options: Record<string, unknown>;
  result: AnalyzeResult;
}

/** POST /api/v1/analyses: the first saved record, with every record the file gave (one per spectrum) and the spectra not saved. */
export interface SavedFile extends LibraryRecord {
  records: FileRecordEntry[];
  notSaved: NotSavedSpectrum[];
}

/** A ranking and its entries (weakest first): the core's types (src/series/types.ts), type-only. */
export type { RankedEntry, Ranking };

export interface LigandFactor {
  ligand: string;
  f: number;
  fUncertainty?: number;
  h?: number;
  hUncertainty?: number;
  tabulatedF?: number;
  tabulatedH?: number;
}

/** GET /api/v1/series?ion=. */
export interface SeriesReport {
  ion: string;
  count: number;
  spectrochemical: Ranking;
  nephelauxetic: Ranking;
  factors: { ion: string; g: number; k?: number; source: string; factors: LigandFactor[]; notes: string[] } | null;
  skipped: { id: string; sample: string; reason: string }[];
  notes: string[];
}
