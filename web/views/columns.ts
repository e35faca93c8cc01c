/**
 * A file with several spectra (y columns): the page says which column it
 * analysed and lets the user analyse another, or every one, as the CLI's
 * batch does. Each column becomes an entry of its own in the list.
 */
import { h } from '../dom.js';
import type { AnalysisEntry } from '../state.js';

export interface ColumnsHandlers {
  /** Analyse these columns of the entry's file, each as a new entry. */
  onAnalyse(columns: number[]): void;
}

/** The panel, or null for a file with one spectrum (or an entry reopened without its file). */
export function columnsPanel(entry: AnalysisEntry, handlers: ColumnsHandlers): HTMLElement | null {
  const columns = entry.result?.spectrum.columns;
  if (columns === undefined || columns.length < 2 || entry.file === null) return null;
  const analysed = entry.result?.spectrum.column ?? columns[0]?.column;
  const others = columns.filter((c) => c.column !== analysed);
  const choose = h(
    'select',
    { id: 'column-choice', 'aria-label': 'Column to analyse' },
    ...others.map((c) => h('option', { value: c.column }, `column ${c.column}: ${c.name}`)),
  );
  const current = columns.find((c) => c.column === analysed);
  return h(
    'section',
    { class: 'panel columns', id: 'columns-panel' },
    h('p', {}, `This file holds ${columns.length} spectra; this is column ${analysed}${current ? ` (${current.name})` : ''}.`),
    h(
      'div',
      { class: 'toolbar' },
      choose,
      h('button', { type: 'button', class: 'button small', id: 'analyse-column', onclick: () => handlers.onAnalyse([Number(choose.value)]) }, 'Analyse this column'),
      h('button', { type: 'button', class: 'button small', id: 'analyse-each-column', onclick: () => handlers.onAnalyse(others.map((c) => c.column)) }, `Analyse each of the other ${others.length}`),
    ),
  );
}
