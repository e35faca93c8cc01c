/**
 * What a fitted 10Dq or B rests on when the bands cannot fix it
 * (src/fit/result.ts restingOnWeakBands; issue 13, item 5): a value is
 * reported with an `undetermined` entry and a warning rather than stated
 * as if measured. Behaviour checks: no outside value is compared.
 */
import { describe, expect, it } from 'vitest';
import { fitBands } from '../../src/fit/index.js';

const VISIBLE = { min: 1e7 / 780, max: 1e7 / 380 };
const listed = (r: ReturnType<typeof fitBands>) => r.undetermined.map((u) => u.parameter).sort();

describe('what 10Dq and B rest on', () => {
  it('one spin-allowed band beside a spin-forbidden one: B and 10Dq both rest on the spin-forbidden assignment', () => {
    // A hexaaqua Co(II)-like list: the visible maximum near 19 800 cm-1 and a weak flagged shoulder near 16 000.
    const r = fitBands({ ion: 'Co2+', bands: '16000:sf:sh, 19800', window: VISIBLE });
    // One strong band: the flagged shoulder may take a spin-forbidden level or the weak two-electron 4A2g (flaggedClass).
    expect(r.assignments.filter((a) => a.spinAllowed && !a.flags.includes('spin-forbidden'))).toHaveLength(1);
    expect(listed(r)).toEqual(['b', 'tenDq']);
    // Either way is honest: B rests on the flagged band's assignment, or (when the score leaves the flagged shoulder
    // unexplained) B is fixed at its prior and 10Dq rests on one band; a 10Dq stated as measured is the failure.
    expect(r.warnings.join(' ')).toMatch(/10Dq = \d+ cm-1 is not determined by (spin-allowed bands alone|one band alone)/);
    if (/one band alone/.test(r.warnings.join(' '))) expect(r.warnings.join(' ')).toMatch(/B fixed at its prior/);
  });

  it('two bands with one maximum beyond the measured range: 10Dq and B say they rest on the extrapolated one', () => {
    // A Ni(II) amine-like pair: ν1 near 12 100 cm-1 (beyond 780 nm = 12 821 cm-1) and ν2 near 18 000 inside.
    const bands = [{ position: 12_100, uncertainty: 450 }, { position: 18_000, uncertainty: 100 }];
    const r = fitBands({ ion: 'Ni2+', bands, window: VISIBLE });
    expect(r.b).not.toBeNull();
    expect(listed(r)).toEqual(['b', 'tenDq']);
    expect(r.warnings.join(' ')).toMatch(/B = \d+ cm-1 is not determined by bands inside the measured range: it rests on the band at 12100 cm-1/);
    // The same bands with both maxima measured: nothing to confess.
    expect(listed(fitBands({ ion: 'Ni2+', bands, window: { min: 9000, max: VISIBLE.max } }))).toEqual([]);
  });
});
