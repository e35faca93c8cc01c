import { describe, expect, it } from 'vitest';
import { predictionReport } from '../../src/cli/commands/predict-report.js';
import { isLowSpinGSource, LOW_SPIN_G, LOW_SPIN_G_COMPLEX } from '../../src/predict/low-spin-g.js';
import { predictComplex } from '../../src/series/predict.js';

/**
 * AUDIT2 finding 26: the low-spin g of Fe2+, Fe3+ and Mn3+ is taken from one
 * hexacyanide each, so predicting that very complex gives its source back.
 * The report says so beside 10Dq; other complexes of the ion do not get the note.
 */
const flat = (text: string) => text.replace(/\s+/g, ' ');

describe('predict: a low-spin g predicting its own source complex', () => {
  it('every ion with a low-spin g names the complex it came from', () => {
    for (const ion of LOW_SPIN_G.keys()) {
      const complex = LOW_SPIN_G_COMPLEX.get(ion);
      expect(complex, ion).toBeDefined();
      expect(LOW_SPIN_G.get(ion)!.source, ion).toContain(complex!);
    }
  });

  it('says "circular" for [Fe(CN)6]4-, also written as a salt', () => {
    for (const f of ['[Fe(CN)6]4-', 'K4[Fe(CN)6]', '[Fe(CN)6]3-']) {
      expect(flat(predictionReport(predictComplex(f))), f).toMatch(/± \d+ \(circular: the low-spin g of Fe[23]\+ is taken from this complex/);
    }
  });

  it('stays silent for other low-spin complexes of the ion and for high-spin ones', () => {
    for (const f of ['[Fe(phen)3]2+', '[Fe(bpy)3]2+', '[Fe(H2O)6]2+']) {
      expect(predictionReport(predictComplex(f)), f).not.toMatch(/circular/);
    }
    expect(isLowSpinGSource('Fe2+', '[Fe(CN)6]4-', 'Jørgensen: 10Dq = f·g')).toBe(false);
  });
});
