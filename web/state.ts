/**
 * The page's working state: one entry per analysed file, the bands as the
 * user has corrected them, and the fit currently shown. Plain data; views
 * read it and call the actions in main.ts to change it.
 */
import { parseFormula } from '../src/chemistry/formula.js';
import { findLigand } from '../src/chemistry/ligands.js';
import { bandFitSigma, bandFlagsOf, bandKindOfFlags } from '../src/band-fit-input.js';
import { fitWithAlternative } from '../src/analysis-corrections.js';
import type { FitResult as CoreFitResult } from '../src/fit/types.js';
import type { AnalyzeResult, ApiErrorBody, Band, BandFlag, BandKind, FitResult, Geometry, TetragonalFitResult, XUnit } from './types.js';

/** What the user says about the sample; sent with the analysis and stored with it. */
export interface SampleDetails {
  ion: string;
  /** Used only when no ion is given. */
  d: number | null;
  geometry: Geometry;
  /** mol/L. */
  concentration: number | null;
  /** cm; the service assumes 1 cm when absent. */
  pathLength: number | null;
  sample: string;
  ligand: string;
  /** Complex formula as written, e.g. "[Cr(H2O)6]Cl3"; the library reads ligand numbers from it. */
  formula: string;
  xUnit: XUnit | null;
  column: string;
  cOverB: number | null;
  freeC: boolean;
  /** false: leave detector steps in the data (the service corrects a step only on overwhelming evidence). @default true */
  stepCorrection?: boolean;
}

/** A band as the user has corrected it. */
export interface EditableBand {
  /** cm-1. */
  position: number;
  uncertainty: number | null;
  epsilon: number | null;
  /** Full width at half maximum, cm-1, when known. */
  width: number | null;
  kind: BandKind;
  shoulder: boolean;
  /** false once the user removes it; kept so it can be put back. */
  included: boolean;
  /** 'found' by the band finder, 'added' by the user. */
  origin: 'found' | 'added';
  /** Index into result.bands for found bands, to find its fitted curve. */
  sourceIndex: number | null;
}

export interface AnalysisEntry {
  /** Page-local identity. */
  key: string;
  fileName: string;
  /** The uploaded file, kept to save it to the library; null for a record reopened from it. */
  file: File | null;
  details: SampleDetails;
  status: 'pending' | 'done' | 'failed';
  result: AnalyzeResult | null;
  error: ApiErrorBody | null;
  /** The best fit for the current band list (after a refit, the refit). */
  fit: FitResult | null;
  /** The fit of the first analysis, kept to show what a correction changed. */
  originalFit: FitResult | null;
  bands: EditableBand[];
  /** C/B used for the next refit; null lets the fit choose. */
  cOverB: number | null;
  freeC: boolean;
  /** Index into fit.alternatives being shown instead of the best fit. */
  shownAlternative: number | null;
  /** Id in the results library once saved. */
  libraryId: number | null;
  /** The symmetry of the next refit: cubic (the fit of the analysis) or tetragonal (Dq, Ds, Dt). @default 'cubic' */
  symmetry?: FitSymmetry;
  /** The last tetragonal refit of the current bands; shown beside the cubic fit while the symmetry is tetragonal. */
  tetragonalFit?: TetragonalFitResult | null;
  /** The request (JSON) the tetragonal fit answered, to tell when the bands or C/B have changed since. */
  tetragonalFitFor?: string;
  /** Spin–orbit coupling in the tetragonal refit. @default { mode: 'off' } */
  zeta?: ZetaChoice;
}

export type FitSymmetry = 'cubic' | 'tetragonal';

/**
 * Spin–orbit coupling in the tetragonal refit (POST /fit `zeta`, `freeZeta`):
 * off (ζ = 0, the default), fixed at a value in cm-1, the free ion's
 * tabulated ζ, or fitted with the other parameters.
 */
export type ZetaChoice = { mode: 'off' } | { mode: 'fixed'; value: number | null } | { mode: 'free-ion' } | { mode: 'fitted' };

export function defaultDetails(): SampleDetails {
  return {
    ion: '',
    d: null,
    geometry: 'octahedral',
    concentration: null,
    pathLength: null,
    sample: '',
    ligand: '',
    formula: '',
    xUnit: null,
    column: '',
    cOverB: null,
    freeC: false,
  };
}

