/**
 * The one pipeline everything calls: a spectrum file's content → one
 * spectrum → processed bands → a ligand-field fit of the d–d bands. Pure (the
 * caller reads the file); the CLI, the service, the page and the library all
 * come through here, so they agree on every number.
 */
import { checkCorrections, fitWithAlternative, type AnalysisCorrections } from './analysis-corrections.js';
import { parseFormula } from './chemistry/formula.js';
import { NoLigandFieldFit } from './analysis-no-fit.js';
import { peakTableError } from './analysis-peak-table.js';
import { assignedKindWarnings, bandsTooStrongForFit, spinForbiddenEpsilonCeiling } from './analysis-kind-checks.js';
import { FieldgapError, invalidArgument } from './errors.js';
import { bandToFitInput } from './band-fit-input.js';
import { fitLigandField, type BandInput, type FitResult } from './fit/index.js';
import type { Geometry } from './ligand-field/types.js';
import { gaussianValue } from './spectrum/gaussian.js';
import { bandsOnEdge } from './spectrum/bands-on-edge.js';
import { parseSpectrumText, processSpectrum } from './spectrum/index.js';
import { parseIon } from './chemistry/ions.js';
import { bandAssignedKinds, type AssignedKind } from './report/band-assigned-kind.js';
import type { Band, MaskedRegion, ParsedFile, Spectrum, StepCorrection, XUnit, YUnit } from './spectrum/types.js';

export interface AnalyzeOptions {
  /** Shown in error paths and warnings. @default "<input>" */
  fileName?: string;
  /** "Cr3+", "Cr(III)"; or give `d`. One of them is required for the fit. */
  ion?: string;
  d?: number;
  /** @default "octahedral" */
  geometry?: Geometry;
  /** mol/L: with it, heights become ε and bands are classified by ε. @default unknown */
  concentration?: number;
  /** cm. @default 1 */
  pathLength?: number;
  /** x unit of the file when its header does not say. @default what the file says, else inferred */
  xUnit?: XUnit;
  yUnit?: YUnit;
  /** Which y column (1-based index or header name). @default the first */
  column?: number | string;
  /** Fixed C/B. @default the free ion's C0/B0, else 4.5 */
  cOverB?: number;
  /** Fixed C, cm-1. */
  c?: number;
  /** Fit C as well. @default false */
  freeC?: boolean;
  /**
   * Correct detector change-over steps. A step is corrected only on
   * overwhelming evidence and listed (spectrum.stepCorrections, warnings);
   * false leaves the data exactly as read. @default true
   */
  stepCorrection?: boolean;
  /** The complex's formula ("[Co(H2O)6]2+"): ligand priors of the fit; the metal when no ion is given. @default none */
  formula?: string;
  /** Ligands ("H2O", "NH3,Cl") for the fit's 10Dq and β priors. @default none */
  ligands?: string | string[];
  /** Return the curves on the energy grid (for plots). @default false */
  curves?: boolean;
  /** The user's corrections (band list, chosen assignment), see analysis-corrections.ts. @default none */
  corrections?: AnalysisCorrections;
}

export interface AnalyzeCurves {
  /** Uniform wavenumber grid, cm-1, ascending. */
  grid: number[];
  /** The data (absorbance, or ε with a concentration); null where masked. */
  signal: Array<number | null>;
  baseline: number[];
  model: number[];
  /** Each band's Gaussian above the baseline, in the order of `bands`. */
  components: number[][];
}

