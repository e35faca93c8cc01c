/**
 * The Levels view: the energy levels of a d^n ion for given Dq, B, C, with
 * a choice of symmetry (cubic or tetragonal: Ds, Dt) and of spin–orbit
 * coupling (ζ), from GET /api/v1/levels. Energies in cm-1, wavelengths in nm
 * beside them. The form is built once and keeps its values between visits.
 */
import * as api from '../api.js';
import { h } from '../dom.js';
import { nmFromWavenumber } from '../format.js';

interface Field {
  name: keyof api.FieldLevelsQuery;
  label: string;
  value: string;
}

const NUMBER_FIELDS: Field[] = [
  { name: 'd', label: 'd electrons', value: '3' },
  { name: 'dq', label: 'Dq / cm-1', value: '1740' },
  { name: 'b', label: 'B / cm-1', value: '725' },
  { name: 'c', label: 'C / cm-1', value: '2900' },
  { name: 'ds', label: 'Ds / cm-1', value: '0' },
  { name: 'dt', label: 'Dt / cm-1', value: '0' },
  { name: 'zeta', label: 'ζ / cm-1', value: '0' },
];

function input(field: Field): HTMLElement {
  return h('label', { class: 'field' }, field.label, h('input', { id: `lv-${field.name}`, name: field.name, type: 'number', step: 'any', value: field.value }));
}

function readQuery(form: HTMLFormElement): api.FieldLevelsQuery {
  const value = (name: string): number => Number((form.elements.namedItem(name) as HTMLInputElement).value);
  const symmetry = (form.elements.namedItem('symmetry') as HTMLSelectElement).value;
  const geometry = symmetry === 'tetrahedral' ? 'tetrahedral' : 'octahedral';
  const tetragonal = symmetry === 'tetragonal';
  return {
    d: value('d'), geometry, dq: value('dq'), b: value('b'), c: value('c'),
    ds: tetragonal ? value('ds') : 0, dt: tetragonal ? value('dt') : 0, zeta: value('zeta'),
  };
}

function table(answer: api.FieldLevelsAnswer): HTMLElement {
  const spinOrbit = answer.levels.some((l) => l.irrep.startsWith('Γ'));
  return h('table', { class: 'assign', id: 'levels-table' },
    h('thead', {}, h('tr', {}, h('th', {}, 'level'), h('th', {}, 'energy / cm-1'), h('th', {}, 'nm'), h('th', {}, 'degeneracy'), h('th', {}, 'parent'), spinOrbit ? h('th', {}, 'weight') : null)),
    h('tbody', {}, answer.levels.map((level, i) => h('tr', {},
      h('td', {}, level.term),
      h('td', { class: 'num' }, level.energy.toFixed(0)),
      h('td', { class: 'num' }, i === 0 || level.energy === 0 ? '' : nmFromWavenumber(level.energy).toFixed(0)),
      h('td', { class: 'num' }, String(level.degeneracy)),
      h('td', {}, level.parent),
      spinOrbit ? h('td', { class: 'num' }, `${(100 * level.parentWeight).toFixed(0)} %`) : null,
    ))),
  );
}

export function renderLevels(host: HTMLElement): void {
  if (host.querySelector('form')) return;
  const out = h('div', { id: 'levels-out', 'aria-live': 'polite' });
  const form = h('form', { id: 'levels-form', class: 'levels-form' },
    h('label', { class: 'field' }, 'symmetry',
      h('select', { id: 'lv-symmetry', name: 'symmetry' },
        h('option', { value: 'octahedral' }, 'octahedral (Oh)'),
        h('option', { value: 'tetrahedral' }, 'tetrahedral (Td)'),
        h('option', { value: 'tetragonal' }, 'tetragonal (D4h: Ds, Dt)'))),
    NUMBER_FIELDS.map(input),
    h('button', { type: 'submit' }, 'Compute levels'),
    h('p', { class: 'muted' }, 'Tetragonal: a1g(z²) = 6Dq − 2Ds − 6Dt, b1g(x²−y²) = 6Dq + 2Ds − Dt, b2g(xy) = −4Dq + 2Ds − Dt, eg(xz, yz) = −4Dq − Ds + 4Dt (positive Ds, Dt: elongated along z). ζ > 0 labels the levels by the double group.'),
  );
  form.addEventListener('submit', (event) => {
    event.preventDefault();
    out.replaceChildren(h('p', { class: 'muted' }, 'Computing…'));
    api.fieldLevels(readQuery(form)).then(
      (answer) => out.replaceChildren(h('p', {}, `Site group ${answer.group}; ground level ${answer.groundTerm}.`), table(answer), ...answer.notes.map((n) => h('p', { class: 'muted' }, n))),
      (error: unknown) => {
        const message = error instanceof api.ApiError ? `${error.body.message}${error.body.path === '' ? '' : ` (${error.body.path})`}` : 'The levels could not be computed.';
        out.replaceChildren(h('p', { class: 'error', role: 'alert' }, message));
      },
    );
  });
  host.replaceChildren(h('h2', {}, 'Energy levels'), form, out);
}
