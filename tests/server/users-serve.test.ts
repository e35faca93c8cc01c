import { afterEach, beforeEach, expect, it } from 'vitest';
import { startServer, type RunningServer } from '../../server/main.js';
import type { Library } from '../../src/library/library.js';
import { forEachEngine, freshLibrary, type TestLibrary } from '../storage/helpers/engines.js';
import { handBuiltRecord } from '../storage/helpers/records.js';
import { captureLogger } from './helpers.js';

/**
 * The service as `fieldgap serve --host 0.0.0.0` starts it: with users in
 * the library, each token names its user and group; on loopback nothing
 * changes. Records are hand-built (numbers made up, helpers/records.ts).
 */

let where: TestLibrary;
let library: Library;
let running: RunningServer | undefined;

forEachEngine('fieldgap serve with users', (engine) => {
  beforeEach(async () => {
    where = await freshLibrary(engine);
    library = await where.open();
  });
  afterEach(async () => {
    await running?.close();
    running = undefined;
    await library.close();
    await where.dispose();
  });

  const location = () => (where.location.engine === 'sqlite' ? { dataDir: where.location.dataDir } : { database: where.location.url });
  const get = (path: string, token?: string) =>
    fetch(`http://127.0.0.1:${running!.port}${path}`, token === undefined ? {} : { headers: { Authorization: `Bearer ${token}` } });

  it('beyond loopback: a user\'s token sees their group only, the printed service token is refused once users exist', async () => {
    await library.users.add('alice', 'labA');
    const alice = await library.users.newToken('alice');
    const mine = await library.scoped({ user: 'alice', group: 'labA', admin: false }).add(handBuiltRecord({ sample: 'a' }));
    await library.scoped({ user: 'bob', group: 'labB', admin: false }).add(handBuiltRecord({ sample: 'b' }, 21_000));
    running = await startServer({ host: '0.0.0.0', port: 0, pool: 'in-process', staticDir: false, logger: captureLogger().logger, ...location() });
    expect(running.token).toBeDefined();
    expect((await get('/api/v1/analyses')).status).toBe(401);
    expect((await get('/api/v1/analyses', running.token)).status).toBe(401);
    const res = await get('/api/v1/analyses', alice);
    expect(res.status).toBe(200);
    expect(((await res.json()) as { analyses: { id: number }[] }).analyses.map((a) => a.id)).toEqual([mine.id]);
  });

  it('on loopback: no login, every record, users or not', async () => {
    await library.users.add('alice', 'labA');
    await library.scoped({ user: 'bob', group: 'labB', admin: false }).add(handBuiltRecord({ sample: 'b' }));
    running = await startServer({ host: '127.0.0.1', port: 0, pool: 'in-process', staticDir: false, logger: captureLogger().logger, ...location() });
    const res = await get('/api/v1/analyses');
    expect(res.status).toBe(200);
    expect(((await res.json()) as { total: number }).total).toBe(1);
  });
});
