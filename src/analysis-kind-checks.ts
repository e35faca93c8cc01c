/**
 * What the assignment and the bands' intensities say together, once the fit
 * is made: a band strong by its size assigned to a spin-forbidden
 * transition is a contradiction the user must hear of (AUDIT2 finding 4),
 * above all for high-spin d5, where every d–d band is spin-forbidden.
 *
 * Intensity ranges (common practice, after Lever, Inorganic Electronic
 * Spectroscopy, 1984, as the validation corpus's families cite it,
 * tests/accuracy/families.ts): the spin-forbidden d–d bands of high-spin d5
 * are weak: hexaaqua Mn(II) ε ≈ 0.03, octahedral Fe(III) ε ≈ 1–4 (a
 * trivalent ion's bands borrow intensity from its nearby charge-transfer
 * bands), tetrahedral MnX4 2- ε ≈ 1–4. The ceilings used here are
 * generous (octahedral: 1 for a divalent ion, 5 for a trivalent; 10
 * tetrahedral), so no measured d5 spectrum trips them; a band ten times
 * above is no d–d band of high-spin d5: charge transfer, or another ion.
 */
import { parseIon } from './chemistry/ions.js';
import type { FitResult } from './fit/index.js';
import type { AssignedKind } from './report/band-assigned-kind.js';
import type { Band } from './spectrum/types.js';

/** ε ceiling of a spin-forbidden d–d band of high-spin d5, L mol-1 cm-1 (common practice, see above); the ion's charge from its label, 2 when not given. */
export function spinForbiddenEpsilonCeiling(geometry: FitResult['geometry'], ion?: string | null): number {
  if (geometry === 'tetrahedral') return 10;
  return ionCharge(ion) >= 3 ? 5 : 1;
}

function ionCharge(ion: string | null | undefined): number {
  if (ion === undefined || ion === null) return 2;
  try {
    return parseIon(ion).charge;
  } catch {
    return 2;
  }
}

/**
 * Without ε: a band whose absorbance as a spin-forbidden band would need more
 * than this concentration (mol/L) at the ceiling is called out: Mn(II) and
 * Fe(III) solutions are measured at up to about 1 mol/L for their weak bands
 * (common practice).
 */
export const SUSPECT_CONCENTRATION = 1;

/** How far above the ceiling a band is not taken as d–d at all. */
export const NOT_D_D_FACTOR = 10;

/** True when every d–d transition of the fit's ground state is spin-forbidden: high-spin d5 (6A1g, 6A1). */
export function allDdSpinForbidden(fit: Pick<FitResult, 'd' | 'spinState'>): boolean {
  return fit.d === 5 && fit.spinState === 'high-spin';
}

/**
 * Indices of the assigned bands of a high-spin d5 fit whose ε lies far
 * (NOT_D_D_FACTOR times) above the spin-forbidden ceiling: not d–d bands of
 * that ion. Empty without ε or for any other fit.
 */
export function bandsTooStrongForFit(bands: readonly Pick<Band, 'epsilon'>[], kinds: readonly (AssignedKind | null)[], fit: Pick<FitResult, 'd' | 'spinState' | 'geometry' | 'ion'>): number[] {
  if (!allDdSpinForbidden(fit)) return [];
  const limit = NOT_D_D_FACTOR * spinForbiddenEpsilonCeiling(fit.geometry, fit.ion);
  return bands.flatMap((b, i) => (kinds[i] != null && b.epsilon !== null && b.epsilon > limit ? [i] : []));
}

/**
 * Warnings where a band's intensity and its assigned transition disagree:
 * - high-spin d5: any assigned band the spectrum calls d-d by its size, or
 *   with ε above the spin-forbidden ceiling;
 * - otherwise: a band as strong as the spin-allowed ones (class 'd-d')
 *   assigned to a spin-forbidden transition.
 */
export function assignedKindWarnings(bands: readonly Pick<Band, 'position' | 'kind' | 'epsilon' | 'height'>[], kinds: readonly (AssignedKind | null)[], fit: Pick<FitResult, 'd' | 'spinState' | 'geometry' | 'assignments' | 'ion'>, pathLength = 1): string[] {
  const at = (i: number) => {
    const b = bands[i]!;
    return `${Math.round(b.position)} cm-1 (${b.epsilon !== null ? `ε = ${b.epsilon.toPrecision(3)} L mol-1 cm-1` : `A = ${b.height.toPrecision(3)}`})`;
  };
  const list = (indices: number[]) => `${indices.length > 1 ? 'bands at' : 'band at'} ${indices.map(at).join(', ')}`;
  if (allDdSpinForbidden(fit)) {
    const ceiling = spinForbiddenEpsilonCeiling(fit.geometry, fit.ion);
    const assigned = bands.flatMap((_, i) => (kinds[i] != null ? [i] : []));
    const head = `for high-spin d5 all d–d bands are spin-forbidden and weak (ε below ~${ceiling} L mol-1 cm-1 for ${fit.ion ?? 'this ion'} ${fit.geometry}; about 0.03 for hexaaqua Mn(II))`;
    if (assigned.every((i) => bands[i]!.epsilon !== null)) {
      const strong = assigned.filter((i) => bands[i]!.epsilon! > ceiling);
      if (strong.length === 0) return [];
      return [`${head}; the ${list(strong)} ${strong.length > 1 ? 'are' : 'is'} stronger than that: check the ion or the concentration`];
    }
    const tallest = Math.max(0, ...assigned.map((i) => bands[i]!.height));
    const needed = tallest / (ceiling * pathLength);
    if (needed <= SUSPECT_CONCENTRATION) return [];
    const strong = assigned.filter((i) => bands[i]!.height / (ceiling * pathLength) > SUSPECT_CONCENTRATION);
    return [`${head}; the ${list(strong)} would need a concentration above ${needed.toPrecision(2)} mol/L (${pathLength} cm): check the ion, or give the concentration (--conc) so that ε can tell`];
  }
  if (!fit.assignments.some((a) => a.spinAllowed)) return [];
  const doubtful = bands.flatMap((b, i) => (kinds[i] === 'spin-forbidden' && b.kind === 'd-d' ? [i] : []));
  if (doubtful.length === 0) return [];
  return [`the ${list(doubtful)}, as strong as the spin-allowed bands, ${doubtful.length > 1 ? 'are' : 'is'} assigned to a spin-forbidden transition: a doubtful assignment (a spin-forbidden band is much weaker than the spin-allowed ones of the same spectrum)`];
}
