/**
 * The results library (GET/POST/DELETE /api/v1/analyses): save the current
 * analysis with its details, list and search the saved ones, reopen or
 * delete one, export the list as CSV.
 */
import * as api from '../api.js';
import { download, h } from '../dom.js';
import { UNIT, formatNumber, formatWithUncertainty, spinStateText } from '../format.js';
import type { AnalysisEntry } from '../state.js';
import { correctionsFor, defaultDetails, editableBandsFromCorrections, editableBandsFromResult, nextKey, type FitRequestBand } from '../state.js';
import type { Geometry, LibraryRecord, LibraryRow, SavedFile, XUnit } from '../types.js';
import { csvText } from '../../src/report/csv.js';

export interface LibraryContext {
  /** Shows a reopened record on the Analyse view. */
  open(entry: AnalysisEntry): void;
  notify(message: string, kind?: 'error' | 'info'): void;
  /** Redraw after a change of an entry. */
  changed(): void;
  /** The page's analyses (to mark the other columns of a file saved with it). */
  entries(): readonly AnalysisEntry[];
}

function errorText(error: unknown): string {
  if (error instanceof api.ApiError) return error.body.path === '' ? error.body.message : `${error.body.message} (at ${error.body.path})`;
  return 'Something went wrong in the page.';
}

/** The "Save to library" button for the current analysis, and what it will store. */
export function saveControls(entry: AnalysisEntry, ctx: LibraryContext): HTMLElement[] {
  if (entry.libraryId !== null) return [h('span', { class: 'saved', id: 'saved-note' }, `Saved in the library as record ${entry.libraryId}.`)];
  const file = entry.file;
  if (file === null) return [];
  const button = h('button', { type: 'button', class: 'button small', id: 'save-library' }, 'Save to library');
  button.addEventListener('click', () => {
    button.disabled = true;
    button.textContent = 'Saving…';
    const details = { ...entry.details, cOverB: entry.cOverB, freeC: entry.freeC };
    const fields = api.analyzeQuery(details);
    const corrections = correctionsFor(entry);
    if (corrections !== null) fields.set('corrections', JSON.stringify(corrections));
    // A file with several spectra is saved as one record per spectrum (the service's rule, as library add and watch);
    // corrections belong to the spectrum on screen, so with them only that column is saved.
    const shownColumn = entry.result?.spectrum.column;
    if (corrections !== null && (entry.result?.spectrum.columns?.length ?? 0) > 1 && !fields.has('column') && shownColumn !== undefined) {
      fields.set('column', String(shownColumn));
    }
    api
      .saveAnalysis(file, fields, {
        sample: entry.details.sample || entry.fileName.replace(/\.[^.]*$/, ''),
        ligands: entry.details.ligand,
        formula: entry.details.formula,
        note: '',
      })
      .then((record) => {
        entry.libraryId = record.id;
        // Show what was stored (the corrected fit, the chosen assignment applied), not what was on screen before.
        entry.fit = record.result.fit;
        entry.shownAlternative = null;
        markSiblingsSaved(entry, record, ctx.entries());
        ctx.notify(savedMessage(entry.fileName, record), record.notSaved.length > 0 ? 'error' : 'info');
        ctx.changed();
      })
      .catch((error: unknown) => {
        ctx.notify(`Could not save: ${errorText(error)}`);
        button.disabled = false;
        button.textContent = 'Save to library';
      });
  });
  const out: HTMLElement[] = [button];
  if (correctionsFor(entry) !== null) {
    out.push(h('span', { class: 'muted small', id: 'save-note' }, 'The library stores the file, this C/B and the corrections made here (bands, chosen assignment).'));
  }
  return out;
}

/** "Saved cr-series.csv as record 4.", or for a file with several spectra every record and each spectrum not saved. */
export function savedMessage(fileName: string, saved: SavedFile): string {
  if (saved.records.length <= 1 && saved.notSaved.length === 0) return `Saved ${fileName} as record ${saved.id}.`;
  const records = saved.records.map((r) => `${r.id} (${r.columnName ?? `column ${r.column}`})`).join(', ');
  const missing = saved.notSaved.map((n) => `column ${n.column}${n.columnName !== null ? ` (${n.columnName})` : ''}: ${n.error.message}`).join('; ');
  return `Saved ${fileName} as ${saved.records.length} record${saved.records.length === 1 ? '' : 's'}, one per spectrum in the file: ${records}.${missing !== '' ? ` Not saved: ${missing}.` : ''}`;
}

