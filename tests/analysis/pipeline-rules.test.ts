import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createApp } from '../../server/app.js';
import { bandFitSigma, bandFlagsOf, bandKindOfFlags, bandToFitInput, cOverBOfFit } from '../../src/band-fit-input.js';
import { detailsFromFormula } from '../../src/library/formula-details.js';
import { DEFAULT_C_OVER_B } from '../../src/fit/settings.js';
import type { Band } from '../../src/spectrum/types.js';
import { bandFlags, fitUncertaintyOf } from '../../web/state.js';
import { captureLogger } from '../server/helpers.js';

/**
 * Issue 18 item 3: each pipeline rule once, in src/, called by the CLI, the
 * service and the page. These are consistency checks between callers, not
 * checks against the outside world.
 */
const band: Band = {
  position: 17_400, wavelength: 574.7, height: 0.4, epsilon: 15, fwhm: 2600, area: 1, oscillatorStrength: null,
  kind: 'd-d', positionUncertainty: 40, shoulder: true, window: 'inside', maximumInWindow: true,
};

describe('band to fit input', () => {
  it('is the same rule in the analysis and the page', () => {
    const input = bandToFitInput(band);
    // Slow reference written out: σ² = σ_pos² + max(100, 1 %)².
    expect(input.uncertainty).toBeCloseTo(Math.sqrt(40 ** 2 + Math.max(100, 0.01 * 17_400) ** 2), 9);
    expect(fitUncertaintyOf(band)).toBe(input.uncertainty);
    expect(bandFitSigma(band.position, band.positionUncertainty)).toBe(input.uncertainty);
    expect(input.flags).toEqual(['shoulder']);
    expect(bandFlags({ position: 1, uncertainty: null, epsilon: null, width: null, kind: 'spin-forbidden', shoulder: true, included: true, origin: 'found', sourceIndex: 0 }))
      .toEqual(bandFlagsOf({ kind: 'spin-forbidden', shoulder: true }));
  });

  it('a band\'s kind from its flags is the inverse of its flags from its kind', () => {
    for (const kind of ['d-d', 'spin-forbidden', 'charge-transfer'] as const) {
      for (const shoulder of [false, true]) expect(bandKindOfFlags(bandFlagsOf({ kind, shoulder }))).toBe(kind);
    }
  });

  it('C/B of a fit: the ratio, else C/B of its values, else the fit default', () => {
    expect(cOverBOfFit({ cOverB: 4.2, b: 700, c: 3000 })).toBe(4.2);
    expect(cOverBOfFit({ cOverB: null, b: 700, c: 2800 })).toBe(4);
    expect(cOverBOfFit({ cOverB: null, b: null, c: null })).toBe(DEFAULT_C_OVER_B);
  });
});

describe('formula details', () => {
  it('give the ion, the ligands and a geometry guess only where the caller gave none', () => {
    const all = detailsFromFormula('[Cr(H2O)6]Cl3', {}, 'formula', '"ion"');
    expect(all).toMatchObject({ ion: 'Cr3+', ligands: ['H2O'], geometry: 'octahedral' });
    const given = detailsFromFormula('[Cr(H2O)6]Cl3', { ion: 'Cr3+', geometry: 'octahedral', ligands: ['aqua'] }, 'formula', '"ion"');
    expect(given.ion).toBeUndefined();
    expect(given.ligands).toBeUndefined();
    expect(given.geometry).toBeUndefined();
    expect(() => detailsFromFormula('[Xx(H2O)6]', {}, 'formula', '"ion"')).toThrow(expect.objectContaining({ path: 'formula' }));
    expect(detailsFromFormula('[Xx(H2O)6]', { ion: 'Cr3+' }, 'formula', '"ion"').notes[0]).toContain('kept as written');
  });

  it('are applied by POST /analyses as by `library add --formula`', async () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'fieldgap-formula-'));
    const app = createApp({ pool: 'in-process', logger: captureLogger().logger, staticDir: false, dataDir });
    try {
      const csv = readFileSync(fileURLToPath(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url)));
      const saved = await request(app).post('/api/v1/analyses?formula=%5BCr(H2O)6%5DCl3&sample=demo').type('text/csv').send(csv).expect(201);
      expect(saved.body.ion).toBe('Cr3+');
      expect(saved.body.ligands).toEqual(['H2O']);
      expect(saved.body.options).toMatchObject({ ion: 'Cr3+', geometry: 'octahedral' });
      expect(saved.body.result.fit.ion).toBe('Cr3+');
    } finally {
      await app.close();
      rmSync(dataDir, { recursive: true, force: true });
    }
  });
});
