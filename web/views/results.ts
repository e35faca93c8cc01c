/**
 * The numbers of one analysis: warnings first, then 10Dq, B, C, β, spin
 * state and magnetism with uncertainties and units, the assignment table and
 * the close alternative assignments.
 */
import { poorFitText, priorStrainNote } from '../goodness-wording.js';
import { h } from '../dom.js';
import { NO_SPIN_STATE_CHOICE } from '../../src/report/spin-state-wording.js';
import { percentText as percentOf } from '../../src/report/probability.js';
import { UNIT, dCountText, formatNumber, formatWithUncertainty, levelLabel, nmFromWavenumber, spinStateText } from '../format.js';
import type { AnalysisEntry } from '../state.js';
import type { Alternative, FitResult } from '../types.js';
import { chemistWording, undeterminedDetail, undeterminedHeadline } from '../undetermined-wording.js';

export interface ResultHandlers {
  onShowAlternative(index: number | null): void;
}

/** The fit's remarks that are not warnings, kept out of the way. */
export function notesBox(notes: readonly string[]): HTMLElement | null {
  if (notes.length === 0) return null;
  return h('details', { class: 'notes', id: 'fit-notes' }, h('summary', {}, `Notes from the fit (${notes.length})`), h('ul', {}, ...notes.map((n) => h('li', {}, chemistWording(n)))));
}

export function warningsBox(messages: readonly string[]): HTMLElement | null {
  if (messages.length === 0) return null;
  return h(
    'div',
    { class: 'warnings', id: 'warnings', role: 'status' },
    h('h3', {}, messages.length === 1 ? 'Warning' : `${messages.length} warnings`),
    h('ul', {}, ...messages.map((m) => h('li', {}, chemistWording(m)))),
  );
}

export function card(id: string, name: string, value: string, unit: string, note?: string | HTMLElement, spread?: string): HTMLElement {
  return h(
    'div',
    { class: 'card', id },
    h('div', { class: 'card-name' }, name),
    h('div', { class: 'card-value' }, h('span', { class: 'value' }, value), unit === '' ? '' : h('span', { class: 'unit' }, ` ${unit}`)),
    note === undefined ? null : h('div', { class: 'card-note' }, note),
    spread === undefined ? null : h('div', { class: 'card-spread', id: `${id}-spread` }, spread),
  );
}

/** "was 17 400" under a value a correction changed. */
function previously(now: number | null, before: number | null | undefined, decimals: number): string | undefined {
  if (before === null || before === undefined || now === null) return undefined;
  if (Math.abs(now - before) < 0.5 * 10 ** -decimals) return undefined;
  return `was ${formatNumber(before, decimals)} before the corrections`;
}

export function parameterCards(fit: FitResult, original: FitResult | null): HTMLElement {
  const u = fit.uncertainty;
  return h(
    'div',
    { class: 'cards', id: 'parameters' },
    card('p-tendq', '10Dq', formatWithUncertainty(fit.tenDq, u.tenDq), UNIT.wavenumber, previously(fit.tenDq, original?.tenDq, 0), spreadNote(fit, 'tenDq')),
    card('p-b', 'Racah B', formatWithUncertainty(fit.b, u.b), UNIT.wavenumber, previously(fit.b, original?.b, 0), spreadNote(fit, 'b')),
    card('p-c', 'Racah C', formatWithUncertainty(fit.c, u.c), UNIT.wavenumber, `C/B = ${formatNumber(fit.cOverB, 2)}`),
    card('p-beta', 'β = B/B(free ion)', fit.beta === null ? '—' : formatWithUncertainty(fit.beta, fit.betaSd ?? null, 2), '', fit.freeIonB === null ? 'free-ion B not known for this ion' : `free-ion B = ${formatNumber(fit.freeIonB)} ${UNIT.wavenumber}`),
    card('p-spin', 'Spin state', spinStateText(fit.spinState), '', fit.spinState === 'no-choice' ? `${dCountText(fit.d)}: ${NO_SPIN_STATE_CHOICE} · ground term ${fit.groundTerm}` : `ground term ${fit.groundTerm}`),
    card('p-unpaired', 'Unpaired electrons', String(fit.unpairedElectrons), ''),
    card('p-moment', 'Spin-only moment', formatNumber(fit.spinOnlyMoment, 2), UNIT.moment),
    card('p-rms', 'RMS residual', formatNumber(fit.rmsResidual, fit.rmsResidual !== null && Math.abs(fit.rmsResidual) < 10 ? 1 : 0), UNIT.wavenumber, fitStatusNote(fit)),
    ...(fit.probability === undefined ? [] : [card('p-probability', 'Probability of this assignment', percentText(fit.probability), '', spinStateProbabilityNote(fit))]),
  );
}

/**
 * "7198–8411 over the weak-band labellings (fit alone ± 529)" under 10Dq or B
 * when the ± was widened by that spread (src/fit/assignment-spread.ts).
 */
function spreadNote(fit: FitResult, which: 'tenDq' | 'b'): string | undefined {
  const s = fit.assignmentSpread;
  if (!s?.widened) return undefined;
  const range = which === 'tenDq' ? s.tenDqRange : s.bRange;
  const sd = which === 'tenDq' ? s.fitUncertainty.tenDq : s.fitUncertainty.b;
  if (!range || sd === null || range[0] === range[1]) return undefined;
  return `${formatNumber(range[0])}–${formatNumber(range[1])} over the weak-band labellings (fit alone ± ${formatNumber(sd)}); the ± covers both`;
}

/** 0.973 → "97 %"; below 0.1 % → "< 0.1 %" (src/report's wording, with the page's space before %). */
const percentText = (p: number): string => percentOf(p, { space: true });

