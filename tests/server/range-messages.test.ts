import request from 'supertest';
import { afterEach, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { zodToFieldgapError } from '../../server/errors.js';
import { makeTestApp, type TestApp } from './helpers.js';

/**
 * Range errors in words (found in the audit: the page showed "zeta: Too
 * small: expected number to be >=0, got -5"). A schema's own message stays.
 */
const messageOf = (schema: z.ZodType, input: unknown): string => {
  const result = schema.safeParse(input);
  if (result.success) throw new Error('expected a failure');
  return zodToFieldgapError(result.error, input).message;
};

describe('range messages', () => {
  it('numbers: ≥, >, ≤, <', () => {
    expect(messageOf(z.object({ zeta: z.number().min(0) }), { zeta: -5 })).toBe('zeta: must be ≥ 0, got -5');
    expect(messageOf(z.object({ dq: z.number().positive() }), { dq: 0 })).toBe('dq: must be > 0, got 0');
    expect(messageOf(z.object({ d: z.number().max(10) }), { d: 12 })).toBe('d: must be ≤ 10, got 12');
    expect(messageOf(z.object({ d: z.number().lt(10) }), { d: 12 })).toBe('d: must be < 10, got 12');
  });

  it('arrays and strings by count; a schema\'s own message is kept', () => {
    expect(messageOf(z.object({ bands: z.array(z.number()).max(2) }), { bands: [1, 2, 3] })).toBe('bands: must have at most 2 items, got an array of 3 items');
    expect(messageOf(z.object({ ion: z.string().min(1) }), { ion: '' })).toBe('ion: must have at least 1 character, got ""');
    expect(messageOf(z.object({ b: z.number().min(1, 'B must be positive') }), { b: 0 })).toBe('b: B must be positive, got 0');
  });

  describe('over REST', () => {
    let t: TestApp | undefined;
    afterEach(async () => {
      await t?.dispose();
      t = undefined;
    });
    it('GET /api/v1/levels with zeta=-5 says "must be ≥ 0"', async () => {
      t = makeTestApp();
      const res = await request(t.app).get('/api/v1/levels?d=9&geometry=octahedral&dq=1200&b=1000&c=4000&ds=1500&dt=300&zeta=-5').expect(400);
      expect(res.body.error).toEqual({ code: 'invalid-argument', message: 'zeta: must be ≥ 0, got -5', path: 'zeta' });
    });
  });
});
