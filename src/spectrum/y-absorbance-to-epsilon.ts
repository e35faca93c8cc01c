import { invalidArgument } from '../errors.js';

/**
 * Beer–Lambert law: ε = A / (c · l), with A decadic absorbance, c in mol/L
 * and l in cm, giving ε in L mol-1 cm-1. Works on one number or an array.
 */
export function absorbanceToEpsilon(absorbance: number, concentration: number, pathLength = 1): number {
  checkBeerLambert(concentration, pathLength);
  return absorbance / (concentration * pathLength);
}

/** Array form of absorbanceToEpsilon. */
export function yAbsorbanceToEpsilon(y: Float64Array, concentration: number, pathLength = 1): Float64Array {
  checkBeerLambert(concentration, pathLength);
  const factor = 1 / (concentration * pathLength);
  const out = new Float64Array(y.length);
  for (let i = 0; i < y.length; i++) out[i] = (y[i] as number) * factor;
  return out;
}

/** A = ε · c · l, the inverse of absorbanceToEpsilon. */
export function epsilonToAbsorbance(epsilon: number, concentration: number, pathLength = 1): number {
  checkBeerLambert(concentration, pathLength);
  return epsilon * concentration * pathLength;
}

function checkBeerLambert(concentration: number, pathLength: number): void {
  if (!(concentration > 0) || !Number.isFinite(concentration)) {
    throw invalidArgument('concentration', `concentration: expected a positive number of mol/L, got ${concentration}`);
  }
  if (!(pathLength > 0) || !Number.isFinite(pathLength)) {
    throw invalidArgument('pathLength', `pathLength: expected a positive number of cm, got ${pathLength}`);
  }
}
