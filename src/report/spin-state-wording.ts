/**
 * The one wording of a spin state for people. A d^n and geometry with one
 * spin state only ('no-choice') is said as NO_SPIN_STATE_CHOICE in every
 * sentence of the CLI and the page; text-table cells and the page's cards
 * use the short words (spinStateWords: "one possible"), while CSV and JSON
 * keep the value itself ('high-spin', 'low-spin', 'no-choice').
 */
import type { SpinState } from '../ligand-field/types.js';

export const NO_SPIN_STATE_CHOICE = 'no high/low-spin choice';

/** "no high/low-spin choice for d3 octahedral", or the state itself. */
export function spinStateSentence(spinState: SpinState, d: number, geometry: string): string {
  return spinState === 'no-choice' ? `${NO_SPIN_STATE_CHOICE} for d${d} ${geometry}` : spinState;
}

/** Short words for a card or cell on the page: "high spin", "low spin", "one possible"; unknown words pass through. */
export function spinStateWords(spinState: SpinState | string): string {
  return spinState === 'no-choice' ? 'one possible' : spinState.replace('-', ' ');
}
