/**
 * The page: holds the analyses, runs the calls to the service and redraws
 * the views when something changes.
 */
import 'uplot/dist/uPlot.min.css';
import './styles.css';
import * as api from './api.js';
import { download, h, keepingFocus } from './dom.js';
import { dCountText, safeFileStem } from './format.js';
import { resultCsv, resultJson } from './export-results.js';
import type { AnalysisEntry, EditableBand, SampleDetails } from './state.js';
import { editableBandsFromResult, fitRequestFor, nextKey, shownFit, tetragonalFitRequestFor, warningsFor } from './state.js';
import type { ApiErrorBody } from './types.js';
import type { AxisUnit } from './plots/spectrum-spec.js';
import { createUploadPanel } from './views/upload.js';
import { alternativesPanel, assignmentTable, notesBox, parameterCards, warningsBox } from './views/results.js';
import { bandsPanel } from './views/bands.js';
import { tetragonalPanel } from './views/tetragonal.js';
import { showFittedLevels } from './views/levels-from-fit.js';
import { columnsPanel } from './views/columns.js';
import { diagramFigure, spectrumFigures } from './views/plots.js';
import { keptPanel } from './views/keep.js';
import { renderCompare } from './views/compare.js';
import { setupTabs } from './views/tabs.js';
import { renderLibrary, saveControls, type LibraryContext } from './views/library.js';
import { seriesPanel } from './views/series.js';
import { renderPredict } from './views/predict.js';
import { renderLevels } from './views/levels.js';

interface PageState {
  entries: AnalysisEntry[];
  currentKey: string | null;
  unit: AxisUnit;
  pickArmed: boolean;
  refitting: boolean;
  tab: 'analyse' | 'compare' | 'library' | 'predict' | 'levels';
  /** The service has the results library (GET /api/v1/analyses answers). */
  libraryAvailable: boolean;
}

const state: PageState = { entries: [], currentKey: null, unit: 'cm-1', pickArmed: false, refitting: false, tab: 'analyse', libraryAvailable: false };

const byId = (id: string): HTMLElement => {
  const el = document.getElementById(id);
  if (el === null) throw new Error(`page element #${id} is missing`);
  return el;
};

function current(): AnalysisEntry | null {
  return state.entries.find((e) => e.key === state.currentKey) ?? null;
}

function errorText(error: ApiErrorBody): string {
  return error.path === '' ? error.message : `${error.message} (at ${error.path})`;
}

function asErrorBody(error: unknown): ApiErrorBody {
  if (error instanceof api.ApiError) return error.body;
  return { code: 'internal', message: 'Something went wrong in the page; reload it and try again.', path: '' };
}

/** A message at the top of the page that screen readers announce. */
function notify(message: string, kind: 'error' | 'info' = 'error'): void {
  const notice = byId('notice');
  notice.replaceChildren(message === '' ? '' : h('div', { class: `notice ${kind}` }, h('span', {}, message), h('button', { type: 'button', class: 'button small', id: 'notice-close', onclick: () => notify('') }, 'Dismiss')));
}

async function analyseFiles(files: File[], details: SampleDetails): Promise<void> {
  await analyseEntries(files.map((file) => ({ file, name: file.name, details })));
}

/** Analyses other columns of an entry's file (a file with several spectra), each as an entry of its own. */
async function analyseColumns(source: AnalysisEntry, columns: number[]): Promise<void> {
  const file = source.file;
  if (file === null) return;
  const all = source.result?.spectrum.columns;
  await analyseEntries(columns.map((column) => ({ file, name: `${file.name} #${column}`, details: { ...source.details, column: String(column) }, ...(all !== undefined && { sibling: { column, columns: all } }) })));
}

/**
 * A column of a file with several spectra, analysed on its own: the service
 * then reads that column alone and lists no others, so the page keeps the
 * file's list (from the first analysis) to say which of how many it is.
 */
