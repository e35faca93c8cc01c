/**
 * What a band is, once it is assigned: the one rule the text table, the JSON
 * (`bands[i].assignedKind`), the CSV and the page use to name a band's kind.
 *
 * The spectrum stage classifies a band by its intensity and width alone
 * (`Band.kind`: 'd-d', 'spin-forbidden', 'charge-transfer'). That is a guess
 * made before any assignment: a weak shoulder is "spin-forbidden" by its
 * size. Once the fit has assigned the band to a transition, the transition
 * says what it is: a spin-allowed one-electron jump, a spin-allowed
 * two-electron jump (weak: 4A2g of high-spin octahedral Co(II)), or a
 * spin-forbidden one (a change of multiplicity). The intensity class stays
 * in `Band.kind`, as what the spectrum alone suggested.
 *
 * Two-electron: the strong-field configuration of the excited level differs
 * from the ground's by two electrons and no one-electron level of the same
 * symmetry and spin lends it intensity (src/fit/two-electron.ts, the fit's
 * own rule; common practice). It depends only on (multiplicity, irrep) for a
 * given ground, so a label that occurs twice is classed alike.
 */
import type { FitResult } from '../fit/index.js';
import { scanLevels } from '../fit/scan.js';
import { twoElectronLevels } from '../fit/two-electron.js';
import type { Geometry } from '../ligand-field/types.js';
import type { Band } from '../spectrum/types.js';

/** The kind of an assigned band, from its transition. */
export const ASSIGNED_KINDS = ['spin-allowed', 'two-electron', 'spin-forbidden'] as const;
export type AssignedKind = (typeof ASSIGNED_KINDS)[number];

/** The words of the text table and the page. */
export const ASSIGNED_KIND_TEXT: Record<AssignedKind, string> = {
  'spin-allowed': 'd-d, spin-allowed',
  'two-electron': 'd-d, two-electron, weak',
  'spin-forbidden': 'd-d, spin-forbidden',
};

/** A band caption's note on the page (nothing for the ordinary case, a spin-allowed one-electron band). */
export const ASSIGNED_KIND_NOTE: Record<AssignedKind, string | null> = {
  'spin-allowed': null,
  'two-electron': 'two-electron, weak',
  'spin-forbidden': 'spin-forbidden',
};

type FitPart = Pick<FitResult, 'd' | 'geometry' | 'groundTerm' | 'cOverB' | 'assignments'>;

/**
 * Per band (same order as `bands`): the kind its assigned transition gives,
 * or null for a band the fit left unassigned (charge transfer, unexplained).
 * `fit.assignments[].bands` index `bands` (the found bands the fit took).
 */
export function bandAssignedKinds(bands: readonly Pick<Band, 'kind'>[], fit: FitPart | null): Array<AssignedKind | null> {
  if (fit === null) return bands.map(() => null);
  return bands.map((_, i) => {
    const a = fit.assignments.find((row) => row.bands.includes(i));
    return a === undefined ? null : assignedKindOf(a, fit);
  });
}

/** The kind of one assignment row of `fit` (for a caller that matches bands to rows its own way, as the page does by position). */
export function assignedKindOf(row: Pick<FitPart['assignments'][number], 'spinAllowed' | 'multiplicity' | 'term'>, fit: Omit<FitPart, 'assignments'>): AssignedKind {
  if (!row.spinAllowed) return 'spin-forbidden';
  const twoElectron = twoElectronTransitions(fit.d, fit.geometry, fit.groundTerm, fit.cOverB ?? 4.5);
  return twoElectron.has(`${row.multiplicity}${irrepOf(row.term)}`) ? 'two-electron' : 'spin-allowed';
}

/**
 * The kind column of a text table: the assigned kind when there is one, else
 * the spectrum's class ("charge-transfer", "d-d" for an unexplained band).
 */
export function bandKindText(band: Pick<Band, 'kind'>, assigned: AssignedKind | null): string {
  return assigned === null ? band.kind : ASSIGNED_KIND_TEXT[assigned];
}

/** Whether the spectrum's intensity class and the assignment disagree (a strong band on a spin-forbidden transition, a weak one on a strong spin-allowed transition). */
export function kindsDisagree(band: Pick<Band, 'kind'>, assigned: AssignedKind | null): boolean {
  if (assigned === null) return false;
  if (band.kind === 'charge-transfer') return true;
  if (band.kind === 'd-d') return assigned === 'spin-forbidden';
  return assigned === 'spin-allowed';
}

/** "T1g" of "4T1g". */
function irrepOf(term: string): string {
  return term.replace(/^\d+/, '');
}

const cache = new Map<string, Set<string>>();

/**
 * "multiplicity+irrep" of every two-electron level from the ground term's
 * lowest level. Only the strong-field end of the scan matters for the
 * electron count (scan.ts promotedElectrons: the slope between its last two
 * points), so two points of the default grid's end suffice.
 */
export function twoElectronTransitions(d: number, geometry: Geometry, groundTerm: string, cOverB: number): Set<string> {
  const key = `${d}|${geometry}|${groundTerm}|${cOverB.toFixed(3)}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const scan = scanLevels(d, geometry, cOverB, Float64Array.from([11.75, 12]));
  const ground = scan.ids.findIndex((id) => id.term === groundTerm && id.rank === 0);
  const found = new Set<string>();
  if (ground >= 0) {
    const flags = twoElectronLevels(scan, ground);
    scan.ids.forEach((id, k) => {
      if (flags[k] === 1) found.add(`${id.multiplicity}${id.irrep}`);
    });
  }
  cache.set(key, found);
  return found;
}
