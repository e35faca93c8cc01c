/**
 * The side panel: choose or drop spectrum files, describe the sample, start
 * the analysis; below, the list of analysed files to switch between.
 */
import { h, numberOrNull } from '../dom.js';
import type { AnalysisEntry, SampleDetails } from '../state.js';
import { columnNote } from './columns.js';
import type { Geometry, XUnit } from '../types.js';
import { ANALYSIS_OPTION_NAMES as NAME } from '../../src/analysis-option-names.js';
import { oversizeMessage } from '../upload-size.js';

export interface UploadHandlers {
  onAnalyse(files: File[], details: SampleDetails): void;
  onSelect(key: string): void;
}

/** Ions the page suggests; any other the service knows can be typed. */
const ION_SUGGESTIONS = ['Ti3+', 'V3+', 'V2+', 'Cr3+', 'Cr2+', 'Mn2+', 'Mn3+', 'Fe2+', 'Fe3+', 'Co2+', 'Co3+', 'Ni2+', 'Cu2+'];

function field(id: string, label: string, input: HTMLElement, hint?: string): HTMLElement {
  return h('div', { class: 'field' }, h('label', { for: id }, label), input, hint === undefined ? null : h('small', { id: `${id}-hint` }, hint));
}

export interface UploadPanel {
  /** Redraws the list of analyses; the form keeps what the user typed. */
  renderEntries(entries: readonly AnalysisEntry[], currentKey: string | null): void;
  /** The service's upload limit, bytes (null: unknown): larger files are refused here, before they are sent. */
  setUploadLimit(bytes: number | null): void;
}

