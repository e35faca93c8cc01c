import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { CSV_COLUMNS, libraryCsv } from '../../src/library/export.js';
import { refitAnalysis, type AnalyzeStored } from '../../src/library/refit.js';
import { forEachEngine, libraryPerTest } from './helpers/engines.js';
import { handBuiltRecord, partialResult } from './helpers/records.js';

forEachEngine('refit and export', (engine) => {
const fresh = libraryPerTest(engine);

/** A stand-in for the pipeline that records what it was given, so the merge of options can be checked. */
function recordingAnalyze(): { analyze: AnalyzeStored; calls: { content: Buffer; options: Record<string, unknown> }[] } {
  const calls: { content: Buffer; options: Record<string, unknown> }[] = [];
  const analyze: AnalyzeStored = async (content, options) => {
    calls.push({ content, options: options as Record<string, unknown> });
    const o = options as { ion?: string };
    return partialResult({ fit: { ion: o.ion ?? null, tenDq: 18_000 + calls.length, status: 'converged' }, warnings: [] });
  };
  return { analyze, calls };
}

describe('refitAnalysis', () => {
  it('reruns on the stored original with merged options and keeps the history', async () => {
    const input = handBuiltRecord({ options: { ion: 'Cr3+', geometry: 'octahedral', cOverB: 4, xUnit: 'nm' } });
    const saved = await fresh.library.add(input);
    const { analyze, calls } = recordingAnalyze();
    const refit = await refitAnalysis(fresh.library, saved.id, { cOverB: 4.5, xUnit: null }, analyze);
    expect(Buffer.compare(calls[0]!.content, Buffer.from(input.content))).toBe(0);
    expect(calls[0]!.options).toEqual({ ion: 'Cr3+', geometry: 'octahedral', cOverB: 4.5, fileName: 'sample-a.csv' });
    expect(refit.revision).toBe(2);
    expect(refit.summary.tenDq).toBe(18_001);
    expect(refit.revisions[0]!.summary.tenDq).toBe(17_400);
    expect(refit.original).toEqual(saved.original);
  });

  it('replaces d by a new ion and follows the ion in the details', async () => {
    const saved = await fresh.library.add(handBuiltRecord({ ion: 'Cr3+', options: { d: 3 } }));
    const { analyze, calls } = recordingAnalyze();
    const refit = await refitAnalysis(fresh.library, saved.id, { ion: 'V2+' }, analyze);
    expect(calls[0]!.options).toEqual({ ion: 'V2+', fileName: 'sample-a.csv' });
    expect(refit.ion).toBe('V2+');
  });

  it('saves nothing when the analysis fails', async () => {
    const saved = await fresh.library.add(handBuiltRecord());
    await expect(refitAnalysis(fresh.library, saved.id, {}, async () => Promise.reject(new Error('no fit')))).rejects.toThrow('no fit');
    expect((await await fresh.library.get(saved.id)).revision).toBe(1);
    await expect(refitAnalysis(fresh.library, 42, {}, recordingAnalyze().analyze)).rejects.toMatchObject({ code: 'not-found' });
  });
});

describe('libraryCsv', () => {
  it('writes one row per record that a CSV reader gives back, formulas escaped', async () => {
    await fresh.library.add(handBuiltRecord({ sample: 'plain, with "quotes"', ligands: ['H2O', 'Cl'] }));
    await fresh.library.add(handBuiltRecord({ sample: '=HYPERLINK("x")' }, 17_123.456));
    const text = libraryCsv(await await fresh.library.listAll());
    const parsed = Papa.parse<string[]>(text.trim(), { newline: '\r\n' }); // papaparse as the reference reader
    expect(parsed.errors).toEqual([]);
    const [header, first, second] = parsed.data;
    expect(header).toEqual([...CSV_COLUMNS]);
    const col = (row: string[] | undefined, name: (typeof CSV_COLUMNS)[number]) => row![CSV_COLUMNS.indexOf(name)];
    expect(col(first, 'sample')).toBe(`'=HYPERLINK("x")`);
    expect(col(first, 'tenDq_cm-1')).toBe('17123.5');
    expect(col(second, 'sample')).toBe('plain, with "quotes"');
    expect(col(second, 'ligands')).toBe('H2O; Cl');
    expect(col(second, 'beta')).toBe(String(Math.round((700 / 918) * 1e4) / 1e4));
    expect(col(second, 'temperature_K')).toBe('295');
  });
});
});
