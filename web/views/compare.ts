/**
 * Several analyses side by side: a compact table of their parameters and
 * an overlay of the spectra, each scaled to its maximum.
 */
import { download, h } from '../dom.js';
import { UNIT, formatNumber, formatWithUncertainty, spinStateText } from '../format.js';
import type { AnalysisEntry } from '../state.js';
import { shownFit } from '../state.js';
import { PlotFrame } from '../plots/frame.js';
import { svgFromSpec } from '../plots/svg.js';
import type { AxisUnit } from '../plots/spectrum-spec.js';
import { overlaySpec } from '../plots/spectrum-spec.js';
import { csvText, type CsvCell } from '../../src/report/csv.js';
import { resultsTableCsv } from '../export-results.js';

let frame: PlotFrame | null = null;
/** The overlay's plot host, kept with its chart across renders so the zoom survives. */
let host: HTMLElement | null = null;

function name(entry: AnalysisEntry): string {
  return entry.details.sample || entry.fileName;
}

/** CSV of the comparison table: one row per analysis, cm-1. */
export function comparisonCsv(entries: readonly AnalysisEntry[]): string {
  const header = ['sample', 'file', 'ligand', 'ion', 'd', 'geometry', '10Dq (cm-1)', 'u(10Dq) (cm-1)', 'B (cm-1)', 'u(B) (cm-1)', 'C (cm-1)', 'beta', 'spin state', 'rms residual (cm-1)'];
  const rows: CsvCell[][] = [];
  for (const entry of entries) {
    const fit = shownFit(entry);
    rows.push([name(entry), entry.fileName, entry.details.ligand, fit?.ion ?? entry.details.ion, fit?.d ?? entry.details.d, fit?.geometry ?? entry.details.geometry, fit?.tenDq ?? null, fit?.uncertainty.tenDq ?? null, fit?.b ?? null, fit?.uncertainty.b ?? null, fit?.c ?? null, fit?.beta ?? null, fit?.spinState ?? null, fit?.rmsResidual ?? null]);
  }
  return csvText(header, rows, { newline: '\n' });
}

export function renderCompare(root: HTMLElement, entries: readonly AnalysisEntry[], unit: AxisUnit, onUnit: (unit: AxisUnit) => void): void {
  const done = entries.filter((e) => e.status === 'done');
  if (done.length === 0) {
    frame?.destroy();
    frame = null;
    root.replaceChildren(h('h2', {}, 'Compare analyses'), h('p', { class: 'muted' }, 'Analyse two or more spectra (several files can be chosen at once) to compare them here.'));
    return;
  }
  const table = h(
    'table',
    { class: 'data', id: 'compare-table' },
    h('caption', {}, 'Parameters of each analysis (the fit shown on its page)'),
    h(
      'thead',
      {},
      h('tr', {}, ...['Sample', 'Ligand', 'Ion', 'Geometry', `10Dq / ${UNIT.wavenumber}`, `B / ${UNIT.wavenumber}`, `C / ${UNIT.wavenumber}`, 'β', 'Spin state', `RMS / ${UNIT.wavenumber}`].map((t) => h('th', { scope: 'col' }, t))),
    ),
    h(
      'tbody',
      {},
      ...done.map((entry) => {
        const fit = shownFit(entry);
        return h(
          'tr',
          {},
          h('th', { scope: 'row' }, name(entry)),
          h('td', {}, entry.details.ligand || '—'),
          h('td', {}, fit?.ion ?? (entry.details.ion || (fit === null ? '—' : `d${fit.d}`))),
          h('td', {}, fit?.geometry ?? entry.details.geometry),
          h('td', { class: 'num' }, fit === null ? 'no fit' : formatWithUncertainty(fit.tenDq, fit.uncertainty.tenDq)),
          h('td', { class: 'num' }, fit === null ? '—' : formatWithUncertainty(fit.b, fit.uncertainty.b)),
          h('td', { class: 'num' }, fit === null ? '—' : formatWithUncertainty(fit.c, fit.uncertainty.c)),
          // β with its ± as on the result cards and in the library.
          h('td', { class: 'num' }, fit === null || fit.beta === null ? '—' : formatWithUncertainty(fit.beta, fit.betaSd ?? null, 2)),
          h('td', {}, fit === null ? '—' : spinStateText(fit.spinState)),
          h('td', { class: 'num' }, fit === null ? '—' : formatNumber(fit.rmsResidual)),
        );
      }),
    ),
  );
  const withCurves = done.filter((e) => e.result?.curves !== undefined);
  const plotHost = host ?? h('div', { class: 'plot', id: 'overlay-plot', role: 'img', 'aria-label': 'Overlay of the spectra' });
  host = plotHost;
  const spec = overlaySpec(withCurves.map((e) => ({ name: name(e), curves: e.result!.curves! })), unit);
  const tools = h(
    'div',
    { class: 'toolbar', role: 'toolbar', 'aria-label': 'overlay plot tools' },
    ...(['cm-1', 'nm'] as const).map((u) => h('button', { type: 'button', class: 'button small', id: `overlay-unit-${u}`, 'aria-pressed': String(unit === u), onclick: () => onUnit(u) }, u === 'nm' ? 'nm' : 'cm⁻¹')),
    h('button', { type: 'button', class: 'button small', id: 'overlay-reset', onclick: () => frame?.resetZoom() }, 'Reset zoom'),
    h('button', { type: 'button', class: 'button small', id: 'overlay-png', onclick: () => { if (frame) download('comparison.png', frame.toPng(), 'image/png'); } }, 'PNG'),
    h('button', { type: 'button', class: 'button small', id: 'overlay-svg', onclick: () => { if (frame) download('comparison.svg', svgFromSpec(frame.spec, { xRange: frame.xRange(), yRange: frame.yRange() }), 'image/svg+xml'); } }, 'SVG'),
  );
  root.replaceChildren(
    h('h2', {}, 'Compare analyses'),
    h('section', { class: 'panel' }, table, h('div', { class: 'toolbar' }, h('button', { type: 'button', class: 'button small', id: 'compare-csv', onclick: () => download('comparison.csv', comparisonCsv(done), 'text/csv') }, 'Download CSV'), h('button', { type: 'button', class: 'button small', id: 'compare-results-csv', title: 'The columns of analyze --csv and library export --columns results', onclick: () => download('results.csv', resultsTableCsv(done), 'text/csv') }, 'Results CSV'))),
    withCurves.length === 0 ? '' : h('figure', { class: 'panel figure' }, h('figcaption', {}, h('h3', {}, 'Spectra, each scaled to its maximum'), tools), plotHost),
  );
  // The kept chart takes the new data when its axis is the same; a new chart is built after layout otherwise.
  if (withCurves.length > 0 && (frame === null || !frame.update(spec))) requestAnimationFrame(() => { frame?.destroy(); frame = new PlotFrame(plotHost, spec); });
}
