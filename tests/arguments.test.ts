import { describe, expect, it } from 'vitest';
import { parseCommandArgs } from '../src/arguments.js';
import { runCli } from '../src/cli/main.js';
import type { CliIo } from '../src/cli/command.js';
import { FieldgapError } from '../src/errors.js';

/** node:util parseArgs errors as one line naming the option (found in the audit: "--bands -5,10" printed three lines). */
describe('parseCommandArgs', () => {
  const options = { bands: { type: 'string' }, json: { type: 'boolean' } } as const;
  const errorOf = (argv: string[]): FieldgapError => {
    try {
      parseCommandArgs(argv, options);
    } catch (error) {
      return error as FieldgapError;
    }
    throw new Error('expected an error');
  };

  it('a value starting with "-" gives one line that says how to write it', () => {
    const error = errorOf(['--bands', '-5,10']);
    expect(error).toBeInstanceOf(FieldgapError);
    expect(error.path).toBe('--bands');
    expect(error.message).toBe('--bands: the value "-5,10" starts with "-" and reads as an option: write --bands=-5,10');
  });

  it('every parseArgs error is one line naming the option', () => {
    for (const argv of [['--bands'], ['--nope', '1'], ['--json=3'], ['--bands', '--json']]) {
      const error = errorOf(argv);
      expect(error.message).not.toContain('\n');
      expect(error.path).toMatch(/^--(bands|nope|json)$/);
    }
  });

  it('fieldgap fit --bands -5,10: one line on stderr, exit 2', async () => {
    let err = '';
    const io: CliIo = { stdout: () => {}, stderr: (t) => { err += t; }, isTty: false, cwd: process.cwd(), env: {} };
    expect(await runCli(['fit', '--ion', 'Ni2+', '--bands', '-5,10'], io)).toBe(2);
    expect(err.trimEnd().split('\n')).toHaveLength(1);
    expect(err).toContain('--bands=-5,10');
  });
});
