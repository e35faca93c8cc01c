import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { entryFromRecord, libraryCsv, savedMessage } from '../../../web/views/library.js';
import type { LibraryRecord, LibraryRow } from '../../../web/types.js';

const row: LibraryRow = {
  id: 7, sample: '=cmd', ion: 'Cr3+', ligands: ['H2O'], createdAt: '2025-01-01T00:00:00.000Z', updatedAt: '2025-01-01T00:00:00.000Z',
  original: { fileName: 'cr.csv', sha256: 'ab', size: 10 }, revision: 1,
  summary: { tenDq: 17_400, tenDqSd: 50, b: 700, bSd: 10, c: 3000, beta: 0.76, betaSd: 0.01, spinState: 'no-choice', rmsResidual: 30, status: 'converged' },
};

describe('library view data', () => {
  it('CSV has one row per record and escapes text a spreadsheet would run', () => {
    const rows = Papa.parse<string[]>(libraryCsv([row]).trim()).data;
    expect(rows).toHaveLength(2);
    expect(rows[1]![0]).toBe('7');
    expect(rows[1]![1]).toBe("'=cmd");
    expect(rows[1]![5]).toBe('17400');
  });

  it('a reopened record keeps its options, details and stored result', () => {
    const record: LibraryRecord = {
      ...row,
      sample: 'aqua',
      options: { ion: 'Cr3+', geometry: 'octahedral', concentration: 0.05, cOverB: 4.2 },
      result: { spectrum: { points: 3, range: [1, 2], xUnit: 'nm', yUnit: 'absorbance', masked: [] }, bands: [{ position: 17_400, kind: 'd-d' }], fit: null, warnings: [] },
    };
    const entry = entryFromRecord(record);
    expect(entry.libraryId).toBe(7);
    expect(entry.details).toMatchObject({ ion: 'Cr3+', concentration: 0.05, cOverB: 4.2, sample: 'aqua', ligand: 'H2O' });
    expect(entry.bands.map((b) => b.position)).toEqual([17_400]);
    expect(entry.file).toBeNull();
  });
});

describe('the save message of a file with several spectra', () => {
  const base = { ...row, options: {}, result: { spectrum: { points: 3, range: [1, 2] as [number, number], xUnit: 'nm' as const, yUnit: 'absorbance' as const, masked: [] }, bands: [], fit: null, warnings: [] } };

  it('a file with one spectrum: one record, as before', () => {
    expect(savedMessage('cr.csv', { ...base, records: [{ id: 7, sample: 'cr', column: null, columnName: null }], notSaved: [] })).toBe('Saved cr.csv as record 7.');
  });

  it('names every record by its column, and each spectrum not saved with its reason', () => {
    const saved = {
      ...base,
      records: [{ id: 7, sample: 'mix: en', column: 1, columnName: 'en' }, { id: 8, sample: 'mix: urea', column: 2, columnName: 'urea' }],
      notSaved: [{ column: 3, columnName: 'blank', error: { code: 'unexplained' as const, message: 'no d–d bands to fit', path: 'mix.csv#3' } }],
    };
    expect(savedMessage('mix.csv', saved)).toBe('Saved mix.csv as 2 records, one per spectrum in the file: 7 (en), 8 (urea). Not saved: column 3 (blank): no d–d bands to fit.');
  });
});
