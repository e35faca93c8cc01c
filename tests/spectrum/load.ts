/** Test helper: reads a fixture the way the CLI will (bytes from disk, then parse). */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export const FIXTURES = fileURLToPath(new URL('../../fixtures/spectra/', import.meta.url));

export function fixtureBytes(name: string): Uint8Array {
  return new Uint8Array(readFileSync(FIXTURES + name));
}