/**
 * The σ of a found band's position as the analysis gives it to the fit: the
 * spectral fit's σ combined in quadrature with the fit's default σ for a band
 * maximum (the core rule bandFitSigma, which the analysis uses), so a refit without corrections
 * reproduces the analysis.
 */
export function fitUncertaintyOf(band: Band): number | null {
  if (typeof band.uncertainty === 'number') return band.uncertainty;
  if (typeof band.positionUncertainty === 'number' && Number.isFinite(band.positionUncertainty)) {
    return bandFitSigma(band.position, band.positionUncertainty);
  }
  return null;
}

/** The editable band list a fresh analysis starts with. */
export function editableBandsFromResult(bands: readonly Band[]): EditableBand[] {
  return bands.map((band, index) => ({
    position: band.position,
    uncertainty: fitUncertaintyOf(band),
    epsilon: typeof band.epsilon === 'number' ? band.epsilon : null,
    width: typeof band.fwhm === 'number' && band.fwhm > 0 ? band.fwhm : null,
    kind: band.kind,
    shoulder: band.shoulder === true || (band.flags ?? []).includes('shoulder'),
    included: true,
    origin: 'found',
    sourceIndex: index,
  }));
}

/**
 * The editable band list of a stored record saved with corrected bands: a
 * corrected band at a found band's position is that band (with its stored
 * kind and shoulder flag), any other is one the user added, and a found band
 * left out of the corrections is shown as removed. So a reopened record
 * shows the bands its stored fit was made from.
 */
export function editableBandsFromCorrections(found: readonly Band[], corrected: readonly FitRequestBand[]): EditableBand[] {
  const bands = editableBandsFromResult(found).map((band) => ({ ...band, included: false }));
  for (const c of corrected) {
    const flags = c.flags ?? [];
    const kind = bandKindOfFlags(flags);
    const same = bands.find((band) => band.origin === 'found' && !band.included && Math.abs(band.position - c.position) < 1e-6);
    if (same) {
      Object.assign(same, { included: true, kind, shoulder: flags.includes('shoulder'), uncertainty: c.uncertainty ?? same.uncertainty });
    } else {
      bands.push({
        position: c.position, uncertainty: c.uncertainty ?? null, epsilon: c.epsilon ?? null, width: c.width ?? null,
        kind, shoulder: flags.includes('shoulder'), included: true, origin: 'added', sourceIndex: null,
      });
    }
  }
  return bands;
}

/** Flags the fit endpoint reads for one band. */
export function bandFlags(band: EditableBand): BandFlag[] {
  return bandFlagsOf(band);
}

export interface FitRequestBand {
  position: number;
  uncertainty?: number;
  epsilon?: number;
  width?: number;
  flags: BandFlag[];
}

export interface FitRequest {
  ion?: string;
  d?: number;
  geometry: Geometry;
  bands: FitRequestBand[];
  cOverB?: number;
  freeC: boolean;
  /** The measured range, cm-1, for the fit's window terms. */
  window?: { min: number; max: number };
  formula?: string;
  ligands?: string;
}

/** The POST /api/v1/fit body for the entry's current corrections. */
export function fitRequestFor(entry: AnalysisEntry): FitRequest {
  const request: FitRequest = {
    geometry: entry.details.geometry,
    bands: entry.bands
      .filter((band) => band.included)
      .map((band) => {
        const out: FitRequestBand = { position: band.position, flags: bandFlags(band) };
        if (band.uncertainty !== null) out.uncertainty = band.uncertainty;
        if (band.epsilon !== null) out.epsilon = band.epsilon;
        if (band.width !== null) out.width = band.width;
        return out;
      })
      .sort((a, b) => a.position - b.position),
    freeC: entry.freeC,
  };
  const ion = entry.details.ion.trim();
  if (ion !== '') request.ion = ion;
  else if (entry.details.d !== null) request.d = entry.details.d;
  if (entry.cOverB !== null) request.cOverB = entry.cOverB;
  const range = entry.result?.spectrum.range;
  if (range) request.window = { min: range[0], max: range[1] };
  const priors = priorFields(entry.details);
  if (priors.formula !== undefined) request.formula = priors.formula;
  if (priors.ligands !== undefined) request.ligands = priors.ligands;
  return request;
}

/**
 * The POST /api/v1/fit body of the tetragonal refit: the same bands, ion and
 * C/B with symmetry "tetragonal". The measured range, the ligand priors and a
 * free C are the cubic fit's only (the service names them as errors here).
 */
