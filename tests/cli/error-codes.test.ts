import { afterEach, describe, expect, it, vi } from 'vitest';
import { ERROR_CODES, FieldgapError } from '../../src/errors.js';
import { readError } from '../../src/cli/files.js';
import { httpStatusFor, RequestAbortedError, ServiceBusyError } from '../../server/errors.js';

/** Issue 18 item 9: error codes say what happened. */
describe('error codes', () => {
  it('busy is 503 and client-left 499, apart from timeout (504)', () => {
    expect(new ServiceBusyError().code).toBe('busy');
    expect(httpStatusFor(new ServiceBusyError())).toBe(503);
    expect(new RequestAbortedError().code).toBe('client-left');
    // 499 "client closed request": common practice (no standard status), never sent.
    expect(httpStatusFor(new RequestAbortedError())).toBe(499);
    expect(httpStatusFor(new FieldgapError('timeout', 'slow'))).toBe(504);
    for (const code of ERROR_CODES) expect(httpStatusFor(new FieldgapError(code, 'x'))).toBeGreaterThanOrEqual(400);
  });

  it('a refused read is permission-denied, not not-found', () => {
    const errno = (code: string) => Object.assign(new Error(code), { code });
    expect(readError(errno('ENOENT'), 'a.csv').code).toBe('not-found');
    expect(readError(errno('EACCES'), 'a.csv')).toMatchObject({ code: 'permission-denied', path: 'a.csv' });
    expect(readError(errno('EPERM'), 'a.csv').code).toBe('permission-denied');
    expect(readError(errno('EISDIR'), 'a.csv').code).toBe('invalid-argument');
  });
});

describe('itemsOf', () => {
  afterEach(() => {
    vi.doUnmock('../../src/analysis.js');
    vi.resetModules();
  });

  // The error thrown is made with the freshly loaded errors module, the one batch-rows checks against.
  async function itemsOfWith(fail: (errors: typeof import('../../src/errors.js')) => Error) {
    vi.resetModules();
    const errors = await import('../../src/errors.js');
    const listSpectra = () => { throw fail(errors); };
    vi.doMock('../../src/analysis.js', async (original) => ({ ...(await original<object>()), listSpectra }));
    vi.doMock('../../src/cli/files.js', async (original) => ({ ...(await original<object>()), readInputFile: () => new Uint8Array([49]) }));
    const { itemsOf } = await import('../../src/cli/batch-rows.js');
    return () => itemsOf('a.csv', {}, '/', true);
  }

  it('keeps a file that does not read as one item (its row says why)', async () => {
    const run = await itemsOfWith((errors) => new errors.FieldgapError('parse-error', 'no numbers', 'a.csv'));
    expect(run()).toEqual([{ file: 'a.csv', column: undefined, label: 'a.csv' }]);
  });

  it('lets a bug through instead of turning it into a failed row', async () => {
    const run = await itemsOfWith(() => new TypeError('a bug'));
    expect(run).toThrow(TypeError);
  });
});