/** The other analyses on the page of the same uploaded file and a column saved with it: marked saved, so they are not saved twice. */
function markSiblingsSaved(entry: AnalysisEntry, saved: SavedFile, entries: readonly AnalysisEntry[]): void {
  for (const other of entries) {
    if (other === entry || other.file !== entry.file || other.libraryId !== null || correctionsFor(other) !== null) continue;
    const column = other.result?.spectrum.column ?? (other.details.column.trim() === '' ? undefined : Number(other.details.column));
    const record = saved.records.find((r) => r.column !== null && r.column === column);
    if (record !== undefined) other.libraryId = record.id;
  }
}

/** A page entry for a stored record: its details and stored result, ready to correct and refit. */
export function entryFromRecord(record: LibraryRecord): AnalysisEntry {
  const options = record.options;
  const text = (key: string): string => (typeof options[key] === 'string' ? (options[key] as string) : '');
  const num = (key: string): number | null => (typeof options[key] === 'number' ? (options[key] as number) : null);
  const details = {
    ...defaultDetails(),
    ion: record.ion ?? text('ion'),
    d: num('d'),
    geometry: (text('geometry') || record.result.fit?.geometry || 'octahedral') as Geometry,
    concentration: num('concentration'),
    pathLength: num('pathLength'),
    sample: record.sample,
    ligand: (record.ligands ?? []).join(', '),
    formula: record.formula ?? '',
    xUnit: (text('xUnit') || null) as XUnit | null,
    column: text('column') || (num('column') === null ? '' : String(num('column'))),
    cOverB: num('cOverB'),
    freeC: options['freeC'] === true,
  };
  return {
    key: nextKey(), fileName: record.original.fileName, file: null, details, status: 'done', result: record.result, error: null,
    fit: record.result.fit, originalFit: record.result.fit, bands: storedBands(record),
    cOverB: details.cOverB, freeC: details.freeC, shownAlternative: null, libraryId: record.id,
  };
}

/** The bands the stored fit was made from: the corrected list when the record was saved with one. */
function storedBands(record: LibraryRecord): AnalysisEntry['bands'] {
  const corrections = record.options['corrections'] as { bands?: FitRequestBand[] } | undefined;
  return Array.isArray(corrections?.bands) ? editableBandsFromCorrections(record.result.bands, corrections.bands) : editableBandsFromResult(record.result.bands);
}

/** CSV of library rows: one per record, cm-1, sd = one standard deviation. */
export function libraryCsv(rows: readonly LibraryRow[]): string {
  const header = ['id', 'sample', 'formula', 'ion', 'ligands', '10Dq (cm-1)', 'sd 10Dq (cm-1)', 'B (cm-1)', 'sd B (cm-1)', 'C (cm-1)', 'beta', 'sd beta', 'spin state', 'rms (cm-1)', 'file', 'saved'];
  const data = rows.map((r) => [r.id, r.sample, r.formula ?? '', r.ion ?? '', (r.ligands ?? []).join('; '), r.summary.tenDq, r.summary.tenDqSd, r.summary.b, r.summary.bSd, r.summary.c, r.summary.beta, r.summary.betaSd, r.summary.spinState ?? '', r.summary.rmsResidual, r.original.fileName, r.createdAt]);
  return csvText(header, data, { newline: '\n' });
}

interface ListState {
  query: string;
  ion: string;
}
const listState: ListState = { query: '', ion: '' };
/** Only the latest render may fill the view: answers of earlier ones are dropped. */
let generation = 0;