export interface AnalyzeResult {
  spectrum: {
    points: number;
    /** [min, max], cm-1. */
    range: [number, number];
    xUnit: XUnit;
    yUnit: YUnit;
    masked: MaskedRegion[];
    name: string;
    column: number;
    format: ParsedFile['format'];
    /** 'absorbance', or 'epsilon' (L mol-1 cm-1) with a concentration. */
    signalUnit: 'absorbance' | 'epsilon';
    /** Noise standard deviation, signal unit. */
    noise: number;
    /** Rounding step of the values as read (0.01 for two decimals), signal unit; 0 when not rounded. */
    quantization: number;
    /** Detector steps removed from the data, with their size; empty when none (or stepCorrection was false). */
    stepCorrections: StepCorrection[];
    /** Every spectrum of a file that holds more than one (its y columns), so a caller can offer the others. */
    columns?: Array<{ column: number; name: string }>;
  };
  /**
   * The found bands. `kind` is the spectrum stage's class by intensity and
   * width alone; `assignedKind` what the fit's assignment makes of the band
   * (src/report/band-assigned-kind.ts), null when the fit left it unassigned
   * or the fit used a corrected band list. A record from an older fieldgap
   * lacks it.
   */
  bands: Array<Band & { assignedKind?: AssignedKind | null }>;
  fit: FitResult;
  warnings: string[];
  curves?: AnalyzeCurves;
  /** The corrections `fit` was made with, when any (checked copy of options.corrections). */
  corrections?: AnalysisCorrections;
}

/** The spectra a file holds, for a batch run that analyses every column. */
export function listSpectra(content: string | Uint8Array, options: Pick<AnalyzeOptions, 'fileName' | 'xUnit' | 'yUnit'> = {}): Array<{ column: number; name: string }> {
  return parseSpectrumText(content, parseOptions(options)).spectra.map((s) => ({ column: s.column, name: s.name }));
}

export function analyzeSpectrum(content: string | Uint8Array, options: AnalyzeOptions): AnalyzeResult {
  checkOptions(options);
  const parsed = parseSpectrumText(content, { ...parseOptions(options), ...(options.column !== undefined && { column: options.column }) });
  const spectrum = parsed.spectra[0];
  if (spectrum === undefined) throw new FieldgapError('parse-error', 'the file holds no spectrum', options.fileName ?? '<input>');
  const warnings = [...parsed.warnings];
  if (options.column === undefined && parsed.spectra.length > 1) {
    const others = parsed.spectra.slice(1).map((s) => `${s.column} (${s.name})`).join(', ');
    warnings.push(`the file holds ${parsed.spectra.length} spectra; analysed column ${spectrum.column} (${spectrum.name}); choose another (--column, or the column field of the page): ${others}`);
  }
  const result = analyzeOne(spectrum, parsed.format, options, warnings);
  if (parsed.spectra.length > 1) result.spectrum.columns = parsed.spectra.map((s) => ({ column: s.column, name: s.name }));
  return result;
}

