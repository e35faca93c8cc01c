/**
 * Writes fixtures/spectra/real-like/*.csv from real-like.ts (synthesized to
 * resemble measured data; not measurements).
 *
 *   node --import tsx tests/accuracy/write-real-like.ts
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { REAL_LIKE, realLikeCsv } from './real-like.js';

const DIR = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'fixtures', 'spectra', 'real-like');
mkdirSync(DIR, { recursive: true });
for (const s of REAL_LIKE) {
  writeFileSync(join(DIR, s.file), realLikeCsv(s));
  console.log(`wrote fixtures/spectra/real-like/${s.file}`);
}
