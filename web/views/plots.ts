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
import { cOverBOfFit } from '../../src/band-fit-input.js';
import { PlotFrame } from '../plots/frame.js';
import type { PlotSpec } from '../plots/spec.js';
import { svgFromSpec } from '../plots/svg.js';
import { BoundedCache } from '../plots/lru.js';
import type { AxisUnit } from '../plots/spectrum-spec.js';
import { fromAxis, residualSpec, spectrumSpec } from '../plots/spectrum-spec.js';
import { diagramRangeFor, diagramSpec } from '../plots/diagram-spec.js';

export interface PlotHandlers {
  onUnit(unit: AxisUnit): void;
  /** Position in cm-1 clicked while adding a band. */
  onPick(wavenumber: number): void;
}

/**
 * One figure kept across renders: its element and plot host stay the same
 * DOM nodes while the analysis it shows (`owner`) stays the same, so the
 * chart keeps the user's zoom; only its caption is rebuilt.
 */
interface Slot {
  owner: string;
  element: HTMLElement;
  host: HTMLElement;
  frame: PlotFrame | null;
  /** The spec waiting for the next animation frame to build the chart. */
  pending: PlotSpec | null;
  /** What the chart was last drawn from; the same inputs skip the update. */
  inputs: readonly unknown[];
  /** The current click handler; the frame calls it through the slot. */
  pick: ((x: number) => void) | undefined;
  /** Bumped on each diagram request, so a late answer cannot overwrite a newer one. */
  generation: number;
}

const slots = new Map<string, Slot>();
/** Diagrams already asked for, by query; bounded so a long session does not keep every one. */
export const DIAGRAM_CACHE_LIMIT = 16;
const diagramCache = new BoundedCache<string, Promise<Diagram>>(DIAGRAM_CACHE_LIMIT);

function dropSlot(id: string): void {
  slots.get(id)?.frame?.destroy();
  slots.delete(id);
}

/** The slot for this figure and analysis; a new one (new nodes) when the analysis changed. */
function slotFor(id: string, owner: string): Slot {
  const known = slots.get(id);
  if (known !== undefined && known.owner === owner) return known;
  dropSlot(id);
  const host = h('div', { class: 'plot', id: `${id}-plot` });
  const slot: Slot = { owner, element: h('figure', { class: 'panel figure', id: `${id}-figure` }), host, frame: null, pending: null, inputs: [], pick: undefined, generation: 0 };
  slots.set(id, slot);
  return slot;
}

/** Whether two input lists hold the same objects (or equal plain values) in order. */
function sameInputs(a: readonly unknown[], b: readonly unknown[]): boolean {
  return a.length === b.length && a.every((v, i) => Object.is(v, b[i]));
}

function toolbar(id: string, stem: string, extra: HTMLElement[] = []): HTMLElement {
  const frame = (): PlotFrame | undefined => slots.get(id)?.frame ?? undefined;
  return h(
    'div',
    { class: 'toolbar', role: 'toolbar', 'aria-label': `${id} plot tools` },
    ...extra,
    h('button', { type: 'button', class: 'button small', id: `${id}-reset`, onclick: () => frame()?.resetZoom() }, 'Reset zoom'),
    h('button', { type: 'button', class: 'button small', id: `${id}-png`, onclick: () => { const f = frame(); if (f) download(`${stem}-${id}.png`, f.toPng(), 'image/png'); } }, 'PNG'),
    h('button', { type: 'button', class: 'button small', id: `${id}-svg`, onclick: () => { const f = frame(); if (f) download(`${stem}-${id}.svg`, svgFromSpec(f.spec, { xRange: f.xRange(), yRange: f.yRange() }), 'image/svg+xml'); } }, 'SVG'),
  );
}

/** Puts a fresh caption and note around the slot's kept plot host. */
function dress(slot: Slot, title: string, tools: HTMLElement, note?: string): HTMLElement {
  slot.host.setAttribute('role', 'img');
  slot.host.setAttribute('aria-label', title);
  slot.element.replaceChildren(h('figcaption', {}, h('h3', {}, title), tools), slot.host, note === undefined ? '' : h('p', { class: 'muted small' }, note));
  return slot.element;
}

/** Shows the spec in the slot: an update of the kept chart, else a new chart after layout. */
function show(id: string, slot: Slot, spec: PlotSpec): void {
  if (slot.frame !== null && slot.pending === null && slot.frame.update(spec, (x) => slot.pick?.(x))) return;
  const scheduled = slot.pending !== null;
  slot.pending = spec;
  if (scheduled) return;
  // Build after layout so the plot takes the width of its column.
  requestAnimationFrame(() => {
    const latest = slot.pending;
    slot.pending = null;
    if (slots.get(id) !== slot || latest === null) return;
    slot.frame?.destroy();
    slot.frame = new PlotFrame(slot.host, latest, { onPick: (x) => slot.pick?.(x) });
  });
}

