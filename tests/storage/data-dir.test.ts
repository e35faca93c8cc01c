import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { resolveDataDir } from '../../src/library/data-dir.js';

describe('resolveDataDir', () => {
  const cwd = resolve('/home/chemist/lab');

  it('uses ./fieldgap-data by default', () => {
    expect(resolveDataDir({ cwd })).toBe(resolve(cwd, 'fieldgap-data'));
    expect(resolveDataDir({ cwd, env: { FIELDGAP_DATA: '  ' } })).toBe(resolve(cwd, 'fieldgap-data'));
  });

  it('takes FIELDGAP_DATA, relative to cwd', () => {
    expect(resolveDataDir({ cwd, env: { FIELDGAP_DATA: 'shared/lib' } })).toBe(resolve(cwd, 'shared/lib'));
    expect(resolveDataDir({ cwd, env: { FIELDGAP_DATA: '/srv/fg' } })).toBe(resolve('/srv/fg'));
  });

  it('lets --data win over the variable', () => {
    expect(resolveDataDir({ cwd, flag: 'mine', env: { FIELDGAP_DATA: '/srv/fg' } })).toBe(resolve(cwd, 'mine'));
  });

  it('rejects an empty --data', () => {
    expect(() => resolveDataDir({ cwd, flag: '' })).toThrow(expect.objectContaining({ code: 'invalid-argument', path: '--data' }));
  });
});