function analyzeOne(spectrum: Spectrum, format: ParsedFile['format'], options: AnalyzeOptions, warnings: string[]): AnalyzeResult {
  // A formula's geometry guess (from its coordination number) stands in when none is given.
  const geometry = options.geometry ?? formulaGeometry(options.formula) ?? 'octahedral';
  const d = options.d ?? dCountOf(options.ion ?? formulaMetal(options.formula));
  if (spectrum.metadata['jcampForm'] === 'PEAK TABLE') throw peakTableError(spectrum, { ...options, geometry }, options.fileName ?? '<input>');
  const processed = processSpectrum(spectrum, {
    geometry,
    // d0 (MnO4-, CrO4 2-) and d10 have no d–d transitions: every band is charge transfer.
    chargeTransferOnly: d === 0 || d === 10,
    ...(options.stepCorrection !== undefined && { correctSteps: options.stepCorrection }),
    ...(options.concentration !== undefined && { concentration: options.concentration }),
    ...(options.pathLength !== undefined && { pathLength: options.pathLength }),
  });
  warnings.push(...processed.warnings);
  const where = `${options.fileName ?? '<input>'}${format === 'delimited' && spectrum.column > 1 ? `#${spectrum.column}` : ''}`;
  const corrections = options.corrections === undefined ? undefined : checkCorrections(options.corrections);
  const dd = processed.bands.filter((b) => b.kind !== 'charge-transfer');
  const spectrumPart: AnalyzeResult['spectrum'] = {
    points: processed.points,
    range: processed.range,
    xUnit: processed.xUnit,
    yUnit: processed.yUnit,
    masked: processed.masked,
    name: spectrum.name,
    column: spectrum.column,
    format,
    signalUnit: processed.signalUnit,
    noise: processed.noise,
    quantization: processed.quantization,
    stepCorrections: processed.stepCorrections,
  };
  if (dd.length === 0 && corrections?.bands === undefined) {
    const found = processed.bands.length === 0 ? 'no bands were found' : `only charge-transfer bands were found (${positions(processed.bands)} cm-1)`;
    const message = d === 0 || d === 10
      ? `no ligand-field fit: a d${d} ion has no d–d transitions; ${found.replace('only ', '')} between ${Math.round(processed.range[0])} and ${Math.round(processed.range[1])} cm-1`
      : `no d–d bands to fit: ${found} between ${Math.round(processed.range[0])} and ${Math.round(processed.range[1])} cm-1`;
    // The bands were found and classified: the error carries them, so the CLI can print the table beside the note.
    throw new NoLigandFieldFit(message, where, { spectrum: spectrumPart, bands: processed.bands, warnings });
  }
  const fitOf = (bands: BandInput[]): FitResult => fitLigandField({
    ...(options.ion !== undefined && { ion: options.ion }),
    ...(options.d !== undefined && { d: options.d }),
    geometry,
    bands,
    ...(options.cOverB !== undefined && { cOverB: options.cOverB }),
    ...(options.c !== undefined && { c: options.c }),
    ...(options.freeC !== undefined && { freeC: options.freeC }),
    ...(options.formula !== undefined && { formula: options.formula }),
    ...(options.ligands !== undefined && { ligands: options.ligands }),
    // The range of the data used (the measured range less masked end stretches): a strong transition predicted inside it must show a band.
    window: { min: processed.keptRange[0], max: processed.keptRange[1] },
  });
  let fit: FitResult;
  try {
    fit = fitOf(corrections?.bands ?? processed.bands.map(bandToFitInput));
  } catch (error) {
    if (error instanceof FieldgapError && error.code === 'unexplained') {
      // A shoulder riding on the charge-transfer edge may be a piece of the edge: when no assignment takes the bands as
      // found, it is left to the edge (flagged charge transfer) and the fit tried once more; it says so.
      const riding = corrections?.bands === undefined ? bandsOnEdge(processed.bands, processed.edge).filter((k) => processed.bands[k]!.kind !== 'charge-transfer') : [];
      const retried = riding.length === 0 ? null : fitOrNull(() => fitOf(processed.bands.map((b, k) => bandToFitInput(riding.includes(k) ? { ...b, kind: 'charge-transfer' } : b))));
      if (retried === null) throw new FieldgapError('unexplained', `${error.message} (bands found at ${positions(processed.bands)} cm-1)`, where);
      fit = retried;
      warnings.push(`the band${riding.length > 1 ? 's' : ''} at ${riding.map((k) => Math.round(processed.bands[k]!.position)).join(', ')} cm-1, a shoulder on the charge-transfer edge, left to the edge: no assignment takes ${riding.length > 1 ? 'them' : 'it'} as a d–d band beside the others`);
    } else throw error;
  }
  if (corrections?.alternative !== undefined) fit = fitWithAlternative(fit, corrections.alternative);
  if (corrections === undefined) {
    // High-spin d5 has only spin-forbidden d–d bands: one whose ε is far above them is not d–d (analysis-kind-checks.ts); it is left out, as charge transfer, and the fit made again.
    const tooStrong = bandsTooStrongForFit(processed.bands, bandAssignedKinds(processed.bands, fit), fit);
    if (tooStrong.length > 0) {
      const which = `${tooStrong.map((k) => `${Math.round(processed.bands[k]!.position)} cm-1 (ε = ${processed.bands[k]!.epsilon!.toPrecision(3)})`).join(', ')}`;
      const why = `far above any d–d band of high-spin d5 (spin-forbidden, ε < ~${spinForbiddenEpsilonCeiling(geometry, fit.ion)} L mol-1 cm-1 ${geometry}): not d–d (charge transfer? another ion?); check the ion or the concentration`;
      const left = processed.bands.map((b, k) => bandToFitInput(tooStrong.includes(k) ? { ...b, kind: 'charge-transfer' } : b));
      const refit = left.some((b) => !b.flags?.includes('charge-transfer')) ? fitOrNull(() => fitOf(left)) : null;
      if (refit === null) throw new NoLigandFieldFit(`no ligand-field fit: the band${tooStrong.length > 1 ? 's' : ''} at ${which} ${tooStrong.length > 1 ? 'are' : 'is'} ${why}, and no assignment explains the other bands without ${tooStrong.length > 1 ? 'them' : 'it'}`, where, { spectrum: spectrumPart, bands: processed.bands, warnings });
      fit = refit;
      warnings.push(`the band${tooStrong.length > 1 ? 's' : ''} at ${which}, ${why}: left out of the fit`);
    }
  }
  const assignedKinds = bandAssignedKinds(processed.bands, corrections?.bands === undefined ? fit : null);
  if (corrections?.bands === undefined) warnings.push(...assignedKindWarnings(processed.bands, assignedKinds, fit, options.pathLength ?? 1));
  const result: AnalyzeResult = {
    spectrum: spectrumPart,
    bands: processed.bands.map((b, i) => ({ ...b, assignedKind: assignedKinds[i] ?? null })),
    fit,
    warnings: [...warnings, ...fit.warnings.map((w) => `fit: ${w}`)],
    ...(corrections !== undefined && { corrections }),
  };
  if (options.curves) {
    const grid = processed.grid;
    result.curves = {
      grid: Array.from(grid),
      signal: Array.from(processed.signal, (v) => (Number.isFinite(v) ? v : null)),
      baseline: Array.from(processed.baseline),
      model: Array.from(processed.model),
      // The fitted Gaussians (a band's reported position is its measured maximum, not the Gaussian's centre).
      components: processed.components.map((b) => Array.from(grid, (x) => gaussianValue(x, b.position, b.height, b.fwhm))),
    };
  }
  return result;
}