export interface TetragonalFitRequest {
  ion?: string;
  d?: number;
  geometry: Geometry;
  bands: FitRequestBand[];
  cOverB?: number;
  symmetry: 'tetragonal';
  /** ζ in cm-1 or the free ion's; absent: 0 (off). */
  zeta?: number | 'free-ion';
  freeZeta?: boolean;
}

export function tetragonalFitRequestFor(entry: AnalysisEntry): TetragonalFitRequest {
  const { ion, d, geometry, bands, cOverB } = fitRequestFor(entry);
  const request: TetragonalFitRequest = { geometry, bands, symmetry: 'tetragonal' };
  if (ion !== undefined) request.ion = ion;
  if (d !== undefined) request.d = d;
  if (cOverB !== undefined) request.cOverB = cOverB;
  const zeta = entry.zeta ?? { mode: 'off' };
  if (zeta.mode === 'fixed' && zeta.value !== null) request.zeta = zeta.value;
  if (zeta.mode === 'free-ion') request.zeta = 'free-ion';
  if (zeta.mode === 'fitted') request.freeZeta = true;
  return request;
}

/**
 * The corrections to store with a saved analysis (POST /analyses
 * "corrections"): the corrected band list when the bands differ from those
 * found, and the alternative shown. The service applies them with the same
 * fit (src/analysis-corrections.ts), so the record holds the fit shown here.
 */
export function correctionsFor(entry: AnalysisEntry): { bands?: FitRequestBand[]; alternative?: number } | null {
  const out: { bands?: FitRequestBand[]; alternative?: number } = {};
  if (hasBandCorrections(entry)) out.bands = fitRequestFor(entry).bands;
  if (entry.shownAlternative !== null) out.alternative = entry.shownAlternative;
  return out.bands === undefined && out.alternative === undefined ? null : out;
}

/**
 * The formula and ligands of the details as the fit's priors: only when they
 * read (a free-text formula the library keeps need not be one the fit can use).
 */
export function priorFields(details: SampleDetails): { formula?: string; ligands?: string } {
  const out: { formula?: string; ligands?: string } = {};
  const formula = details.formula.trim();
  if (formula !== '') {
    try {
      const parsed = parseFormula(formula);
      if (details.ion.trim() === '' || parsed.metal.label === details.ion.trim()) out.formula = formula;
    } catch {
      // Not a formula the fit reads: no ligand prior from it.
    }
  }
  const ligands = details.ligand.split(',').map((l) => l.trim()).filter((l) => l !== '');
  if (ligands.length > 0 && ligands.every((l) => findLigand(l) !== undefined)) out.ligands = ligands.join(',');
  return out;
}

/** True when the bands or the fit differ from what the analysis found. */
export function hasBandCorrections(entry: AnalysisEntry): boolean {
  if (entry.result === null) return false;
  const found = editableBandsFromResult(entry.result.bands);
  if (found.length !== entry.bands.length) return true;
  return entry.bands.some((band, i) => {
    const f = found[i]!;
    return band.position !== f.position || band.kind !== f.kind || band.shoulder !== f.shoulder || band.included !== f.included;
  });
}


/**
 * The fit shown: an alternative when the user picked one, else the best.
 * An alternative is the core's rule (fitWithAlternative, src/analysis-corrections.ts),
 * the one the service applies when the record is saved with it: no
 * uncertainties, its own magnetism, LFSE and C/B, the reason it lost as a warning.
 */
export function shownFit(entry: AnalysisEntry): FitResult | null {
  const fit = entry.fit;
  if (fit === null) return null;
  const index = entry.shownAlternative;
  if (index === null || fit.alternatives?.[index] === undefined) return fit;
  // The page's fit is the service's FitResult; web/types.ts marks optional only what a record from an older fieldgap may lack.
  return fitWithAlternative(fit as CoreFitResult, index);
}

/**
 * Warnings to show: the spectrum's, then the shown fit's. The analysis
 * lists its fit's warnings among its own with a "fit: " prefix
 * (src/analysis.ts); those are replaced by the warnings of the fit shown,
 * which may be a refit or an alternative.
 */
export function warningsFor(entry: AnalysisEntry): string[] {
  const spectrum = (entry.result?.warnings ?? []).filter((w) => !w.startsWith('fit: '));
  return [...spectrum, ...(shownFit(entry)?.warnings ?? []).map((w) => `fit: ${w}`)];
}

let counter = 0;
export function nextKey(): string {
  counter += 1;
  return `a${counter}`;
}
