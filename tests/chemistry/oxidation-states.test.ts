import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TRANSITION_ELEMENTS } from '../../src/chemistry/elements.js';
import { parseIon } from '../../src/chemistry/ions.js';
import { HIGHEST_OXIDATION_STATES, oxidationStateWarning } from '../../src/chemistry/oxidation-states.js';
import { runCliCaptured } from '../helpers/cli-run.js';
import { makeTestApp, type TestApp } from '../server/helpers.js';

/**
 * AUDIT2 finding 16: an ion above every oxidation state its element is
 * known in ("Fe7+", "Zn3+", "Co6+") is analysed as asked, with a warning
 * that names the source and the d-count assumed, in analyze, fit, predict,
 * the JSON warnings and the service (whose warnings the page shows).
 */
const ROOT = new URL('../../', import.meta.url).pathname;
const cli = (...args: string[]) => runCliCaptured(args, { cwd: ROOT });

describe('the table of highest oxidation states', () => {
  it('has every transition metal fieldgap reads, and no other', () => {
    expect([...HIGHEST_OXIDATION_STATES.keys()].sort()).toEqual([...TRANSITION_ELEMENTS.keys()].sort());
  });

  it('holds the published maxima', () => {
    const highest = (symbol: string) => HIGHEST_OXIDATION_STATES.get(symbol)!.isolable;
    // Greenwood & Earnshaw, Chemistry of the Elements, 2nd ed. 1997, as listed in Wikipedia's "List of oxidation states of the elements":
    expect(highest('Mn')).toBe(7); // permanganate
    expect(highest('Cr')).toBe(6);
    expect(highest('Fe')).toBe(6); // ferrate(VI); +7, +8 only as gas-phase/matrix species (the list's notes)
    expect(highest('Co')).toBe(5);
    expect(highest('Ni')).toBe(4);
    expect(highest('Cu')).toBe(4);
    expect(highest('Zn')).toBe(2);
    expect(highest('Ru')).toBe(8); // RuO4
    expect(highest('Os')).toBe(8); // OsO4
    expect(highest('Pd')).toBe(4);
    expect(highest('Ag')).toBe(3);
    expect(highest('Cd')).toBe(2);
    expect(highest('Pt')).toBe(6);
    expect(highest('Au')).toBe(5);
    expect(highest('Hg')).toBe(2); // HgF4 (+4) by matrix isolation only
    expect(HIGHEST_OXIDATION_STATES.get('Ir')!.beyond!.highest).toBe(9); // [IrO4]+, Wang et al., Nature 514, 475 (2014)
  });
});

describe('oxidationStateWarning', () => {
  it('is null for known states, 0 and negative ones', () => {
    for (const ion of ['Cr3+', 'Mn7+', 'Os8+', 'Fe6+', 'Cu+', 'Fe(0)', 'Fe(-II)', 'Zn2+', 'Co5+']) expect(oxidationStateWarning(parseIon(ion))).toBeNull();
  });

  it('names the element, its highest known state, the source and the d-count assumed', () => {
    expect(oxidationStateWarning(parseIon('Zn3+'))).toBe(
      'Zn3+: zinc is not known above +2 (Greenwood & Earnshaw, Chemistry of the Elements, 2nd ed. 1997, as listed in Wikipedia\'s "List of oxidation states of the elements"); the result assumes d9, as the charge given says',
    );
  });

  it('says what lies beyond the isolable states where the list reports more', () => {
    const fe7 = oxidationStateWarning(parseIon('Fe7+'))!;
    expect(fe7).toMatch(/^Fe7\+: iron is not known above \+6 in compounds that can be isolated \(\+7 and \+8 only in the gas phase or in matrix isolation; Greenwood & Earnshaw/);
    expect(fe7).toMatch(/the result assumes d1, as the charge given says$/);
    expect(oxidationStateWarning(parseIon('Ir7+'))).toMatch(/^Ir7\+: iridium is not known above \+6 in compounds that can be isolated \(\+7 to \+9 only in the gas phase/);
  });
});

describe('where the warning shows', () => {
  let t: TestApp;
  beforeAll(() => {
    t = makeTestApp();
  });
  afterAll(async () => {
    await t.dispose();
  });

  it('analyze --json: among the warnings (Co6+ is d3, so the invented Cr(III) demo spectrum fits)', { timeout: 120_000 }, async () => {
    const { code, out } = await cli('analyze', 'spectra-demo/cr-aqua.csv', '--ion', 'Co6+', '--json');
    expect(code).toBe(0);
    const warnings = (JSON.parse(out) as { warnings: string[] }).warnings;
    expect(warnings.some((w) => /Co6\+: cobalt is not known above \+5 .*the result assumes d3/.test(w))).toBe(true);
  });

  it('analyze: a fit that fails says it in its error (the audit\'s Fe7+ on a Cr(III) spectrum)', { timeout: 120_000 }, async () => {
    const { code, err } = await cli('analyze', 'spectra-demo/cr-aqua.csv', '--ion', 'Fe7+');
    expect(code).toBe(2);
    expect(err).toMatch(/for d1 octahedral \(Fe7\+: iron is not known above \+6 in compounds that can be isolated\)/);
  });

  it('fit: in the text and the JSON', async () => {
    const text = await cli('fit', '--ion', 'Zn3+', '--bands', '12000');
    expect(text.code).toBe(0);
    expect(text.out).toMatch(/^Warning: Zn3\+: zinc is not known above \+2 /m);
    const json = JSON.parse((await cli('fit', '--ion', 'Zn3+', '--bands', '12000', '--json')).out) as { warnings: string[] };
    expect(json.warnings[0]).toMatch(/^Zn3\+: zinc is not known above \+2/);
  });

  it('predict: in the JSON warnings', async () => {
    const { code, out } = await cli('predict', '[Zn(H2O)6]3+', '--json');
    expect(code).toBe(0);
    expect((JSON.parse(out) as { warnings: string[] }).warnings.some((w) => /^Zn3\+: zinc is not known above \+2/.test(w))).toBe(true);
  });

  it('the service: POST /analyze answers it among the warnings the page shows', { timeout: 120_000 }, async () => {
    const { readFileSync } = await import('node:fs');
    // The invented demo scenario's spectrum, as upload content only.
    const res = await request(t.app).post('/api/v1/analyze?ion=Co6%2B').set('Content-Type', 'text/csv').send(readFileSync(`${ROOT}spectra-demo/cr-aqua.csv`)).expect(200);
    expect((res.body.warnings as string[]).some((w) => /Co6\+: cobalt is not known above \+5/.test(w))).toBe(true);
    const known = await request(t.app).post('/api/v1/analyze?ion=Cr3%2B').set('Content-Type', 'text/csv').send(readFileSync(`${ROOT}spectra-demo/cr-aqua.csv`)).expect(200);
    expect(JSON.stringify(known.body.warnings)).not.toMatch(/not known above/);
  });
});