/** The geometry guessed from a formula, or undefined (the fit reports a bad formula with its path). */
function formulaGeometry(formula: string | undefined): Geometry | undefined {
  if (formula === undefined) return undefined;
  try {
    return parseFormula(formula).geometry;
  } catch {
    return undefined;
  }
}

/** The metal ion of a formula ("Co2+"), or undefined when there is none or it does not read. */
function formulaMetal(formula: string | undefined): string | undefined {
  if (formula === undefined) return undefined;
  try {
    return parseFormula(formula).metal.label;
  } catch {
    return undefined;
  }
}

/** The d-electron count of an ion label, or undefined (the fit reports a bad ion with its path). */
function dCountOf(ion: string | undefined): number | undefined {
  if (ion === undefined) return undefined;
  try {
    return parseIon(ion).d;
  } catch {
    return undefined;
  }
}

/** The fit, or null when it refuses the bands as unexplained. */
function fitOrNull(fit: () => FitResult): FitResult | null {
  try {
    return fit();
  } catch (error) {
    if (error instanceof FieldgapError && error.code === 'unexplained') return null;
    throw error;
  }
}

function positions(bands: readonly Band[]): string {
  return bands.map((b) => Math.round(b.position)).join(', ');
}

function parseOptions(options: Pick<AnalyzeOptions, 'fileName' | 'xUnit' | 'yUnit'>) {
  return {
    ...(options.fileName !== undefined && { fileName: options.fileName }),
    ...(options.xUnit !== undefined && { xUnit: options.xUnit }),
    ...(options.yUnit !== undefined && { yUnit: options.yUnit }),
  };
}

function checkOptions(options: AnalyzeOptions): void {
  if (options.ion === undefined && options.d === undefined && options.formula === undefined) {
    throw invalidArgument('ion', 'the metal ion (ion, e.g. Cr3+) or the d-electron count (d) is needed for the fit');
  }
  for (const key of ['concentration', 'pathLength'] as const) {
    const value = options[key];
    if (value !== undefined && !(Number.isFinite(value) && value > 0)) {
      throw invalidArgument(key, `${key} must be a positive number, got ${value}`);
    }
  }
}
