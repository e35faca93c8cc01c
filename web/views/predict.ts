/**
 * The Predict view: type a complex's formula, see what it says before any
 * spectrum — d-count, geometry, spin state (the rule of the trade that decides
 * it, or its probability), the orbital occupation with arrows, 10Dq beside the
 * crossover and the mean pairing energy on one energy scale, the LFSE, the
 * unpaired electrons and the moment. Two complexes side by side (same metal,
 * two ligands) is the everyday use. Answers come from POST /api/v1/predict.
 */
import './predict.css';
import * as api from '../api.js';
import { h, keepingFocus } from '../dom.js';
import type { Prediction } from '../../src/series/predict.js';
import { formatPlusMinus } from '../../src/report/plus-minus.js';
import { probabilityText } from '../../src/report/probability.js';
import { NO_SPIN_STATE_CHOICE } from '../../src/report/spin-state-wording.js';
import type { ApiErrorBody } from '../types.js';

export type PredictGeometryChoice = '' | 'octahedral' | 'tetrahedral' | 'square-planar';

interface Column {
  formula: string;
  geometry: PredictGeometryChoice;
  library: boolean;
  status: 'idle' | 'busy' | 'done' | 'failed';
  result: Prediction | null;
  error: ApiErrorBody | null;
}

const newColumn = (formula: string): Column => ({ formula, geometry: '', library: false, status: 'idle', result: null, error: null });

/** Two columns, A and B; the examples are the textbook pair of one metal with two ligands. */
const columns: [Column, Column] = [newColumn('[Fe(H2O)6]2+'), newColumn('[Fe(CN)6]4-')];

/** The request body of POST /api/v1/predict for a column. */
export function predictBody(column: Pick<Column, 'formula' | 'geometry' | 'library'>): Record<string, unknown> {
  const body: Record<string, unknown> = { formula: column.formula.trim() };
  if (column.geometry !== '') body['geometry'] = column.geometry;
  if (column.library) body['library'] = true;
  return body;
}

/** Through the page's one request path (api.ts), so the write header the service asks of the page goes with it. */
function requestPrediction(body: Record<string, unknown>): Promise<Prediction> {
  return api.predict<Prediction>(body);
}

const cm = (x: number): string => Math.round(x).toLocaleString('en-US').replace(/,/g, ' ');
const pmText = (value: number, sigma: number | undefined, digits = 0): string =>
  formatPlusMinus(value, sigma, { digits, number: (v, d) => (d === 0 ? cm(v) : v.toFixed(d)) });

/** "high-spin (rule)", "low-spin, P = 0.97", "borderline: low-spin, P = 0.62". */
export function spinHeadline(p: Prediction): string {
  const d = p.spinDecision;
  if (d.state === 'no-choice') return NO_SPIN_STATE_CHOICE;
  if (d.decidedBy === 'rule') return `${d.state} (by a rule of the trade)`;
  const n = d.numbers;
  const probability = n ? probabilityText(d.state === 'low-spin' ? n.probabilities.lowSpin : n.probabilities.highSpin) : '';
  return `${d.borderline ? 'borderline: ' : ''}${d.state}${n ? `, ${probability}` : ''}`;
}

/** "x2-y2" → "x²−y²", "z2" → "z²", "t2g" unchanged: orbital names as printed. */
export function orbitalSetName(name: string): string {
  return name === 'x2-y2' ? 'x²−y²' : name === 'z2' ? 'z²' : name;
}

/** The orbital diagram: highest set on top, one box per orbital, arrows for electrons. */
function orbitalDiagram(p: Prediction, id: string): HTMLElement {
  const sets = [...p.occupation.sets].reverse();
  const label = `Orbital occupation ${p.occupation.configuration.replace(/\^/g, '')}: ${sets.map((s) => `${s.name} ${s.electrons} electrons`).join(', ')}`;
  return h(
    'div',
    { class: 'orbitals', id: `${id}-orbitals`, role: 'img', 'aria-label': label },
    ...sets.map((s) =>
      h(
        'div',
        { class: 'orbital-set' },
        h('span', { class: 'set-name' }, orbitalSetName(s.name)),
        h('span', { class: 'boxes' }, ...s.boxes.map(([up, down]) => h('span', { class: 'box' }, up ? '↑' : '\u2002', down ? '↓' : '\u2002'))),
        h('span', { class: 'set-energy muted' }, `${s.energyDq > 0 ? '+' : s.energyDq < 0 ? '−' : ''}${Math.abs(s.energyDq)} Dq`),
      ),
    ),
  );
}

