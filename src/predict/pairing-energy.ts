/**
 * The mean spin-pairing energy Π of d^n (octahedral, cm-1) from the Racah
 * parameters, in Griffith's expressions:
 *
 *   d4: Π = 6B + 5C     d5: Π = 7.5B + 5C     d6: Π = 2.5B + 4C     d7: Π = 4B + 4C
 *
 * Source: J. S. Griffith, The Theory of Transition-Metal Ions (1961), mean
 * pairing energies, as reproduced in Huheey, Inorganic Chemistry (coefficients
 * from memory). In the simple picture a complex is low-spin when 10Dq > Π;
 * the engine's exact crossover (crossover.ts) is what decides, Π is shown
 * beside it to explain. Undefined for d-counts with no spin choice.
 */
export const PAIRING_ENERGY_SOURCE = 'Griffith, The Theory of Transition-Metal Ions (1961), mean spin-pairing energies (coefficients from memory)';

const COEFFICIENTS: Record<number, readonly [b: number, c: number]> = {
  4: [6, 5],
  5: [7.5, 5],
  6: [2.5, 4],
  7: [4, 4],
};

/** The expression as text for d^n, "6B + 5C"; undefined outside d4–d7. */
export function pairingEnergyExpression(d: number): string | undefined {
  const k = COEFFICIENTS[d];
  return k ? `${k[0]}B + ${k[1]}C` : undefined;
}

/** Π in cm-1 for d^n at Racah B and C (cm-1); undefined outside d4–d7. */
export function meanPairingEnergy(d: number, b: number, c: number): number | undefined {
  const k = COEFFICIENTS[d];
  return k ? k[0] * b + k[1] * c : undefined;
}
