import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

let cached: string | undefined;

/**
 * fieldgap's version from its package.json, recorded with every stored
 * analysis. Looks upward from this file, so it works from the sources
 * (server/storage/) and from the build (dist/server/storage/) alike.
 */
export function toolVersion(): string {
  if (cached !== undefined) return cached;
  let folder = dirname(fileURLToPath(import.meta.url));
  for (;;) {
    const candidate = join(folder, 'package.json');
    if (existsSync(candidate)) {
      const parsed = JSON.parse(readFileSync(candidate, 'utf8')) as { name?: unknown; version?: unknown };
      if (parsed.name === 'fieldgap' && typeof parsed.version === 'string') return (cached = parsed.version);
    }
    const parent = dirname(folder);
    if (parent === folder) return (cached = 'unknown');
    folder = parent;
  }
}
