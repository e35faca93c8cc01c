import { createHash } from 'node:crypto';
import request from 'supertest';
import { afterEach, beforeEach, expect, it } from 'vitest';
import { createApp, type FieldgapApp } from '../../server/app.js';
import { createInProcessPool, type ComputePool } from '../../server/pool.js';
import { singleTokenResolver } from '../../server/security/auth.js';
import type { Library } from '../../src/library/library.js';
import type { AnalysisRecord } from '../../src/library/types.js';
import { forEachEngine, freshLibrary, type TestLibrary } from '../storage/helpers/engines.js';
import { handBuiltRecord } from '../storage/helpers/records.js';
import { captureLogger } from './helpers.js';

/**
 * Issue 17 item 3: a user of group A can neither read, list, refit nor
 * delete group B's records, on every library route, on both engines. A
 * record outside the user's group answers 404 exactly as a missing one does
 * (same code, same message), so its existence does not leak.
 *
 * The records are hand-built (numbers made up, tests/storage/helpers/records.ts);
 * these tests check who sees what, not chemistry. The pipeline is a stand-in
 * that answers the hand-built result, so refits cost nothing.
 */

const SERVICE_TOKEN = 'the-single-service-token-0123456789';

function standInPool(): ComputePool {
  const real = createInProcessPool();
  return {
    ...real,
    run: async (task, options) => (task.kind === 'analyze' ? (handBuiltRecord({}, 17_050).result as never) : real.run(task, options)),
  };
}

let where: TestLibrary;
let library: Library;
let app: FieldgapApp;
let tokens: { alice: string; bob: string; root: string };
let recA: AnalysisRecord;
let recB: AnalysisRecord;
let orphan: AnalysisRecord;

const as = (token: string) => ({ Authorization: `Bearer ${token}` });

