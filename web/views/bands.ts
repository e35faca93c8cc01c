/**
 * The band list as the user corrects it: remove or put back a band, mark it
 * as charge-transfer, spin-forbidden or a shoulder, add one by position or
 * by clicking the spectrum, set C/B, refit.
 */
import { h, numberOrNull } from '../dom.js';
import { UNIT, formatNumber, nmFromWavenumber } from '../format.js';
import type { AnalysisEntry, EditableBand, FitSymmetry, ZetaChoice } from '../state.js';
import { shownFit } from '../state.js';
import type { BandKind } from '../types.js';
import { bandCaption } from '../plots/spectrum-spec.js';

export interface BandHandlers {
  onPatch(index: number, patch: Partial<EditableBand>): void;
  onDelete(index: number): void;
  onAdd(position: number): void;
  onArmPick(armed: boolean): void;
  onCOverB(value: number | null): void;
  onFreeC(value: boolean): void;
  /** The symmetry of the next refit: cubic, or tetragonal (Dq, Ds, Dt). */
  onSymmetry(value: FitSymmetry): void;
  /** Spin–orbit coupling of the next tetragonal refit. */
  onZeta(value: ZetaChoice): void;
  onRefit(): void;
  onUndo(): void;
}

const KINDS: { value: BandKind; text: string }[] = [
  { value: 'd-d', text: 'd–d' },
  { value: 'spin-forbidden', text: 'spin-forbidden' },
  { value: 'charge-transfer', text: 'charge transfer' },
];

/** A short note when a band's maximum is not well inside the measured range. */
function windowNote(window: string | undefined): HTMLElement | null {
  const text: Record<string, string> = {
    'near-red-end': 'maximum near the red end', 'near-blue-end': 'maximum near the blue end',
    'beyond-red-end': 'maximum beyond the red end (estimated)', 'beyond-blue-end': 'maximum beyond the blue end (estimated)',
  };
  const note = window === undefined ? undefined : text[window];
  return note === undefined ? null : h('div', { class: 'muted small' }, note);
}

function bandRow(entry: AnalysisEntry, band: EditableBand, index: number, handlers: BandHandlers): HTMLElement {
  const found = band.sourceIndex === null ? undefined : entry.result?.bands[band.sourceIndex];
  const fit = shownFit(entry);
  // With the tetragonal fit shown, each band is named by its D4h level with the octahedral parent: "2B2g[2T2g(D)]".
  const tetragonal = entry.symmetry === 'tetragonal' ? entry.tetragonalFit ?? null : null;
  const assignments = tetragonal?.assignments ?? fit?.assignments ?? [];
  const unused = band.included && tetragonal === null ? fit?.unassigned?.find((u) => Math.abs(u.observed - band.position) <= 1) : undefined;
  const kind = h(
    'select',
    { id: `band-${index}-kind`, 'aria-label': `Kind of band ${index + 1}`, disabled: !band.included },
    ...KINDS.map((k) => h('option', { value: k.value, selected: k.value === band.kind }, k.text)),
  );
  kind.addEventListener('change', () => handlers.onPatch(index, { kind: kind.value as BandKind }));
  const shoulder = h('input', { type: 'checkbox', id: `band-${index}-shoulder`, checked: band.shoulder, disabled: !band.included, 'aria-label': `Band ${index + 1} is a shoulder` });
  shoulder.addEventListener('change', () => handlers.onPatch(index, { shoulder: shoulder.checked }));
  const action =
    band.origin === 'added'
      ? h('button', { type: 'button', class: 'button small', id: `band-${index}-delete`, onclick: () => handlers.onDelete(index) }, 'Delete')
      : band.included
        ? h('button', { type: 'button', class: 'button small', id: `band-${index}-remove`, onclick: () => handlers.onPatch(index, { included: false }) }, 'Remove')
        : h('button', { type: 'button', class: 'button small', id: `band-${index}-restore`, onclick: () => handlers.onPatch(index, { included: true }) }, 'Put back');
  return h(
    'tr',
    { class: band.included ? '' : 'removed', 'data-position': band.position },
    h('th', { scope: 'row' }, band.origin === 'added' ? `${index + 1} (added)` : String(index + 1)),
    h('td', { class: 'num' }, formatNumber(band.position)),
    h('td', { class: 'num' }, formatNumber(nmFromWavenumber(band.position), 1), windowNote(found?.window)),
    h('td', { class: 'num' }, formatNumber(band.epsilon, 1)),
    h('td', { class: 'num' }, formatNumber(found?.fwhm, 0)),
    h('td', {}, bandCaption(band, assignments, tetragonal === null ? fit : null), unused === undefined ? null : h('div', { class: 'muted small' }, `not used: ${unused.reason}`)),
    h('td', {}, kind),
    h('td', { class: 'center' }, shoulder),
    h('td', {}, action),
  );
}

