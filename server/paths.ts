/**
 * Folders the service reads, resolved from this file so they are right both
 * from source (server/*.ts under tsx or vitest) and compiled (dist/server/*.js).
 */
import { existsSync } from 'node:fs';
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

/** The package version: one source, in src/. */
export { packageVersion } from '../src/version.js';
