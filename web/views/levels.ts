/**
 * The Levels view: the energy levels of a d^n ion for given Dq, B, C, with
 * a choice of symmetry (cubic or tetragonal: Ds, Dt) and of spin–orbit
 * coupling (ζ), from GET /api/v1/levels, and the level diagram from
 * GET /api/v1/diagram: E/B against Dq, against the distortion (Ds, Dt
 * growing from the cube to the chosen values) or against ζ. Energies in
 * cm⁻¹, wavelengths in nm beside them. The form is built once and keeps its
 * values between visits; the chart is kept and updated.
 */
import * as api from '../api.js';
import { download, h } from '../dom.js';
import { UNIT, nmFromWavenumber } from '../format.js';
import { chemistWording } from '../undetermined-wording.js';
import { PlotFrame } from '../plots/frame.js';
import { svgFromSpec } from '../plots/svg.js';
import { AXIS_WORDS, levelDiagramSpec } from '../plots/level-diagram-spec.js';
import { diagramRangeFor } from '../plots/diagram-spec.js';

interface Field {
  name: keyof api.FieldLevelsQuery;
  label: string;
  value: string;
  /** Shown only for the tetragonal symmetry. */
  tetragonal?: boolean;
}

const NUMBER_FIELDS: Field[] = [
  { name: 'd', label: 'd electrons', value: '3' },
  { name: 'dq', label: `Dq / ${UNIT.wavenumber}`, value: '1740' },
  { name: 'b', label: `B / ${UNIT.wavenumber}`, value: '725' },
  { name: 'c', label: `C / ${UNIT.wavenumber}`, value: '2900' },
  { name: 'ds', label: `Ds / ${UNIT.wavenumber}`, value: '0', tetragonal: true },
  { name: 'dt', label: `Dt / ${UNIT.wavenumber}`, value: '0', tetragonal: true },
  { name: 'zeta', label: `ζ / ${UNIT.wavenumber}`, value: '0' },
];

type Axis = api.FieldDiagramQuery['axis'];

/** Points along the diagram's axis: enough for smooth lines, few enough for d5 with spin–orbit (252 states). */
const DIAGRAM_STEPS = 60;

