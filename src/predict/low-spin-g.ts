/**
 * Jørgensen's g of an ion is the 10Dq of its hexaaqua ion (f(H2O) = 1). For
 * Cr(II), Mn(II), Fe(II), Co(II), Mn(III) and Fe(III) that aqua ion is
 * high-spin, so g was measured on a high-spin complex, with electrons in the
 * antibonding eg set and long metal–ligand bonds. Applied to a low-spin
 * complex of the same ion, f·g misses badly: [Fe(CN)6]4- comes out at
 * 1.7 × 8 500 = 14 450 cm-1 against about 33 800, [Fe(CN)6]3- at 23 800
 * against 34 950 (a known limit of the factorisation at the strong-field
 * end, common practice).
 *
 * Where a low-spin complex of the ion has a published 10Dq, its "low-spin
 * g" = 10Dq / f(ligand) stands in for g, marked as such; σ 20 %: it rests
 * on one complex, and how well it carries over to other strong-field
 * ligands is untested. Elsewhere f·g is kept but its σ widened to
 * UNKNOWN_LOW_SPIN_SCATTER, and the result says why.
 *
 * Sources:
 * - [Fe(CN)6]3-: Dq = 3 495 cm-1, 10Dq = 34 950 ("Bindungsverhältnisse in
 *   Prussiaten", abstract on scilit.net, looked up).
 * - [Fe(CN)6]4-: 10Dq ≈ 33 800 cm-1 (Lever, Inorganic Electronic
 *   Spectroscopy, 2nd ed. (1984), from memory; the audit found a web page
 *   giving 32 000).
 * - [Mn(CN)6]3-: 10Dq ≈ 30 000 cm-1 (Figgis & Hitchman, Ligand Field Theory
 *   and Its Applications (2000), from memory).
 * f(CN-) = 1.7 (Jørgensen, src/chemistry/jorgensen.ts).
 */
import type { FactorValue } from './factor-table.js';

/** Ions whose tabulated (or estimated) g comes from a high-spin hexaaqua ion. */
export const HIGH_SPIN_G_IONS: ReadonlySet<string> = new Set(['Cr2+', 'Mn2+', 'Fe2+', 'Co2+', 'Mn3+', 'Fe3+']);

/** Relative σ of 10Dq = f·g for a low-spin complex of such an ion without a low-spin g: the factor 2.3 of [Fe(CN)6]4- at about two σ (ln 2.3 / 2 ≈ 0.42, as the fit's low-spin prior, src/fit/likelihood.ts), as a relative σ. */
export const UNKNOWN_LOW_SPIN_SCATTER = 0.5;

const F_CN = 1.7;
const lowSpinG = (tenDq: number, complex: string, where: string): FactorValue => ({
  value: Math.round(tenDq / F_CN / 10) * 10,
  sigma: 0.2 * Math.round(tenDq / F_CN / 10) * 10,
  kind: 'estimate',
  source: `low-spin g = 10Dq of ${complex} / f(CN-) = ${tenDq} / ${F_CN} (${where}); rests on one complex, σ 20 %`,
});

/** Low-spin g per ion (see the module docstring). */
export const LOW_SPIN_G: ReadonlyMap<string, FactorValue> = new Map([
  ['Fe2+', lowSpinG(33800, '[Fe(CN)6]4-', 'Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984), from memory')],
  ['Fe3+', lowSpinG(34950, '[Fe(CN)6]3-', 'Dq = 3 495 cm-1, "Bindungsverhältnisse in Prussiaten", abstract on scilit.net, looked up')],
  ['Mn3+', lowSpinG(30000, '[Mn(CN)6]3-', 'Figgis & Hitchman, Ligand Field Theory and Its Applications (2000), from memory')],
]);

/** The complex each low-spin g was taken from: predicting that complex only gives its own source back. */
export const LOW_SPIN_G_COMPLEX: ReadonlyMap<string, string> = new Map([
  ['Fe2+', '[Fe(CN)6]4-'],
  ['Fe3+', '[Fe(CN)6]3-'],
  ['Mn3+', '[Mn(CN)6]3-'],
]);

/** True when a prediction's 10Dq rests on a low-spin g taken from this very complex (circular: no independent estimate). */
export function isLowSpinGSource(ionLabel: string, complexIon: string, tenDqMethod: string): boolean {
  return /low-spin g/.test(tenDqMethod) && LOW_SPIN_G_COMPLEX.get(ionLabel) === complexIon;
}

export type LowSpinAdjustment =
  | { kind: 'low-spin-g'; g: FactorValue; warning: string }
  | { kind: 'widened'; scatter: number; warning: string };

/**
 * What to do with f·g for a complex decided low-spin: use the ion's low-spin
 * g, widen σ, or nothing (the ion's g already is a low-spin one, as for
 * Co(III), or the user gave g). Only octahedral: Jørgensen's table is of
 * octahedral complexes, and low-spin tetrahedral complexes are rare.
 */
export function lowSpinAdjustment(ionLabel: string, geometry: string, state: string, userG: boolean): LowSpinAdjustment | null {
  if (userG || state !== 'low-spin' || geometry !== 'octahedral' || !HIGH_SPIN_G_IONS.has(ionLabel)) return null;
  const g = LOW_SPIN_G.get(ionLabel);
  const why = `the tabulated g(${ionLabel}) is the 10Dq of its high-spin aqua ion, and f·g underestimates its low-spin complexes (about 2.3-fold for [Fe(CN)6]4-)`;
  if (g) return { kind: 'low-spin-g', g, warning: `low-spin ${ionLabel}: 10Dq from its low-spin g = ${g.value} ± ${Math.round(g.sigma)} cm-1 (${g.source}) instead of f·g: ${why}` };
  return { kind: 'widened', scatter: UNKNOWN_LOW_SPIN_SCATTER, warning: `low-spin ${ionLabel}: 10Dq = f·g is likely too low and its ± is widened to ${100 * UNKNOWN_LOW_SPIN_SCATTER}%: ${why}; no low-spin g of ${ionLabel} is known to fieldgap` };
}
