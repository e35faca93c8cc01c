import { describe, expect, it } from 'vitest';
import { runCliCaptured } from '../helpers/cli-run.js';

/**
 * `analyze` of a d0 ion (AUDIT2 finding 15): the bands are found and
 * printed, the note says why there is no ligand-field fit, and the exit code
 * is 3 ("analysed, nothing to fit"), not 2 ("bad input"). The spectrum is the
 * synthesized permanganate fixture (fixtures/spectra/real-like/README.md).
 */
const file = 'fixtures/spectra/real-like/permanganate-visible.csv';

describe('analyze: no ligand-field fit', () => {
  it('d0: prints the band table and the reason, exit 3, nothing on stderr', async () => {
    const { code, out, err } = await runCliCaptured(['analyze', file, '--ion', 'Mn7+', '--conc', '0.0004']);
    expect(err).toBe('');
    expect(code).toBe(3);
    expect(out).toMatch(/^Bands$/m);
    expect(out.match(/charge-transfer.*\(not fitted\)/g)?.length).toBeGreaterThanOrEqual(1);
    expect(out).toContain('a d0 ion has no d–d transitions');
  });

  it('--json: the bands, fit null and the reason', async () => {
    const { code, out } = await runCliCaptured(['analyze', file, '--ion', 'Mn7+', '--json']);
    expect(code).toBe(3);
    const json = JSON.parse(out) as { bands: unknown[]; fit: unknown; noFit: { code: string; message: string } };
    expect(json.fit).toBeNull();
    expect(json.bands.length).toBeGreaterThan(0);
    expect(json.noFit.code).toBe('unexplained');
    expect(json.noFit.message).toContain('d0');
  });

  it('a batch still counts it as a failed row (exit 1)', async () => {
    const { code, out } = await runCliCaptured(['analyze', file, 'fixtures/spectra/real-like/ni-aqua-visible.csv', '--ion', 'Mn7+', '--threads', '1']);
    expect(code).toBe(1);
    expect(out).toMatch(/permanganate-visible\.csv +FAILED: .*no ligan/);
  });

  it('--help documents exit code 3', async () => {
    const { out } = await runCliCaptured(['analyze', '--help']);
    expect(out).toMatch(/3 one spectrum analysed/);
  });
});
