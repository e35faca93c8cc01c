/**
 * The downloads of one analysis: JSON (everything the page knows: sample
 * details, bands as corrected, the fit shown, the tetragonal refit shown) and CSV (parameters, then the
 * band and assignment table). Pure; cm-1 throughout, nm as an extra column.
 */
import type { AnalysisEntry } from './state.js';
import { shownFit, warningsFor } from './state.js';
import { assignmentForBand, bandCaption } from './plots/spectrum-spec.js';
import { nmFromWavenumber } from './format.js';
import { csvText, type CsvCell } from '../src/report/csv.js';
import { resultsCsv } from '../src/report/results-csv.js';

/**
 * The results table (src/report/results-csv.ts) of the analyses done on the
 * page, one row each with the fit shown: the bytes `analyze --csv` and
 * `library export --columns results` give for the same spectra.
 */
export function resultsTableCsv(entries: readonly AnalysisEntry[]): string {
  return resultsCsv(entries.map((entry) => ({ label: entry.fileName, fit: shownFit(entry), warnings: warningsFor(entry) })));
}

export function resultJson(entry: AnalysisEntry): string {
  const fit = shownFit(entry);
  return JSON.stringify(
    {
      fileName: entry.fileName,
      sample: entry.details,
      spectrum: entry.result?.spectrum ?? null,
      bands: entry.bands,
      fit,
      warnings: warningsFor(entry),
      cOverB: entry.cOverB,
      freeC: entry.freeC,
      // The tetragonal refit, when one is shown: the service's answer as it came.
      ...(entry.symmetry === 'tetragonal' && entry.tetragonalFit ? { tetragonalFit: entry.tetragonalFit } : {}),
    },
    null,
    2,
  );
}

type Row = CsvCell[];

function cell(value: number | null | undefined): number | null {
  return value === null || value === undefined || !Number.isFinite(value) ? null : value;
}

export function resultCsv(entry: AnalysisEntry): string {
  const fit = shownFit(entry);
  const rows: Row[] = [['quantity', 'value', 'uncertainty', 'unit']];
  if (fit !== null) {
    rows.push(
      ['10Dq', cell(fit.tenDq), cell(fit.uncertainty.tenDq), 'cm-1'],
      ['B', cell(fit.b), cell(fit.uncertainty.b), 'cm-1'],
      ['C', cell(fit.c), cell(fit.uncertainty.c), 'cm-1'],
      ['C/B', cell(fit.cOverB), null, ''],
      ['beta', cell(fit.beta), null, ''],
      ['free-ion B', cell(fit.freeIonB), null, 'cm-1'],
      ['ground term', fit.groundTerm, null, ''],
      ['spin state', fit.spinState, null, ''],
      ['unpaired electrons', fit.unpairedElectrons, null, ''],
      ['spin-only moment', cell(fit.spinOnlyMoment), null, 'muB'],
      ['rms residual', cell(fit.rmsResidual), null, 'cm-1'],
      ['fit status', fit.status, null, ''],
    );
  }
  rows.push([], ['band', 'position (cm-1)', 'wavelength (nm)', 'epsilon (L mol-1 cm-1)', 'kind', 'shoulder', 'in fit', 'assignment', 'calculated (cm-1)']);
  const assignments = fit?.assignments ?? [];
  entry.bands.forEach((band, i) => {
    const a = band.included ? assignmentForBand(band.position, assignments) : undefined;
    rows.push([
      i + 1,
      band.position,
      Number(nmFromWavenumber(band.position).toFixed(1)),
      cell(band.epsilon),
      band.kind,
      band.shoulder ? 'yes' : 'no',
      band.included ? 'yes' : 'no',
      bandCaption(band, assignments, fit ?? null),
      cell(a?.calculated),
    ]);
  });
  return csvText(null, rows, { newline: '\n' });
}
