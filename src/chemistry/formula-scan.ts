import { FieldgapError } from '../errors.js';

/**
 * A tiny left-to-right scanner over a formula, shared by the formula parser's
 * stages. Positions in messages are 1-based characters of the text as typed.
 */
export class FormulaScanner {
  readonly text: string;
  index = 0;
  private readonly original: string;

  constructor(original: string) {
    this.original = original;
    this.text = normaliseFormulaText(original);
  }

  get done(): boolean {
    return this.index >= this.text.length;
  }

  peek(offset = 0): string {
    return this.text[this.index + offset] ?? '';
  }

  skipSpaces(): void {
    while (/\s/.test(this.peek())) this.index += 1;
  }

  /** Reads a run of digits; `fallback` when there is none. */
  count(fallback = 1): number {
    const m = /^\d+/.exec(this.text.slice(this.index));
    if (!m) return fallback;
    this.index += m[0].length;
    return Number(m[0]);
  }

  /** Index of the bracket closing the one at `open`, or -1. */
  closing(open: number): number {
    const pairs: Record<string, string> = { '(': ')', '[': ']', '{': '}' };
    const stack: string[] = [];
    for (let i = open; i < this.text.length; i += 1) {
      const ch = this.text[i] as string;
      if (pairs[ch]) stack.push(pairs[ch] as string);
      else if (ch === ')' || ch === ']' || ch === '}') {
        if (stack.pop() !== ch) return -1;
        if (stack.length === 0) return i;
      }
    }
    return -1;
  }

  /** FieldgapError('parse-error') naming the character (1-based) and the formula. */
  error(message: string, at = this.index): FieldgapError {
    return new FieldgapError('parse-error', `${message} (character ${at + 1} of "${this.original}")`, 'formula');
  }

  /** Checks that every bracket is closed by its own kind; throws naming the first bad one. */
  checkBrackets(): void {
    const stack: { ch: string; at: number }[] = [];
    const closes: Record<string, string> = { ')': '(', ']': '[', '}': '{' };
    for (let i = 0; i < this.text.length; i += 1) {
      const ch = this.text[i] as string;
      if (ch === '(' || ch === '[' || ch === '{') stack.push({ ch, at: i });
      else if (closes[ch]) {
        const top = stack.pop();
        if (!top) throw this.error(`unbalanced brackets: "${ch}" closes nothing`, i);
        if (top.ch !== closes[ch]) throw this.error(`unbalanced brackets: "${ch}" closes "${top.ch}"`, i);
      }
    }
    const open = stack.pop();
    if (open) throw this.error(`unbalanced brackets: "${open.ch}" is never closed`, open.at);
  }
}

const CHARACTER_MAP: Record<string, string> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9',
  '₀': '0', '₁': '1', '₂': '2', '₃': '3', '₄': '4', '₅': '5', '₆': '6', '₇': '7', '₈': '8', '₉': '9',
  '⁺': '+', '⁻': '-', '−': '-', '–': '-',
};

/** Sub- and superscript digits and signs to ASCII, one character for one, so positions stay. */
export function normaliseFormulaText(text: string): string {
  return text.replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹₀-₉⁺⁻−–]/g, (ch) => CHARACTER_MAP[ch] ?? ch);
}

/**
 * A charge written after a complex: "3+", "^3+", "2-", "+", "--", "+3".
 * Returns the charge and the characters used, or undefined if none starts here.
 */
export function chargeAt(text: string, index: number): { charge: number; length: number } | undefined {
  const rest = text.slice(index);
  const m = /^\^?\s*(?:(\d+)\s*([+-])|([+-])(\d+)|(\++|-+))/.exec(rest);
  if (!m) return undefined;
  let charge: number;
  if (m[1] !== undefined) charge = Number(m[1]) * (m[2] === '+' ? 1 : -1);
  else if (m[4] !== undefined) charge = Number(m[4]) * (m[3] === '+' ? 1 : -1);
  else charge = (m[5] as string).length * ((m[5] as string)[0] === '+' ? 1 : -1);
  return { charge, length: m[0].length };
}
