/**
 * The tetragonal refit of one analysis (POST /fit with symmetry
 * "tetragonal"): Dq, Ds, Dt (and B, ζ) with their uncertainties, and each
 * band with its D4h level and the octahedral level it comes from. Energies
 * arrive in cm-1; nm appears only beside the observed positions.
 */
import { h } from '../dom.js';
import { percentText as percentOf } from '../../src/report/probability.js';
import { UNIT, formatNumber, formatWithUncertainty, nmFromWavenumber } from '../format.js';
import type { TetragonalFitResult } from '../types.js';
import { chemistWording } from '../undetermined-wording.js';
import { card } from './results.js';

const percentText = (p: number): string => percentOf(p, { space: true });

/** "1 560 ± 16", or the value alone with "not fixed by the bands alone" when the data leave it free. */
function valueCard(id: string, name: string, value: number, uncertainty: number | null, undetermined: boolean, note?: string): HTMLElement {
  const notes = [undetermined ? 'not fixed by the bands alone' : '', note ?? ''].filter((n) => n !== '').join(' · ');
  return card(id, name, formatWithUncertainty(value, undetermined ? null : uncertainty), UNIT.wavenumber, notes === '' ? undefined : notes);
}

function parameterCards(fit: TetragonalFitResult): HTMLElement {
  const u = fit.uncertainty;
  const free = new Set(fit.undetermined);
  const cards = [
    valueCard('t-dq', 'Dq', fit.dq, u.dq, free.has('Dq'), `10Dq = ${formatWithUncertainty(fit.tenDq, free.has('Dq') ? null : u.tenDq)} ${UNIT.wavenumber}`),
    valueCard('t-ds', 'Ds', fit.ds, u.ds, free.has('Ds')),
    valueCard('t-dt', 'Dt', fit.dt, u.dt, free.has('Dt')),
  ];
  if (fit.b !== null) cards.push(valueCard('t-b', 'Racah B', fit.b, u.b, free.has('B'), `C/B = ${formatNumber(fit.cOverB, 2)} (fixed)`));
  if (fit.zeta !== 0 || fit.zetaMode === 'free') {
    const mode = fit.zetaMode === 'free' ? 'fitted' : fit.zetaMode === 'free-ion' ? 'free-ion value' : 'fixed';
    cards.push(valueCard('t-zeta', 'Spin–orbit ζ', fit.zeta, u.zeta, free.has('ζ'), mode));
  }
  const rmsDecimals = Math.abs(fit.rmsResidual) < 10 ? 1 : 0;
  cards.push(card('t-rms', 'RMS residual', formatNumber(fit.rmsResidual, rmsDecimals), UNIT.wavenumber, `fit: ${fit.status}`));
  cards.push(card('t-probability', 'Probability of this assignment', percentText(fit.probability), '', `ground level ${fit.groundTerm}`));
  return h('div', { class: 'cards', id: 'tetragonal-parameters' }, ...cards);
}

/** What the bands fix, said once under the cards when they do not fix everything. */
function determinedLine(fit: TetragonalFitResult): HTMLElement | null {
  if (fit.undetermined.length === 0) return null;
  return h(
    'p',
    { class: 'muted', id: 'tetragonal-determined' },
    `The bands fix ${fit.determined.join(', ')}; ${fit.undetermined.join(', ')} ${fit.undetermined.length === 1 ? 'is' : 'are'} not fixed on ${fit.undetermined.length === 1 ? 'its' : 'their'} own (shown without uncertainty).`,
  );
}

function assignmentTable(fit: TetragonalFitResult): HTMLElement {
  const head = ['D4h level', 'Octahedral parent', `Observed / ${UNIT.wavenumber}`, 'Observed / nm', `Calculated / ${UNIT.wavenumber}`, `Obs. − calc. / ${UNIT.wavenumber}`];
  return h(
    'table',
    { class: 'data', id: 'tetragonal-assignments' },
    h('caption', {}, `Assignments in D4h (transitions from ${fit.groundLabel})`),
    h('thead', {}, h('tr', {}, ...head.map((t) => h('th', { scope: 'col' }, t)))),
    h(
      'tbody',
      {},
      ...fit.assignments.map((a) =>
        h(
          'tr',
          {},
          h('th', { scope: 'row' }, a.term),
          h('td', {}, a.parent),
          h('td', { class: 'num' }, formatNumber(a.observed)),
          h('td', { class: 'num' }, formatNumber(nmFromWavenumber(a.observed), 1)),
          h('td', { class: 'num' }, formatNumber(a.calculated)),
          h('td', { class: 'num' }, formatNumber(a.observed - a.calculated)),
        ),
      ),
    ),
  );
}

/** "15 600 and 19 100 cm⁻¹: components of one 2T2g(D) band, split by 3 500 cm⁻¹". */
function componentsList(fit: TetragonalFitResult): HTMLElement | null {
  if (fit.components.length === 0) return null;
  return h(
    'ul',
    { id: 'tetragonal-components' },
    ...fit.components.map((c) => {
      const positions = c.bands.map((b) => formatNumber(b));
      const listed = positions.length === 2 ? positions.join(' and ') : `${positions.slice(0, -1).join(', ')} and ${positions[positions.length - 1]}`;
      return h('li', {}, `${listed} ${UNIT.wavenumber}: components of one octahedral ${c.parent} band, split by ${formatNumber(c.splitting)} ${UNIT.wavenumber} by the tetragonal field`);
    }),
  );
}

export interface TetragonalHandlers {
  /** The bands or C/B have changed since this fit. */
  stale: boolean;
  /** Opens the Levels view with the fitted parameters. */
  onShowLevels(): void;
}

export function tetragonalPanel(fit: TetragonalFitResult, handlers: TetragonalHandlers): HTMLElement {
  return h(
    'section',
    { class: 'panel', id: 'tetragonal-fit', 'aria-labelledby': 'tetragonal-title', tabindex: '-1' },
    h('h3', { id: 'tetragonal-title' }, 'Tetragonal fit (D4h): Dq, Ds, Dt'),
    handlers.stale ? h('p', { class: 'notice info', id: 'tetragonal-stale', role: 'status' }, 'The bands or C/B have changed since this fit: press Refit to fit them.') : null,
    fit.warnings.length === 0 ? null : h(
      'div',
      { class: 'warnings', id: 'tetragonal-warnings', role: 'status' },
      h('ul', {}, ...fit.warnings.map((w) => h('li', {}, chemistWording(w)))),
    ),
    parameterCards(fit),
    determinedLine(fit),
    h('p', { class: 'muted small' }, 'Positive Ds and Dt: octahedron elongated along z (the convention is in the notes below). The cards further down are the cubic fit of the same bands.'),
    assignmentTable(fit),
    componentsList(fit),
    h('div', { class: 'toolbar' }, h('button', { type: 'button', class: 'button small', id: 'tetragonal-levels', onclick: () => handlers.onShowLevels() }, 'Show these levels and their diagram')),
    fit.notes.length === 0 ? null : h('details', { class: 'notes', id: 'tetragonal-notes' }, h('summary', {}, `Notes from the tetragonal fit (${fit.notes.length})`), h('ul', {}, ...fit.notes.map((n) => h('li', {}, chemistWording(n))))),
  );
}
