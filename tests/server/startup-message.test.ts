import { describe, expect, it } from 'vitest';
import { startupMessage } from '../../server/main.js';

/**
 * What `fieldgap serve` says at start (found in the audit: beyond loopback,
 * with users in the library, it printed a service token and an address with
 * it, and then refused that token with 401).
 */
describe('startupMessage', () => {
  const url = 'http://192.0.2.2:5177/';
  const token = 'SERVICE-TOKEN';

  it('beyond loopback with users: no service token offered, each user sends their own', () => {
    const { stdout, stderr } = startupMessage({ url, host: '192.0.2.2', token, tokenGiven: false, users: 3 });
    expect(stdout + stderr).not.toContain(token);
    expect(stdout).toMatch(/^fieldgap: serving on http:\/\/192\.0\.2\.2:5177\/ /);
    expect(stderr).toContain('3 users are defined in the library');
    expect(stderr).toContain('fieldgap users token NAME');
  });

  it('beyond loopback without users: the generated token is printed, with the note about users', () => {
    const { stdout, stderr } = startupMessage({ url, host: '192.0.2.2', token, tokenGiven: false, users: 0 });
    expect(stdout).toContain(`${url}?token=${token}`);
    expect(stderr).toContain(`every request needs the access token ${token}`);
    expect(stderr).toContain('once users are defined');
  });

  it('a token the user chose is never echoed; the library unreachable keeps the token lines', () => {
    const { stdout, stderr } = startupMessage({ url, host: '0.0.0.0', token, tokenGiven: true, users: undefined });
    expect(stdout + stderr).not.toContain(token);
    expect(stdout).toContain('?token=YOUR_TOKEN');
  });

  it('loopback: the address only', () => {
    const { stdout, stderr } = startupMessage({ url: 'http://127.0.0.1:5177/', host: '127.0.0.1', token: undefined, tokenGiven: false, users: 0 });
    expect(stdout).toBe('fieldgap: serving on http://127.0.0.1:5177/ (API http://127.0.0.1:5177/api/v1, press Ctrl-C to stop)\n');
    expect(stderr).toBe('');
  });
});
