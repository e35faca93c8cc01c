import { FieldgapError } from '../errors.js';
import type { Ion } from '../chemistry/ions.js';
import { spinStateChoice } from '../ligand-field/spin-state.js';
import { probabilityText } from '../report/probability.js';
import type { Geometry, SpinState } from '../ligand-field/types.js';
import { spinRule, type PredictGeometry, type Rule } from './rules.js';
import { spinNumbers, type SpinNumbers } from './spin-decision.js';

/**
 * The spin state of a complex as a decision: no choice (d^n has one spin
 * state in this geometry), a named rule of the trade (rules.ts), or the
 * numbers, 10Dq against the engine's crossover with a probability
 * (spin-decision.ts), in that order; and where the moment departs from
 * spin-only. Energies in cm-1.
 */

/** How the spin state was decided. */
export interface SpinDecision {
  state: SpinState;
  /** 'rule': a named rule of the trade; 'numbers': 10Dq against the crossover; 'no-choice': d^n has one spin state here. */
  decidedBy: 'rule' | 'numbers' | 'no-choice';
  rule: Rule | null;
  /** Both spin states plausible on the numbers (each ≥ 10%) and no rule decides. */
  borderline: boolean;
  /** The numbers' verdict, when B could be estimated and d^n has a crossover; else null. */
  numbers: SpinNumbers | null;
  /** One sentence a user reads. */
  summary: string;
}

/** The spin state: no choice, a named rule, or the numbers (in that order). */
export function decideSpin(
  metal: Ion,
  geometry: PredictGeometry,
  tenDq: number,
  tenDqSigmaRel: number,
  racah: { b: number; c: number; bSigmaRel: number } | undefined,
  keys: readonly string[],
  warnings: string[],
): SpinDecision {
  if (geometry === 'square-planar') {
    const state: SpinState = metal.d >= 4 && metal.d <= 8 ? 'low-spin' : 'no-choice';
    const summary = metal.d === 8
      ? 'square-planar d8: the x²−y² orbital stays empty, so the complex is diamagnetic (common practice)'
      : 'square planar: orbitals filled in order of energy (strong-field filling, an assumption; the square-planar field is not modelled)';
    return { state, decidedBy: metal.d === 8 ? 'rule' : 'no-choice', rule: null, borderline: false, numbers: null, summary };
  }
  const cubic: Geometry = geometry;
  if (!spinStateChoice(metal.d, cubic)) {
    return { state: 'no-choice', decidedBy: 'no-choice', rule: null, borderline: false, numbers: null, summary: `d${metal.d} ${cubic} has one spin state only: no high/low-spin choice` };
  }
  const numbers = racah
    ? spinNumbers({ d: metal.d, geometry: cubic, tenDq, tenDqSigmaRel, b: racah.b, c: racah.c, bSigmaRel: racah.bSigmaRel }) ?? null
    : null;
  const ruled = spinRule(metal, geometry, { keys });
  if (ruled) {
    if (numbers) {
      const p = ruled.spin === 'low-spin' ? numbers.probabilities.lowSpin : numbers.probabilities.highSpin;
      if (p < 0.5) {
        warnings.push(`the estimated numbers alone lean the other way (P(${ruled.spin}) = ${p.toFixed(2)}): the rule "${ruled.rule.statement}" decides; Jørgensen's factors are least reliable at the ends of the series`);
      }
    }
    return { state: ruled.spin, decidedBy: 'rule', rule: ruled.rule, borderline: false, numbers, summary: `${ruled.spin} by the rule: ${ruled.rule.statement} (${ruled.rule.source})` };
  }
  if (!numbers) {
    throw new FieldgapError(
      'invalid-argument',
      `${metal.label} (d${metal.d}, ${cubic}) can be high- or low-spin, no rule of the trade decides it, and Racah B cannot be estimated (no free-ion B0 for ${metal.label}): give the geometry or your own factors`,
      'formula',
    );
  }
  const lowSpin = numbers.probabilities.lowSpin >= 0.5;
  const state: SpinState = lowSpin ? 'low-spin' : 'high-spin';
  const p = lowSpin ? numbers.probabilities.lowSpin : numbers.probabilities.highSpin;
  const side = lowSpin ? 'above' : 'below';
  // p ≥ 0.5 here, so the wording is "P = 0.87" or "P > 0.99".
  const pText = probabilityText(p);
  const summary = numbers.borderline
    ? `borderline: 10Dq ≈ ${Math.round(tenDq)} cm-1 lies within the uncertainty of the crossover (${Math.round(numbers.crossoverTenDq)} cm-1); ${state} more likely (${pText})`
    : `${state}: 10Dq ≈ ${Math.round(tenDq)} cm-1 lies ${side} the crossover ${Math.round(numbers.crossoverTenDq)} cm-1 (${pText})`;
  if (numbers.borderline) warnings.push(`borderline spin state: P(high-spin) = ${numbers.probabilities.highSpin.toFixed(2)}, P(low-spin) = ${numbers.probabilities.lowSpin.toFixed(2)}; spin crossover or a mixture is possible`);
  return { state, decidedBy: 'numbers', rule: null, borderline: numbers.borderline, numbers, summary };
}

