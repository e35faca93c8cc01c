import { FieldgapError } from '../../../src/errors.js';

/** The FieldgapError that `run` rejects (or throws) with; fails the test when it succeeds or fails otherwise. */
export async function rejectionOf(run: () => Promise<unknown> | unknown): Promise<FieldgapError> {
  try {
    await run();
  } catch (error) {
    if (error instanceof FieldgapError) return error;
    throw error;
  }
  throw new Error('expected a FieldgapError');
}
