import { describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/main.js';
import { runServe } from '../../server/main.js';
import { capturedIo, type CapturedIo } from '../helpers/cli-run.js';

// What bin/fieldgap hands the CLI: the service's own entry.
const io = (): CapturedIo => capturedIo({ runService: runServe });

describe('fieldgap serve', () => {
  it('is listed and documents its options', async () => {
    const help = io();
    expect(await runCli(['--help'], help)).toBe(0);
    expect(help.out).toMatch(/serve\s+run the REST service/);
    const usage = io();
    expect(await runCli(['serve', '--help'], usage)).toBe(0);
    for (const option of ['--port', '--host', '--data', '5177', '127.0.0.1']) expect(usage.out).toContain(option);
  });
  it('rejects a bad port or an unknown option in one line, exit 2, without listening', async () => {
    const bad = io();
    expect(await runCli(['serve', '--port', 'abc'], bad)).toBe(2);
    expect(bad.err).toBe('fieldgap serve: --port: expected a number, got "abc"\n');
    const range = io();
    expect(await runCli(['serve', '--port', '70000'], range)).toBe(2);
    expect(range.err).toContain('--port');
    const unknown = io();
    expect(await runCli(['serve', '--prot', '1'], unknown)).toBe(2);
    expect(unknown.err).toContain('--prot');
  });
});
