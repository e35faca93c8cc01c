/**
 * The ligand series of one metal ion from the library (GET /api/v1/series):
 * the spectrochemical (10Dq) and nephelauxetic (1 − β) rankings with
 * error bars, neighbours that are not resolved flagged, and the ligand
 * factors f and h fitted from the user's own analyses.
 */
import * as api from '../api.js';
import { download, h } from '../dom.js';
import { UNIT, formatNumber, formatWithUncertainty } from '../format.js';
import { PlotFrame } from '../plots/frame.js';
import { rankingSpec } from '../plots/series-spec.js';
import { svgFromSpec } from '../plots/svg.js';
import type { LibraryRow, Ranking, SeriesReport } from '../types.js';
import { csvText } from '../../src/report/csv.js';

const frames: PlotFrame[] = [];

/** CSV of both rankings: one row per analysis and ranking. */
export function seriesCsv(report: SeriesReport): string {
  const header = ['ranking', 'position', 'sample', 'ligand', 'quantity', 'value', 'sd', 'not resolved from next'];
  const rows: (string | number)[][] = [];
  for (const ranking of [report.spectrochemical, report.nephelauxetic]) {
    for (const e of ranking.entries) rows.push([ranking.kind, e.position, e.sample, e.ligandLabel, ranking.quantity, e.value, e.uncertainty, e.overlapsNext ? 'yes' : 'no']);
  }
  return csvText(header, rows, { newline: '\n' });
}

function rankingBlock(ranking: Ranking, id: string): HTMLElement {
  const beta = ranking.kind === 'nephelauxetic';
  const host = h('div', { class: 'plot', id: `${id}-plot`, role: 'img', 'aria-label': `${ranking.kind} ranking plot` });
  const spec = rankingSpec(ranking);
  const block = h(
    'section',
    { class: 'panel', id },
    h('h3', {}, beta ? 'Nephelauxetic series (by 1 − β)' : 'Spectrochemical series (by 10Dq)'),
    h('p', { class: 'series-line' }, ranking.series || '—'),
    h('p', { class: 'muted small' }, `Weakest first; “~” joins neighbours not resolved within ${ranking.criterion === 'two-sigma' ? 'two' : 'one'} standard deviation of their difference.`),
    h(
      'table',
      { class: 'data' },
      h('thead', {}, h('tr', {}, ...['#', 'Ligand', 'Sample', beta ? 'β' : `10Dq / ${UNIT.wavenumber}`, ''].map((t) => h('th', { scope: 'col' }, t)))),
      h(
        'tbody',
        {},
        ...ranking.entries.map((e) =>
          h(
            'tr',
            {},
            h('td', {}, String(e.position)),
            h('th', { scope: 'row' }, e.ligandLabel),
            h('td', {}, e.sample),
            h('td', { class: 'num' }, beta ? formatWithUncertainty(1 - e.value, e.uncertainty, 3) : formatWithUncertainty(e.value, e.uncertainty)),
            h('td', { class: 'overlap' }, e.overlapsNext ? 'not resolved from the next' : ''),
          ),
        ),
      ),
    ),
    ranking.skipped.length === 0 ? '' : h('p', { class: 'muted small' }, `Left out: ${ranking.skipped.map((s) => `${s.sample} (${s.reason})`).join('; ')}`),
    h(
      'div',
      { class: 'toolbar' },
      h('button', { type: 'button', class: 'button small', id: `${id}-png`, onclick: () => { const f = frames.find((x) => x.spec === spec); if (f) download(`${id}.png`, f.toPng(), 'image/png'); } }, 'PNG'),
      h('button', { type: 'button', class: 'button small', id: `${id}-svg`, onclick: () => { const f = frames.find((x) => x.spec === spec); if (f) download(`${id}.svg`, svgFromSpec(spec, { xRange: f.xRange(), yRange: f.yRange() }), 'image/svg+xml'); } }, 'SVG'),
    ),
    host,
  );
  if (ranking.entries.length > 0) requestAnimationFrame(() => frames.push(new PlotFrame(host, spec, { height: 260 })));
  return block;
}

function factorsBlock(report: SeriesReport): HTMLElement | null {
  const factors = report.factors;
  if (factors === null || factors.factors.length === 0) return null;
  return h(
    'section',
    { class: 'panel', id: 'series-factors' },
    h('h3', {}, `Ligand factors f and h from these analyses (g = ${formatNumber(factors.g)} ${UNIT.wavenumber}${factors.k === undefined ? '' : `, k = ${formatNumber(factors.k, 2)}`})`),
    h('p', { class: 'muted small' }, `g and k: ${factors.source}`),
    h(
      'table',
      { class: 'data' },
      h('thead', {}, h('tr', {}, ...['Ligand', 'f', 'f tabulated', 'h', 'h tabulated'].map((t) => h('th', { scope: 'col' }, t)))),
      h(
        'tbody',
        {},
        ...factors.factors.map((f) =>
          h(
            'tr',
            {},
            h('th', { scope: 'row' }, f.ligand),
            h('td', { class: 'num' }, formatWithUncertainty(f.f, f.fUncertainty ?? null, 2)),
            h('td', { class: 'num' }, formatNumber(f.tabulatedF, 2)),
            h('td', { class: 'num' }, f.h === undefined ? '—' : formatWithUncertainty(f.h, f.hUncertainty ?? null, 2)),
            h('td', { class: 'num' }, formatNumber(f.tabulatedH, 2)),
          ),
        ),
      ),
    ),
  );
}

export function seriesPanel(rows: readonly LibraryRow[]): HTMLElement | null {
  const ions = [...new Set(rows.map((r) => r.ion).filter((ion): ion is string => ion !== undefined && ion !== ''))].sort();
  if (ions.length === 0) return null;
  while (frames.length > 0) frames.pop()!.destroy();
  const select = h('select', { id: 'series-ion' }, ...ions.map((ion) => h('option', { value: ion }, ion)));
  const out = h('div', { id: 'series-body' });
  const show = (): void => {
    while (frames.length > 0) frames.pop()!.destroy();
    out.replaceChildren(h('p', { class: 'muted' }, 'Ranking…'));
    api.series(select.value).then(
      (report) => {
        out.replaceChildren(
          h('p', {}, `${report.count} analys${report.count === 1 ? 'is' : 'es'} of ${report.ion}.`, ' ', h('button', { type: 'button', class: 'button small', id: 'series-csv', onclick: () => download(`series-${report.ion}.csv`, seriesCsv(report), 'text/csv') }, 'Download CSV')),
          h('div', { class: 'ranking' }, rankingBlock(report.spectrochemical, 'series-tendq'), rankingBlock(report.nephelauxetic, 'series-beta')),
          factorsBlock(report) ?? '',
          report.notes.length + report.skipped.length === 0 ? '' : h('ul', { class: 'muted small' }, ...report.skipped.map((s) => h('li', {}, `${s.sample}: ${s.reason}`)), ...report.notes.map((n) => h('li', {}, n))),
        );
      },
      (error: unknown) => {
        const body = error instanceof api.ApiError ? error.body : { message: 'The series could not be made.', path: '' };
        out.replaceChildren(h('p', { class: 'error', role: 'alert' }, body.message));
      },
    );
  };
  select.addEventListener('change', show);
  show();
  return h('section', { class: 'panel', id: 'series' }, h('h2', {}, 'Ligand series'), h('div', { class: 'inline' }, h('label', { for: 'series-ion' }, 'Metal ion'), select), out);
}
