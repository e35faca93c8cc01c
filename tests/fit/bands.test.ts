import { describe, expect, it } from 'vitest';
import { normalizeBands, parseBandList } from '../../src/fit/bands.js';
import { errorOf } from '../helpers/errors.js';


describe('parseBandList', () => {
  it('reads plain cm-1 lists with commas, semicolons and spaces', () => {
    expect(parseBandList('17400,24600')).toEqual([{ position: 17400 }, { position: 24600 }]);
    expect(parseBandList(' 17400 ; 24600 ')).toEqual([{ position: 17400 }, { position: 24600 }]);
  });

  it('converts nm, um and eV to cm-1', () => {
    const [a, b, c] = parseBandList('625nm, 1.25um, 2eV');
    expect(a!.position).toBeCloseTo(16000, 9); // 1e7/625, definition of the wavenumber
    expect(b!.position).toBeCloseTo(8000, 9); // 1e4/1.25
    expect(c!.position).toBeCloseTo(2 * 8065.543937, 6); // CODATA 2018
  });

  it('reads uncertainties in the position unit or their own', () => {
    const [a, b, c, d] = parseBandList('17400±200, 17400+-150, 625nm±5, 625nm+/-100cm-1');
    expect(a!.uncertainty).toBe(200);
    expect(b!.uncertainty).toBe(150);
    // ±5 nm at 625 nm is ≈ 1e7·10/625² / 2·... : the interval 622.5–627.5 nm in cm-1
    expect(c!.uncertainty).toBeCloseTo(1e7 / 622.5 - 1e7 / 627.5, 6);
    expect(d!.uncertainty).toBe(100);
  });

  it('reads flags, ε and width', () => {
    const [band] = parseBandList('21000±300:sf:sh:e=1.5:w=1200');
    expect(band).toEqual({ position: 21000, uncertainty: 300, epsilon: 1.5, width: 1200, flags: ['spin-forbidden', 'shoulder'] });
    expect(parseBandList('36000:ct')[0]!.flags).toEqual(['charge-transfer']);
    expect(parseBandList('36000:charge-transfer')[0]!.flags).toEqual(['charge-transfer']);
  });

  it('names the band, the text and the option in every error', () => {
    const bad = errorOf(() => parseBandList('17400,17x00'));
    expect(bad.path).toBe('--bands');
    expect(bad.code).toBe('invalid-argument');
    expect(bad.message).toBe('band 2 ("17x00"): position "17x00" is not a number (with an optional unit nm, cm-1, um or eV)');
    expect(errorOf(() => parseBandList('17400pm')).message).toMatch(/unknown unit "pm"/);
    expect(errorOf(() => parseBandList('17400,,24600')).message).toMatch(/band 2 is empty/);
    expect(errorOf(() => parseBandList('')).message).toMatch(/no bands given/);
    expect(errorOf(() => parseBandList('17400:zz')).message).toMatch(/unknown flag ":zz"/);
    expect(errorOf(() => parseBandList('625')).message).toMatch(/looks like a wavelength: write 625nm/);
    expect(errorOf(() => parseBandList('50000nm')).message).not.toMatch(/looks like a wavelength/);
    expect(errorOf(() => parseBandList('17400±-3')).message).toMatch(/uncertainty must be positive/);
    expect(errorOf(() => parseBandList('17400:x', { path: 'bands' })).path).toBe('bands');
  });
});

describe('normalizeBands', () => {
  it('accepts numbers, objects and text, keeping the input order and index', () => {
    const bands = normalizeBands([24600, { position: 17400, uncertainty: 100, flags: ['sh'] }]);
    expect(bands).toEqual([
      { index: 0, position: 24600, flags: [] },
      { index: 1, position: 17400, uncertainty: 100, flags: ['shoulder'] },
    ]);
    expect(normalizeBands('17400,24600:ct')[1]!.flags).toEqual(['charge-transfer']);
  });

  it('names the field of a bad band', () => {
    expect(errorOf(() => normalizeBands([17400, { position: 'x' }])).path).toBe('bands[1].position');
    expect(errorOf(() => normalizeBands([17400, 500])).message).toBe(
      'bands[1]: 500 cm-1 is below 2000 cm-1 (500 looks like a wavelength: write 500nm)',
    );
    expect(errorOf(() => normalizeBands([{ position: 17400, uncertainty: 0 }])).path).toBe('bands[0].uncertainty');
    expect(errorOf(() => normalizeBands([{ position: 17400, flags: ['weird'] }])).path).toBe('bands[0].flags[0]');
    expect(errorOf(() => normalizeBands([{ position: 17400, flags: ['sf', 'ct'] }])).path).toBe('bands[0].flags');
    expect(errorOf(() => normalizeBands([])).path).toBe('bands');
    expect(errorOf(() => normalizeBands([null])).path).toBe('bands[0]');
  });
});