/** Builds the form once inside `root`. */
export function createUploadPanel(root: HTMLElement, handlers: UploadHandlers): UploadPanel {
  const queued: File[] = [];
  let uploadLimit: number | null = null;
  // Files refused for their size, said in words beside the list; cleared when files are added again.
  const refusedNote = h('div', { id: 'upload-refused', role: 'alert' });
  const refuseOversized = (files: File[]): File[] => {
    const refused = files.map((file) => oversizeMessage(file.name, file.size, uploadLimit)).filter((m): m is string => m !== null);
    refusedNote.replaceChildren(...refused.map((message) => h('p', { class: 'error' }, message)));
    return files.filter((file) => oversizeMessage(file.name, file.size, uploadLimit) === null);
  };
  const fileInput = h('input', { type: 'file', id: 'file-input', multiple: true, accept: '.csv,.txt,.tsv,.dat,.jdx,.dx,.jcamp,text/plain,text/csv' });
  const queueList = h('ul', { class: 'queue', id: 'queue', 'aria-live': 'polite' });
  const showQueue = (): void => {
    queueList.replaceChildren(
      ...queued.map((file, index) =>
        h(
          'li',
          {},
          h('span', { class: 'name' }, file.name),
          h('span', { class: 'muted' }, ` ${(file.size / 1024).toFixed(1)} kB `),
          h('button', { type: 'button', class: 'link', 'aria-label': `Remove ${file.name} from the list`, onclick: () => { queued.splice(index, 1); showQueue(); } }, '×'),
        ),
      ),
      queued.length < 2 ? '' : h('li', { class: 'clear' }, h('button', { type: 'button', class: 'link', id: 'queue-clear', onclick: () => { queued.splice(0, queued.length); showQueue(); } }, 'Clear the list')),
    );
    analyseButton.disabled = queued.length === 0;
    fileInput.value = '';
  };
  const addFiles = (files: FileList | null): void => {
    if (files === null) return;
    for (const file of refuseOversized(Array.from(files))) if (!queued.some((q) => q.name === file.name && q.size === file.size)) queued.push(file);
    showQueue();
  };
  fileInput.addEventListener('change', () => addFiles(fileInput.files));

  const drop = h(
    'div',
    { class: 'drop', id: 'drop-zone' },
    h('p', {}, 'Drop spectrum files here'),
    h('p', { class: 'muted' }, 'text columns (CSV, TSV, whitespace) or JCAMP-DX; several at once'),
    h('label', { class: 'button secondary', for: 'file-input' }, 'Choose files…'),
    fileInput,
  );
  drop.addEventListener('dragover', (event) => {
    event.preventDefault();
    drop.classList.add('over');
  });
  drop.addEventListener('dragleave', () => drop.classList.remove('over'));
  drop.addEventListener('drop', (event) => {
    event.preventDefault();
    drop.classList.remove('over');
    addFiles(event.dataTransfer?.files ?? null);
  });

  const ion = h('input', { id: 'ion', name: NAME.ion.rest, list: 'ion-list', autocomplete: 'off', placeholder: 'e.g. Ni2+', 'aria-describedby': 'ion-hint' });
  const ionList = h('datalist', { id: 'ion-list' }, ...ION_SUGGESTIONS.map((value) => h('option', { value })));
  const dCount = h('select', { id: 'd-count', name: NAME.d.rest }, h('option', { value: '' }, '—'), ...[1, 2, 3, 4, 5, 6, 7, 8, 9].map((d) => h('option', { value: String(d) }, `d${d}`)));
  const geometry = h('select', { id: 'geometry', name: NAME.geometry.rest }, h('option', { value: 'octahedral' }, 'octahedral'), h('option', { value: 'tetrahedral' }, 'tetrahedral'));
  const conc = h('input', { id: 'conc', name: NAME.concentration.rest, inputmode: 'decimal', placeholder: 'mol L⁻¹' });
  const path = h('input', { id: 'path', name: NAME.pathLength.rest, inputmode: 'decimal', placeholder: '1' });
  const sample = h('input', { id: 'sample', name: 'sample', placeholder: 'name or formula' });
  const ligand = h('input', { id: 'ligand', name: 'ligand', placeholder: 'e.g. H2O' });
  const formula = h('input', { id: 'formula', name: 'formula', placeholder: 'e.g. [Cr(H2O)6]Cl3', autocomplete: 'off' });
  const xUnit = h('select', { id: 'x-unit', name: NAME.xUnit.rest }, h('option', { value: '' }, 'from the file'), h('option', { value: 'nm' }, 'nm'), h('option', { value: 'cm-1' }, 'cm⁻¹'), h('option', { value: 'eV' }, 'eV'), h('option', { value: 'um' }, 'µm'));
  const column = h('input', { id: 'column', name: NAME.column.rest, placeholder: 'first y column' });
  const cOverB = h('input', { id: 'c-over-b', name: NAME.cOverB.rest, inputmode: 'decimal', placeholder: 'free-ion value' });
  const freeC = h('input', { id: 'free-c', name: NAME.freeC.rest, type: 'checkbox' });
  const stepCorrection = h('input', { id: 'step-correction', name: 'stepCorrection', type: 'checkbox', checked: true });

  const analyseButton = h('button', { type: 'submit', id: 'analyse', class: 'button primary', disabled: queued.length === 0 }, 'Analyse');
  const form = h(
    'form',
    { id: 'sample-form', novalidate: true },
    h('h2', {}, 'Spectra'),
    drop,
    refusedNote,
    queueList,
    h('h2', {}, 'Sample'),
    h('div', { class: 'row' }, field('ion', 'Metal ion', ion, 'charge with the sign: Co2+'), field('d-count', 'or dⁿ', dCount)),
    ionList,
    field('geometry', 'Geometry', geometry),
    h('div', { class: 'row' }, field('conc', 'Concentration / mol L⁻¹', conc), field('path', 'Path length / cm', path)),
    h('div', { class: 'row' }, field('sample', 'Sample', sample), field('ligand', 'Ligand', ligand)),
    field('formula', 'Formula (optional)', formula),
    h(
      'details',
      {},
      h('summary', {}, 'More: file columns, C/B, detector steps'),
      h('div', { class: 'row' }, field('x-unit', 'x unit of the file', xUnit), field('column', 'y column (number or name)', column)),
      field('c-over-b', 'C/B', cOverB),
      h('div', { class: 'check' }, freeC, h('label', { for: 'free-c' }, 'fit C as well (needs enough bands)')),
      h('div', { class: 'check' }, stepCorrection, h('label', { for: 'step-correction' }, 'correct detector steps (only clear ones; each is listed with its size)')),
    ),
    analyseButton,
  );
  form.addEventListener('submit', (event) => {
    event.preventDefault();
    const dValue = numberOrNull(dCount.value);
    const details: SampleDetails = {
      ion: ion.value.trim(),
      d: dValue,
      geometry: geometry.value as Geometry,
      concentration: numberOrNull(conc.value),
      pathLength: numberOrNull(path.value),
      sample: sample.value.trim(),
      ligand: ligand.value.trim(),
      formula: formula.value.trim(),
      xUnit: xUnit.value === '' ? null : (xUnit.value as XUnit),
      column: column.value.trim(),
      cOverB: numberOrNull(cOverB.value),
      freeC: freeC.checked,
      stepCorrection: stepCorrection.checked,
    };
    const files = queued.splice(0, queued.length);
    showQueue();
    handlers.onAnalyse(files, details);
  });

  const heading = h('h2', { hidden: true }, 'Analyses');
  const list = h('ul', { class: 'entries', id: 'entries' });
  root.replaceChildren(form, heading, list);
  showQueue();
  return {
    setUploadLimit(bytes) {
      uploadLimit = bytes;
      // Files chosen before the limit was known are checked now.
      const kept = refuseOversized(queued);
      if (kept.length !== queued.length) {
        queued.splice(0, queued.length, ...kept);
        showQueue();
      }
    },
    renderEntries(entries, currentKey) {
      heading.hidden = entries.length === 0;
      list.replaceChildren(...entries.map((entry) => entryItem(entry, currentKey, handlers)));
    },
  };
}

function entryStatus(entry: AnalysisEntry): string {
  if (entry.status === 'pending') return 'analysing…';
  if (entry.status === 'failed') return 'failed';
  if (entry.fit === null) return 'no fit';
  return `10Dq ${Math.round(entry.fit.tenDq)} cm⁻¹`;
}

/** Under the name of an entry whose file holds several spectra: which one it is. */
function columnItemNote(entry: AnalysisEntry): HTMLElement | null {
  const note = columnNote(entry);
  return note === null ? null : h('small', { class: 'entry-column' }, note);
}

function entryItem(entry: AnalysisEntry, currentKey: string | null, handlers: UploadHandlers): HTMLElement {
  const current = entry.key === currentKey;
  return h(
    'li',
    {},
    h(
      'button',
      {
        type: 'button',
        class: current ? 'entry current' : 'entry',
        id: `entry-${entry.key}`,
        'aria-current': current ? 'true' : undefined,
        onclick: () => handlers.onSelect(entry.key),
      },
      h('span', { class: 'name' }, entry.details.sample || entry.fileName, columnItemNote(entry)),
      // Read aloud between name and status ("cr-aqua.csv, 10Dq …"); not drawn between the flex items.
      h('span', { class: 'visually-hidden' }, ', '),
      h('span', { class: `status ${entry.status}` }, entryStatus(entry)),
    ),
  );
}
