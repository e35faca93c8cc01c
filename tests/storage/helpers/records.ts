import type { NewAnalysis, StoredResult } from '../../../src/library/types.js';

/**
 * A stored result with only some fields (or odd values), as an older
 * fieldgap or another client may have stored it: typed as a StoredResult on
 * purpose, so the tests can check that the library keeps whatever it got.
 */
export function partialResult(value: object): StoredResult {
  return value as StoredResult;
}

/**
 * Hand-built records for the storage tests. The "result" is a stand-in with
 * the shape of an AnalyzeResult (src/analysis.ts) and numbers made up for
 * these tests; the tests only check that what goes in comes back, never
 * that the numbers are right chemistry.
 */
export function handBuiltRecord(overrides: Partial<NewAnalysis> = {}, tenDq = 17_400): NewAnalysis {
  const content = new TextEncoder().encode(`# hand-built test file\nnm,absorbance\n400,0.10\n575,0.20\n${tenDq},0\n`);
  return {
    sample: 'test sample A',
    formula: '[Cr(H2O)6]3+',
    ion: 'Cr3+',
    ligands: ['H2O'],
    solvent: 'water',
    temperature: 295,
    measuredOn: '2025-03-14',
    note: 'stored by the storage tests',
    fileName: 'sample-a.csv',
    content,
    options: { ion: 'Cr3+', geometry: 'octahedral', xUnit: 'nm' },
    result: partialResult({
      spectrum: { points: 3, range: [10_000, 25_000], xUnit: 'nm', yUnit: 'absorbance', masked: [] },
      bands: [{ position: tenDq, kind: 'd-d' }],
      fit: {
        d: 3, ion: 'Cr3+', geometry: 'octahedral', tenDq, b: 700, c: 3000, beta: 700 / 918,
        freeIonB: 918, spinState: 'quartet', rmsResidual: 120, status: 'converged',
        uncertainty: { tenDq: 150, b: 20, c: 200 },
      },
      warnings: [],
    }),
    ...overrides,
  };
}
