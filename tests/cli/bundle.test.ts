import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildCli } from '../../scripts/build-cli.mjs';
import { runCli } from '../../src/cli/main.js';

/**
 * The bundled CLI (scripts/build-cli.mjs) prints byte for byte what the
 * CLI from source prints, with the same exit code, for every command. The
 * bundle is built into a fresh folder inside the project (so it finds
 * node_modules) and run as a process; the reference is runCli in process.
 */
const ROOT = fileURLToPath(new URL('../..', import.meta.url));
let outdir: string;
let data: string;

beforeAll(async () => {
  outdir = mkdtempSync(join(ROOT, 'dist', 'cli-test-'));
  data = mkdtempSync(join(tmpdir(), 'fieldgap-bundle-data-'));
  await buildCli({ outdir });
  writeFileSync(join(outdir, 'run.mjs'), "const { main } = await import('./main.js');\nawait main();\n");
}, 60_000);
afterAll(() => {
  for (const d of [outdir, data]) rmSync(d, { recursive: true, force: true });
});

function runBundle(args: string[]): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [join(outdir, 'run.mjs'), ...args], { cwd: ROOT, env: { ...process.env, FIELDGAP_DATA: data, FIELDGAP_DEBUG: '' } });
    let stdout = '';
    let stderr = '';
    child.stdout.setEncoding('utf8').on('data', (t: string) => void (stdout += t));
    child.stderr.setEncoding('utf8').on('data', (t: string) => void (stderr += t));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout, stderr }));
  });
}

async function runSource(args: string[]) {
  let stdout = '';
  let stderr = '';
  const code = await runCli(args, { stdout: (t) => void (stdout += t), stderr: (t) => void (stderr += t), isTty: false, cwd: ROOT, env: { FIELDGAP_DATA: data } });
  return { code, stdout, stderr };
}

const COMMANDS: string[][] = [
  ['--help'],
  ['--version'],
  ['fit', '--help'],
  ['fit', '--ion', 'Cr3+', '--bands', '17400'],
  ['fit', '--ion', 'Cr3+', '--bands', '17400,24600', '--json'],
  ['fit', '--ion', 'Qq3+', '--bands', '17400'],
  ['levels', '--d', '6', '--dq', '2000', '--b', '650', '--c', '3100'],
  ['diagram', '--d', '3', '--c-over-b', '4.5', '--csv'],
  ['analyze', 'spectra-demo/cr-aqua.csv', '--ion', 'Cr3+'],
  ['analyze', 'spectra-demo/cr-ammine.jdx', '--ion', 'Cr3+', '--json'],
  ['analyze', 'spectra-demo', '--ion', 'Cr3+', '--threads', '2'],
  ['predict', '[Co(NH3)6]3+'],
  ['series', '--ion', 'Cr3+', 'spectra-demo/cr-aqua.csv', 'spectra-demo/cr-ammine.jdx', 'spectra-demo/cr-oxalato.txt'],
  ['library', 'list'],
  ['nonsense'],
];

describe('the bundled CLI', () => {
  it.each(COMMANDS.map((c) => [c.join(' '), c] as const))('%s: same output and exit code as from source', async (_name, args) => {
    const [bundle, source] = await Promise.all([runBundle(args), runSource(args)]);
    expect(bundle).toEqual(source);
  }, 60_000);
});
