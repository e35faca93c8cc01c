import type { CounterIonCount } from './formula.js';
import { counterIonAt, counterIonByFormula, type CounterIon } from './counter-ions.js';
import type { FormulaScanner } from './formula-scan.js';

/**
 * The parts of a salt's formula outside the complex: counter-ions before
 * (cations) and after (anions) it, and water of crystallisation.
 */

/** Reads one counter-ion with its count ("K3", "(NH4)2", "Cl2", "(NO3)2") at scan.index. */
export function readCounterIon(scan: FormulaScanner, kind: 'cation' | 'anion'): CounterIonCount {
  const at = scan.index;
  let ion: CounterIon | undefined;
  let spelled: string;
  if (scan.peek() === '(') {
    const close = scan.closing(at);
    spelled = scan.text.slice(at + 1, close);
    ion = counterIonByFormula(spelled, kind);
    scan.index = close + 1;
  } else {
    const found = counterIonAt(scan.text, at, kind);
    spelled = found?.spelling ?? (/^[A-Za-z0-9]+/.exec(scan.text.slice(at))?.[0] ?? scan.peek());
    ion = found?.ion;
    if (found) scan.index += found.spelling.length;
  }
  if (!ion) {
    const where = kind === 'cation' ? 'before' : 'after';
    throw scan.error(`unknown counter-${kind} "${spelled}" ${where} the complex`, at);
  }
  const count = scan.count(1);
  return { formula: ion.formula, count, charge: ion.charge };
}

/** "·6H2O", ".H2O", "*2H2O", "·6 H2O" at scan.index: records it and returns true. */
export function readHydrate(scan: FormulaScanner, hydrate: { water: number }): boolean {
  const m = /^[·.•∙*]\s*(\d*)\s*H2O\s*$/.exec(scan.text.slice(scan.index));
  if (!m) {
    if (/^[·.•∙*]/.test(scan.peek())) throw scan.error('cannot read what follows the dot (only water of crystallisation, "·6H2O", is read)');
    return false;
  }
  hydrate.water = m[1] === '' ? 1 : Number(m[1]);
  scan.index = scan.text.length;
  return true;
}