interface SiblingColumn {
  column: number;
  columns: Array<{ column: number; name: string }>;
}

async function analyseEntries(requests: Array<{ file: File; name: string; details: SampleDetails; sibling?: SiblingColumn }>): Promise<void> {
  const entries = requests.map(({ file, name, details, sibling }) => {
    const entry: AnalysisEntry = {
      key: nextKey(), fileName: name, file, details: { ...details }, status: 'pending', result: null, error: null, fit: null,
      originalFit: null, bands: [], cOverB: details.cOverB, freeC: details.freeC, shownAlternative: null, libraryId: null,
    };
    return { file, entry, sibling };
  });
  state.entries.push(...entries.map((e) => e.entry));
  if (entries[0] !== undefined) state.currentKey = entries[0].entry.key;
  render();
  await Promise.all(
    entries.map(async ({ file, entry, sibling }) => {
      try {
        const result = await api.analyze(file, entry.details);
        if (sibling !== undefined && result.spectrum.columns === undefined) {
          result.spectrum.columns = sibling.columns;
          result.spectrum.column ??= sibling.column;
        }
        entry.result = result;
        entry.fit = result.fit;
        entry.originalFit = result.fit;
        entry.bands = editableBandsFromResult(result.bands);
        entry.status = 'done';
      } catch (error) {
        entry.status = 'failed';
        entry.error = asErrorBody(error);
      }
      render();
    }),
  );
}

async function refit(entry: AnalysisEntry): Promise<void> {
  state.refitting = true;
  render();
  const tetragonal = entry.symmetry === 'tetragonal';
  try {
    if (tetragonal) {
      const request = tetragonalFitRequestFor(entry);
      entry.tetragonalFit = await api.fitTetragonal(request);
      entry.tetragonalFitFor = JSON.stringify(request);
    } else {
      entry.fit = await api.fit(fitRequestFor(entry));
      entry.shownAlternative = null;
    }
    notify('');
  } catch (error) {
    notify(`${tetragonal ? 'Tetragonal fit' : 'Refit'} failed: ${errorText(asErrorBody(error))}`);
  } finally {
    state.refitting = false;
    // The Refit button was disabled while it ran, which drops the keyboard focus: give it back (the tetragonal result takes it below).
    const focusLost = document.activeElement === document.body || document.activeElement === null;
    render();
    if (focusLost) document.getElementById('refit')?.focus({ preventScroll: true });
  }
  // The tetragonal result is drawn above the cubic cards, far from the Refit button: take the reader there.
  if (tetragonal && entry.tetragonalFit && state.currentKey === entry.key && state.tab === 'analyse') {
    const panel = document.getElementById('tetragonal-fit');
    panel?.scrollIntoView({ block: 'start' });
    panel?.focus({ preventScroll: true });
  }
}

function patchBand(entry: AnalysisEntry, index: number, patch: Partial<EditableBand>): void {
  const band = entry.bands[index];
  if (band !== undefined) entry.bands[index] = { ...band, ...patch };
  render();
}

function addBand(entry: AnalysisEntry, position: number): void {
  const range = entry.result?.spectrum.range;
  if (range !== undefined && (position < range[0] || position > range[1])) {
    notify(`${Math.round(position)} cm⁻¹ is outside the measured range ${Math.round(range[0])}–${Math.round(range[1])} cm⁻¹.`);
    return;
  }
  entry.bands.push({ position: Math.round(position), uncertainty: null, epsilon: null, width: null, kind: 'd-d', shoulder: false, included: true, origin: 'added', sourceIndex: null });
  entry.bands.sort((a, b) => a.position - b.position);
  state.pickArmed = false;
  notify('');
  render();
}

/** The bands or C/B have changed since the tetragonal fit shown. */
function tetragonalFitIsStale(entry: AnalysisEntry): boolean {
  return entry.tetragonalFitFor !== JSON.stringify(tetragonalFitRequestFor(entry));
}