export function renderLibrary(root: HTMLElement, ctx: LibraryContext, extra: (rows: LibraryRow[]) => HTMLElement | null = () => null): void {
  const search = h('input', { id: 'library-query', type: 'search', value: listState.query, placeholder: 'sample, ligand, formula, note' });
  const ion = h('input', { id: 'library-ion', value: listState.ion, placeholder: 'e.g. Cr3+' });
  const form = h(
    'form',
    { class: 'inline', id: 'library-search', role: 'search' },
    h('label', { for: 'library-query' }, 'Search'),
    search,
    h('label', { for: 'library-ion' }, 'Ion'),
    ion,
    h('button', { type: 'submit', class: 'button small' }, 'Show'),
  );
  const body = h('div', { id: 'library-body' }, h('p', { class: 'muted' }, 'Loading the library…'));
  form.addEventListener('submit', (event) => {
    event.preventDefault();
    listState.query = search.value.trim();
    listState.ion = ion.value.trim();
    renderLibrary(root, ctx, extra);
  });
  const mine = ++generation;
  root.replaceChildren(h('h2', {}, 'Results library'), h('section', { class: 'panel' }, form, body));
  const query: api.LibraryQuery = { limit: 1000 };
  if (listState.query !== '') query.query = listState.query;
  if (listState.ion !== '') query.ion = listState.ion;
  api.listAnalyses(query).then(
    (page) => {
      if (mine !== generation) return;
      body.replaceChildren(libraryTable(page.analyses, page.total, root, ctx, extra));
      const more = extra(page.analyses);
      if (more !== null) root.append(more);
    },
    (error: unknown) => {
      if (mine === generation) body.replaceChildren(h('p', { class: 'error', role: 'alert' }, `The library could not be read: ${errorText(error)}`));
    },
  );
}

function libraryTable(rows: LibraryRow[], total: number, root: HTMLElement, ctx: LibraryContext, extra: (rows: LibraryRow[]) => HTMLElement | null): HTMLElement {
  if (rows.length === 0) return h('p', { class: 'muted', id: 'library-empty' }, 'No saved analyses match. Save one from the Analyse view.');
  const open = (id: number): void => {
    api.getAnalysis(id).then((record) => ctx.open(entryFromRecord(record)), (error: unknown) => ctx.notify(`Could not open record ${id}: ${errorText(error)}`));
  };
  const remove = (row: LibraryRow): void => {
    if (!window.confirm(`Delete “${row.sample}” (record ${row.id}) from the library? This cannot be undone.`)) return;
    api.deleteAnalysis(row.id).then(() => renderLibrary(root, ctx, extra), (error: unknown) => ctx.notify(`Could not delete record ${row.id}: ${errorText(error)}`));
  };
  return h(
    'div',
    {},
    h(
      'table',
      { class: 'data', id: 'library-table' },
      h('caption', {}, `${total} saved analys${total === 1 ? 'is' : 'es'}${total > rows.length ? ` (first ${rows.length} shown)` : ''}`),
      h('thead', {}, h('tr', {}, ...['Sample', 'Ion', 'Ligands', `10Dq / ${UNIT.wavenumber}`, `B / ${UNIT.wavenumber}`, 'β', 'Spin state', 'Saved', ''].map((t) => h('th', { scope: 'col' }, t)))),
      h(
        'tbody',
        {},
        ...rows.map((row) =>
          h(
            'tr',
            { 'data-id': row.id },
            h('th', { scope: 'row' }, row.sample),
            h('td', {}, row.ion ?? '—'),
            h('td', {}, (row.ligands ?? []).join(', ') || row.formula || '—'),
            h('td', { class: 'num' }, formatWithUncertainty(row.summary.tenDq, row.summary.tenDqSd)),
            h('td', { class: 'num' }, formatWithUncertainty(row.summary.b, row.summary.bSd)),
            h('td', { class: 'num' }, formatWithUncertainty(row.summary.beta, row.summary.betaSd, 2)),
            h('td', {}, row.summary.spinState === null ? '—' : spinStateText(row.summary.spinState)),
            h('td', {}, new Date(row.createdAt).toLocaleString()),
            h(
              'td',
              { class: 'actions' },
              h('button', { type: 'button', class: 'button small', id: `library-open-${row.id}`, onclick: () => open(row.id) }, 'Open'),
              h('button', { type: 'button', class: 'button small', id: `library-delete-${row.id}`, 'aria-label': `Delete ${row.sample}`, onclick: () => remove(row) }, 'Delete'),
            ),
          ),
        ),
      ),
    ),
    h('div', { class: 'toolbar' }, h('button', { type: 'button', class: 'button small', id: 'library-csv', onclick: () => download('fieldgap-library.csv', libraryCsv(rows), 'text/csv') }, 'Download CSV'), h('span', { class: 'muted small' }, `${formatNumber(rows.length)} rows`)),
  );
}
