import { describe, expect, it } from 'vitest';
import { librarySeries, seriesAnalysisOf } from '../../src/library/series.js';
import { forEachEngine, freshLibrary, libraryPerTest } from './helpers/engines.js';
import { handBuiltRecord } from './helpers/records.js';

forEachEngine('series from the library', (engine) => {
const fresh = libraryPerTest(engine);

const noFit = { tenDq: null, tenDqSd: null, b: null, bSd: null, c: null, beta: null, betaSd: null, spinState: null, rmsResidual: null, status: null };

describe('seriesAnalysisOf', () => {
  it('takes the ligand numbers from the formula, else one ligand as homoleptic', async () => {
    const summary = { ...noFit, tenDq: 20_000, tenDqSd: 100, beta: 0.7, betaSd: 0.01 };
    expect(seriesAnalysisOf({ id: '1', sample: 's', formula: '[Co(NH3)5Cl]Cl2', summary })).toMatchObject({
      ligands: [{ ligand: 'NH3', count: 5 }, { ligand: 'Cl', count: 1 }], tenDq: 20_000, tenDqUncertainty: 100, beta: 0.7, betaUncertainty: 0.01,
    });
    expect(seriesAnalysisOf({ id: '1', sample: 's', ligands: ['urea'], summary })).toMatchObject({ ligand: 'urea' });
    expect(seriesAnalysisOf({ id: '1', sample: 's', ligands: ['NH3', 'Cl'], summary })).toMatch(/several ligands/);
    expect(seriesAnalysisOf({ id: '1', sample: 's', summary })).toMatch(/no ligand/);
    expect(seriesAnalysisOf({ id: '1', sample: 's', ligands: ['NH3'], summary: noFit })).toBe('no fitted 10Dq');
  });
});

describe('librarySeries', () => {
  it('ranks the analyses of one ion by 10Dq and by 1 - beta, skipping what cannot be ranked', async () => {
    // hand-built records; the numbers are made up for the test
    await fresh.library.add(handBuiltRecord({ sample: 'en', formula: '[Cr(en)3]Cl3', ligands: ['en'] }, 21_900));
    await fresh.library.add(handBuiltRecord({ sample: 'aqua', formula: '[Cr(H2O)6]3+', ligands: ['H2O'] }, 17_400));
    await fresh.library.add(handBuiltRecord({ sample: 'urea', formula: 'my urea complex', ligands: ['urea'] }, 16_200));
    await fresh.library.add(handBuiltRecord({ sample: 'mixed', formula: 'unknown', ligands: ['NH3', 'Cl'] }, 18_000));
    await fresh.library.add(handBuiltRecord({ sample: 'nickel', ion: 'Ni2+', formula: '[Ni(H2O)6]2+', ligands: ['H2O'] }, 8_500));
    const report = await librarySeries(fresh.library, 'Cr(III)');
    expect(report.ion).toBe('Cr3+');
    expect(report.count).toBe(3);
    expect(report.spectrochemical.entries.map((e) => [e.sample, e.value])).toEqual([['urea', 16_200], ['aqua', 17_400], ['en', 21_900]]);
    expect(report.spectrochemical.entries.map((e) => e.id)).toEqual(['3', '2', '1']);
    expect(report.skipped).toEqual([{ id: '4', sample: 'mixed', reason: expect.stringMatching(/several ligands/) }]);
    // every hand-built record has beta = 700/918 with sd 20/918: all neighbours overlap
    expect(report.nephelauxetic.entries).toHaveLength(3);
    expect(report.nephelauxetic.overlaps).toHaveLength(2);
    const aqua = report.factors!.factors.find((f) => f.ligand === 'H2O')!;
    expect(aqua.f).toBeCloseTo(17_400 / report.factors!.g, 12);
  });

  it('says not-found when the library has no analyses of the ion', async () => {
    await fresh.library.add(handBuiltRecord());
    await expect(librarySeries(fresh.library, 'V3+')).rejects.toThrow(expect.objectContaining({ code: 'not-found', path: 'ion' }));
    const aloneWhere = await freshLibrary(engine);
    const alone = await aloneWhere.open();
    try {
      await alone.add(handBuiltRecord({ ligands: [], formula: 'unreadable' }));
      await expect(librarySeries(alone, 'Cr3+')).rejects.toThrow(/^the one analysis of Cr3\+ has no fitted 10Dq or no known ligand \(no ligand given/);
    } finally {
      await alone.close();
      await aloneWhere.dispose();
    }
    await expect(librarySeries(fresh.library, 'Q7')).rejects.toThrow(expect.objectContaining({ code: 'invalid-argument', path: 'ion' }));
  });
});
});
