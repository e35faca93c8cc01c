import { FieldgapError } from '../../src/errors.js';

/** The FieldgapError that `run` throws; fails the test when it throws nothing or something else. */
export function errorOf(run: () => unknown): FieldgapError {
  try {
    run();
  } catch (error) {
    if (error instanceof FieldgapError) return error;
    throw error;
  }
  throw new Error('expected a FieldgapError');
}
