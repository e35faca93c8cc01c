import { describe, expect, it } from 'vitest';
import { FieldgapError, invalidArgument, isFieldgapError } from '../src/errors.js';

describe('FieldgapError', () => {
  it('carries a code, a path and a message, and serialises to them', () => {
    const error = invalidArgument('--dq', '--dq: expected a number');
    expect(isFieldgapError(error)).toBe(true);
    expect(error).toBeInstanceOf(FieldgapError);
    expect(error.toJSON()).toEqual({ code: 'invalid-argument', path: '--dq', message: '--dq: expected a number' });
  });
});
