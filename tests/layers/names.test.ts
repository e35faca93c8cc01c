import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { fitBands, fitLigandField } from '../../src/fit/index.js';

/** Issue 18 item 6: one file-naming style, and names that say what they do. */
const root = fileURLToPath(new URL('../..', import.meta.url));

function tsFiles(folder: string): string[] {
  return readdirSync(join(root, folder), { recursive: true, withFileTypes: true })
    .filter((e) => e.isFile() && e.name.endsWith('.ts'))
    .map((e) => join(e.parentPath, e.name).slice(root.length));
}

describe('names', () => {
  it('every source file of src/, server/ and web/ is named in kebab-case', () => {
    const files = [...tsFiles('src'), ...tsFiles('server'), ...tsFiles('web')].filter((f) => !f.includes('/public/'));
    expect(files.length).toBeGreaterThan(100);
    const kebab = /^[a-z0-9]+(-[a-z0-9]+)*(\.[a-z0-9]+)*\.ts$/;
    expect(files.filter((f) => !kebab.test(f.split('/').pop()!))).toEqual([]);
  });

  it('the ligand-field fit is fitLigandField; fitBands stays as its deprecated alias', () => {
    expect(fitBands).toBe(fitLigandField);
  });
});
