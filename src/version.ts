/**
 * The package version, the one source for it: read once from package.json,
 * found from this file both from source (src/version.ts) and compiled
 * (dist/src/version.js). Used by the CLI's --version, the service's health
 * answer and the library (each record notes the version that made it).
 */
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = fileURLToPath(new URL('.', import.meta.url));

let cached: string | undefined;

/** The package version ("0.1.0"), or "0.0.0" when package.json cannot be found. */
export function packageVersion(): string {
  cached ??= readPackageVersion();
  return cached;
}

function readPackageVersion(): string {
  for (const dir of [resolve(here, '..'), resolve(here, '..', '..')]) {
    const file = resolve(dir, 'package.json');
    if (!existsSync(file)) continue;
    try {
      // A small synchronous read, once per process.
      const json = JSON.parse(readFileSync(file, 'utf8')) as { name?: string; version?: string };
      if (json.name === 'fieldgap' && typeof json.version === 'string') return json.version;
    } catch {
      // fall through to the next candidate
    }
  }
  return '0.0.0';
}
