import { copyFileSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cli } from '../analysis/helpers.js';

/** Issue 18 item 4: `--out FILE` for the JSON results file, `--json FILE` kept with a note; one version. Invented demo spectra. */
const demo = (name: string) => fileURLToPath(new URL(`../../spectra-demo/${name}`, import.meta.url));
let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-out-'));
  copyFileSync(demo('cr-aqua.csv'), join(dir, 'cr-aqua.csv'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('analyze output files', () => {
  it('--out FILE writes what the old --json FILE wrote; the old spelling says it is deprecated', async () => {
    const out = await cli(['analyze', dir, '--ion', 'Cr3+', '--out', 'new.json'], dir);
    expect(out.code).toBe(0);
    expect(out.stderr).not.toMatch(/deprecated/);
    const old = await cli(['analyze', dir, '--ion', 'Cr3+', '--json', 'old.json'], dir);
    expect(old.code).toBe(0);
    expect(old.stderr).toMatch(/--json FILE is deprecated; write --out FILE/);
    expect(readFileSync(join(dir, 'new.json'), 'utf8')).toBe(readFileSync(join(dir, 'old.json'), 'utf8'));
    const both = await cli(['analyze', dir, '--ion', 'Cr3+', '--out', 'a.json', '--json', 'b.json'], dir);
    expect(both.code).toBe(2);
    expect(both.stderr).toMatch(/--out/);
  });

  it('--version is the package version', async () => {
    const pkg = JSON.parse(readFileSync(fileURLToPath(new URL('../../package.json', import.meta.url)), 'utf8')) as { version: string };
    const { code, stdout } = await cli(['--version']);
    expect(code).toBe(0);
    expect(stdout.trim()).toBe(pkg.version);
  });
});
