import { describe, expect, it } from 'vitest';
import { FieldgapError } from '../../src/errors.js';
import { fitBands, type FitInput } from '../../src/fit/index.js';
import { runCliCaptured } from '../helpers/cli-run.js';

function errorOf(input: unknown): FieldgapError {
  try {
    fitBands(input as FitInput);
  } catch (error) {
    if (error instanceof FieldgapError) return error;
    throw error;
  }
  throw new Error('expected a FieldgapError');
}

async function cli(argv: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  const { code, out, err } = await runCliCaptured(argv, { cwd: '/' });
  return { code, stdout: out, stderr: err };
}

describe('fitBands input errors', () => {
  it('names the field of each bad input', () => {
    expect(errorOf({ bands: [17400, 24600] })).toMatchObject({ code: 'invalid-argument', path: 'ion' });
    expect(errorOf({ ion: 'Qq3+', bands: [17400] }).path).toBe('ion');
    expect(errorOf({ ion: 'Cr3+', d: 4, bands: [17400] })).toMatchObject({ path: 'd', message: 'd = 4 disagrees with Cr3+, which is d3' });
    expect(errorOf({ d: 10, bands: [17400] }).path).toBe('d');
    expect(errorOf({ d: 2.5, bands: [17400] }).path).toBe('d');
    expect(errorOf({ ion: 'Zn2+', bands: [17400] }).message).toMatch(/no d–d transitions/);
    expect(errorOf({ d: 3, geometry: 'square-planar', bands: [17400, 24600] }).path).toBe('geometry');
    expect(errorOf({ d: 3, bands: [] }).path).toBe('bands');
    expect(errorOf({ d: 3, bands: [17400, 'x'] }).path).toBe('bands[1]');
    expect(errorOf({ d: 3, bands: [17400, { position: -5 }] }).path).toBe('bands[1].position');
    expect(errorOf({ d: 3, bands: [17400, 24600], cOverB: -1 }).path).toBe('cOverB');
    expect(errorOf({ d: 3, bands: [17400, 24600], cOverB: 4, c: 3000 }).path).toBe('c');
    expect(errorOf({ d: 3, bands: [17400, 24600], freeC: true, c: 3000 }).path).toBe('freeC');
    expect(errorOf({ d: 3, bands: [17400, 24600], freeC: 'yes' }).path).toBe('freeC');
  });

  it('says when there are too few bands for the parameters', () => {
    // One band is fitted with B fixed at its prior (tests/fit/one-band.test.ts); two bands cannot fix a free C as well.
    expect(errorOf({ ion: 'Cr3+', bands: [17400, 24600], freeC: true })).toMatchObject({
      code: 'invalid-argument', path: 'freeC',
      message: '2 d–d bands cannot determine 10Dq, B and C for d3 octahedral (Cr3+): give at least 3',
    });
    expect(errorOf({ ion: 'Cr3+', bands: [17400, 24600], freeC: true }).path).toBe('freeC');
    expect(errorOf({ d: 3, bands: [{ position: 30000, flags: ['ct'] }] }).message).toMatch(/charge-transfer/);
  });

  it('reports bands no assignment explains as a failure, not as a number', () => {
    // Six bands are more than d3's three quartet transitions; 8000, 9000, 40000 fit no d8 assignment within 1000 cm-1.
    const tooMany = errorOf({ ion: 'Cr3+', bands: [9000, 14000, 17400, 24600, 30000, 35000] });
    expect(tooMany.code).toBe('unexplained');
    const badRms = errorOf({ d: 8, bands: [8000, 9000, 40000] });
    expect(badRms.code).toBe('unexplained');
    expect(badRms.message).toMatch(/^no assignment explains these bands for d8 octahedral; best rms \d+ cm-1 \(limit \d+ cm-1\)$/);
  });
});

describe('fieldgap fit on the command line', () => {
  it('prints a readable report with units', async () => {
    const { code, stdout } = await cli(['fit', '--ion', 'Cr3+', '--bands', '17400,24600']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/10Dq = 17400 ± \d+ cm-1/);
    expect(stdout).toMatch(/4A2g\(F\) → 4T2g\(F\)/);
    expect(stdout).toMatch(/spin-only moment 3\.87 μB/);
  });

  it('prints the JSON contract', async () => {
    const { code, stdout } = await cli(['fit', '--ion', 'Co2+', '--geometry', 'tetrahedral', '--bands', '5500±100,14700±150,40000:ct', '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    for (const key of ['d', 'ion', 'geometry', 'dq', 'tenDq', 'b', 'c', 'cOverB', 'beta', 'freeIonB', 'groundTerm', 'spinState',
      'unpairedElectrons', 'spinOnlyMoment', 'lfse', 'rmsResidual', 'status', 'uncertainty', 'assignments', 'alternatives',
      'predicted', 'warnings']) {
      expect(json, key).toHaveProperty(key);
    }
    expect(Object.keys(json.uncertainty)).toEqual(expect.arrayContaining(['tenDq', 'b', 'c']));
    expect(Object.keys(json.assignments[0])).toEqual(expect.arrayContaining(['observed', 'calculated', 'term', 'parent']));
    expect(Object.keys(json.predicted[0])).toEqual(expect.arrayContaining(['energy', 'term', 'spinAllowed']));
    expect(json.unassigned).toEqual([{ observed: 40000, band: 2, reason: 'charge-transfer band: left out of the fit' }]);
  });

  it('gives beta null with --d and says why', async () => {
    const { stdout } = await cli(['fit', '--d', '3', '--bands', '17400,24600', '--json']);
    const json = JSON.parse(stdout);
    expect(json.beta).toBeNull();
    expect(json.ion).toBeNull();
    expect(json.notes.join(' ')).toMatch(/beta is null: no ion was given/);
  });

  it.each([
    [['fit', '--ion', 'Cr3+'], '--bands'],
    [['fit', '--bands', '17400'], '--ion'],
    [['fit', '--ion', 'Cr3+', '--bands', '17400,abc'], '--bands'],
    [['fit', '--ion', 'Cr3+', '--bands', '17400,24600', '--c', '3000', '--free-c'], '--free-c'],
    [['fit', '--ion', 'Cr3+', '--bands', '17400,24600', '--c-over-b', 'x'], '--c-over-b'],
    [['fit', '--d', '0', '--bands', '17400'], '--d'],
    [['fit', '--ion', 'Cr3+', '--geometry', 'cube', '--bands', '17400,24600'], '--geometry'],
    [['fit', '--ion', 'V3+', '--bands', '30000:ct'], '--bands'],
    [['fit', '--ion', 'Cr3+', '--bands', '17400,24600', '--free-c'], '--free-c'],
    [['fit', '--ion', 'Cr3+', '--bands', '17400,24600', '--bogus'], '--bogus'],
  ])('exits 2 with one line naming the option: %j', async (argv, option) => {
    const { code, stdout, stderr } = await cli(argv);
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(stderr).toContain(option);
    expect(stderr).not.toMatch(/at .*\.ts/);
  });
});
