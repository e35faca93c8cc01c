/**
 * Stored text reaches the terminal neutralised: `library list` and `library
 * show` print escape sequences, CR/LF and bidi overrides in a sample name or
 * note as visible escapes, so a record cannot clear the screen, forge lines
 * or links, or reorder what is read.
 */
import { copyFileSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { terminalSafe } from '../../src/cli/terminal-text.js';
import { runCliCaptured } from '../helpers/cli-run.js';

// Any C0 control but LF (which separates our own lines), DEL, C1, bidi controls.
const RAW_CONTROL = /[\u0000-\u0009\u000b-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/;

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-terminal-'));
  // The invented demo scenario's spectrum, as input only.
  copyFileSync(fileURLToPath(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url)), join(dir, 'cr.csv'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

function cli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  return runCliCaptured(['library', ...args], { cwd: dir, env: { FIELDGAP_DATA: join(dir, 'lib') } });
}

describe('terminalSafe', () => {
  it('shows controls as escapes and leaves printable text alone', () => {
    expect(terminalSafe('a\u001b[2Jb')).toBe('a\\x1B[2Jb');
    expect(terminalSafe('line\r\nforged')).toBe('line\\r\\nforged');
    expect(terminalSafe('\u202Egnp.exe')).toBe('\\u202Egnp.exe');
    expect(terminalSafe('\u009b31m')).toBe('\\x9B31m');
    expect(terminalSafe('[Cr(H2O)6]³⁺ in H₂O, β = 0.72, 10Dq ≈ 17 400 cm⁻¹')).toBe('[Cr(H2O)6]³⁺ in H₂O, β = 0.72, 10Dq ≈ 17 400 cm⁻¹');
  });
});

describe('library list and show', () => {
  it('print stored escape sequences and line breaks as visible escapes', async () => {
    const sample = 'evil\u001b]8;;http://x.example\u0007link\u001b[2J';
    const note = 'first\r\n#2  forged record\u202E';
    const added = await cli('add', 'cr.csv', '--ion', 'Cr3+', '--conc', '0.05', '--sample', sample, '--note', note);
    expect(added.code).toBe(0);
    expect(added.out).not.toMatch(RAW_CONTROL);
    const list = await cli('list');
    expect(list.code).toBe(0);
    expect(list.out).not.toMatch(RAW_CONTROL);
    expect(list.out).toContain('evil\\x1B]8;;');
    const show = await cli('show', '1');
    expect(show.out).not.toMatch(RAW_CONTROL);
    expect(show.out).toContain('first\\r\\n#2  forged record\\u202E');
    // No line of the output starts with the forged record.
    expect(show.out.split('\n').some((line) => line.startsWith('#2'))).toBe(false);
    // What is stored is what was given: only the display is neutralised.
    const json = JSON.parse((await cli('show', '1', '--json')).out) as { sample: string; note: string };
    expect(json.sample).toBe(sample);
    expect(json.note).toBe(note);
  });

  it('library add of several files prints the saved lines neutralised too', async () => {
    // In a batch each record is named after its file: a file name can carry an escape sequence.
    const evil = 'evil\u001b[2J.csv';
    copyFileSync(join(dir, 'cr.csv'), join(dir, evil));
    const added = await cli('add', 'cr.csv', evil, '--ion', 'Cr3+');
    expect(added.code, added.err).toBe(0);
    expect(added.out).toContain('evil\\x1B[2J');
    expect(added.out).not.toMatch(RAW_CONTROL);
  });
});
