/**
 * `npm run bench`: imports every bench/*.ts module (this file aside) in name
 * order and awaits its exported `run(): Promise<void>`. A module adds itself
 * by existing; `npm run bench -- NAME` runs only the modules whose file name
 * contains NAME.
 */
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const filters = process.argv.slice(2);
const files = readdirSync(here)
  .filter((name) => name.endsWith('.ts') && name !== 'run.ts' && !name.endsWith('.d.ts'))
  .filter((name) => filters.length === 0 || filters.some((f) => name.includes(f)))
  .sort();

for (const file of files) {
  const module = (await import(pathToFileURL(join(here, file)).href)) as { run?: () => Promise<void> };
  if (typeof module.run !== 'function') continue;
  process.stdout.write(`\n== ${file} ==\n`);
  await module.run();
}
