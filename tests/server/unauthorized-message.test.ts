import request from 'supertest';
import { afterEach, expect, it } from 'vitest';
import { singleTokenResolver } from '../../server/security/auth.js';
import { makeTestApp, type TestApp } from './helpers.js';

/**
 * The 401 a facility's user meets (found in the audit: it said only "open the
 * address it printed at start", a token that is refused once the library has
 * users). It now names both ways to a token.
 */
let t: TestApp | undefined;
afterEach(async () => {
  await t?.dispose();
  t = undefined;
});

it('the 401 says where a token comes from: a user\'s (fieldgap users token) or the printed one', async () => {
  t = makeTestApp({ identify: singleTokenResolver('correct-horse-battery-staple-42'), allowedHosts: ['127.0.0.1'] });
  const res = await request(t.app).get('/api/v1/analyses').expect(401);
  expect(res.body.error.code).toBe('unauthorized');
  expect(res.body.error.message).toContain('fieldgap users token NAME');
  expect(res.body.error.message).toContain('printed at start');
  expect(res.body.error.message).not.toContain('\n');
});
