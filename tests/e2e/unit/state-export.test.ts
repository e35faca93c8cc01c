import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import type { AnalysisEntry } from '../../../web/state.js';
import { defaultDetails, editableBandsFromResult, fitRequestFor, shownFit } from '../../../web/state.js';
import { resultCsv, resultJson } from '../../../web/export-results.js';
import { analyzeQuery } from '../../../web/api.js';
import type { FitResult } from '../../../web/types.js';

const fit: FitResult = {
  d: 8, ion: 'Ni2+', geometry: 'octahedral', dq: 850, tenDq: 8500, b: 900, c: 4000, cOverB: 4.44, beta: 0.87, freeIonB: 1030,
  groundTerm: '3A2g', spinState: 'no-choice', unpairedElectrons: 2, spinOnlyMoment: 2.83, lfse: -10_200, rmsResidual: 40, status: 'converged',
  uncertainty: { tenDq: 60, b: 12, c: null },
  assignments: [{ observed: 8500, calculated: 8500, term: '3T2g', parent: '3F' }],
  // complete, as the core's Alternative (src/fit/types.ts): the page shows it through the core's fitWithAlternative
  alternatives: [{
    dq: 910, tenDq: 9100, b: 700, c: 3100, beta: 0.68, groundTerm: '3A2g', groundLabel: '3A2g(F)', spinState: 'no-choice',
    rmsResidual: 90, chiSquare: 6, score: 14, probability: 0.08, penalties: [], assignments: [], reason: 'a larger RMS residual',
  }],
  predicted: [], warnings: [],
};

function entry(): AnalysisEntry {
  const bands = editableBandsFromResult([
    { position: 8500, kind: 'd-d', epsilon: 4.5, fwhm: 2000, uncertainty: 30 },
    { position: 13_800, kind: 'd-d', fwhm: 2500, flags: ['shoulder'] },
    { position: 25_300, kind: 'd-d', epsilon: null },
  ]);
  return {
    key: 'a1', fileName: 'x.csv', file: null, details: { ...defaultDetails(), ion: ' Ni2+ ', sample: 'invented' }, status: 'done',
    result: null, error: null, fit, originalFit: fit, bands, cOverB: null, freeC: false, shownAlternative: null, libraryId: null,
  };
}

describe('page state', () => {
  it('sends only included bands, sorted, with their flags and known fields', () => {
    const e = entry();
    e.bands[2] = { ...e.bands[2]!, kind: 'charge-transfer' };
    e.bands[0] = { ...e.bands[0]!, included: false };
    e.bands.push({ position: 11_000, uncertainty: null, epsilon: null, width: null, kind: 'spin-forbidden', shoulder: false, included: true, origin: 'added', sourceIndex: null });
    e.cOverB = 4.2;
    const request = fitRequestFor(e);
    expect(request).toEqual({
      ion: 'Ni2+',
      geometry: 'octahedral',
      freeC: false,
      cOverB: 4.2,
      bands: [
        { position: 11_000, flags: ['spin-forbidden'] },
        { position: 13_800, width: 2500, flags: ['shoulder'] },
        { position: 25_300, flags: ['charge-transfer'] },
      ],
    });
  });

  it('uses d when no ion is given', () => {
    const e = entry();
    e.details = { ...e.details, ion: '', d: 3 };
    expect(fitRequestFor(e).d).toBe(3);
    expect(fitRequestFor(e).ion).toBeUndefined();
  });

  it('shows an alternative over the best fit when one is chosen', () => {
    const e = entry();
    expect(shownFit(e)?.tenDq).toBe(8500);
    e.shownAlternative = 0;
    expect(shownFit(e)?.tenDq).toBe(9100);
    expect(shownFit(e)?.groundTerm).toBe('3A2g');
    expect(shownFit(e)?.alternatives).toHaveLength(1);
  });

  it('names the analyze query fields as the service reads them', () => {
    const q = analyzeQuery({ ...defaultDetails(), ion: 'Cr3+', concentration: 0.01, pathLength: 0.5, xUnit: 'nm', column: '2', freeC: true });
    expect(Object.fromEntries(q)).toEqual({ ion: 'Cr3+', geometry: 'octahedral', conc: '0.01', path: '0.5', xUnit: 'nm', column: '2', freeC: 'true', curves: 'true' });
  });
});

describe('result downloads', () => {
  it('CSV holds the parameters with units and one row per band', () => {
    const csv = resultCsv(entry());
    const [params, bands] = csv.trim().split(/\n\s*\n/);
    const p = Papa.parse<string[]>(params!).data;
    expect(p[0]).toEqual(['quantity', 'value', 'uncertainty', 'unit']);
    expect(p.find((r) => r[0] === '10Dq')).toEqual(['10Dq', '8500', '60', 'cm-1']);
    expect(p.find((r) => r[0] === 'spin-only moment')).toEqual(['spin-only moment', '2.83', '', 'muB']);
    const b = Papa.parse<string[]>(bands!).data;
    expect(b).toHaveLength(4);
    expect(b[1]![7]).toBe('3T2g(F)');
    expect(b[2]![5]).toBe('yes');
  });

  it('JSON round-trips the fit shown', () => {
    const parsed = JSON.parse(resultJson(entry())) as { fit: FitResult; sample: { sample: string } };
    expect(parsed.fit.tenDq).toBe(8500);
    expect(parsed.sample.sample).toBe('invented');
  });
});

describe('band uncertainty sent to the fit', () => {
  it('combines the spectral σ with the fit default σ as the analysis does', async () => {
    const { fitUncertaintyOf } = await import('../../../web/state.js');
    const { defaultBandSigma } = await import('../../../src/fit/observations.js');
    expect(fitUncertaintyOf({ position: 17_400, kind: 'd-d', positionUncertainty: 30 })).toBeCloseTo(Math.hypot(30, defaultBandSigma(17_400)), 9);
    expect(fitUncertaintyOf({ position: 17_400, kind: 'd-d', positionUncertainty: 30, uncertainty: 55 })).toBe(55);
    expect(fitUncertaintyOf({ position: 17_400, kind: 'd-d' })).toBeNull();
  });
});

describe('warnings shown', () => {
  it('keep the spectrum warnings and replace the analysis fit warnings by those of the fit shown', async () => {
    const { warningsFor } = await import('../../../web/state.js');
    const e = entry();
    e.result = { spectrum: { points: 1, range: [1, 2], xUnit: 'nm', yUnit: 'absorbance', masked: [] }, bands: [], fit, warnings: ['edge modelled', 'fit: old fit warning'] };
    e.fit = { ...fit, warnings: ['new fit warning'] };
    expect(warningsFor(e)).toEqual(['edge modelled', 'fit: new fit warning']);
    e.shownAlternative = 0;
    // an alternative's own warning is why it lost (fitWithAlternative, src/analysis-corrections.ts)
    expect(warningsFor(e)).toEqual(['edge modelled', 'fit: alternative assignment: a larger RMS residual']);
  });

  it('an alternative shows no uncertainties and its own magnetism', () => {
    const e = entry();
    e.fit = { ...fit, alternatives: [{ ...fit.alternatives![0]!, dq: 900, tenDq: 9000, b: 500, c: 2000, groundTerm: '1A1g', groundLabel: '1A1g(G)', spinState: 'low-spin' }] };
    e.shownAlternative = 0;
    const shown = shownFit(e)!;
    expect(shown.uncertainty).toEqual({ tenDq: null, dq: null, b: null, c: null });
    expect(shown.unpairedElectrons).toBe(0);
    expect(shown.spinOnlyMoment).toBe(0);
    expect(shown.cOverB).toBe(4);
  });
});
