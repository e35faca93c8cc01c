import { crossoverDqOverB } from '../ligand-field/crossover.js';
import type { Geometry } from '../ligand-field/types.js';
import { normalCdf } from './normal.js';
import { meanPairingEnergy, pairingEnergyExpression, PAIRING_ENERGY_SOURCE } from './pairing-energy.js';

/**
 * The spin state as a decision with a margin: the estimated 10Dq against the
 * engine's exact high-/low-spin crossover at the estimated B and C/B, with the
 * mean pairing energy Π beside it.
 *
 * Uncertainty model: 10Dq and B are log-normal with relative standard
 * deviations σ_Dq and σ_B (independent); the crossover scales with B at fixed
 * C/B, so ln(10Dq / 10Dq_x) is normal with σ² = σ_Dq² + σ_B², and
 * P(low-spin) = Φ(ln(10Dq / 10Dq_x) / σ). The uncertainty of C/B itself is
 * not included. "Borderline" when both states have at least 10% probability.
 */
export interface SpinNumbers {
  /** Estimated 10Dq, cm-1. */
  tenDq: number;
  /** The 10Dq at which the engine's ground state changes spin, at the estimated B and C/B; cm-1. */
  crossoverTenDq: number;
  /** Mean spin-pairing energy Π, cm-1, with the expression used; undefined outside d4–d7. */
  pairingEnergy: { value: number; expression: string; source: string } | undefined;
  /** ln(10Dq / crossover) / σ: how many standard deviations 10Dq lies above the crossover. */
  margin: number;
  /** σ of ln(10Dq / crossover). */
  sigmaLog: number;
  probabilities: { highSpin: number; lowSpin: number };
  borderline: boolean;
}

/** The borderline band: both states at least this probable. */
export const BORDERLINE_PROBABILITY = 0.1;

export interface SpinNumbersInput {
  d: number;
  geometry: Geometry;
  tenDq: number;
  /** Relative σ of 10Dq. */
  tenDqSigmaRel: number;
  b: number;
  c: number;
  /** Relative σ of B. */
  bSigmaRel: number;
}

/** The numbers' verdict, or undefined when d^n in this geometry has no crossover below Dq/B = 20. */
export function spinNumbers(input: SpinNumbersInput): SpinNumbers | undefined {
  const { d, geometry, tenDq, tenDqSigmaRel, b, c, bSigmaRel } = input;
  const x = crossoverDqOverB(d, geometry, c / b, { maxDqOverB: 20 });
  if (x === undefined) return undefined;
  const crossoverTenDq = 10 * x * b;
  const sigmaLog = Math.hypot(tenDqSigmaRel, bSigmaRel);
  const margin = Math.log(tenDq / crossoverTenDq) / sigmaLog;
  const lowSpin = normalCdf(margin);
  const pi = meanPairingEnergy(d, b, c);
  return {
    tenDq,
    crossoverTenDq,
    pairingEnergy: pi === undefined ? undefined : { value: pi, expression: pairingEnergyExpression(d) as string, source: PAIRING_ENERGY_SOURCE },
    margin,
    sigmaLog,
    probabilities: { highSpin: 1 - lowSpin, lowSpin },
    borderline: Math.min(lowSpin, 1 - lowSpin) >= BORDERLINE_PROBABILITY,
  };
}