export function bandsPanel(entry: AnalysisEntry, pickArmed: boolean, refitting: boolean, handlers: BandHandlers): HTMLElement {
  const position = h('input', { id: 'add-position', inputmode: 'decimal', placeholder: UNIT.wavenumber, 'aria-describedby': 'add-hint' });
  const addForm = h(
    'form',
    { class: 'inline', id: 'add-form' },
    h('label', { for: 'add-position' }, `Add a band at / ${UNIT.wavenumber}`),
    position,
    h('button', { type: 'submit', class: 'button small', id: 'add-band' }, 'Add'),
    h(
      'button',
      { type: 'button', class: pickArmed ? 'button small armed' : 'button small', id: 'pick-band', 'aria-pressed': String(pickArmed), onclick: () => handlers.onArmPick(!pickArmed) },
      pickArmed ? 'Click the spectrum… (Esc to stop)' : 'or click on the spectrum',
    ),
    h('small', { id: 'add-hint' }, 'wavenumber of the band maximum'),
  );
  addForm.addEventListener('submit', (event) => {
    event.preventDefault();
    const value = numberOrNull(position.value);
    if (value !== null && value > 0) handlers.onAdd(value);
    else position.setAttribute('aria-invalid', 'true');
  });

  const cOverB = h('input', { id: 'refit-c-over-b', inputmode: 'decimal', value: entry.cOverB === null ? '' : String(entry.cOverB), placeholder: 'free-ion value' });
  cOverB.addEventListener('change', () => handlers.onCOverB(numberOrNull(cOverB.value)));
  const freeC = h('input', { type: 'checkbox', id: 'refit-free-c', checked: entry.freeC });
  freeC.addEventListener('change', () => handlers.onFreeC(freeC.checked));
  const symmetryNow = entry.symmetry ?? 'cubic';
  const symmetry = h(
    'select',
    { id: 'refit-symmetry', 'aria-describedby': 'refit-symmetry-hint' },
    h('option', { value: 'cubic', selected: symmetryNow === 'cubic' }, 'cubic (Oh, Td)'),
    h('option', { value: 'tetragonal', selected: symmetryNow === 'tetragonal' }, 'tetragonal (D4h)'),
  );
  symmetry.addEventListener('change', () => handlers.onSymmetry(symmetry.value === 'tetragonal' ? 'tetragonal' : 'cubic'));
  const tetragonal = symmetryNow === 'tetragonal';
  const zetaControls = tetragonal ? zetaChoice(entry.zeta ?? { mode: 'off' }, handlers.onZeta) : null;
  const included = entry.bands.filter((b) => b.included && b.kind !== 'charge-transfer').length;

  return h(
    'section',
    { class: 'panel', id: 'bands', 'aria-labelledby': 'bands-title' },
    h('h3', { id: 'bands-title' }, 'Bands and corrections'),
    h(
      'table',
      { class: 'data', id: 'band-table' },
      h(
        'thead',
        {},
        h('tr', {}, ...['Band', `Position / ${UNIT.wavenumber}`, 'λ / nm', `ε / ${UNIT.epsilon}`, `FWHM / ${UNIT.wavenumber}`, 'Assignment', 'Kind', 'Shoulder', ''].map((t) => h('th', { scope: 'col' }, t))),
      ),
      h('tbody', {}, ...entry.bands.map((band, index) => bandRow(entry, band, index, handlers))),
    ),
    addForm,
    h(
      'div',
      { class: 'inline refit' },
      h('label', { for: 'refit-symmetry' }, 'Symmetry'),
      symmetry,
      h('label', { for: 'refit-c-over-b' }, 'C/B'),
      cOverB,
      // The tetragonal fit keeps C/B fixed.
      tetragonal ? null : h('span', { class: 'check' }, freeC, h('label', { for: 'refit-free-c' }, 'fit C as well')),
      ...(zetaControls ?? []),
      h('button', { type: 'button', class: 'button primary', id: 'refit', disabled: refitting || included === 0, onclick: () => handlers.onRefit() }, refitting ? 'Refitting…' : 'Refit'),
      h('button', { type: 'button', class: 'button secondary', id: 'undo', onclick: () => handlers.onUndo() }, 'Undo all corrections'),
      h('span', { class: 'muted' }, `${included} band${included === 1 ? '' : 's'} go into the fit; charge-transfer bands are left out.`),
    ),
    h('small', { id: 'refit-symmetry-hint', class: 'muted' }, tetragonal
      ? 'Tetragonal: Dq, Ds and Dt (and B for d2–d8) from the same bands, C/B fixed; a split octahedral band is two components of one parent.'
      : 'Cubic: 10Dq, B (and C) as in the analysis. Choose tetragonal for a trans-disubstituted or Jahn–Teller-distorted complex.'),
  );
}