function renderMain(root: HTMLElement): void {
  const entry = current();
  if (entry === null) {
    root.replaceChildren(
      h('section', { class: 'panel intro' }, h('h2', {}, 'Start here'), h('p', {}, 'Choose or drop one or more absorption spectra on the left, say which metal ion and geometry they are, and press Analyse. fieldgap finds the bands, assigns them to ligand-field transitions and reports 10Dq, the Racah parameters B and C, β and the spin state.'), h('p', { class: 'muted' }, 'To try it: the project folder spectra-demo/ holds invented Cr³⁺ spectra (not measurements) at 0.05 mol L⁻¹; give the ion as Cr3+.')),
    );
    return;
  }
  const title = h('h2', { id: 'result-title' }, entry.details.sample || entry.fileName, entry.details.ligand === '' ? '' : h('span', { class: 'muted' }, ` · ${entry.details.ligand}`));
  if (entry.status === 'pending') {
    root.replaceChildren(title, h('p', { class: 'busy', role: 'status' }, `Analysing ${entry.fileName}…`));
    return;
  }
  if (entry.status === 'failed' || entry.result === null) {
    const error = entry.error ?? { code: 'internal', message: 'No result.', path: '' };
    root.replaceChildren(title, h('div', { class: 'error-box', role: 'alert', id: 'analysis-error' }, h('h3', {}, `${entry.fileName} could not be analysed`), h('p', {}, error.message), error.path === '' ? null : h('p', {}, 'Where: ', h('code', {}, error.path))));
    return;
  }
  const fit = shownFit(entry);
  const warnings = warningsFor(entry);
  const stem = safeFileStem(entry.fileName);
  const subtitle = fit === null ? 'No ligand-field fit for this spectrum.' : `${fit.ion ?? entry.details.ion ?? ''} ${dCountText(fit.d)}, ${fit.geometry}${entry.shownAlternative === null ? '' : ` — showing alternative ${entry.shownAlternative + 1}`}`;
  root.replaceChildren(
    title,
    h('p', { class: 'subtitle', id: 'result-subtitle' }, subtitle, h('span', { class: 'muted' }, ` · ${entry.fileName}, ${entry.result.spectrum.points} points`)),
    columnsPanel(entry, state.entries, { onAnalyse: (columns) => void analyseColumns(entry, columns), onSelect: (key) => { state.currentKey = key; render(); } }) ?? '',
    keptPanel('warnings', [entry, JSON.stringify(warnings)], () => warningsBox(warnings)) ?? '',
    entry.symmetry === 'tetragonal' && entry.tetragonalFit ? keptPanel('tetragonal', [entry.tetragonalFit, tetragonalFitIsStale(entry)], () => tetragonalPanel(entry.tetragonalFit!, { stale: tetragonalFitIsStale(entry), onShowLevels: () => showLevelsOf(entry) })) : '',
    fit === null ? '' : keptPanel('cards', [entry.fit, entry.shownAlternative, entry.originalFit], () => parameterCards(fit, entry.originalFit)),
    keptPanel('notes', [entry.fit, entry.shownAlternative], () => notesBox(fit?.notes ?? [])) ?? '',
    h(
      'div',
      { class: 'toolbar downloads' },
      h('button', { type: 'button', class: 'button small', id: 'download-json', onclick: () => download(`${stem}-fieldgap.json`, resultJson(entry), 'application/json') }, 'Download JSON'),
      h('button', { type: 'button', class: 'button small', id: 'download-csv', onclick: () => download(`${stem}-fieldgap.csv`, resultCsv(entry), 'text/csv') }, 'Download CSV'),
      ...(state.libraryAvailable ? saveControls(entry, libraryContext) : []),
    ),
    ...spectrumFigures(entry, state.unit, state.pickArmed, {
      onUnit: (unit) => { state.unit = unit; render(); },
      onPick: (position) => addBand(entry, position),
    }),
    fit === null ? '' : keptPanel('assignments', [entry.fit, entry.shownAlternative], () => h('section', { class: 'panel' }, assignmentTable(fit))),
    keptPanel('alternatives', [entry, entry.fit, entry.shownAlternative], () => alternativesPanel(entry, { onShowAlternative: (index) => { entry.shownAlternative = index; render(); } })) ?? '',
    diagramFigure(entry) ?? '',
    // The C/B and free-C fields write to the entry without a render; their values are inputs all the same.
    keptPanel('bands', [entry, entry.result, JSON.stringify(entry.bands), entry.fit, entry.shownAlternative, state.pickArmed, state.refitting, entry.cOverB, entry.freeC, entry.symmetry, entry.tetragonalFit, entry.zeta?.mode], () => bandsPanel(entry, state.pickArmed, state.refitting, {
      onPatch: (index, patch) => patchBand(entry, index, patch),
      onDelete: (index) => { entry.bands.splice(index, 1); render(); },
      onAdd: (position) => addBand(entry, position),
      onArmPick: (armed) => { state.pickArmed = armed; render(); if (armed) byId('spectrum-figure').scrollIntoView({ block: 'nearest' }); },
      onCOverB: (value) => { entry.cOverB = value; },
      onFreeC: (value) => { entry.freeC = value; },
      onSymmetry: (value) => { entry.symmetry = value; render(); },
      onZeta: (value) => { const redraw = value.mode !== (entry.zeta ?? { mode: 'off' }).mode; entry.zeta = value; if (redraw) render(); },
      onRefit: () => void refit(entry),
      onUndo: () => {
        if (entry.result === null) return;
        entry.bands = editableBandsFromResult(entry.result.bands);
        entry.fit = entry.originalFit;
        entry.cOverB = entry.details.cOverB;
        entry.freeC = entry.details.freeC;
        entry.shownAlternative = null;
        entry.symmetry = 'cubic';
        entry.tetragonalFit = null;
        entry.zeta = { mode: 'off' };
        render();
      },
    })),
  );
}

