/**
 * Command-line arguments for every entry point (the CLI's commands and the
 * service's `node dist/server/main.js`): node:util parseArgs in strict mode,
 * and option values checked into numbers or choices, each error naming the
 * option.
 */
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { invalidArgument } from './errors.js';

type Options = NonNullable<ParseArgsConfig['options']>;

/**
 * parseArgs in strict mode, with its errors turned into FieldgapError naming
 * the option, so the user sees one line such as "--dq: expected a number".
 */
export function parseCommandArgs<O extends Options>(
  argv: string[],
  options: O,
  allowPositionals = false,
) {
  try {
    return parseArgs({ args: argv, options, strict: true, allowPositionals, allowNegative: false });
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const match = /'(-{1,2}[\w-]+)/.exec(message);
    const option = match?.[1] ?? 'arguments';
    // "--bands -5,10": node's three-line "ambiguous" message becomes one line that says what to type.
    const next = argv[argv.indexOf(option) + 1];
    if (/is ambiguous/.test(message) && argv.includes(option) && next !== undefined) {
      throw invalidArgument(option, `${option}: the value "${next}" starts with "-" and reads as an option: write ${option}=${next}`);
    }
    if (/^Unknown option/.test(message) && match) {
      const near = nearestOption(option, Object.keys(options));
      throw invalidArgument(option, `${option}: no such option${near ? `; did you mean --${near}?` : ''} (every option: --help)`);
    }
    throw invalidArgument(option, message.replace(/\.?\s*To specify.*$/s, '').replace(/\s*\n\s*/g, ' '));
  }
}

/**
 * The option name closest to a mistyped one (edit distance at most 2, or one of
 * three letters or more being a prefix of the other), or undefined. Hand-written rather than the
 * npm package leven: a dozen lines over a handful of short names, and no new
 * dependency in the shared package.json for an error message.
 */
export function nearestOption(typed: string, names: readonly string[]): string | undefined {
  const word = typed.replace(/^-+/, '').toLowerCase();
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const name of names) {
    const d = Math.min(word.length, name.length) >= 3 && (name.startsWith(word) || word.startsWith(name)) ? 1 : editDistance(word, name);
    if (d < bestDistance) [best, bestDistance] = [name, d];
  }
  return bestDistance <= 2 ? best : undefined;
}

/** Levenshtein distance (insertions, deletions, substitutions each 1). */
function editDistance(a: string, b: string): number {
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const row = [i];
    for (let j = 1; j <= b.length; j++) {
      row[j] = Math.min((previous[j] as number) + 1, (row[j - 1] as number) + 1, (previous[j - 1] as number) + (a[i - 1] === b[j - 1] ? 0 : 1));
    }
    previous = row;
  }
  return previous[b.length] as number;
}

/** A finite number from an option value, or a clear error naming the option. */
export function numberOption(
  name: string,
  raw: string | undefined,
  { required = false, min = -Infinity, max = Infinity, integer = false } = {},
): number | undefined {
  if (raw === undefined) {
    if (required) throw invalidArgument(`--${name}`, `--${name} is required`);
    return undefined;
  }
  const value = Number(raw.trim());
  if (raw.trim() === '' || !Number.isFinite(value)) {
    // A decimal comma (a European locale's 0,012) is not read as a number, so as not to guess: say how to write it.
    const comma = /^\s*[-+]?\d*,\d+\s*$/.test(raw) ? ` (write the decimal point: ${raw.trim().replace(',', '.')})` : '';
    throw invalidArgument(`--${name}`, `--${name}: expected a number, got "${raw}"${comma}`);
  }
  if (integer && !Number.isInteger(value)) {
    throw invalidArgument(`--${name}`, `--${name}: expected a whole number, got "${raw}"`);
  }
  if (value < min || value > max) {
    throw invalidArgument(`--${name}`, `--${name}: ${raw.trim()} ${rangeWords(min, max)}`);
  }
  return value;
}

/**
 * The allowed range in words: a minimum of Number.MIN_VALUE means "greater
 * than 0" (no user should read 5e-324), an infinite end is left unsaid.
 */
export function rangeWords(min: number, max: number): string {
  const low = min === Number.MIN_VALUE ? 'greater than 0' : `at least ${min}`;
  if (max === Infinity) return min === -Infinity ? 'is not allowed' : `is not allowed: the value must be ${low}`;
  if (min === -Infinity) return `is not allowed: the value must be at most ${max}`;
  return min === Number.MIN_VALUE ? `is not allowed: the value must be greater than 0 and at most ${max}` : `is outside the allowed range ${min} to ${max}`;
}

/** One of a fixed set of words, or a clear error listing them. */
export function choiceOption<T extends string>(
  name: string,
  raw: string | undefined,
  choices: readonly T[],
  fallback: T,
): T {
  if (raw === undefined) return fallback;
  const value = raw.trim().toLowerCase() as T;
  if (!choices.includes(value)) {
    throw invalidArgument(`--${name}`, `--${name}: expected one of ${choices.join(', ')}, got "${raw}"`);
  }
  return value;
}