const ZETA_MODES: ReadonlyArray<[ZetaChoice['mode'], string]> = [
  ['off', 'off (ζ = 0)'],
  ['fixed', 'fixed at…'],
  ['free-ion', 'the free ion’s ζ'],
  ['fitted', 'fitted'],
];

/**
 * The spin–orbit choice of the tetragonal refit: a mode, a value for "fixed",
 * and the caution that fits with spin–orbit coupling are not yet validated
 * (README), always beside it.
 */
function zetaChoice(choice: ZetaChoice, onZeta: (value: ZetaChoice) => void): HTMLElement[] {
  const mode = h('select', { id: 'refit-zeta-mode', 'aria-describedby': 'refit-zeta-caution' },
    ...ZETA_MODES.map(([value, text]) => h('option', { value, selected: choice.mode === value }, text)));
  mode.addEventListener('change', () => {
    const next = mode.value as ZetaChoice['mode'];
    onZeta(next === 'fixed' ? { mode: 'fixed', value: choice.mode === 'fixed' ? choice.value : null } : { mode: next } as ZetaChoice);
  });
  const out: HTMLElement[] = [h('label', { for: 'refit-zeta-mode' }, 'Spin–orbit ζ'), mode];
  if (choice.mode === 'fixed') {
    const value = h('input', { id: 'refit-zeta', inputmode: 'decimal', value: choice.value === null ? '' : String(choice.value), placeholder: 'cm⁻¹', 'aria-label': `ζ / ${UNIT.wavenumber}` });
    // Written without a redraw, as C/B: the field keeps the focus while the user types.
    value.addEventListener('change', () => {
      const v = numberOrNull(value.value);
      value.toggleAttribute('aria-invalid', v !== null && v < 0);
      onZeta({ mode: 'fixed', value: v !== null && v >= 0 ? v : null });
    });
    out.push(value);
  }
  out.push(h('small', { id: 'refit-zeta-caution', class: choice.mode === 'off' ? 'muted' : 'caution' },
    'Fits with spin–orbit coupling run but are not yet validated.'));
  return out;
}