function input(field: Field): HTMLElement {
  return h('div', { class: field.tetragonal ? 'field tetragonal-only' : 'field' },
    h('label', { for: `lv-${field.name}` }, field.label),
    h('input', { id: `lv-${field.name}`, name: field.name, type: 'number', step: 'any', value: field.value, ...(field.name === 'd' && { min: '1', max: '9', step: '1' }) }));
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

/** The axes that show something for these parameters: the distortion needs Ds or Dt, the ζ axis a ζ. */
export function availableAxes(query: api.FieldLevelsQuery): Axis[] {
  const axes: Axis[] = ['dq'];
  if (query.ds !== 0 || query.dt !== 0) axes.push('distortion');
  if (query.zeta > 0) axes.push('zeta');
  return axes;
}

/** The axis shown first: what the user last set beyond the cube (ζ, else the distortion), else Dq. */
export function defaultAxis(query: api.FieldLevelsQuery): Axis {
  const axes = availableAxes(query);
  return axes[axes.length - 1]!;
}

function table(answer: api.FieldLevelsAnswer): HTMLElement {
  const spinOrbit = answer.levels.some((l) => l.irrep.startsWith('Γ'));
  return h('table', { class: 'data', id: 'levels-table' },
    h('caption', {}, `Levels of the ${answer.group} site; ground level ${answer.groundTerm}`),
    h('thead', {}, h('tr', {},
      h('th', { scope: 'col' }, 'Level'),
      h('th', { scope: 'col', class: 'num' }, `Energy / ${UNIT.wavenumber}`),
      h('th', { scope: 'col', class: 'num' }, 'λ / nm'),
      h('th', { scope: 'col', class: 'num' }, 'Degeneracy'),
      h('th', { scope: 'col' }, 'Parent'),
      spinOrbit ? h('th', { scope: 'col', class: 'num' }, 'Weight') : null)),
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

function errorMessage(error: unknown, what: string): string {
  // The service's message already names the field ("zeta: must be ≥ 0, got -5").
  return error instanceof api.ApiError ? error.body.message : `The ${what} could not be computed.`;
}

/** The diagram figure: axis choice, tools, and one chart kept across updates. */
class LevelDiagram {
  readonly element: HTMLElement;
  private readonly host = h('div', { class: 'plot', id: 'levels-diagram-plot', role: 'img', 'aria-label': 'Level diagram' });
  private readonly axisGroup = h('div', { class: 'segmented', role: 'group', 'aria-label': 'Diagram axis' });
  private readonly note = h('p', { class: 'muted small', id: 'levels-diagram-note' });
  private readonly heading = h('h3', {}, 'Level diagram');
  private frame: PlotFrame | null = null;
  private generation = 0;
  private query: api.FieldLevelsQuery | null = null;
  private axis: Axis = 'dq';

  constructor() {
    const tool = (id: string, text: string, act: () => void): HTMLElement => h('button', { type: 'button', class: 'button small', id, onclick: act }, text);
    this.element = h('figure', { class: 'panel figure', id: 'levels-diagram' },
      h('figcaption', {}, this.heading, h('div', { class: 'toolbar' }, this.axisGroup,
        tool('levels-diagram-reset', 'Reset zoom', () => this.frame?.resetZoom()),
        tool('levels-diagram-png', 'PNG', () => { if (this.frame) download('fieldgap-levels.png', this.frame.toPng(), 'image/png'); }),
        tool('levels-diagram-svg', 'SVG', () => { const f = this.frame; if (f) download('fieldgap-levels.svg', svgFromSpec(f.spec, { xRange: f.xRange(), yRange: f.yRange() }), 'image/svg+xml'); }))),
      this.host, this.note);
    this.element.hidden = true;
  }

  /** Shows the diagram for new parameters, on the axis that fits them best. */
  show(query: api.FieldLevelsQuery): void {
    this.query = query;
    this.axis = defaultAxis(query);
    this.draw();
  }

  private setAxis(axis: Axis): void {
    this.axis = axis;
    this.draw();
  }

  private draw(): void {
    const query = this.query;
    if (query === null) return;
    this.element.hidden = false;
    const axes = availableAxes(query);
    this.axisGroup.replaceChildren(...axes.map((axis) => h('button', {
      type: 'button', class: 'button small', id: `levels-axis-${axis}`, 'aria-pressed': String(axis === this.axis), onclick: () => this.setAxis(axis),
    }, AXIS_WORDS[axis])));
    this.note.textContent = this.axis === 'dq'
      ? 'E/B of every level, from the ground level, as Dq grows at the chosen Ds, Dt and ζ; the red line marks the chosen Dq.'
      : this.axis === 'distortion'
        ? 'E/B of every level as Ds and Dt grow together from the cube (left) to the chosen values (right), at the chosen Dq and ζ.'
        : 'E/B of every level as spin–orbit coupling grows from ζ = 0 (left) to the chosen ζ (right).';
    const generation = ++this.generation;
    if (this.frame === null) this.host.replaceChildren(h('p', { class: 'muted', id: 'levels-diagram-status' }, 'Computing the diagram…'));
    const maxDqOverB = diagramRangeFor(query.b > 0 ? query.dq / query.b : 0);
    api.fieldDiagram({ ...query, axis: this.axis, maxDqOverB, steps: DIAGRAM_STEPS }).then(
      (diagram) => {
        if (generation !== this.generation) return;
        const spec = levelDiagramSpec(diagram, query.dq);
        this.heading.textContent = `Level diagram of d${diagram.d} (${diagram.geometry}${query.ds !== 0 || query.dt !== 0 ? ', tetragonal' : ''})`;
        this.host.setAttribute('aria-label', spec.title);
        if (this.frame !== null && this.frame.update(spec)) return;
        this.frame?.destroy();
        // Built after layout so the chart takes the width of its column.
        requestAnimationFrame(() => {
          if (generation !== this.generation) return;
          this.frame?.destroy();
          this.frame = new PlotFrame(this.host, spec, { height: 360 });
        });
      },
      (error: unknown) => {
        if (generation !== this.generation) return;
        this.frame?.destroy();
        this.frame = null;
        this.host.replaceChildren(h('p', { class: 'error', role: 'alert' }, errorMessage(error, 'diagram')));
      },
    );
  }
}

export function renderLevels(host: HTMLElement): void {
  if (host.querySelector('form')) return;
  const out = h('div', { id: 'levels-out', 'aria-live': 'polite' });
  const diagram = new LevelDiagram();
  const convention = h('p', { class: 'muted small tetragonal-only', id: 'levels-convention' },
    'a1g(z²) = 6Dq − 2Ds − 6Dt, b1g(x²−y²) = 6Dq + 2Ds − Dt, b2g(xy) = −4Dq + 2Ds − Dt, eg(xz, yz) = −4Dq − Ds + 4Dt: positive Ds and Dt stretch the octahedron along z; large ones reach square planar.');
  const symmetry = h('select', { id: 'lv-symmetry', name: 'symmetry' },
    h('option', { value: 'octahedral' }, 'octahedral (Oh)'),
    h('option', { value: 'tetrahedral' }, 'tetrahedral (Td)'),
    h('option', { value: 'tetragonal' }, 'tetragonal (D4h: Ds, Dt)'));
  const form = h('form', { id: 'levels-form', class: 'levels-form' },
    h('div', { class: 'field' }, h('label', { for: 'lv-symmetry' }, 'Symmetry'), symmetry),
    h('div', { class: 'levels-fields' }, NUMBER_FIELDS.map(input)),
    convention,
    h('p', { class: 'muted small' }, 'ζ > 0 couples spin and orbit: the levels are then labelled by the double group (Γ6, Γ7, Γ8), with their spin-free parent.'),
    h('button', { type: 'submit', class: 'button primary' }, 'Compute levels'),
  );
  const showTetragonal = (): void => { form.classList.toggle('is-tetragonal', symmetry.value === 'tetragonal'); };
  symmetry.addEventListener('change', showTetragonal);
  showTetragonal();
  // Only the latest request's answer is drawn (the first look's default may still be on its way when the user computes).
  let generation = 0;
  form.addEventListener('submit', (event) => {
    event.preventDefault();
    const query = readQuery(form);
    const asked = ++generation;
    out.replaceChildren(h('p', { class: 'muted' }, 'Computing…'));
    api.fieldLevels(query).then(
      (answer) => {
        if (asked !== generation) return;
        // The convention and the double-group labels are said in the form already; other notes go under the table.
        const notes = answer.notes.filter((n) => !n.startsWith('tetragonal field:') && !n.startsWith('spin–orbit coupling on:'));
        out.replaceChildren(table(answer), ...notes.map((n) => h('p', { class: 'muted small' }, chemistWording(n))));
        diagram.show(query);
      },
      (error: unknown) => {
        if (asked !== generation) return;
        out.replaceChildren(h('p', { class: 'error', role: 'alert' }, errorMessage(error, 'levels')));
      },
    );
  });
  host.replaceChildren(
    h('h2', {}, 'Energy levels'),
    h('p', { class: 'muted subtitle' }, `The levels of a dⁿ ion in a cubic or tetragonal field, with or without spin–orbit coupling; energies in ${UNIT.wavenumber} above the ground level.`),
    h('div', { class: 'levels-grid' },
      h('section', { class: 'panel levels-side', 'aria-label': 'Parameters' }, form),
      h('div', { class: 'levels-main' }, h('section', { class: 'panel', id: 'levels-result' }, out), diagram.element)),
  );
  // The first look shows the form's example computed (Cr(III)-like d3), not an empty box; submitted once the form is in the page.
  form.requestSubmit();
}
