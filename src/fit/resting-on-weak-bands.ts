/**
 * Which parameters the chosen assignment fixes only through an assumption
 * the band positions cannot check (split from result.ts, issue 18).
 */
import type { Evaluated } from './evaluate.js';
import { dqOnlyLevel } from './candidates.js';
import type { FitSettings } from './settings.js';

/**
 * Parameters that the chosen assignment fixes only through an assumption the
 * positions cannot check (issue 13, item 5: say which parameter the data
 * cannot fix):
 * - B (and C) when a single band is assigned to a spin-allowed transition and
 *   the rest to spin-forbidden ones: B then rests on which of the many weak
 *   spin-forbidden transitions those bands are, and a stray or split maximum
 *   finds one within its σ (common practice: B is read from two spin-allowed
 *   bands, or from the sextet-free spectrum of high-spin d5).
 *   10Dq then rests on that B as well, unless the spin-allowed band lies at
 *   exactly 10Dq (ν1 of d3, d8).
 * - 10Dq when one band is fitted and the spin-allowed class has several
 *   transitions: which one the band is cannot be told from its position
 *   alone, and 10Dq follows from that choice.
 * - 10Dq and B when fewer than two of the spin-allowed bands they are fitted
 *   to have their maximum inside the measured range: the others' positions
 *   are extrapolated from a flank (the spectrum stage's 'beyond-…' bands),
 *   and a two-parameter fit through one extrapolated position is no
 *   measurement of B.
 * The value is still reported; the entry and the warning say on what it rests.
 */
export function restingOnWeakBands(best: Evaluated, settings: FitSettings): Array<{ parameter: 'b' | 'tenDq'; reason: string; action: string; warning: string }> {
  const { branch, variant, scan } = best.candidate;
  const out: Array<{ parameter: 'b' | 'tenDq'; reason: string; action: string; warning: string }> = [];
  if (branch.allowed.length === 0) return out;
  const allowed = new Set(branch.allowed);
  // A band flagged spin-forbidden on a weak spin-allowed level (flaggedClass, enumerate.ts) is as weak a support as a spin-forbidden one.
  const strong = (k: number, i: number) => allowed.has(k) && i < variant.nPrimary;
  const assignedAllowed = new Set(Array.from(best.levelIndices).filter((k, i) => strong(k, i)));
  const assignedWeak = Array.from(best.levelIndices).filter((k, i) => !strong(k, i));
  const weakAllowed = assignedWeak.some((k) => allowed.has(k));
  if (best.bDetermined && assignedAllowed.size === 1 && assignedWeak.length > 0) {
    const which = weakAllowed ? 'the weak (flagged) ones' : 'the spin-forbidden ones';
    out.push({
      parameter: 'b',
      reason: `one band is assigned to a strong spin-allowed transition; B rests on the assignment of ${which}`,
      action: 'reported, but not determined by spin-allowed bands',
      warning: `B = ${Math.round(best.params.b)} cm-1 is not determined by spin-allowed bands: one band is a strong spin-allowed one and B rests on which ${weakAllowed ? 'weak (spin-forbidden or two-electron)' : 'spin-forbidden'} transitions the others are`,
    });
    if (dqOnlyLevel(scan, branch) !== [...assignedAllowed][0]) {
      out.push({
        parameter: 'tenDq',
        reason: `one band is assigned to a strong spin-allowed transition whose energy depends on B; B rests on ${which}`,
        action: 'reported, but not determined by spin-allowed bands',
        warning: `10Dq = ${Math.round(10 * best.params.dq)} cm-1 is not determined by spin-allowed bands alone: it rests on B, and B on the ${weakAllowed ? 'weak bands\' assignment' : 'spin-forbidden assignment'}`,
      });
    }
  }
  const window = settings.window;
  if (window && best.bDetermined && !best.bPrior) {
    const observations = variant.observations;
    const allowedRows = observations.map((o, i) => ({ o, k: best.levelIndices[i]! })).filter(({ k }) => allowed.has(k));
    const outside = allowedRows.filter(({ o }) => o.position < window.min || o.position > window.max);
    if (outside.length > 0 && allowedRows.length - outside.length < 2) {
      const where = outside.map(({ o }) => Math.round(o.position)).join(' and ');
      const reason = `it rests on the band at ${where} cm-1, whose maximum lies outside the measured range (${Math.round(window.min)}–${Math.round(window.max)} cm-1): its position is extrapolated`;
      for (const [parameter, name, value] of [['tenDq', '10Dq', 10 * best.params.dq], ['b', 'B', best.params.b]] as const) {
        if (out.some((u) => u.parameter === parameter)) continue;
        out.push({ parameter, reason, action: 'reported, but not fixed by bands inside the measured range', warning: `${name} = ${Math.round(value)} cm-1 is not determined by bands inside the measured range: ${reason}` });
      }
    }
  }
  if (variant.observations.length === 1 && branch.allowed.length > 1 && assignedAllowed.size === 1) {
    const id = scan.ids[best.levelIndices[0]!]!;
    out.push({
      parameter: 'tenDq',
      reason: `one band, and ${describeSingle(settings, branch.multiplicity)} has ${branch.allowed.length} spin-allowed transitions`,
      action: `reported, assuming the band is ${scan.ids[branch.ground]!.label} → ${id.label}`,
      warning: `10Dq = ${Math.round(10 * best.params.dq)} cm-1 is not determined by one band alone: it assumes the band is ${scan.ids[branch.ground]!.label} → ${id.label}, one of ${branch.allowed.length} spin-allowed transitions`,
    });
  }
  return out;
}

/** "d7 octahedral with a quartet ground level". */
export function describeSingle(settings: FitSettings, multiplicity: number): string {
  const names = ['', 'singlet', 'doublet', 'triplet', 'quartet', 'quintet', 'sextet'];
  return `d${settings.d} ${settings.geometry} with a ${names[multiplicity] ?? `${multiplicity}-fold`} ground level`;
}
