/**
 * The three plots of one analysis (spectrum with bands, residuals, energy
 * levels), each with its toolbar: axis unit, zoom reset, PNG and SVG.
 */
import * as api from '../api.js';
import { download, h } from '../dom.js';
import { safeFileStem } from '../format.js';
import type { AnalysisEntry } from '../state.js';
import { shownFit } from '../state.js';
import type { Diagram, FitResult } from '../types.js';
import { PlotFrame } from '../plots/frame.js';
import type { PlotSpec } from '../plots/spec.js';
import { svgFromSpec } from '../plots/svg.js';
import type { AxisUnit } from '../plots/spectrum-spec.js';
import { residualSpec, spectrumSpec } from '../plots/spectrum-spec.js';
import { diagramRangeFor, diagramSpec } from '../plots/diagram-spec.js';

export interface PlotHandlers {
  onUnit(unit: AxisUnit): void;
  /** Position in cm-1 clicked while adding a band. */
  onPick(wavenumber: number): void;
}

const frames = new Map<string, PlotFrame>();
const diagramCache = new Map<string, Promise<Diagram>>();

function destroyFrame(id: string): void {
  frames.get(id)?.destroy();
  frames.delete(id);
}

function toolbar(id: string, stem: string, extra: HTMLElement[] = []): HTMLElement {
  const frame = (): PlotFrame | undefined => frames.get(id);
  return h(
    'div',
    { class: 'toolbar', role: 'toolbar', 'aria-label': `${id} plot tools` },
    ...extra,
    h('button', { type: 'button', class: 'button small', id: `${id}-reset`, onclick: () => frame()?.resetZoom() }, 'Reset zoom'),
    h('button', { type: 'button', class: 'button small', id: `${id}-png`, onclick: () => { const f = frame(); if (f) download(`${stem}-${id}.png`, f.toPng(), 'image/png'); } }, 'PNG'),
    h('button', { type: 'button', class: 'button small', id: `${id}-svg`, onclick: () => { const f = frame(); if (f) download(`${stem}-${id}.svg`, svgFromSpec(f.spec, { xRange: f.xRange(), yRange: f.yRange() }), 'image/svg+xml'); } }, 'SVG'),
  );
}

function figure(id: string, title: string, tools: HTMLElement, note?: string): { element: HTMLElement; host: HTMLElement } {
  const host = h('div', { class: 'plot', id: `${id}-plot`, role: 'img', 'aria-label': title });
  const element = h(
    'figure',
    { class: 'panel figure', id: `${id}-figure` },
    h('figcaption', {}, h('h3', {}, title), tools),
    host,
    note === undefined ? null : h('p', { class: 'muted small' }, note),
  );
  return { element, host };
}

function mount(id: string, host: HTMLElement, spec: PlotSpec, onPick?: (x: number) => void): void {
  destroyFrame(id);
  // Build after layout so the plot takes the width of its column.
  requestAnimationFrame(() => {
    destroyFrame(id);
    frames.set(id, new PlotFrame(host, spec, onPick === undefined ? {} : { onPick }));
  });
}

export function spectrumFigures(entry: AnalysisEntry, unit: AxisUnit, pickArmed: boolean, handlers: PlotHandlers): HTMLElement[] {
  const result = entry.result;
  const curves = result?.curves;
  const stem = safeFileStem(entry.fileName);
  if (result === null || curves === undefined || curves.grid.length === 0) {
    destroyFrame('spectrum');
    destroyFrame('residuals');
    return [h('p', { class: 'muted' }, 'The service sent no curves for this spectrum, so there is nothing to plot.')];
  }
  const fit = shownFit(entry);
  const unitSwitch = h(
    'div',
    { class: 'segmented', role: 'group', 'aria-label': 'x axis unit' },
    ...(['cm-1', 'nm'] as const).map((u) =>
      h('button', { type: 'button', class: 'button small', id: `unit-${u}`, 'aria-pressed': String(unit === u), onclick: () => handlers.onUnit(u) }, u === 'nm' ? 'nm' : 'cm⁻¹'),
    ),
  );
  const spectrum = figure('spectrum', 'Spectrum, baseline and fitted bands', toolbar('spectrum', stem, [unitSwitch]), pickArmed ? 'Click where the new band has its maximum.' : 'Drag across the plot to zoom; double-click or Reset zoom to see it all.');
  if (pickArmed) spectrum.host.classList.add('picking');
  const spec = spectrumSpec({
    title: entry.details.sample || entry.fileName,
    curves,
    signalUnit: result.spectrum.signalUnit,
    bands: entry.bands,
    assignments: fit?.assignments ?? [],
    masked: result.spectrum.masked,
    unit,
  });
  mount('spectrum', spectrum.host, spec, (x) => {
    if (pickArmed) handlers.onPick(unit === 'nm' ? 1e7 / x : x);
  });
  const out = [spectrum.element];
  const residual = residualSpec(`Residuals of ${entry.fileName}`, curves, unit, result.spectrum.signalUnit);
  if (residual !== null) {
    const residuals = figure('residuals', 'Residuals: measured − (baseline + bands)', toolbar('residuals', stem));
    mount('residuals', residuals.host, residual);
    out.push(residuals.element);
  } else {
    destroyFrame('residuals');
  }
  return out;
}

/** The fitted Dq/B, or null when the fit did not determine B. */
function fittedDqOverB(fit: FitResult): number | null {
  return fit.b !== null && fit.b > 0 ? fit.dq / fit.b : null;
}

/** C/B used by the analysis when the fit reports none (src/analysis.ts: free-ion ratio, else 4.5). */
const FALLBACK_C_OVER_B = 4.5;

function diagramKey(fit: FitResult): api.DiagramQuery {
  const cOverB = fit.cOverB ?? (fit.b !== null && fit.c !== null && fit.b > 0 ? fit.c / fit.b : FALLBACK_C_OVER_B);
  return { d: fit.d, geometry: fit.geometry, cOverB: Number(cOverB.toFixed(3)), maxDqOverB: diagramRangeFor(fittedDqOverB(fit) ?? 0), steps: 160 };
}

export function diagramFigure(entry: AnalysisEntry): HTMLElement | null {
  const fit = shownFit(entry);
  if (fit === null) {
    destroyFrame('diagram');
    return null;
  }
  const stem = safeFileStem(entry.fileName);
  const { element, host } = figure('diagram', 'Energy levels (E/B against Dq/B) at the fitted C/B', toolbar('diagram', stem), 'Strong lines: levels of the ground-state spin; points: the observed bands on their assigned levels.');
  host.append(h('p', { class: 'muted', id: 'diagram-status' }, 'Computing the levels…'));
  const query = diagramKey(fit);
  const key = JSON.stringify(query);
  let pending = diagramCache.get(key);
  if (pending === undefined) {
    pending = api.diagram(query);
    diagramCache.set(key, pending);
    pending.catch(() => diagramCache.delete(key));
  }
  pending.then(
    (diagram) => {
      if (!host.isConnected) return;
      const spec = diagramSpec({ diagram, dqOverB: fittedDqOverB(fit), b: fit.b, assignments: fit.assignments });
      mount('diagram', host, spec);
    },
    (error: unknown) => {
      const message = error instanceof api.ApiError ? `${error.body.message}${error.body.path === '' ? '' : ` (${error.body.path})`}` : 'The diagram could not be computed.';
      host.replaceChildren(h('p', { class: 'error' }, message));
    },
  );
  return element;
}
