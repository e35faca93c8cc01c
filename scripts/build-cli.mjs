#!/usr/bin/env node
/**
 * Bundles the CLI with esbuild into dist/cli/: main.js (what bin/fieldgap
 * runs) and batch-worker.js (the worker threads of `analyze` on many files),
 * with the code they share in chunks beside them and a source map for each.
 * Loading a few files instead of ~440 modules is most of a short command's
 * start-up time. Code reached only by a dynamic import (the library, the
 * service) stays in a chunk of its own, loaded when that command runs.
 *
 * Kept outside the bundle, loaded from node_modules as before:
 * - better-sqlite3: a native addon that finds its .node file from its own folder;
 * - piscina: starts its threads from a file of its own package;
 * - pg: the PostgreSQL client, loaded only for a --database library; it looks
 *   for its optional native binding (pg-native) at run time.
 * The service is no part of it: bin/fieldgap hands `serve` the compiled
 * dist/server/main.js (built by tsc), whose worker and page are found from
 * its own folder.
 *
 * Usage: node scripts/build-cli.mjs [--outdir DIR]
 */
import { build } from 'esbuild';
import { rm } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

/** Packages the bundle leaves to node_modules (see above for why). */
export const EXTERNAL_PACKAGES = ['better-sqlite3', 'piscina', 'pg'];

/** @param {{ outdir?: string }} [options] */
export async function buildCli(options = {}) {
  const outdir = resolve(options.outdir ?? join(root, 'dist', 'cli'));
  await rm(outdir, { recursive: true, force: true });
  await build({
    entryPoints: { main: join(root, 'src', 'cli', 'main.ts'), 'batch-worker': join(root, 'src', 'cli', 'batch-worker.ts') },
    outdir,
    bundle: true,
    splitting: true,
    format: 'esm',
    platform: 'node',
    target: ['node20'],
    chunkNames: 'chunk-[hash]',
    sourcemap: 'linked',
    external: EXTERNAL_PACKAGES,
    // Bundled CommonJS packages (papaparse, …) call require() for Node's own modules.
    banner: { js: "import { createRequire as __fieldgapRequire } from 'node:module'; const require = __fieldgapRequire(import.meta.url);" },
    legalComments: 'linked',
    logLevel: 'warning',
  });
  return outdir;
}

if (process.argv[1] !== undefined && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const args = process.argv.slice(2);
  const at = args.indexOf('--outdir');
  buildCli(at >= 0 && args[at + 1] ? { outdir: args[at + 1] } : {})
    .then((dir) => console.log(`build-cli: CLI bundled in ${dir}`))
    .catch((error) => {
      console.error(`build-cli: ${error instanceof Error ? error.message : String(error)}`);
      process.exit(1);
    });
}
