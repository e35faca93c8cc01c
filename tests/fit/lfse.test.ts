import { describe, expect, it } from 'vitest';
import { ligandFieldStabilisation, spinOnlyMoment, strongFieldConfiguration } from '../../src/fit/lfse.js';

describe('strongFieldConfiguration', () => {
  it('fills the octahedral sets for high- and low-spin grounds', () => {
    // common practice: the textbook configurations
    expect(strongFieldConfiguration(3, 3, 'octahedral').text).toBe('t2g^3 eg^0');
    expect(strongFieldConfiguration(6, 4, 'octahedral').text).toBe('t2g^4 eg^2');
    expect(strongFieldConfiguration(6, 0, 'octahedral').text).toBe('t2g^6 eg^0');
    expect(strongFieldConfiguration(7, 1, 'octahedral').text).toBe('t2g^6 eg^1');
    expect(strongFieldConfiguration(7, 3, 'octahedral').text).toBe('t2g^5 eg^2');
    expect(strongFieldConfiguration(5, 1, 'octahedral').text).toBe('t2g^5 eg^0');
    expect(strongFieldConfiguration(8, 2, 'octahedral').text).toBe('t2g^6 eg^2');
  });

  it('fills the tetrahedral sets lower e first', () => {
    // common practice
    expect(strongFieldConfiguration(7, 3, 'tetrahedral').text).toBe('e^4 t2^3');
    expect(strongFieldConfiguration(8, 2, 'tetrahedral').text).toBe('e^4 t2^4');
    expect(strongFieldConfiguration(4, 4, 'tetrahedral').text).toBe('e^2 t2^2');
  });

  it('conserves electrons and carries the asked spin for every d^n and spin', () => {
    for (const geometry of ['octahedral', 'tetrahedral'] as const) {
      for (let d = 1; d <= 9; d++) {
        for (let u = Math.min(d, 10 - d); u >= 0; u -= 2) {
          const c = strongFieldConfiguration(d, u, geometry);
          expect(c.lower + c.upper).toBe(d);
        }
      }
    }
  });
});

describe('ligandFieldStabilisation', () => {
  it('gives the textbook LFSE and pairing counts', () => {
    // common practice: LFSE tables of any inorganic text
    expect(ligandFieldStabilisation(3, 3, 'octahedral', 1740)).toMatchObject({ dq: -12, cm1: -20880, extraPairs: 0 });
    expect(ligandFieldStabilisation(6, 0, 'octahedral', 2300)).toMatchObject({ dq: -24, pairs: 3, extraPairs: 2 });
    expect(ligandFieldStabilisation(6, 4, 'octahedral', 1000)).toMatchObject({ dq: -4, pairs: 1, extraPairs: 0 });
    expect(ligandFieldStabilisation(5, 5, 'octahedral', 800).dq).toBe(0);
    expect(ligandFieldStabilisation(8, 2, 'octahedral', 850).dq).toBe(-12);
    expect(ligandFieldStabilisation(7, 3, 'tetrahedral', 320).dq).toBe(-12);
  });
});

describe('spinOnlyMoment', () => {
  it('is √(n(n+2)) μB', () => {
    // common practice: 1.73, 2.83, 3.87, 4.90, 5.92 μB
    expect(spinOnlyMoment(0)).toBe(0);
    expect(spinOnlyMoment(1)).toBeCloseTo(1.732, 3);
    expect(spinOnlyMoment(3)).toBeCloseTo(3.873, 3);
    expect(spinOnlyMoment(5)).toBeCloseTo(5.916, 3);
  });
});