let upload: ReturnType<typeof createUploadPanel> | null = null;

function render(): void {
  keepingFocus(() => {
    upload?.renderEntries(state.entries, state.currentKey);
    if (state.tab === 'analyse') renderMain(byId('main'));
    if (state.tab === 'library') renderLibrary(byId('view-library'), libraryContext, seriesPanel);
    if (state.tab === 'predict') renderPredict(byId('view-predict'), state.libraryAvailable);
    if (state.tab === 'compare') renderCompare(byId('view-compare'), state.entries, state.unit, (unit) => { state.unit = unit; render(); });
    if (state.tab === 'levels') renderLevels(byId('view-levels'));
  });
}

const tabs = setupTabs((tab) => { state.tab = tab; render(); });

/** The Levels view, computed at the entry's tetragonal fit. */
function showLevelsOf(entry: AnalysisEntry): void {
  const fit = entry.tetragonalFit;
  if (!fit) return;
  tabs.select('levels');
  showFittedLevels(fit);
}

const libraryContext: LibraryContext = {
  open(entry) {
    state.entries.push(entry);
    state.currentKey = entry.key;
    tabs.select('analyse');
  },
  notify,
  changed: render,
  entries: () => state.entries,
};

function start(): void {
  upload = createUploadPanel(byId('side'), {
    onAnalyse: (files, details) => void analyseFiles(files, details),
    onSelect: (key) => { state.currentKey = key; state.pickArmed = false; render(); byId('main').focus({ preventScroll: true }); },
  });
  document.addEventListener('keydown', (event) => {
    if (event.key === 'Escape' && state.pickArmed) { state.pickArmed = false; render(); }
  });
  void api.uploadLimit().then((bytes) => upload?.setUploadLimit(bytes));
  void api.libraryAvailable().then((available) => {
    state.libraryAvailable = available;
    if (available) tabs.enable('library');
    render();
  });
  render();
}

start();