/**
 * Under the probability: "high spin 99 % · low spin 1 %" where the ion has a
 * choice, and one short line naming what the bands do not fix (10Dq, B),
 * with the reasons folded ("why") so the card stays a card.
 */
function spinStateProbabilityNote(fit: FitResult): HTMLElement {
  const entries = Object.entries(fit.spinStateProbabilities ?? {}).filter(([key]) => key !== 'no-choice');
  const parts = entries.map(([key, p]) => `${spinStateText(key)} ${percentText(p)}`);
  // Relative to the other assignments: say so when only weak-band labels differ, and when even the best fits poorly.
  if (fit.assignmentGroup && fit.assignmentGroup.members > 1) parts.push(`spin-allowed assignment and parameters ${percentText(fit.assignmentGroup.probability)}`);
  const poor = poorFitText(fit.goodnessOfFit);
  if (poor !== null) parts.push(poor);
  const strain = priorStrainNote(fit);
  if (strain !== null) parts.push(strain);
  const spin = parts.join(' · ');
  const undetermined = fit.undetermined ?? [];
  return h(
    'div',
    { id: 'p-probability-note' },
    spin === '' ? null : h('div', {}, spin),
    undetermined.length === 0 ? null : h(
      'details',
      { class: 'card-details', id: 'p-undetermined' },
      h('summary', {}, undeterminedHeadline(undetermined)),
      h('ul', {}, ...undetermined.map((u) => h('li', {}, undeterminedDetail(u)))),
    ),
  );
}

/** "fit: converged"; the fit's own message only when it did not simply converge. */
function fitStatusNote(fit: FitResult): string {
  const plain = fit.status === 'converged' || fit.status === 'exact';
  return plain || fit.message === undefined ? `fit: ${fit.status}` : `fit: ${fit.status} — ${fit.message}`;
}

export function assignmentTable(fit: FitResult): HTMLElement {
  if (fit.assignments.length === 0) return h('p', { class: 'muted' }, 'No band is assigned.');
  return h(
    'table',
    { class: 'data', id: 'assignments' },
    h('caption', {}, `Assignments (${dCountText(fit.d)}, ${fit.geometry}; transitions from ${fit.groundTerm})`),
    h(
      'thead',
      {},
      h('tr', {}, h('th', { scope: 'col' }, 'Level'), h('th', { scope: 'col' }, `Observed / ${UNIT.wavenumber}`), h('th', { scope: 'col' }, 'Observed / nm'), h('th', { scope: 'col' }, `Calculated / ${UNIT.wavenumber}`), h('th', { scope: 'col' }, `Obs. − calc. / ${UNIT.wavenumber}`)),
    ),
    h(
      'tbody',
      {},
      ...fit.assignments.map((a) =>
        h(
          'tr',
          {},
          h('th', { scope: 'row' }, `${fit.groundTerm} → ${levelLabel(a.term, a.parent, a.label)}`),
          h('td', { class: 'num' }, formatNumber(a.observed)),
          h('td', { class: 'num' }, formatNumber(nmFromWavenumber(a.observed), 1)),
          h('td', { class: 'num' }, formatNumber(a.calculated)),
          h('td', { class: 'num' }, formatNumber(a.observed - a.calculated)),
        ),
      ),
    ),
  );
}

function alternativeSummary(alternative: Alternative | FitResult): string {
  const parts: string[] = [];
  if (typeof alternative.tenDq === 'number') parts.push(`10Dq ${formatNumber(alternative.tenDq)} ${UNIT.wavenumber}`);
  if (typeof alternative.b === 'number') parts.push(`B ${formatNumber(alternative.b)} ${UNIT.wavenumber}`);
  if (typeof alternative.rmsResidual === 'number') parts.push(`rms ${formatNumber(alternative.rmsResidual)} ${UNIT.wavenumber}`);
  if (typeof alternative.spinState === 'string' && alternative.spinState !== 'no-choice') parts.push(spinStateText(alternative.spinState));
  if (typeof alternative.probability === 'number') parts.push(`probability ${percentText(alternative.probability)}`);
  const levels = (alternative.assignments ?? []).map((a) => levelLabel(a.term, a.parent, a.label));
  if (levels.length > 0) parts.push(levels.join(', '));
  return parts.join(' · ');
}

export function alternativesPanel(entry: AnalysisEntry, handlers: ResultHandlers): HTMLElement | null {
  const alternatives = entry.fit?.alternatives ?? [];
  if (alternatives.length === 0) return null;
  const shown = entry.shownAlternative;
  return h(
    'section',
    { class: 'panel', id: 'alternatives', 'aria-labelledby': 'alternatives-title' },
    h('h3', { id: 'alternatives-title' }, 'Other assignments that fit almost as well'),
    h('p', { class: 'muted' }, 'Choose one to show its numbers, assignments and levels instead of the best fit.'),
    h(
      'ul',
      { class: 'choices' },
      h('li', {}, h('button', { type: 'button', id: 'alt-best', class: shown === null ? 'choice chosen' : 'choice', 'aria-pressed': String(shown === null), onclick: () => handlers.onShowAlternative(null) }, 'Best fit: ', alternativeSummary(entry.fit!))),
      ...alternatives.map((alternative, index) =>
        h('li', {}, h('button', { type: 'button', id: `alt-${index}`, class: shown === index ? 'choice chosen' : 'choice', 'aria-pressed': String(shown === index), onclick: () => handlers.onShowAlternative(index) }, `Alternative ${index + 1}: `, alternativeSummary(alternative))),
      ),
    ),
  );
}
