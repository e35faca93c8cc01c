/**
 * A folder's files as paths relative to the working folder: the prefix is
 * joined by hand (src/cli/files.ts, filesInFolder) rather than by
 * path.join and path.relative per file; the list must be what those give
 * (the slow reference below, the code it replaced), wherever the folder is.
 */
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { extname, join, relative, resolve, sep } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { expandInputPaths, SPECTRUM_EXTENSIONS } from '../../src/cli/files.js';

/** The former listing: every path through join, then relative to cwd. */
function referenceList(given: string, cwd: string): string[] {
  const walk = (folder: string): string[] => readdirSync(folder, { withFileTypes: true })
    .sort((a, b) => a.name.localeCompare(b.name))
    .filter((e) => !e.name.startsWith('.'))
    .flatMap((e) => (e.isDirectory() ? walk(join(folder, e.name)) : e.isFile() && SPECTRUM_EXTENSIONS.includes(extname(e.name).toLowerCase()) ? [join(folder, e.name)] : []));
  return walk(resolve(cwd, given)).map((f) => relative(cwd, f) || f);
}

const root = mkdtempSync(join(tmpdir(), 'fieldgap-files-list-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));
for (const dir of ['data', 'data/b-sub', 'data/b-sub/deeper', 'data/.hidden', 'elsewhere']) mkdirSync(join(root, dir), { recursive: true });
for (const file of ['data/a.csv', 'data/B.TSV', 'data/c.jdx', 'data/notes.md', 'data/.x.csv', 'data/b-sub/s1.csv', 'data/b-sub/deeper/s2.dat', 'data/.hidden/h.csv']) {
  writeFileSync(join(root, file), 'x,y\n');
}

describe('expandInputPaths on folders', () => {
  const cases: Array<[string, string, string]> = [
    ['the folder below the working folder', 'data', root],
    ['the working folder itself', '.', join(root, 'data')],
    ['a folder beside the working folder', '../data', join(root, 'elsewhere')],
    ['a subfolder given with a trailing separator', 'data/b-sub/', root],
    ['an absolute folder', join(root, 'data'), join(root, 'elsewhere')],
  ];
  for (const [what, given, cwd] of cases) {
    it(`lists ${what} as join and relative would`, () => {
      const listed = expandInputPaths([given], cwd);
      expect(listed.length).toBeGreaterThan(0);
      expect(listed).toEqual(referenceList(given, cwd));
    });
  }

  it('skips hidden entries and other endings, and goes into subfolders', () => {
    expect(expandInputPaths(['data'], root)).toEqual(
      ['data/a.csv', 'data/b-sub/deeper/s2.dat', 'data/b-sub/s1.csv', 'data/B.TSV', 'data/c.jdx'].map((p) => p.split('/').join(sep)),
    );
  });
});
