import { describe, expect, it } from 'vitest';
import { decimalsForUncertainty, formatNumber, formatWithUncertainty, nmFromWavenumber, safeFileStem, spinStateText } from '../../../web/format.js';

describe('page number formatting', () => {
  it('converts cm-1 to nm as 1e7 / x and back', () => {
    expect(nmFromWavenumber(20_000)).toBeCloseTo(500, 12); // common practice: λ/nm = 10^7 / (ν̃/cm-1)
    for (const x of [1234.5, 9000, 31_250]) expect(nmFromWavenumber(nmFromWavenumber(x))).toBeCloseTo(x, 9);
  });

  it('rounds a value to the second significant figure of its uncertainty', () => {
    expect(decimalsForUncertainty(120)).toBe(0);
    expect(decimalsForUncertainty(0.034)).toBe(3);
    expect(decimalsForUncertainty(1.2)).toBe(1);
    expect(formatWithUncertainty(17_412.6, 123)).toBe('17\u2009413 ± 123');
    expect(formatWithUncertainty(0.7123, 0.034)).toBe('0.712 ± 0.034');
  });

  it('shows the value alone when the uncertainty is missing or not positive', () => {
    expect(formatWithUncertainty(812.4, null)).toBe('812');
    expect(formatWithUncertainty(812.4, 0, 1)).toBe('812.4');
    expect(formatWithUncertainty(null, 3)).toBe('—');
  });

  it('groups thousands only above four digits and uses a real minus sign', () => {
    expect(formatNumber(8500)).toBe('8500');
    expect(formatNumber(12_345)).toBe('12\u2009345');
    expect(formatNumber(-42.25, 1)).toBe('−42.3');
    expect(formatNumber(-0.01, 1)).toBe('0.0');
    expect(formatNumber(Number.NaN)).toBe('—');
  });

  it('writes spin states and file stems in plain words', () => {
    expect(spinStateText('high-spin')).toBe('high spin');
    expect(spinStateText('no-choice')).toBe('one possible');
    expect(safeFileStem('Ni(H2O)6 run 2.csv')).toBe('Ni_H2O_6_run_2');
    expect(safeFileStem('.csv')).toBe('analysis');
  });
});

describe('level names', () => {
  it('follow the label format of DEVELOPERS.md when the service sends no label', async () => {
    const { levelLabel } = await import('../../../web/format.js');
    expect(levelLabel('4T1g', '4P')).toBe('4T1g(P)');
    expect(levelLabel('2T2g', '2D2')).toBe('2T2g(D2)');
    expect(levelLabel('4T1g', '4P', '4T1g(P)')).toBe('4T1g(P)');
    expect(levelLabel('3A2', '')).toBe('3A2');
  });
});