/**
 * Orbital contribution to the moment: expected (first order) for T ground
 * terms, orbital triplets. A and E terms have none in first order, but
 * spin–orbit coupling mixes in the T term 10Dq above: μ ≈ μso(1 − αλ/10Dq),
 * α = 4 for A2, 2 for E (Figgis, Introduction to Ligand Fields (1966); the
 * formula from memory), λ > 0 for a less than half-filled shell (μ below
 * spin-only), λ < 0 for a more than half-filled one (μ above); noticeable
 * where 10Dq is small (tetrahedral Co(II): 4.4–4.8 μB against 3.87, from
 * memory). A1 terms with S > 0 (6A1 of d5) have no orbital angular momentum
 * to mix in: spin-only. A closed-shell ground term (singlet) is diamagnetic.
 * d, when given, decides the sign of λ; without it the direction is not said.
 */
export function orbitalContribution(term: string, geometry: PredictGeometry, d?: number): { expected: boolean; why: string } {
  const m = /^(\d+)([A-Z]\d?)/.exec(term);
  const multiplicity = m ? Number(m[1]) : NaN;
  const irrep = m?.[2] ?? '';
  if (multiplicity === 1) return { expected: false, why: `${term}: no unpaired electrons, the complex is diamagnetic (common practice)` };
  if (geometry !== 'square-planar' && irrep.startsWith('T')) {
    return { expected: true, why: `${term} is an orbital triplet: an orbital contribution is expected, the moment departs from spin-only (common practice)` };
  }
  const secondOrder = geometry !== 'square-planar' && (irrep === 'A2' || irrep.startsWith('E'));
  if (secondOrder) {
    const alpha = irrep === 'A2' ? 4 : 2;
    const kind = irrep === 'A2' ? 'orbitally non-degenerate' : 'an orbital doublet';
    const direction = d === undefined || d === 5 ? 'shifted from spin-only' : d > 5 ? 'somewhat above spin-only (λ < 0, shell more than half full)' : 'somewhat below spin-only (λ > 0, shell less than half full)';
    return {
      expected: false,
      why: `${term} is ${kind}: no first-order orbital contribution, but spin–orbit mixing with the excited T term puts the moment ${direction}, μ ≈ μso(1 − ${alpha}λ/10Dq), the more so the smaller 10Dq (Figgis, Introduction to Ligand Fields (1966), from memory)`,
    };
  }
  if (irrep.startsWith('A') && multiplicity === 6) return { expected: false, why: `${term} has no orbital angular momentum, not even by mixing: spin-only (common practice)` };
  return { expected: false, why: `${term === 'not modelled' ? 'non-degenerate ground state assumed' : `${term} is orbitally non-degenerate`}: close to spin-only (common practice)` };
}
