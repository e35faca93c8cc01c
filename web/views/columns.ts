/**
 * A file with several spectra (y columns): the page says, in the list and
 * above the result, that the file holds N spectra and which one is shown;
 * the panel switches to a column already analysed and analyses another, or
 * every other one, as the CLI's batch does. Each column becomes an entry of
 * its own in the list.
 */
import { h } from '../dom.js';
import type { AnalysisEntry } from '../state.js';

export interface ColumnsHandlers {
  /** Analyse these columns of the entry's file, each as a new entry. */
  onAnalyse(columns: number[]): void;
  /** Show the entry of another column already analysed. */
  onSelect(key: string): void;
}

/** The y column an entry shows (1-based), when its file holds several spectra. */
export function shownColumn(entry: AnalysisEntry): { column: number; name: string; count: number } | null {
  const columns = entry.result?.spectrum.columns;
  if (columns === undefined || columns.length < 2) return null;
  const column = entry.result?.spectrum.column ?? columns[0]!.column;
  const name = columns.find((c) => c.column === column)?.name ?? '';
  return { column, name, count: columns.length };
}

/** "spectrum 1 of 3: Cr-en absorbance" for the list of analyses; null for a file with one spectrum. */
export function columnNote(entry: AnalysisEntry): string | null {
  const shown = shownColumn(entry);
  if (shown === null) return null;
  return `spectrum ${shown.column} of ${shown.count}${shown.name === '' ? '' : `: ${shown.name}`}`;
}

/** Entries of the same uploaded file, by the column they show. */
function siblingsByColumn(entry: AnalysisEntry, entries: readonly AnalysisEntry[]): Map<number, AnalysisEntry> {
  const out = new Map<number, AnalysisEntry>();
  for (const other of entries) {
    if (other === entry || other.file === null || other.file !== entry.file) continue;
    const column = other.status === 'done' ? shownColumn(other)?.column : Number(other.details.column);
    if (column !== undefined && Number.isFinite(column) && !out.has(column)) out.set(column, other);
  }
  return out;
}

/** The panel, or null for a file with one spectrum (or an entry reopened without its file). */
export function columnsPanel(entry: AnalysisEntry, entries: readonly AnalysisEntry[], handlers: ColumnsHandlers): HTMLElement | null {
  const columns = entry.result?.spectrum.columns;
  const shown = shownColumn(entry);
  if (columns === undefined || shown === null) return null;
  const analysed = siblingsByColumn(entry, entries);
  const others = columns.filter((c) => c.column !== shown.column);
  const waiting = others.filter((c) => !analysed.has(c.column));
  const switches = others.filter((c) => analysed.has(c.column)).map((c) => {
    const other = analysed.get(c.column)!;
    return h('button', { type: 'button', class: 'button small', id: `show-column-${c.column}`, onclick: () => handlers.onSelect(other.key) }, `Show column ${c.column} (${c.name})`);
  });
  const choose = h(
    'select',
    { id: 'column-choice', 'aria-label': 'Column to analyse' },
    ...waiting.map((c) => h('option', { value: c.column }, `column ${c.column}: ${c.name}`)),
  );
  const canAnalyse = entry.file !== null && waiting.length > 0;
  return h(
    'section',
    { class: 'panel columns', id: 'columns-panel', role: 'status' },
    h('p', {}, h('strong', {}, `This file holds ${columns.length} spectra; this is column ${shown.column}${shown.name === '' ? '' : ` (${shown.name})`}.`),
      ' ', waiting.length === 0 ? 'Every column is analysed as its own entry in the list.' : `${waiting.length} of them ${waiting.length === 1 ? 'is' : 'are'} not analysed yet.`),
    h(
      'div',
      { class: 'toolbar' },
      ...switches,
      canAnalyse ? choose : null,
      canAnalyse ? h('button', { type: 'button', class: 'button small', id: 'analyse-column', onclick: () => handlers.onAnalyse([Number(choose.value)]) }, 'Analyse this column') : null,
      canAnalyse ? h('button', { type: 'button', class: 'button small primary', id: 'analyse-each-column', onclick: () => handlers.onAnalyse(waiting.map((c) => c.column)) }, waiting.length === 1 ? 'Analyse the other one' : `Analyse each of the other ${waiting.length}`) : null,
    ),
  );
}
