import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseIon } from '../../src/chemistry/ions.js';

/**
 * AUDIT2 finding 13: the README's curl examples are what a user copies first;
 * each must send a spectrum type the service accepts and an ion that survives
 * URL decoding (a bare "+" in a query is a space).
 */
const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
const curls = readme.split('\n').filter((l) => /^\s*curl .*\/api\/v1\/analyze/.test(l));

describe('README curl examples for /api/v1/analyze', () => {
  it('there are some', () => {
    expect(curls.length).toBeGreaterThan(0);
  });

  it('each ion decodes to a readable ion', () => {
    for (const line of curls) {
      const ion = /[?&]ion=([^&'\s]+)/.exec(line)?.[1];
      expect(ion, line).toBeDefined();
      // URLSearchParams decodes as the service does: "+" → space, %2B → "+".
      const decoded = new URLSearchParams(`ion=${ion}`).get('ion') as string;
      expect(parseIon(decoded).label, line).toMatch(/^[A-Z][a-z]?\d*[+-]$/);
    }
  });

  it('each raw-body upload names a spectrum type; multipart uses the field "spectrum"', () => {
    for (const line of curls) {
      if (line.includes('--data-binary')) expect(line, line).toMatch(/-H '?Content-Type: (text\/csv|text\/plain|chemical\/x-jcamp-dx)/);
      if (/ -F /.test(line)) expect(line, line).toMatch(/-F spectrum=@/);
    }
  });
});
