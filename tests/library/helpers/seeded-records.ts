import type { NewAnalysis } from '../../../src/library/types.js';
import { partialResult } from '../../storage/helpers/records.js';
import { SERIES_FORMULAS, SERIES_LIGAND_LISTS } from '../../helpers/series-spellings.js';
import { seededLcg } from '../../reference/seeded-random.js';

/**
 * Seeded records (numbers invented for this test; the test compares two
 * code paths, not chemistry). 10Dq rounded to 0.1 cm-1 so equal values and
 * exact overlaps occur; β from B / 918 as a fit gives it, unrounded.
 */
/** With `everySigma`, every fitted record has σ(10Dq) > 0 and σ(B) > 0 (a series then takes weighted means). */
export function seededRecords(count: number, seed: number, everySigma = false): NewAnalysis[] {
  const next = seededLcg(seed);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(next() * list.length)]!;
  return Array.from({ length: count }, (_v, i): NewAnalysis => {
    const hasFit = next() > 0.05;
    const b = 450 + 400 * next();
    const fit: Record<string, unknown> = { ion: 'Cr3+', freeIonB: 918, uncertainty: {} };
    if (hasFit) {
      fit['tenDq'] = Math.round(150_000 + 100_000 * next()) / 10;
      fit['b'] = b;
      if (next() > 0.1) fit['beta'] = b / 918;
      // β above 1.2 is left out of the nephelauxetic ranking (a fit that went astray)
      if (next() > 0.97) fit['beta'] = 1.25;
      const uncertainty = fit['uncertainty'] as Record<string, number>;
      if (next() > 0.2 || everySigma) uncertainty['tenDq'] = Math.round(2_000 * next()) / 10 + (everySigma ? 1 : 0);
      if (next() > 0.3 || everySigma) uncertainty['b'] = 25 * next() + (everySigma ? 1 : 0);
    }
    const record: NewAnalysis = {
      sample: `sample ${i}${next() > 0.9 ? ' "quoted", \\ and ünïcode\n' : ''}`,
      ion: next() > 0.1 ? pick(['Cr3+', 'Cr(III)', 'cr 3+']) : 'V3+',
      fileName: `s${i}.csv`,
      content: new TextEncoder().encode(`# seeded ${seed} ${i}\n400,0.1\n`),
      options: { ion: 'Cr3+' },
      result: partialResult({ fit }),
    };
    const formula = pick(SERIES_FORMULAS);
    if (formula !== undefined) record.formula = formula;
    const ligands = pick(SERIES_LIGAND_LISTS);
    if (ligands.length > 0) record.ligands = ligands;
    return record;
  });
}

