import { readdirSync, readFileSync } from 'node:fs';
import { join, posix } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { wrongWayImports, type SourceFile } from './import-rules.js';

const root = fileURLToPath(new URL('../..', import.meta.url));

function sourcesUnder(folder: string): SourceFile[] {
  const entries = readdirSync(join(root, folder), { recursive: true, withFileTypes: true });
  return entries
    .filter((e) => e.isFile() && /\.(ts|mts|js|mjs)$/.test(e.name))
    .map((e) => {
      const rel = posix.join(...join(e.parentPath, e.name).slice(root.length).split(/[\\/]/).filter(Boolean));
      return { path: rel, text: readFileSync(join(e.parentPath, e.name), 'utf8') };
    })
    // The built page bundle under server/public is generated code, not a layer.
    .filter((f) => !f.path.startsWith('server/public/'));
}

describe('layers point one way', () => {
  it('src/ never imports server/, server/ never imports src/cli/', () => {
    const files = [...sourcesUnder('src'), ...sourcesUnder('server')];
    expect(files.length).toBeGreaterThan(50);
    expect(files.some((f) => f.path === 'src/library/library.ts')).toBe(true);
    expect(wrongWayImports(files)).toEqual([]);
  });

  // The checker itself must be able to fail: each wrong way, written as the code would write it.
  it.each([
    ['src/cli/commands/library.ts', "import type { Library } from '../../../server/storage/library.js';", 'src/ must not import server/'],
    ['src/cli/commands/serve.ts', "const { runServe } = await import('../../../server/main.js');", 'src/ must not import server/'],
    ['src/fit/engine.ts', "export { x } from '../../server/app.js';", 'src/ must not import server/'],
    ['server/main.ts', "import { numberOption } from '../src/cli/options.js';", 'server/ must not import src/cli/'],
    ['server/routes/analyses.ts', "import type { CliIo } from '../../src/cli/command.js';", 'server/ must not import src/cli/'],
    ['src/library/library.ts', "const m = await import(`../../server/${name}.js`);", 'no import() with a computed specifier in src/ or server/'],
    ['src/report/csv.ts', "import { io } from '../cli/command.js';", 'src/report/ must not import src/cli/'],
    ['src/report/results-csv.ts', "import type { AnalysisRecord } from '../library/types.js';", 'src/report/ must not import src/library/'],
  ])('flags %s: %s', (path, text, rule) => {
    expect(wrongWayImports([{ path, text }]).map((w) => w.rule)).toEqual([rule]);
  });

  it('allows the right way: server/ → src/, src/cli/ → src/library/, packages', () => {
    const right: SourceFile[] = [
      { path: 'server/app.ts', text: "import { openLibrary } from '../src/library/library.js';" },
      { path: 'src/cli/commands/library.ts', text: "const { openLibrary } = await import('../../library/library.js');" },
      { path: 'src/library/library.ts', text: "import Database from 'better-sqlite3';\nimport { join } from 'node:path';" },
      // A folder merely named like a layer is not that layer.
      { path: 'src/cli/x.ts', text: "import { y } from './server-names.js';" },
    ];
    expect(wrongWayImports(right)).toEqual([]);
  });
});
