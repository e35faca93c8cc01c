/**
 * The probability card's words for what the fit could not fix: parameter
 * names a chemist reads (10Dq, B), "not determined" for the JSON "(null)",
 * cm⁻¹ as the rest of the page writes it. The inputs are the core's own
 * sentences (src/fit/result.ts), not outside values.
 */
import { describe, expect, it } from 'vitest';
import { chemistWording, parameterName, undeterminedDetail, undeterminedHeadline } from '../../../web/undetermined-wording.js';

describe('undetermined parameters in words', () => {
  it('names the fit fields as a chemist writes them', () => {
    expect(parameterName('tenDq')).toBe('10Dq');
    expect(parameterName('b')).toBe('B');
    expect(parameterName('cOverB')).toBe('C/B');
    expect(parameterName('something-new')).toBe('something-new');
  });

  it('has no JSON words left', () => {
    expect(chemistWording('B, C and β are not reported (null)')).toBe('B, C and β are not determined');
    expect(chemistWording('beta is null: no ion')).toBe('beta is not determined: no ion');
    expect(chemistWording('B fixed at its prior 753 ± 80 cm-1')).toBe('B fixed at its prior 753 ± 80 cm⁻¹');
  });

  it('gives one short headline naming each parameter once, the reasons apart', () => {
    const entries = [
      { parameter: 'tenDq', reason: 'one band is assigned to a spin-allowed transition whose energy depends on B', action: 'reported, but not determined by spin-allowed bands' },
      { parameter: 'b', reason: 'one band cannot fix both 10Dq and B', action: 'B fixed at its prior 753 ± 80 cm-1 (a long citation)' },
      { parameter: 'b', reason: 'one band', action: 'B, C and β are not reported (null)' },
    ];
    expect(undeterminedHeadline(entries)).toBe('not fixed by the bands: 10Dq, B');
    expect(undeterminedHeadline([])).toBe('');
    expect(undeterminedDetail(entries[2]!)).toBe('B: one band; B, C and β are not determined');
    for (const e of entries) expect(undeterminedDetail(e)).not.toMatch(/tenDq|null|cm-1/);
  });
});