/** The energies a column draws on its scale (cm-1). */
function scaleEnergies(p: Prediction): number[] {
  const n = p.spinDecision.numbers;
  return n ? [p.tenDq.value, n.crossoverTenDq, ...(n.pairingEnergy ? [n.pairingEnergy.value] : [])] : [];
}

/** 10Dq beside the crossover and Π as bars on one scale, shared by both columns (`max`, cm-1). */
function energyScale(p: Prediction, id: string, max: number): HTMLElement | '' {
  const n = p.spinDecision.numbers;
  if (!n) return '';
  const rows: [string, number, string][] = [['10Dq', p.tenDq.value, 'tendq'], ['crossover', n.crossoverTenDq, 'crossover']];
  if (n.pairingEnergy) rows.push([`Π = ${n.pairingEnergy.expression}`, n.pairingEnergy.value, 'pairing']);
  return h(
    'div',
    { class: 'energy-scale', id: `${id}-energy` },
    h('p', { class: 'muted small' }, 'One energy scale for both complexes (cm⁻¹): low-spin when 10Dq lies beyond the crossover.'),
    ...rows.map(([name, value, kind]) => {
      const fill = h('span', { class: `energy-bar ${kind}` });
      // Through the CSSOM: the page's CSP refuses style attributes.
      fill.style.width = `${((100 * value) / max).toFixed(1)}%`;
      return h(
        'div',
        { class: 'energy-row' },
        h('span', { class: 'energy-name' }, name),
        h('span', { class: 'energy-track', 'aria-hidden': 'true' }, fill),
        h('span', { class: 'energy-value num' }, `${cm(value)} cm⁻¹`),
      );
    }),
  );
}

function resultBlock(p: Prediction, id: string, scaleMax: number): HTMLElement {
  const rows: [string, string, string][] = [
    ['d-count', `d${p.d} (${p.ion})`, 'dcount'],
    ['Geometry', p.geometry.value, 'geometry-value'],
    ['10Dq', `${pmText(p.tenDq.value, p.tenDq.uncertainty)} cm⁻¹`, 'tendq'],
    ['β', p.beta ? pmText(p.beta.value, p.beta.uncertainty, 2) : p.d <= 1 || p.d >= 9 ? `not needed for d${p.d}` : 'not estimated', 'beta'],
    ['Spin state', spinHeadline(p), 'spin'],
    ['Unpaired electrons', String(p.unpairedElectrons.value), 'unpaired'],
    ['Spin-only moment', `${p.spinOnlyMoment.value.toFixed(2)} μB${p.orbitalContribution.expected ? ' (orbital contribution expected)' : ''}`, 'moment'],
    ['Ground term', p.groundTerm.value, 'term'],
    ['LFSE', `${p.lfse.deltaUnits.toFixed(2)} Δ = ${pmText(p.lfse.value, p.lfse.uncertainty)} cm⁻¹ (pairing energy not included)`, 'lfse'],
  ];
  return h(
    'div',
    { class: 'predict-result', id: `${id}-result` },
    h('h3', {}, p.complexIon),
    h('table', { class: 'data' }, h('tbody', {}, ...rows.map(([name, value, key]) => h('tr', {}, h('th', { scope: 'row' }, name), h('td', { id: `${id}-${key}` }, value))))),
    p.spinDecision.borderline ? h('p', { class: 'borderline', id: `${id}-borderline`, role: 'note' }, 'Borderline: both spin states are plausible on these estimates.') : '',
    orbitalDiagram(p, id),
    energyScale(p, id, scaleMax),
    h('p', { class: 'why', id: `${id}-why` }, p.spinDecision.summary),
    h('p', { class: 'muted small' }, p.orbitalContribution.why),
    p.warnings.length === 0 ? '' : h('ul', { class: 'warnings small' }, ...p.warnings.map((w) => h('li', {}, w))),
    h(
      'details',
      { class: 'small' },
      h('summary', {}, 'Factors and sources'),
      h('ul', {}, ...p.ligands.map((l) => h('li', {}, `${l.count} × ${l.key}: f = ${pmText(l.fFactor.value, l.fFactor.uncertainty, 2)} (${l.fFactor.kind}), h = ${pmText(l.hFactor.value, l.hFactor.uncertainty, 1)} (${l.hFactor.kind})`)),
        h('li', {}, `${p.ion}: g = ${pmText(p.metalFactors.g.value, p.metalFactors.g.uncertainty)} cm⁻¹ (${p.metalFactors.g.kind}), k = ${pmText(p.metalFactors.k.value, p.metalFactors.k.uncertainty, 2)} (${p.metalFactors.k.kind})`)),
      h('ul', {}, ...p.sources.map((s) => h('li', {}, s))),
    ),
  );
}