export function spectrumFigures(entry: AnalysisEntry, unit: AxisUnit, pickArmed: boolean, handlers: PlotHandlers): HTMLElement[] {
  const result = entry.result;
  const curves = result?.curves;
  const stem = safeFileStem(entry.fileName);
  if (result === null || curves === undefined || curves.grid.length === 0) {
    dropSlot('spectrum');
    dropSlot('residuals');
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
  const slot = slotFor('spectrum', entry.key);
  const element = dress(slot, 'Spectrum, baseline and fitted bands', toolbar('spectrum', stem, [unitSwitch]), pickArmed ? 'Click where the new band has its maximum.' : 'Drag across the plot to zoom; double-click or Reset zoom to see it all.');
  slot.host.classList.toggle('picking', pickArmed);
  slot.pick = (x) => {
    if (pickArmed) handlers.onPick(fromAxis(x, unit));
  };
  const assignments = fit?.assignments ?? [];
  // The bands are edited in place, so they are compared by content.
  // shownFit makes a new object for an alternative on every call, so the fit is compared by its source.
  const inputs = [curves, unit, JSON.stringify(entry.bands), entry.fit, entry.shownAlternative, entry.details.sample, entry.fileName];
  if (!sameInputs(inputs, slot.inputs)) {
    slot.inputs = inputs;
    show('spectrum', slot, spectrumSpec({
      title: entry.details.sample || entry.fileName,
      curves,
      signalUnit: result.spectrum.signalUnit,
      bands: entry.bands,
      assignments,
      fit,
      masked: result.spectrum.masked,
      unit,
    }));
  }
  const out = [element];
  if (curves.model === undefined) {
    dropSlot('residuals');
    return out;
  }
  const residuals = slotFor('residuals', entry.key);
  out.push(dress(residuals, 'Residuals: measured − (baseline + bands)', toolbar('residuals', stem)));
  const residualInputs = [curves, unit, entry.fileName];
  if (!sameInputs(residualInputs, residuals.inputs)) {
    const residual = residualSpec(`Residuals of ${entry.fileName}`, curves, unit, result.spectrum.signalUnit);
    residuals.inputs = residualInputs;
    if (residual !== null) show('residuals', residuals, residual);
  }
  return out;
}

/** The fitted Dq/B, or null when the fit did not determine B. */
function fittedDqOverB(fit: FitResult): number | null {
  return fit.b !== null && fit.b > 0 ? fit.dq / fit.b : null;
}

function diagramKey(fit: FitResult): api.DiagramQuery {
  const cOverB = cOverBOfFit(fit);
  return { d: fit.d, geometry: fit.geometry, cOverB: Number(cOverB.toFixed(3)), maxDqOverB: diagramRangeFor(fittedDqOverB(fit) ?? 0), steps: 160 };
}

export function diagramFigure(entry: AnalysisEntry): HTMLElement | null {
  const fit = shownFit(entry);
  if (fit === null) {
    dropSlot('diagram');
    return null;
  }
  const stem = safeFileStem(entry.fileName);
  const slot = slotFor('diagram', entry.key);
  const element = dress(slot, 'Energy levels (E/B against Dq/B) at the fitted C/B', toolbar('diagram', stem), 'Strong lines: levels of the ground-state spin; points: the observed bands on their assigned levels.');
  const inputs = [entry.fit, entry.shownAlternative];
  if (sameInputs(inputs, slot.inputs)) return element;
  slot.inputs = inputs;
  if (slot.frame === null && slot.pending === null) slot.host.replaceChildren(h('p', { class: 'muted', id: 'diagram-status' }, 'Computing the levels…'));
  const query = diagramKey(fit);
  const key = JSON.stringify(query);
  let pending = diagramCache.get(key);
  if (pending === undefined) {
    pending = api.diagram(query);
    diagramCache.set(key, pending);
    pending.catch(() => diagramCache.delete(key));
  }
  const generation = ++slot.generation;
  const current = (): boolean => slots.get('diagram') === slot && slot.generation === generation;
  pending.then(
    (diagram) => {
      if (!current()) return;
      show('diagram', slot, diagramSpec({ diagram, dqOverB: fittedDqOverB(fit), b: fit.b, assignments: fit.assignments }));
    },
    (error: unknown) => {
      if (!current()) return;
      const message = error instanceof api.ApiError ? `${error.body.message}${error.body.path === '' ? '' : ` (${error.body.path})`}` : 'The diagram could not be computed.';
      slot.frame?.destroy();
      slot.frame = null;
      slot.pending = null;
      // A later render asks again rather than keep showing the error.
      slot.inputs = [];
      slot.host.replaceChildren(h('p', { class: 'error' }, message));
    },
  );
  return element;
}