forEachEngine('users and groups on the library routes', (engine) => {
  beforeEach(async () => {
    where = await freshLibrary(engine);
    library = await where.open();
    await library.users.add('alice', 'labA');
    await library.users.add('bob', 'labB');
    await library.users.add('root', 'ops', true);
    tokens = { alice: await library.users.newToken('alice'), bob: await library.users.newToken('bob'), root: await library.users.newToken('root') };
    // A record of the single-user mode (no group), one of each group; distinct contents so sha256 filters tell them apart.
    orphan = await library.add(handBuiltRecord({ sample: 'before users' }, 17_100));
    recA = await library.scoped({ user: 'alice', group: 'labA', admin: false }).add(handBuiltRecord({ sample: 'alice aqua', ligands: ['H2O'] }, 17_400));
    recB = await library.scoped({ user: 'bob', group: 'labB', admin: false }).add(
      handBuiltRecord({ sample: 'bob ammine', formula: '[Cr(NH3)6]3+', ligands: ['NH3'], fileName: 'b.csv' }, 21_600),
    );
    const location = where.location.engine === 'sqlite' ? { dataDir: where.location.dataDir } : { database: where.location.url };
    app = createApp({
      pool: standInPool(), logger: captureLogger().logger, staticDir: false, ...location,
      identify: singleTokenResolver(SERVICE_TOKEN), identifyUsers: true,
    });
  });
  afterEach(async () => {
    await app.close();
    await library.close();
    await where.dispose();
  });

  /** What a missing record answers, to compare a hidden one with. */
  async function missing(method: 'get' | 'patch' | 'delete' | 'post', path: string, token: string) {
    const res = await request(app)[method](path).set(as(token)).send(method === 'patch' ? { note: 'x' } : undefined);
    return { status: res.status, error: res.body.error };
  }

  it('lists only the group\'s records (GET /analyses), with the total of the group', async () => {
    const res = await request(app).get('/api/v1/analyses').set(as(tokens.alice)).expect(200);
    expect(res.body.analyses.map((a: { id: number }) => a.id)).toEqual([recA.id]);
    expect(res.body.total).toBe(1);
    // Filters cannot reach past the group: B's original by its SHA-256, B's words, B's ion.
    const bySha = await request(app).get('/api/v1/analyses').query({ sha256: recB.original.sha256 }).set(as(tokens.alice)).expect(200);
    expect(bySha.body.total).toBe(0);
    const byWord = await request(app).get('/api/v1/analyses').query({ query: 'ammine' }).set(as(tokens.alice)).expect(200);
    expect(byWord.body.total).toBe(0);
    const bob = await request(app).get('/api/v1/analyses').set(as(tokens.bob)).expect(200);
    expect(bob.body.analyses.map((a: { id: number }) => a.id)).toEqual([recB.id]);
  });

  it('GET /analyses/:id of another group answers 404, as for a record that does not exist', async () => {
    await request(app).get(`/api/v1/analyses/${recA.id}`).set(as(tokens.alice)).expect(200);
    const hidden = await missing('get', `/api/v1/analyses/${recB.id}`, tokens.alice);
    const absent = await missing('get', '/api/v1/analyses/999', tokens.alice);
    expect(hidden.status).toBe(404);
    expect(hidden.error.code).toBe(absent.error.code);
    expect(hidden.error.message).toBe(absent.error.message.replace('999', String(recB.id)));
    expect((await missing('get', `/api/v1/analyses/${orphan.id}`, tokens.alice)).status).toBe(404);
  });

  it('GET /analyses/:id/original of another group answers 404 and sends no byte of it', async () => {
    await request(app).get(`/api/v1/analyses/${recA.id}/original`).set(as(tokens.alice)).expect(200);
    const res = await request(app).get(`/api/v1/analyses/${recB.id}/original`).set(as(tokens.alice)).expect(404);
    expect(res.headers['repr-digest']).toBeUndefined();
    expect(res.text).not.toContain('21600');
  });

  it('PATCH /analyses/:id of another group answers 404 and changes nothing', async () => {
    expect((await missing('patch', `/api/v1/analyses/${recB.id}`, tokens.alice)).status).toBe(404);
    expect((await library.get(recB.id)).note).toBe(recB.note);
    await request(app).patch(`/api/v1/analyses/${recA.id}`).set(as(tokens.alice)).send({ note: 'edited' }).expect(200);
  });

  it('POST /analyses/:id/refit of another group answers 404 and adds no revision', async () => {
    expect((await missing('post', `/api/v1/analyses/${recB.id}/refit?ion=Cr3%2B`, tokens.alice)).status).toBe(404);
    expect((await library.get(recB.id)).revisions).toHaveLength(1);
    const own = await request(app).post(`/api/v1/analyses/${recA.id}/refit?ion=Cr3%2B`).set(as(tokens.alice)).expect(200);
    expect(own.body.revisions).toHaveLength(2);
  });

  it('DELETE /analyses/:id of another group answers 404 and the record stays', async () => {
    expect((await missing('delete', `/api/v1/analyses/${recB.id}`, tokens.alice)).status).toBe(404);
    expect((await library.get(recB.id)).id).toBe(recB.id);
    await request(app).delete(`/api/v1/analyses/${recB.id}`).set(as(tokens.bob)).expect(204);
    await expect(library.get(recB.id)).rejects.toMatchObject({ code: 'not-found' });
  });

  it('GET /series ranks only the group\'s analyses', async () => {
    const res = await request(app).get('/api/v1/series').query({ ion: 'Cr3+' }).set(as(tokens.alice)).expect(200);
    expect(res.body.count).toBe(1);
    expect(res.body.spectrochemical.entries.map((e: { id: string }) => e.id)).toEqual([String(recA.id)]);
    const all = await request(app).get('/api/v1/series').query({ ion: 'Cr3+' }).set(as(tokens.root)).expect(200);
    expect(all.body.count).toBe(3);
  });

  it('POST /predict with library uses only the group\'s fitted factors', async () => {
    const res = await request(app).post('/api/v1/predict').set(as(tokens.alice)).send({ formula: '[Cr(NH3)6]Cl3', library: true }).expect(200);
    // The note that says which library factors were used (or that none were).
    const libraryNote = (warnings: string[]) => warnings.find((w) => /library/.test(w)) ?? '';
    expect(libraryNote(res.body.warnings)).toMatch(/library/);
    expect(libraryNote(res.body.warnings)).not.toMatch(/NH3/);
    const admin = await request(app).post('/api/v1/predict').set(as(tokens.root)).send({ formula: '[Cr(NH3)6]Cl3', library: true }).expect(200);
    expect(libraryNote(admin.body.warnings)).toMatch(/NH3/);
  });

  it('POST /analyses stores the record in the user\'s name and group: their group sees it, the other does not', async () => {
    const made = await request(app)
      .post('/api/v1/analyses?ion=Cr3%2B&sample=new')
      .set(as(tokens.bob))
      .set('Content-Type', 'text/csv')
      .send('nm,absorbance\n400,0.10\n575,0.20\n')
      .expect(201);
    expect(await where.scalar(`SELECT count(*) FROM analyses WHERE id = ${made.body.id} AND owner = 'bob' AND group_name = 'labB'`)).toBe(1);
    await request(app).get(`/api/v1/analyses/${made.body.id}`).set(as(tokens.bob)).expect(200);
    await request(app).get(`/api/v1/analyses/${made.body.id}`).set(as(tokens.alice)).expect(404);
  });

  it('an administrator sees, refits and deletes every record, the single-user ones too', async () => {
    const list = await request(app).get('/api/v1/analyses').set(as(tokens.root)).expect(200);
    expect(list.body.total).toBe(3);
    await request(app).get(`/api/v1/analyses/${orphan.id}/original`).set(as(tokens.root)).expect(200);
    await request(app).post(`/api/v1/analyses/${recB.id}/refit?ion=Cr3%2B`).set(as(tokens.root)).expect(200);
    await request(app).delete(`/api/v1/analyses/${recA.id}`).set(as(tokens.root)).expect(204);
  });

  it('once users exist, the single service token and unknown tokens get 401; a removed user\'s token too', async () => {
    await request(app).get('/api/v1/analyses').expect(401);
    await request(app).get('/api/v1/analyses').set(as(SERVICE_TOKEN)).expect(401);
    await request(app).get('/api/v1/analyses').set(as(`${tokens.alice}x`)).expect(401);
    await library.users.remove('alice');
    await request(app).get('/api/v1/analyses').set(as(tokens.alice)).expect(401);
  });

  it('with no users defined, the single service token still serves and sees every record', async () => {
    for (const name of ['alice', 'bob', 'root']) await library.users.remove(name);
    const res = await request(app).get('/api/v1/analyses').set(as(SERVICE_TOKEN)).expect(200);
    expect(res.body.total).toBe(3);
    await request(app).get('/api/v1/analyses').set(as(tokens.alice)).expect(401);
  });

  it('the page\'s cookie carries a user\'s token like the Bearer header', async () => {
    const res = await request(app).get('/api/v1/analyses').set('Cookie', `fieldgap_token=${encodeURIComponent(tokens.bob)}`).expect(200);
    expect(res.body.analyses.map((a: { id: number }) => a.id)).toEqual([recB.id]);
  });

  it('on loopback without identifyUsers (the single-user mode) nothing changes: no login, every record', async () => {
    const location = where.location.engine === 'sqlite' ? { dataDir: where.location.dataDir } : { database: where.location.url };
    const local = createApp({ pool: standInPool(), logger: captureLogger().logger, staticDir: false, ...location });
    try {
      const res = await request(local).get('/api/v1/analyses').expect(200);
      expect(res.body.total).toBe(3);
    } finally {
      await local.close();
    }
  });

  it('keeps only the SHA-256 of each token', async () => {
    const hash = createHash('sha256').update(tokens.alice, 'utf8').digest('hex');
    expect(await where.scalar(`SELECT count(*) FROM tokens WHERE sha256 = '${hash}' AND user_name = 'alice'`)).toBe(1);
    expect(await where.scalar(`SELECT count(*) FROM tokens WHERE sha256 = '${tokens.alice}'`)).toBe(0);
  });
});