/** Asks the service for a column's prediction and redraws when it is in. */
async function runColumn(column: Column, rerender: () => void): Promise<void> {
  if (column.formula.trim() === '') return;
  // The button pressed is disabled while busy, which drops the keyboard focus: it is given back when the answer is in.
  const returnTo = document.activeElement instanceof HTMLElement ? document.activeElement.id : '';
  column.status = 'busy';
  rerender();
  try {
    column.result = await requestPrediction(predictBody(column));
    column.error = null;
    column.status = 'done';
  } catch (error) {
    column.error = error instanceof api.ApiError ? error.body : { code: 'internal', message: 'Something went wrong in the page.', path: '' };
    column.result = null;
    column.status = 'failed';
  }
  rerender();
  if (returnTo !== '' && (document.activeElement === document.body || document.activeElement === null)) document.getElementById(returnTo)?.focus({ preventScroll: true });
}

/** The example pair is predicted on the first visit, so the view does not open on two empty forms. */
let examplesShown = false;

function columnPanel(column: Column, index: number, libraryAvailable: boolean, scaleMax: number, rerender: () => void): HTMLElement {
  const id = `predict-${index === 0 ? 'a' : 'b'}`;
  const letter = index === 0 ? 'A' : 'B';
  const run = (): Promise<void> => runColumn(column, rerender);
  const form = h(
    'form',
    { class: 'predict-form', id: `${id}-form`, onsubmit: (event: Event) => { event.preventDefault(); void run(); } },
    h('label', { for: `${id}-formula` }, `Complex ${letter}`),
    h('input', { id: `${id}-formula`, type: 'text', value: column.formula, spellcheck: 'false', autocomplete: 'off', placeholder: '[Co(NH3)6]3+', oninput: (e: Event) => { column.formula = (e.target as HTMLInputElement).value; } }),
    h('label', { for: `${id}-geometry` }, 'Geometry'),
    h(
      'select',
      { id: `${id}-geometry`, onchange: (e: Event) => { column.geometry = (e.target as HTMLSelectElement).value as PredictGeometryChoice; } },
      ...([['', 'from the formula and the rules'], ['octahedral', 'octahedral'], ['tetrahedral', 'tetrahedral'], ['square-planar', 'square planar']] as const).map(([value, text]) =>
        h('option', { value, selected: column.geometry === value }, text)),
    ),
    libraryAvailable
      ? h('label', { class: 'check' }, h('input', { type: 'checkbox', id: `${id}-library`, checked: column.library, onchange: (e: Event) => { column.library = (e.target as HTMLInputElement).checked; } }), ' use the factors fitted from my library')
      : '',
    h('button', { type: 'submit', class: 'button', id: `${id}-go`, disabled: column.status === 'busy' }, `Predict ${letter}`),
  );
  let body: HTMLElement | string = '';
  if (column.status === 'busy') body = h('p', { class: 'busy', role: 'status' }, 'Predicting…');
  else if (column.status === 'failed' && column.error) {
    body = h('div', { class: 'error-box', role: 'alert', id: `${id}-error` }, h('p', {}, column.error.message), column.error.path === '' ? '' : h('p', {}, 'Where: ', h('code', {}, column.error.path)));
  } else if (column.result) body = resultBlock(column.result, id, scaleMax);
  return h('section', { class: 'panel predict-column', id, 'aria-label': `Complex ${letter}` }, form, body);
}

/** Draws the view into its tab panel. */
export function renderPredict(root: HTMLElement, libraryAvailable: boolean): void {
  const rerender = (): void => keepingFocus(() => renderPredict(root, libraryAvailable));
  const scaleMax = Math.max(1, ...columns.flatMap((c) => (c.result ? scaleEnergies(c.result) : [])));
  root.replaceChildren(
    h('h2', {}, 'What a formula says'),
    h('p', { class: 'muted' }, 'Type a complex — "[Co(NH3)6]3+", "K3[Fe(CN)6]", "[NiCl4]2-" — to see its d-count, spin state and magnetism estimated from the formula alone (Jørgensen’s factors and the rules of the trade). Every number is an estimate, not a measurement. Compare two side by side: the same metal with two ligands.'),
    h('div', { class: 'predict-grid' }, ...columns.map((column, index) => columnPanel(column, index, libraryAvailable, scaleMax, rerender))),
  );
  if (!examplesShown) {
    examplesShown = true;
    for (const column of columns) if (column.status === 'idle') void runColumn(column, rerender);
  }
}
