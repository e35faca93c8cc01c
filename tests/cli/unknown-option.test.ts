import { describe, expect, it } from 'vitest';
import { nearestOption, parseCommandArgs } from '../../src/arguments.js';
import type { FieldgapError } from '../../src/errors.js';
import { errorOf } from '../helpers/errors.js';

/** AUDIT2 finding 23: an unknown option names itself, the nearest real one, and --help; not node's wording. */
const OPTIONS = { c: { type: 'string' }, ion: { type: 'string' }, conc: { type: 'string' }, path: { type: 'string' }, 'no-step-correction': { type: 'boolean' }, json: { type: 'boolean' } } as const;

/** The error `parseCommandArgs` gives for `argv`. */
function parseError(argv: string[]): FieldgapError {
  return errorOf(() => parseCommandArgs(argv, OPTIONS, true));
}

describe('unknown options', () => {
  it('suggest the nearest option for a typo', () => {
    const e = parseError(['a.csv', '--cnoc', '0.1']);
    expect(e.message).toBe('--cnoc: no such option; did you mean --conc? (every option: --help)');
    expect(e.path).toBe('--cnoc');
    // A one-letter option (--c, Racah C) is no prefix match for a longer typo.
    expect(parseError(['--cnoc', '1']).message).not.toMatch(/did you mean --c\?/);
    expect(parseError(['--no-step']).message).toMatch(/did you mean --no-step-correction\?/);
  });

  it('suggest nothing for a word far from every option', () => {
    expect(parseError(['--bogus']).message).toBe('--bogus: no such option (every option: --help)');
  });

  it('nearestOption against a slow reference: every option is its own nearest', () => {
    for (const name of Object.keys(OPTIONS)) expect(nearestOption(`--${name}`, Object.keys(OPTIONS))).toBe(name);
    expect(nearestOption('--ino', Object.keys(OPTIONS))).toBe('ion'); // one transposition = distance 2
    expect(nearestOption('--xyzzy', Object.keys(OPTIONS))).toBeUndefined();
  });
});
