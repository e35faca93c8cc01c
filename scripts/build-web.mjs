#!/usr/bin/env node
/**
 * Builds the web page into server/public/: web/main.ts (and the CSS it
 * imports, uPlot's included) bundled by esbuild into app.js and app.css, and
 * web/index.html copied beside them. Everything is served locally; nothing
 * is fetched from elsewhere at run time.
 *
 * Usage: node scripts/build-web.mjs [--outdir DIR] [--watch]
 */
import { build, context } from 'esbuild';
import { copyFile, mkdir } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

/** @param {{ outdir?: string, minify?: boolean }} [options] */
export async function buildWeb(options = {}) {
  const outdir = resolve(options.outdir ?? join(root, 'server', 'public'));
  await mkdir(outdir, { recursive: true });
  const config = {
    entryPoints: [join(root, 'web', 'main.ts')],
    bundle: true,
    format: 'esm',
    target: ['es2022'],
    platform: 'browser',
    outfile: join(outdir, 'app.js'),
    minify: options.minify ?? true,
    sourcemap: true,
    legalComments: 'linked',
    logLevel: 'warning',
  };
  await build(config);
  for (const file of ['index.html', 'favicon.svg']) await copyFile(join(root, 'web', file), join(outdir, file));
  return outdir;
}

async function main() {
  const args = process.argv.slice(2);
  const at = args.indexOf('--outdir');
  const outdir = at >= 0 ? args[at + 1] : undefined;
  if (args.includes('--watch')) {
    const dir = await buildWeb(outdir === undefined ? {} : { outdir });
    const ctx = await context({
      entryPoints: [join(root, 'web', 'main.ts')], bundle: true, format: 'esm', target: ['es2022'],
      outfile: join(dir, 'app.js'), sourcemap: true, logLevel: 'info',
    });
    await ctx.watch();
    console.log(`build-web: watching web/ → ${dir}`);
    return;
  }
  const dir = await buildWeb(outdir === undefined ? {} : { outdir });
  console.log(`build-web: page built in ${dir}`);
}

if (process.argv[1] !== undefined && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main().catch((error) => {
    console.error(`build-web: ${error instanceof Error ? error.message : String(error)}`);
    process.exit(1);
  });
}
