import { expect } from 'vitest';

/**
 * The record in a POST /api/v1/analyses answer of a file with one spectrum:
 * checks that the fields the answer adds to the record (`records`, listing
 * the file's one record, and an empty `notSaved`) say so, and returns the
 * record without them, as GET /api/v1/analyses/:id answers it.
 */
export function savedRecordOf(body: Record<string, unknown>): Record<string, unknown> {
  const { records, notSaved, ...record } = body;
  expect(records).toEqual([{ id: record['id'], sample: record['sample'], column: null, columnName: null }]);
  expect(notSaved).toEqual([]);
  return record;
}
