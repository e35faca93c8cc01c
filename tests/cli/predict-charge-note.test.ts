import { describe, expect, it } from 'vitest';
import { predictionReport } from '../../src/cli/commands/predict-report.js';
import { predictComplex } from '../../src/series/predict.js';

/**
 * AUDIT2 finding 10: `predict "[Co(NH3)6]"` (the charge forgotten) read the
 * metal as Co(0), d9, and said so only in a warning 25 lines down. The note is
 * now the report's second line.
 */
describe('predict report: a formula without a charge', () => {
  it('says on its second line that the complex is read as neutral, with the metal it gives', () => {
    const text = predictionReport(predictComplex('[Co(NH3)6]'));
    const lines = text.split('\n');
    expect(lines[0]).toMatch(/^\[Co\(NH3\)6\]: cobalt\(0\), Co0, d9/); // common practice: a neutral Co(NH3)6 would be Co(0), d9
    expect(lines[1]).toMatch(/^NOTE Charge: none given/);
    // The note wraps at 80 columns: read up to the "Ligands:" line as one sentence.
    const note = text.slice(text.indexOf('NOTE'), text.indexOf('Ligands:')).replace(/\s+/g, ' ');
    expect(note).toMatch(/read as neutral and the metal as cobalt\(0\); if you meant an ion, write its charge/);
  });

  it('is silent when the charge is given or counter-ions give it', () => {
    for (const f of ['[Co(NH3)6]3+', '[Co(NH3)6]Cl3', 'K3[Fe(C2O4)3]']) {
      expect(predictionReport(predictComplex(f)), f).not.toMatch(/NOTE Charge/);
    }
  });
});
