/**
 * Folders the service reads, resolved from this file so they are right both
 * from source (server/*.ts under tsx or vitest) and compiled (dist/server/*.js).
 */
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = fileURLToPath(new URL('.', import.meta.url));

/**
 * The web page's folder: server/public next to the code, or, when running
 * from dist/server, the project's server/public (the page is built there, not
 * into dist). Returns the first that exists, else the source location.
 */
export function defaultStaticDir(): string {
  const candidates = [resolve(here, 'public'), resolve(here, '..', '..', 'server', 'public')];
  return candidates.find((dir) => existsSync(dir)) ?? candidates[0]!;
}

/** The package version, read once from package.json (one or two folders up). */
export function packageVersion(): string {
  for (const dir of [resolve(here, '..'), resolve(here, '..', '..')]) {
    const file = resolve(dir, 'package.json');
    if (!existsSync(file)) continue;
    try {
      // A small synchronous read at start-up; never per request.
      const json = JSON.parse(readFileSync(file, 'utf8')) as { name?: string; version?: string };
      if (json.name === 'fieldgap' && typeof json.version === 'string') return json.version;
    } catch {
      // fall through to the next candidate
    }
  }
  return '0.0.0';
}
